/**
 * A kitchen's day menu over HTTP: replace and read back in order, validation with the line and field
 * named, copying a day, and the batch preview (servings split by recipe size and the largest pot)
 * against a hand calculation.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { addDemoCookers, addDishLibrary, createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import type { DishInput } from '../../lib/validations/dishes';

let w: World;
const c: Record<string, Client> = {};
let dish: Record<string, string> = {};
let foreignDishId = '';

const DAY = '2026-12-14';
const NEXT = '2026-12-15';
const EMPTY = '2026-12-13';

/** Invented dishes with round numbers for the hand calculations (common practice, no source). */
const DISHES: DishInput[] = [
  { name: 'Rice', method: 'boil', servingsPerBatch: 130, foodKgPerServing: 0.08, waterKgPerServing: 0.16, foodCpJPerKgK: 1800, litresPerServing: 0.3, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Thick stew', method: 'simmer', servingsPerBatch: 120, foodKgPerServing: 0.2, waterKgPerServing: 0.2, foodCpJPerKgK: 3500, litresPerServing: 0.5, minPotTempC: 88, holdMin: 45, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Porridge', method: 'boil', servingsPerBatch: 120, foodKgPerServing: 0.06, waterKgPerServing: 0.25, foodCpJPerKgK: 1800, litresPerServing: 0.33, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
];

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'otherLead'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
  await addDemoCookers(w.kitchenA); // largest pot 40 L (lib/demo/cookers.ts, "baobab")
  dish = await addDishLibrary(w.org, DISHES);
  const foreign = await addDishLibrary(w.otherOrg, [{ ...DISHES[0]!, name: 'Their rice' }]);
  foreignDishId = foreign['Their rice']!;
});
afterAll(closeTestOrm);

const menu = (date: string, kitchenId = w.kitchenA.id) => `/api/v1/kitchens/${kitchenId}/menus/${date}`;
const put = (client: Client, date: string, lines: unknown[]) => client.request('PUT', menu(date), { lines });

describe('day menu', () => {
  const lines = () => [
    { dishId: dish.Porridge!, servings: 200, serveBy: '10:00', earliestStart: '07:00' },
    { dishId: dish.Rice!, servings: 300, serveBy: '12:30' },
    { dishId: dish['Thick stew']!, servings: 250, serveBy: '12:30', earliestStart: null },
  ];

  it('a lead puts a day menu; everyone in the kitchen reads it back in the same order', async () => {
    const r = await put(c.leadA!, DAY, lines());
    expect(r.status).toBe(200);
    expect(r.json.lines).toHaveLength(3);
    const got = await c.cookA!.get(menu(DAY));
    expect(got.status).toBe(200);
    expect(got.json.date).toBe(DAY);
    expect(got.json.lines.map((l: { dishName: string }) => l.dishName)).toEqual(['Porridge', 'Rice', 'Thick stew']);
    expect(got.json.lines.map((l: { position: number }) => l.position)).toEqual([0, 1, 2]);
    expect(got.json.lines[0]).toMatchObject({ dishId: dish.Porridge, servings: 200, serveBy: '10:00', earliestStart: '07:00' });
    expect(got.json.lines[1]).toMatchObject({ dishId: dish.Rice, servings: 300, serveBy: '12:30', earliestStart: null });
  });

  it('a new PUT replaces the whole list (reordered, one line fewer)', async () => {
    const [a, b] = lines();
    const r = await put(c.leadA!, DAY, [b, a]);
    expect(r.status).toBe(200);
    const got = await c.leadA!.get(menu(DAY));
    expect(got.json.lines.map((l: { dishName: string }) => l.dishName)).toEqual(['Rice', 'Porridge']);
    // Back to the three lines for the rest of the file.
    expect((await put(c.leadA!, DAY, lines())).status).toBe(200);
  });

  it('a cook and a coordinator cannot PUT (403); another organisation gets 404', async () => {
    expect((await put(c.cookA!, DAY, lines())).status).toBe(403);
    expect((await put(c.coordinator!, DAY, lines())).status).toBe(403);
    expect((await c.otherLead!.request('PUT', menu(DAY), { lines: lines() })).status).toBe(404);
    expect((await c.otherLead!.get(menu(DAY))).status).toBe(404);
    // The menu is unchanged.
    expect((await c.leadA!.get(menu(DAY))).json.lines).toHaveLength(3);
  });

  it.each([
    ['a dish of another organisation', () => [{ dishId: foreignDishId, servings: 10, serveBy: '12:00' }], 'lines.0.dishId'],
    ['an unknown dish id', () => [{ dishId: '00000000-0000-4000-8000-000000000000', servings: 10, serveBy: '12:00' }], 'lines.0.dishId'],
    ['serve-by 25:00', () => [{ dishId: dish.Rice!, servings: 10, serveBy: '25:00' }], 'lines.0.serveBy'],
    ['serve-by 12:60', () => [{ dishId: dish.Rice!, servings: 10, serveBy: '12:60' }], 'lines.0.serveBy'],
    ['an earliest start after serve-by', () => [{ dishId: dish.Rice!, servings: 10, serveBy: '12:00', earliestStart: '13:00' }], 'lines.0.earliestStart'],
    ['an earliest start equal to serve-by', () => [{ dishId: dish.Rice!, servings: 10, serveBy: '12:00', earliestStart: '12:00' }], 'lines.0.earliestStart'],
    ['zero servings on the second line', () => [{ dishId: dish.Rice!, servings: 10, serveBy: '12:00' }, { dishId: dish.Rice!, servings: 0, serveBy: '12:00' }], 'lines.1.servings'],
  ])('refuses %s with 422 naming %s, and keeps the menu', async (_what, make, field) => {
    const r = await put(c.leadA!, DAY, make());
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(field);
    expect((await c.leadA!.get(menu(DAY))).json.lines).toHaveLength(3);
  });

  it.each([['2026-13-45'], ['tomorrow'], ['2026-02-30'], ['2026-02-29']])('a path date %j that is malformed or does not exist is 422 naming date, on every menu route', async (date) => {
    for (const r of [
      await c.leadA!.get(menu(date)),
      await put(c.leadA!, date, lines()),
      await c.leadA!.get(`${menu(date)}/batches`),
      await c.leadA!.post(`${menu(date)}/copy`, { fromDate: DAY }),
    ]) {
      expect(r.status).toBe(422);
      expect(Object.keys(r.json.error.fields)).toContain('date');
    }
    // Regression: "2026-02-30" passed Date.parse (any day up to 31) and was stored as a menu date.
    const fromBad = await c.leadA!.post(`${menu(NEXT)}/copy`, { fromDate: date });
    expect(fromBad.status).toBe(422);
    expect(Object.keys(fromBad.json.error.fields)).toContain('fromDate');
  });

  it('copies a day onto another day (replacing it)', async () => {
    expect((await put(c.leadA!, NEXT, [{ dishId: dish.Rice!, servings: 5, serveBy: '09:00' }])).status).toBe(200);
    const r = await c.leadA!.post(`${menu(NEXT)}/copy`, { fromDate: DAY });
    expect(r.status).toBe(200);
    const src = (await c.leadA!.get(menu(DAY))).json.lines;
    const dst = (await c.leadA!.get(menu(NEXT))).json.lines;
    const strip = (l: { dishId: string; servings: number; serveBy: string; earliestStart: string | null; position: number }) => [l.dishId, l.servings, l.serveBy, l.earliestStart, l.position];
    expect(dst.map(strip)).toEqual(src.map(strip));
    // New lines, not the same rows.
    expect(dst.map((l: { id: string }) => l.id)).not.toContain(src[0].id);
  });

  it('copying from an empty day is 422 naming fromDate and leaves the target alone', async () => {
    const r = await c.leadA!.post(`${menu(NEXT)}/copy`, { fromDate: EMPTY });
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('fromDate');
    expect((await c.leadA!.get(menu(NEXT))).json.lines).toHaveLength(3);
    const bad = await c.leadA!.post(`${menu(NEXT)}/copy`, { fromDate: '14/12/2026' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.json.error.fields)).toContain('fromDate');
    expect((await c.cookA!.post(`${menu(NEXT)}/copy`, { fromDate: DAY })).status).toBe(403);
  });

  it('previews the batches: servings split by recipe size and the largest pot (hand calculation)', async () => {
    const r = await c.cookA!.get(`${menu(DAY)}/batches`);
    expect(r.status).toBe(200);
    const by = (name: string) => r.json.batches.filter((b: { dishName: string }) => b.dishName === name);

    // Porridge, 200 servings: recipe 120/batch; pot cap floor(40 L / 0.33 L) = 121 → 120 a batch;
    // ceil(200/120) = 2 batches of 100.
    expect(by('Porridge').map((b: { servings: number }) => b.servings)).toEqual([100, 100]);
    // Rice, 300 servings: recipe 130/batch; pot cap floor(40/0.3) = 133 → 130; ceil(300/130) = 3 batches of 100.
    expect(by('Rice').map((b: { servings: number }) => b.servings)).toEqual([100, 100, 100]);
    // Thick stew, 250 servings: recipe 120/batch but the largest pot (40 L) holds floor(40/0.5) = 80;
    // ceil(250/80) = 4 batches; 250 = 4·62 + 2 → 63, 63, 62, 62.
    const stew = by('Thick stew');
    expect(stew.map((b: { servings: number }) => b.servings)).toEqual([63, 63, 62, 62]);
    expect(stew.map((b: { index: number; of: number }) => `${b.index}/${b.of}`)).toEqual(['1/4', '2/4', '3/4', '4/4']);
    // Volume, masses and hold for the first stew batch: 63 × 0.5 L = 31.5 L; 63 × 0.2 kg = 12.6 kg each.
    expect(stew[0].potVolumeNeededL).toBeCloseTo(31.5, 9);
    expect(stew[0].foodKg).toBeCloseTo(12.6, 9);
    expect(stew[0].waterKg).toBeCloseTo(12.6, 9);
    expect(stew[0].holdS).toBe(45 * 60);
    expect(stew[0].minTempC).toBe(88);
    // Every batch fits the largest pot, and the servings add up per line.
    for (const b of r.json.batches) expect(b.potVolumeNeededL).toBeLessThanOrEqual(40);
    expect(r.json.batches.reduce((s: number, b: { servings: number }) => s + b.servings, 0)).toBe(200 + 300 + 250);
    // Times: the kitchen is in Africa/Ouagadougou (UTC+0); no earliest start → the shift start 06:00.
    expect(by('Porridge')[0].earliestStartMs).toBe(Date.parse(`${DAY}T07:00:00Z`));
    expect(by('Porridge')[0].serveByMs).toBe(Date.parse(`${DAY}T10:00:00Z`));
    expect(by('Rice')[0].earliestStartMs).toBe(Date.parse(`${DAY}T06:00:00Z`));
    expect(by('Rice')[0].serveByMs).toBe(Date.parse(`${DAY}T12:30:00Z`));
    // Batch ids are unique.
    const ids = r.json.batches.map((b: { id: string }) => b.id);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('the menu of a past day keeps its line after the dish is archived and a new dish takes its name', async () => {
    expect((await c.leadA!.del(`/api/v1/kitchens/${w.kitchenA.id}/dishes/${dish.Porridge}`)).status).toBe(204);
    const fresh = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/dishes`, { ...DISHES[2]!, holdMin: 25 });
    expect(fresh.status).toBe(201);
    const got = await c.leadA!.get(menu(DAY));
    expect(got.json.lines).toHaveLength(3);
    expect(got.json.lines[0].dishId).toBe(dish.Porridge);
  });
});
