import { normalisePots } from '../../lib/cookers/spec';
import { randomUUID } from 'node:crypto';
import { MikroORM, type EntityManager } from '@mikro-orm/postgresql';
import { inject } from 'vitest';
import config from '../../mikro-orm.config';
import { CookerSchema, DishSchema, KitchenSchema, MembershipSchema, OrganisationSchema, UserSchema, type Kitchen, type Organisation, type Role } from '../../entities';
import { hashPassword } from '../../lib/auth/password';
import { DEMO_COOKERS } from '../../lib/demo/cookers';
import { DEMO_DISHES } from '../../lib/demo/menus';
import type { DishInput } from '../../lib/validations/dishes';

export const PASSWORD = 'fixture-password-1';

let orm: MikroORM | null = null;

/** An ORM on the test database (the same one the test server uses). */
export async function testOrm(): Promise<MikroORM> {
  orm ??= await MikroORM.init({ ...config, clientUrl: inject('databaseUrl') });
  return orm;
}

export async function closeTestOrm() {
  await orm?.close(true);
  orm = null;
}

export interface World {
  org: Organisation;
  otherOrg: Organisation;
  kitchenA: Kitchen;
  kitchenB: Kitchen;
  otherKitchen: Kitchen;
  /** e-mail per person: coordinator, leadA, cookA, leadB, cookB, otherCoordinator, otherLead, otherCook */
  emails: Record<'coordinator' | 'leadA' | 'cookA' | 'leadB' | 'cookB' | 'otherCoordinator' | 'otherLead' | 'otherCook', string>;
}

/**
 * A fresh, isolated world per test file: organisation with kitchens A and B, a coordinator, a lead
 * and a cook per kitchen, and a second organisation with its own people.
 */
export async function createWorld(em?: EntityManager): Promise<World> {
  const e = em ?? (await testOrm()).em.fork();
  const tag = randomUUID().slice(0, 8);
  const passwordHash = await hashPassword(PASSWORD);
  const org = e.create(OrganisationSchema, { name: `Test org ${tag}` });
  const otherOrg = e.create(OrganisationSchema, { name: `Other org ${tag}` });
  const k = (name: string, o: Organisation) =>
    e.create(KitchenSchema, { organisation: o, name: `${name} ${tag}`, latitude: 12.37, longitude: -1.52, altitudeM: 300, timeZone: 'Africa/Ouagadougou', locale: 'en' });
  const kitchenA = k('Kitchen A', org);
  const kitchenB = k('Kitchen B', org);
  const otherKitchen = k('Other kitchen', otherOrg);
  const person = (key: string, role: Role, o: Organisation, kitchen: Kitchen | null) => {
    const email = `${key.toLowerCase()}.${tag}@example.org`;
    const user = e.create(UserSchema, { email, name: key, passwordHash, locale: 'en', temperatureUnit: 'C' });
    e.create(MembershipSchema, { user, organisation: o, kitchen, role });
    return email;
  };
  const emails = {
    coordinator: person('coordinator', 'coordinator', org, null),
    leadA: person('leadA', 'lead', org, kitchenA),
    cookA: person('cookA', 'cook', org, kitchenA),
    leadB: person('leadB', 'lead', org, kitchenB),
    cookB: person('cookB', 'cook', org, kitchenB),
    otherCoordinator: person('otherCoordinator', 'coordinator', otherOrg, null),
    otherLead: person('otherLead', 'lead', otherOrg, otherKitchen),
    otherCook: person('otherCook', 'cook', otherOrg, otherKitchen),
  };
  await e.flush();
  return { org, otherOrg, kitchenA, kitchenB, otherKitchen, emails };
}

/**
 * Puts a demo kitchen's cookers (lib/demo/cookers.ts; default the two of "baobab": a 5 m² dish
 * with two 40 L pots and a box cooker with one 15 L pot) into a kitchen through the ORM, as the
 * demo loader does. Returns the cooker ids in the order of the demo list.
 */
export async function addDemoCookers(kitchen: Kitchen, slug = 'baobab'): Promise<string[]> {
  const e = (await testOrm()).em.fork();
  const ids: string[] = [];
  for (const c of DEMO_COOKERS[slug] ?? []) {
    const { customMediumId: _c, pots, ...rest } = c;
    const id = randomUUID();
    e.create(CookerSchema, {
      id,
      ...rest,
      pots: normalisePots(pots),
      kitchen: e.getReference(KitchenSchema, kitchen.id),
      customMedium: null,
      archived: false,
    });
    ids.push(id);
  }
  await e.flush();
  return ids;
}

/**
 * A small dish library for an organisation (default: the demo dishes of lib/demo/menus.ts), saved
 * through the ORM. Returns the dish ids by name.
 */
export async function addDishLibrary(organisation: Organisation, dishes: DishInput[] = DEMO_DISHES): Promise<Record<string, string>> {
  const e = (await testOrm()).em.fork();
  const ids: Record<string, string> = {};
  for (const d of dishes) {
    const id = randomUUID();
    e.create(DishSchema, { id, ...d, notes: d.notes ?? null, organisation: e.getReference(OrganisationSchema, organisation.id), archived: false });
    ids[d.name] = id;
  }
  await e.flush();
  return ids;
}
