import { z } from 'zod';

/**
 * A calendar date YYYY-MM-DD that exists. Checked by a round trip through Date.UTC: Date.parse alone
 * accepts any day up to 31 in every month ("2026-02-30" would silently be 2 March).
 */
export const localDate = z
  .string({ message: 'Give a date as YYYY-MM-DD.' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD.')
  .refine((d) => {
    const [y, m, day] = d.split('-').map(Number) as [number, number, number];
    const t = new Date(Date.UTC(y, m - 1, day));
    return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === day;
  }, { message: 'That date does not exist.', params: { i18n: 'dateExists' } });
export const clock = z.string({ message: 'Give a time as HH:MM.' }).regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'Use a 24-hour time as HH:MM, e.g. 12:30.');

export const menuLineSchema = z
  .strictObject({
    dishId: z.uuid({ message: 'Choose a dish.' }),
    servings: z.number({ message: 'Servings is a whole number.' }).int('Servings is a whole number.').min(1, 'At least 1 serving.').max(20000, 'At most 20 000 servings.'),
    serveBy: clock,
    earliestStart: clock.nullable().optional(),
  })
  .superRefine((v, ctx) => {
    if (v.earliestStart && v.earliestStart >= v.serveBy) ctx.addIssue({ code: 'custom', path: ['earliestStart'], message: 'The earliest start must be before the serving time.', params: { i18n: 'earliestBeforeServe' } });
  });

/** The whole menu of a day, replaced at once (a lead edits the list, then saves). */
export const putMenuSchema = z.strictObject({ lines: z.array(menuLineSchema).max(200, 'At most 200 lines a day.') });
export const copyMenuSchema = z.strictObject({ fromDate: localDate });
export const dateQuery = z.strictObject({ date: localDate });
/** A date from the URL path, validated so that a 422 names the field `date` (not "(body)"). */
export const parsePathDate = (date: string): string => dateQuery.parse({ date }).date;
