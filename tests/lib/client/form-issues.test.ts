import { createTranslator } from 'next-intl';
import { describe, expect, it } from 'vitest';
import { formIssues, type Translate } from '@/lib/client/form-issues';
import en from '@/lib/i18n/messages/en.json';
import fr from '@/lib/i18n/messages/fr.json';
import { cookerBaseSchema as createCookerSchema } from '@/lib/validations/cookers';
import { createDishSchema } from '@/lib/validations/dishes';
import { putMenuSchema } from '@/lib/validations/menus';
import { planningSettingsSchema } from '@/lib/validations/plans';

// Expected wording: our own message files (lib/i18n/messages); the rules are the route handlers' zod schemas.
// Common practice, no source: a form shows each issue at its field, in the reader's language.
const tr = (locale: 'en' | 'fr'): Translate => {
  const t = createTranslator({ locale, messages: locale === 'en' ? en : fr, namespace: 'validation' });
  return (key, values) => t(key as never, values as never);
};
const DISH = '7d444840-9dc0-11d1-b245-5ffdce74fad2';
const line = (l: Partial<{ dishId: string; servings: number; serveBy: string; earliestStart: string | null }>) => ({ dishId: DISH, servings: 100, serveBy: '12:30', earliestStart: null, ...l });
const where = (t: Translate) => ([k, i, f]: readonly PropertyKey[]) => (k === 'lines' && typeof i === 'number' ? `${t('line', { n: i + 1 })}, ${String(f)}` : null);

describe('form issues from the route schemas', () => {
  it('puts a menu line’s bad servings at its field and names the line, not the internal path', () => {
    const t = tr('en');
    const body = { lines: [line({}), line({ servings: 0 })] };
    const r = putMenuSchema.safeParse(body);
    expect(r.success).toBe(false);
    const issues = formIssues(r.error!, t, { describe: where(t), input: body });
    expect(issues.fields).toEqual({ 'lines.1.servings': 'At least 1.' });
    expect(issues.summary).toBe('Line 2, servings: At least 1.');
    expect(issues.summary).not.toContain('lines.1');
  });

  it('words the same issues in French, numbers in French notation', () => {
    const t = tr('fr');
    const body = { lines: [line({ servings: 25000 }), line({ servings: Number.NaN }), line({ servings: 2.5 })] };
    const issues = formIssues(putMenuSchema.safeParse(body).error!, t, { describe: where(t), input: body });
    // 20 000 with a narrow no-break space (U+202F), as Intl.NumberFormat('fr') writes it (CLDR).
    expect(issues.fields['lines.0.servings']).toBe('Au plus 20\u202f000.');
    expect(issues.fields['lines.1.servings']).toBe('Saisissez un nombre.');
    expect(issues.fields['lines.2.servings']).toBe('Saisissez un nombre entier.');
    expect(issues.summary).toBe('Ligne 1, servings : Au plus 20\u202f000.');
  });

  it('tells an empty time from a wrong one, a missing choice, and words a refinement by its key', () => {
    const t = tr('fr');
    const body = { lines: [line({ serveBy: '' }), line({ serveBy: '25:00' }), line({ dishId: '' }), line({ serveBy: '11:00', earliestStart: '11:30' })] };
    const { fields } = formIssues(putMenuSchema.safeParse(body).error!, t, { input: body, formats: { serveBy: t('time') } });
    expect(fields['lines.0.serveBy']).toBe('Remplissez ce champ.');
    expect(fields['lines.1.serveBy']).toBe('Indiquez une heure sur 24 h au format HH:MM, p. ex. 12:30.');
    expect(fields['lines.2.dishId']).toBe('Choisissez une des options.');
    expect(fields['lines.3.earliestStart']).toBe('Le début au plus tôt doit précéder l’heure de service.');
  });

  it('shows an English reader the schema’s own message, and words zod’s generic ones', () => {
    const body = { lines: [line({ servings: 0 }), line({ dishId: '' })] };
    const t = tr('en');
    const { fields, summary } = formIssues(putMenuSchema.safeParse(body).error!, t, { describe: where(t), input: body, schemaLanguage: true });
    expect(fields).toEqual({ 'lines.0.servings': 'At least 1 serving.', 'lines.1.dishId': 'Choose a dish.' });
    expect(summary).toBe('Line 1, servings: At least 1 serving.');
    // A bound the schema left to zod's default wording ("Too big: expected string to have <=40 characters").
    const pots = [{ id: 'x'.repeat(41), name: 'Pot', volumeL: 40, massKg: 4, coupling: { kind: 'constant', uaWPerK: 5 }, lidAreaM2: 0.2, lidUWPerM2K: 6 }];
    const r = createCookerSchema.shape.pots.safeParse(pots);
    expect(r.error?.issues[0]?.message).toMatch(/^Too big:/);
    expect(formIssues(r.error!, t, { schemaLanguage: true }).fields).toEqual({ '0.id': 'At most 40 characters.' });
  });

  it('keeps the API’s English messages (the server answers with the schema’s own words)', () => {
    const r = planningSettingsSchema.safeParse({ shiftStart: '16:00', shiftEnd: '08:00', turnaroundMin: 15, currency: 'KES', fuels: [{ stoveId: 'lpg' }] });
    expect(r.error?.issues[0]?.message).toBe('The shift must end after it starts.');
    expect(formIssues(r.error!, tr('fr')).fields).toEqual({ shiftEnd: 'Le service doit finir après avoir commencé.' });
  });

  it('words the dish rules and the bounds of a dish', () => {
    const dish = { name: 'Beans', method: 'boil', servingsPerBatch: 100, foodKgPerServing: 0.1, waterKgPerServing: 0.2, litresPerServing: 0.35, minPotTempC: 60, holdMin: 20, safeCoreTempC: 74 };
    expect(formIssues(createDishSchema.safeParse(dish).error!, tr('en')).fields).toEqual({ minPotTempC: 'The pot must reach at least the safe core temperature of the food.' });
    expect(formIssues(createDishSchema.safeParse({ ...dish, minPotTempC: 90, name: ' ', holdMin: 0 }).error!, tr('en')).fields).toEqual({ name: 'Fill in this field.', holdMin: 'At least 1.' });
  });

  it('has every message in both languages', () => {
    const keys = (o: object, p = ''): string[] => Object.entries(o).flatMap(([k, v]) => (typeof v === 'object' ? keys(v as object, `${p}${k}.`) : [`${p}${k}`]));
    expect(keys(fr.validation).sort()).toEqual(keys(en.validation).sort());
  });
});
