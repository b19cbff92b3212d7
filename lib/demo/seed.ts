import { normalisePots } from '@/lib/cookers/spec';
import type { EntityManager } from '@mikro-orm/postgresql';
import { CookerSchema, KitchenSchema, MembershipSchema, OrganisationSchema, UserSchema, type Kitchen, type Locale, type Organisation, type Role } from '@/entities';
import { hashPassword } from '@/lib/auth/password';
import { DEMO_COOKERS } from './cookers';
import { DEMO_DISHES, DEMO_MENUS } from './menus';
import { DishSchema, MenuLineSchema, PlanSchema } from '@/entities';
import { publishDraft, solveDraft } from '@/lib/drafts';
import { zonedDayBoundsMs } from '@/lib/time';
import { addDays, localDateString } from '@/lib/time';

/**
 * The demo scenario: an invented network of three community kitchens in sunny places (real
 * coordinates, invented names and people; example.org addresses). Loaded only in demo mode.
 */
export const DEMO_PASSWORD = 'sunny-demo-2026';
export const DEMO_ORG = 'Sunward Kitchens Network';

export const DEMO_KITCHENS = [
  { slug: 'baobab', name: 'Baobab Ridge School Kitchen', latitude: -6.163, longitude: 35.7516, altitudeM: 1120, timeZone: 'Africa/Dar_es_Salaam', locale: 'en' as Locale },
  { slug: 'tamarind', name: 'Tamarind Court Shelter Canteen', latitude: 12.3714, longitude: -1.5197, altitudeM: 305, timeZone: 'Africa/Ouagadougou', locale: 'fr' as Locale },
  { slug: 'saltbush', name: 'Saltbush Camp Canteen', latitude: 26.2389, longitude: 73.0243, altitudeM: 231, timeZone: 'Asia/Kolkata', locale: 'en' as Locale },
] as const;

const PEOPLE: Record<string, { lead: string; cooks: [string, string] }> = {
  baobab: { lead: 'Neema Kisanga', cooks: ['Baraka Mollel', 'Zawadi Mrema'] },
  tamarind: { lead: 'Awa Sawadogo', cooks: ['Issa Kaboré', 'Mariam Ouédraogo'] },
  saltbush: { lead: 'Kavita Rathore', cooks: ['Mohan Bishnoi', 'Sunita Meghwal'] },
};

export interface DemoAccount {
  email: string;
  role: Role;
  kitchen: string | null;
  name: string;
}

export function demoAccounts(): DemoAccount[] {
  const list: DemoAccount[] = [{ email: 'coordinator@example.org', role: 'coordinator', kitchen: null, name: 'Farida Okonjo' }];
  for (const k of DEMO_KITCHENS) {
    const p = PEOPLE[k.slug]!;
    list.push({ email: `lead.${k.slug}@example.org`, role: 'lead', kitchen: k.slug, name: p.lead });
    p.cooks.forEach((name, i) => list.push({ email: `cook${i + 1}.${k.slug}@example.org`, role: 'cook', kitchen: k.slug, name }));
  }
  return list;
}

/** Creates the demo organisation, kitchens and people if missing; returns what exists. Idempotent. */
export async function seedDemo(em: EntityManager): Promise<{ organisation: Organisation; kitchens: Record<string, Kitchen>; created: boolean }> {
  return em.transactional(async (tx) => {
    const existing = await tx.findOne(OrganisationSchema, { name: DEMO_ORG });
    if (existing) {
      const ks = await tx.find(KitchenSchema, { organisation: existing });
      const bySlug: Record<string, Kitchen> = {};
      for (const d of DEMO_KITCHENS) {
        const k = ks.find((x) => x.name === d.name);
        if (k) bySlug[d.slug] = k;
      }
      await seedDemoCookers(tx, bySlug);
      await seedDemoDishes(tx, existing);
      return { organisation: existing, kitchens: bySlug, created: false };
    }
    const organisation = tx.create(OrganisationSchema, { name: DEMO_ORG });
    const kitchens: Record<string, Kitchen> = {};
    for (const d of DEMO_KITCHENS) {
      const { slug, ...fields } = d;
      kitchens[slug] = tx.create(KitchenSchema, { ...fields, organisation });
    }
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    for (const a of demoAccounts()) {
      const kitchen = a.kitchen ? kitchens[a.kitchen]! : null;
      const user = tx.create(UserSchema, { email: a.email, name: a.name, passwordHash, locale: kitchen?.locale ?? 'en', temperatureUnit: 'C' });
      tx.create(MembershipSchema, { user, organisation, kitchen, role: a.role });
    }
    await seedDemoCookers(tx, kitchens);
    await seedDemoDishes(tx, organisation);
    return { organisation, kitchens, created: true };
  });
}

/** Adds the demo cookers to a demo kitchen that has none (kitchens a lead already equipped are left alone). */
async function seedDemoCookers(em: EntityManager, kitchens: Record<string, Kitchen>): Promise<void> {
  for (const [slug, kitchen] of Object.entries(kitchens)) {
    if ((await em.count(CookerSchema, { kitchen })) > 0) continue;
    for (const c of DEMO_COOKERS[slug] ?? []) {
      const { customMediumId: _c, pots, ...rest } = c;
      em.create(CookerSchema, { ...rest, pots: normalisePots(pots), kitchen, customMedium: null, archived: false });
    }
  }
}

async function seedDemoDishes(em: EntityManager, organisation: Organisation): Promise<void> {
  if ((await em.count(DishSchema, { organisation })) > 0) return;
  for (const d of DEMO_DISHES) em.create(DishSchema, { ...d, notes: d.notes ?? null, organisation, archived: false });
}

/**
 * Today's and tomorrow's menus and plans in every demo kitchen (local dates): a published plan for
 * today so cooks see slots at once, a solved draft for tomorrow for the lead. Days that already have
 * a menu keep it and days that have a plan keep it, so a lead's own work survives a restart.
 */
export async function seedDemoPlans(em: EntityManager, kitchens: Record<string, Kitchen>, opts: { timeLimitS?: number; now?: number } = {}): Promise<string[]> {
  const done: string[] = [];
  for (const [slug, kitchen] of Object.entries(kitchens)) {
    const today = localDateString(opts.now ?? Date.now(), kitchen.timeZone);
    for (const [date, publish] of [[today, true], [addDays(today, 1), false]] as const) {
      if ((await em.count(MenuLineSchema, { kitchen, date })) === 0) {
        const dishes = await em.find(DishSchema, { organisation: kitchen.organisation.id });
        (DEMO_MENUS[slug] ?? []).forEach((line, i) => {
          const dish = dishes.find((d) => d.name === line.dish);
          if (dish) em.create(MenuLineSchema, { kitchen, date, dish, servings: line.servings, serveBy: line.serveBy, earliestStart: line.earliestStart ?? null, position: i });
        });
        await em.flush();
      }
      if ((await em.count(PlanSchema, { kitchen, date })) > 0) continue;
      // Planned as the lead would have done it: the evening before the day.
      const eveningBefore = zonedDayBoundsMs(date, kitchen.timeZone)[0] - 4 * 3600_000;
      const draft = await solveDraft({ em, kitchen, actorId: null }, date, opts.timeLimitS ?? 2, eveningBefore);
      if (publish) await publishDraft({ em, kitchen, actorId: null }, draft.id);
      done.push(`${kitchen.name} ${date}${publish ? ' (published)' : ' (draft)'}`);
    }
  }
  return done;
}
