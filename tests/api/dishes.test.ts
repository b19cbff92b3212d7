/**
 * Dish library over HTTP: CRUD by a kitchen lead, the role and organisation guard, validation with
 * the field named, the derived heat-up energy against a hand calculation, and the CSV import/export
 * (all-or-nothing import, errors named by line and column, size limit).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, testOrm, type World } from '../helpers/fixtures';
import { DishSchema } from '../../entities';

let w: World;
const c: Record<string, Client> = {};

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'leadB', 'otherLead'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
});
afterAll(closeTestOrm);

const base = (kitchenId = w.kitchenA.id) => `/api/v1/kitchens/${kitchenId}/dishes`;

/** A simmered stew for a 100-serving batch (invented, plausible values; common practice, no source). */
const stew = (patch: Record<string, unknown> = {}) => ({
  name: 'Groundnut stew',
  method: 'simmer',
  servingsPerBatch: 100,
  foodKgPerServing: 0.15,
  waterKgPerServing: 0.2,
  foodCpJPerKgK: 3300,
  litresPerServing: 0.4,
  minPotTempC: 88,
  holdMin: 40,
  safeCoreTempC: 74,
  lidOn: true,
  backupStove: 'lpg',
  notes: 'Stir before serving.',
  ...patch,
});

async function dishCount(organisationId: string): Promise<number> {
  const em = (await testOrm()).em.fork();
  return em.count(DishSchema, { organisation: organisationId, archived: false });
}

describe('dish library', () => {
  let dishId = '';

  it('a kitchen lead creates a dish; every member of the kitchen reads it', async () => {
    const r = await c.leadA!.post(base(), stew());
    expect(r.status).toBe(201);
    expect(r.json.name).toBe('Groundnut stew');
    expect(r.json.method).toBe('simmer');
    dishId = r.json.id;
    const list = await c.cookA!.get(base());
    expect(list.status).toBe(200);
    expect(list.json.dishes.map((d: { id: string }) => d.id)).toContain(dishId);
    const one = await c.cookA!.get(`${base()}/${dishId}`);
    expect(one.status).toBe(200);
    expect(one.json.notes).toBe('Stir before serving.');
  });

  it('derives the heat-up energy of a full batch as lib/fuel/energy.ts documents it', async () => {
    const r = await c.leadA!.get(`${base()}/${dishId}`);
    // lib/fuel/energy.ts, term 1 (heating), at 25 °C ambient and sea level (lib/dishes batchHeatJ):
    //   Q = (m_food·cp_food + m_pot·cp_pot)·(T_target − 25) + m_water·4186·(min(T_target, T_boil) − 25)
    // with m_food = servings × food/serving, m_water = servings × water/serving, T_target = minPotTempC
    // for a simmer (the boiling point only for boil/steam), and the default stove pot of
    // 0.12 kg per litre of the batch's volume, aluminium cp 900 J/(kg·K) (energy.ts, HeatEstimateOptions).
    // Water at 4186 J/(kg·K): ASAE S580.1, as quoted in energy.ts.
    const servings = 100;
    const contentsJPerK = servings * (0.15 * 3300 + 0.2 * 4186); // 133 220 J/K
    const potKg = 0.12 * (servings * 0.4); // 4.8 kg for a 40 L batch
    const dT = 88 - 25; // 63 K (88 °C is below the boiling point at sea level, so the water is not capped)
    const handJ = contentsJPerK * dT + potKg * 900 * dT; // 8 392 860 J + 272 160 J = 8 665 020 J
    const handKWh = handJ / 3.6e6; // ≈ 2.40695 kWh
    expect(handKWh).toBeCloseTo(2.40695, 4);
    // Same formula, so only rounding separates them: tolerance 0.01 % relative.
    expect(Math.abs(r.json.heatUpKWh - handKWh) / handKWh).toBeLessThan(1e-4);
    // With holding losses (and no boil-off for a simmer) the batch needs more than the heat-up alone.
    expect(r.json.batchHeatKWh).toBeGreaterThan(r.json.heatUpKWh);
  });

  it('a lead edits and archives; the archived dish is gone from the list and its GET is 404', async () => {
    const created = await c.leadA!.post(base(), stew({ name: 'Short-lived soup', method: 'boil', minPotTempC: 95 }));
    expect(created.status).toBe(201);
    const id = created.json.id;
    const r = await c.leadA!.patch(`${base()}/${id}`, { holdMin: 25, notes: null });
    expect(r.status).toBe(200);
    expect(r.json.holdMin).toBe(25);
    expect(r.json.notes).toBeNull();
    expect((await c.leadA!.del(`${base()}/${id}`)).status).toBe(204);
    expect((await c.leadA!.get(`${base()}/${id}`)).status).toBe(404);
    const list = await c.leadA!.get(base());
    expect(list.json.dishes.map((d: { id: string }) => d.id)).not.toContain(id);
    // Its name is free again.
    expect((await c.leadA!.post(base(), stew({ name: 'Short-lived soup' }))).status).toBe(201);
  });

  it.each([
    ['cookA', 'cook'],
    ['coordinator', 'coordinator'],
  ] as const)('%s (a %s) gets 403 on every write', async (who, _role) => {
    expect((await c[who]!.post(base(), stew({ name: `By ${who}` }))).status).toBe(403);
    expect((await c[who]!.patch(`${base()}/${dishId}`, { holdMin: 10 })).status).toBe(403);
    expect((await c[who]!.del(`${base()}/${dishId}`)).status).toBe(403);
    expect((await c[who]!.request('POST', `${base()}/import`, undefined, { raw: 'name\n', headers: { 'content-type': 'text/csv' } })).status).toBe(403);
    // Reading stays open to them.
    expect((await c[who]!.get(`${base()}/${dishId}`)).status).toBe(200);
  });

  it("another organisation's kitchen is 404 both ways, and a dish id is not found through it", async () => {
    expect((await c.leadA!.post(base(w.otherKitchen.id), stew())).status).toBe(404);
    expect((await c.leadA!.get(base(w.otherKitchen.id))).status).toBe(404);
    expect((await c.otherLead!.get(`${base()}/${dishId}`)).status).toBe(404);
    expect((await c.otherLead!.patch(`${base()}/${dishId}`, { holdMin: 10 })).status).toBe(404);
    // Through their own kitchen, the other organisation's lead does not find our dish either.
    expect((await c.otherLead!.get(`${base(w.otherKitchen.id)}/${dishId}`)).status).toBe(404);
    expect((await c.otherLead!.patch(`${base(w.otherKitchen.id)}/${dishId}`, { holdMin: 10 })).status).toBe(404);
    // A lead of the sibling kitchen sees the shared library through their own kitchen only.
    expect((await c.leadB!.get(`${base(w.kitchenB.id)}/${dishId}`)).status).toBe(200);
    expect((await c.leadB!.get(`${base()}/${dishId}`)).status).toBe(404);
  });

  it('a duplicate name is 409 naming `name`, on create and on rename', async () => {
    const dup = await c.leadA!.post(base(), stew());
    expect(dup.status).toBe(409);
    expect(Object.keys(dup.json.error.fields)).toContain('name');
    const other = await c.leadA!.post(base(), stew({ name: 'Plain rice', method: 'boil', minPotTempC: 90 }));
    expect(other.status).toBe(201);
    const rename = await c.leadA!.patch(`${base()}/${other.json.id}`, { name: 'Groundnut stew' });
    expect(rename.status).toBe(409);
    expect(Object.keys(rename.json.error.fields)).toContain('name');
    // Another organisation may use the same name.
    expect((await c.otherLead!.post(base(w.otherKitchen.id), stew())).status).toBe(201);
  });

  it('renaming a dish to the name of an archived one works (the name is free), not 500', async () => {
    const old = await c.leadA!.post(base(), stew({ name: 'Retired porridge', method: 'boil', minPotTempC: 90 }));
    expect((await c.leadA!.del(`${base()}/${old.json.id}`)).status).toBe(204);
    const cur = await c.leadA!.post(base(), stew({ name: 'Porridge (new)', method: 'boil', minPotTempC: 90 }));
    const r = await c.leadA!.patch(`${base()}/${cur.json.id}`, { name: 'Retired porridge' });
    expect(r.status).toBe(200);
    expect(r.json.name).toBe('Retired porridge');
    expect((await c.leadA!.get(`${base()}/${cur.json.id}`)).json.name).toBe('Retired porridge');
  });

  it.each([
    ['a pot temperature below the safe core temperature', { minPotTempC: 70, safeCoreTempC: 74 }, 'minPotTempC'],
    ['an unknown method', { method: 'grill' }, 'method'],
    ['a negative food mass', { foodKgPerServing: -0.1 }, 'foodKgPerServing'],
    ['a negative water mass', { waterKgPerServing: -1 }, 'waterKgPerServing'],
    ['a fractional batch size', { servingsPerBatch: 10.5 }, 'servingsPerBatch'],
    ['an unknown backup stove', { backupStove: 'rocket' }, 'backupStove'],
    ['neither food nor water', { foodKgPerServing: 0, waterKgPerServing: 0 }, 'foodKgPerServing'],
    ['an unknown field', { colour: 'red' }, 'colour'],
  ])('refuses %s with 422 naming the field', async (_what, patch, field) => {
    const r = await c.leadA!.post(base(), stew({ name: `Invalid ${field}`, ...patch }));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(field);
  });

  it('regression: a PATCH changes only the fields it names (defaults of a new dish are not re-applied)', async () => {
    const created = await c.leadA!.post(base(), stew({ name: 'Fried plantain', method: 'fry', minPotTempC: 160, foodCpJPerKgK: 2900, lidOn: false, backupStove: 'charcoal' }));
    expect(created.status).toBe(201);
    const r = await c.leadA!.patch(`${base()}/${created.json.id}`, { holdMin: 12 });
    expect(r.status).toBe(200);
    // Before the fix, zod 4 filled the create-time defaults into the PATCH: 3500, true and "lpg".
    expect(r.json).toMatchObject({ holdMin: 12, foodCpJPerKgK: 2900, lidOn: false, backupStove: 'charcoal', method: 'fry' });
    expect((await c.leadA!.get(`${base()}/${created.json.id}`)).json).toMatchObject({ foodCpJPerKgK: 2900, lidOn: false, backupStove: 'charcoal' });
  });

  it('an edit that leaves a serving with neither food nor water is refused naming foodKgPerServing', async () => {
    const created = await c.leadA!.post(base(), stew({ name: 'Plain broth', foodKgPerServing: 0, waterKgPerServing: 0.3 }));
    expect(created.status).toBe(201);
    const r = await c.leadA!.patch(`${base()}/${created.json.id}`, { waterKgPerServing: 0 });
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('foodKgPerServing');
  });

  it('an edit that would put the pot below the safe core temperature is refused naming minPotTempC', async () => {
    const r = await c.leadA!.patch(`${base()}/${dishId}`, { minPotTempC: 60 });
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('minPotTempC');
    expect((await c.leadA!.get(`${base()}/${dishId}`)).json.minPotTempC).toBe(88); // unchanged
  });
});

describe('dish CSV', () => {
  const header = 'name,method,servings_per_batch,food_kg_per_serving,water_kg_per_serving,food_cp_j_per_kg_k,litres_per_serving,min_pot_temp_c,hold_min,safe_core_temp_c,lid_on,backup_stove,notes';
  const row = (name: string, patch: Partial<Record<'method' | 'food', string>> = {}) => `${name},${patch.method ?? 'boil'},100,${patch.food ?? '0.08'},0.2,1800,0.3,90,20,74,yes,lpg,`;
  const importCsv = (client: Client, kitchenId: string, text: string | Buffer) =>
    client.request('POST', `${base(kitchenId)}/import`, undefined, { raw: text, headers: { 'content-type': 'text/csv' } });

  it('export then import into another organisation round-trips every column', async () => {
    const exported = await c.leadA!.get(`${base()}/export`);
    expect(exported.status).toBe(200);
    expect(exported.headers.get('content-type')).toMatch(/^text\/csv/);
    expect(exported.text.split(/\r?\n/)[0]).toBe(header);
    const mine = (await c.leadA!.get(base())).json.dishes as Record<string, unknown>[];
    expect(mine.length).toBeGreaterThanOrEqual(3);

    // The other organisation starts with one dish of the same name ("Groundnut stew"), which the import updates.
    const before = await dishCount(w.otherOrg.id);
    const imp = await importCsv(c.otherLead!, w.otherKitchen.id, exported.text);
    expect(imp.status).toBe(200);
    expect(imp.json.created + imp.json.updated).toBe(mine.length);
    expect(await dishCount(w.otherOrg.id)).toBe(before + imp.json.created);

    const theirs = (await c.otherLead!.get(base(w.otherKitchen.id))).json.dishes as Record<string, unknown>[];
    const strip = (d: Record<string, unknown>) => {
      const { id: _id, ...rest } = d;
      return rest;
    };
    for (const d of mine) expect(strip(theirs.find((t) => t.name === d.name)!)).toEqual(strip(d));
    // And their export is the same text.
    const again = await c.otherLead!.get(`${base(w.otherKitchen.id)}/export`);
    const sameNames = new Set(mine.map((d) => d.name));
    const lines = again.text.split(/\r?\n/).filter((l, i) => i === 0 || sameNames.has(l.split(',')[0]!.replace(/^"|"$/g, '')));
    expect(lines.join('\n')).toBe(exported.text.split(/\r?\n/).join('\n'));
  });

  it('a file with errors is refused with 422 naming "line N.<column>", and nothing is saved', async () => {
    const csv = [
      header, // line 1
      row('Csv dish one'), // line 2: fine
      'Csv dish two,boil,100,0.08', // line 3: wrong column count
      row('Csv dish three'), // line 4: fine
      row('Csv dish four', { food: 'abc' }), // line 5: not a number
      row('Csv dish five'), // line 6: fine
      row('Csv dish six', { method: 'grill' }), // line 7: unknown method
      row('Csv dish one'), // line 8: the name of line 2 again
    ].join('\n');
    const before = await dishCount(w.org.id);
    const r = await importCsv(c.leadA!, w.kitchenA.id, csv);
    expect(r.status).toBe(422);
    const keys = Object.keys(r.json.error.fields);
    expect(keys).toContain('line 3.(row)');
    expect(keys).toContain('line 5.food_kg_per_serving');
    expect(keys).toContain('line 7.method');
    expect(keys).toContain('line 8.name');
    expect(keys).toHaveLength(4);
    expect(r.json.error.fields['line 3.(row)']).toMatch(/13/); // expected 13 fields
    expect(r.json.error.message).toMatch(/nothing was imported/);
    expect(await dishCount(w.org.id)).toBe(before);
    const names = ((await c.leadA!.get(base())).json.dishes as { name: string }[]).map((d) => d.name);
    expect(names.filter((n) => n.startsWith('Csv dish'))).toEqual([]);
  });

  it('a good file imports every row', async () => {
    const before = await dishCount(w.org.id);
    const r = await importCsv(c.leadA!, w.kitchenA.id, [header, row('Csv dish one'), row('Csv dish two', { method: 'steam' })].join('\n'));
    expect(r.status).toBe(200);
    expect(r.json).toEqual({ created: 2, updated: 0 });
    expect(await dishCount(w.org.id)).toBe(before + 2);
  });

  it('a 2 MB file is refused with 413 and nothing is saved', async () => {
    const before = await dishCount(w.org.id);
    const lines = [header];
    for (let i = 0; lines.join('\n').length < 2 * 1024 * 1024; i++) for (let k = 0; k < 1000; k++) lines.push(row(`Big dish ${i}-${k}`));
    const body = Buffer.from(lines.join('\n'));
    expect(body.byteLength).toBeGreaterThan(2 * 1024 * 1024);
    const r = await importCsv(c.leadA!, w.kitchenA.id, body);
    expect(r.status).toBe(413);
    expect(await dishCount(w.org.id)).toBe(before);
  });
});
