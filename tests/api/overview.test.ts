/**
 * The coordinator's overview over HTTP: per kitchen, the published plan (or else the draft) with
 * servings on the sun and on backup fuel and the fuel totals; organisation totals that are the sums
 * of the kitchens' numbers; the role guard and the date validation.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { addDemoCookers, addDishLibrary, createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import type { DishInput } from '../../lib/validations/dishes';

let w: World;
const c: Record<string, Client> = {};
let dish: Record<string, string> = {};
const DAY = '2026-12-16';

/** Invented dishes (plausible values; common practice, no source). */
const DISHES: DishInput[] = [
  { name: 'Porridge', method: 'boil', servingsPerBatch: 120, foodKgPerServing: 0.06, waterKgPerServing: 0.25, foodCpJPerKgK: 1800, litresPerServing: 0.33, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Rice', method: 'boil', servingsPerBatch: 130, foodKgPerServing: 0.08, waterKgPerServing: 0.16, foodCpJPerKgK: 1800, litresPerServing: 0.3, minPotTempC: 90, holdMin: 20, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Sweet tea', method: 'boil', servingsPerBatch: 100, foodKgPerServing: 0.02, waterKgPerServing: 0.25, foodCpJPerKgK: 1800, litresPerServing: 0.3, minPotTempC: 90, holdMin: 15, safeCoreTempC: 74, lidOn: true, backupStove: 'lpg', notes: null },
  { name: 'Early beans', method: 'simmer', servingsPerBatch: 100, foodKgPerServing: 0.15, waterKgPerServing: 0.2, foodCpJPerKgK: 3300, litresPerServing: 0.4, minPotTempC: 88, holdMin: 30, safeCoreTempC: 74, lidOn: true, backupStove: 'three-stone-wood', notes: null },
];

// The overview and plans as the API returns them (JSON).
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type J = Record<string, any>;
const plans: Record<string, J> = {};

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'leadB', 'otherCoordinator'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
  await addDemoCookers(w.kitchenA, 'baobab');
  await addDemoCookers(w.kitchenB, 'tamarind');
  dish = await addDishLibrary(w.org, DISHES);
  // Kitchen A buys LPG at a local price; kitchen B keeps the defaults (no prices: cost unknown).
  const s = await c.leadA!.request('PUT', `/api/v1/kitchens/${w.kitchenA.id}/planning-settings`, {
    shiftStart: '06:00',
    shiftEnd: '19:00',
    turnaroundMin: 15,
    currency: 'XOF',
    fuels: [{ stoveId: 'lpg', price: 1000 }, { stoveId: 'three-stone-wood', price: 100 }],
  });
  if (s.status !== 200) throw new Error(`settings: ${s.status} ${s.text}`);
  // Each menu has batches for the sun and two that only backup fuel can serve (06:10, inside the
  // first 10 minutes of the shift): tea on LPG and beans on a three-stone wood fire.
  const menu = (extraRice: number) => [
    { dishId: dish.Porridge!, servings: 120, serveBy: '10:00', earliestStart: '07:00' },
    { dishId: dish.Rice!, servings: 130 + extraRice, serveBy: '12:30' },
    { dishId: dish['Sweet tea']!, servings: 80, serveBy: '06:10' },
    { dishId: dish['Early beans']!, servings: 60, serveBy: '06:10' },
  ];
  const solve = async (lead: Client, kitchenId: string) => {
    const r = await lead.post(`/api/v1/kitchens/${kitchenId}/plans`, { date: DAY, timeLimitS: 1 });
    if (r.status !== 201) throw new Error(`solve: ${r.status} ${r.text}`);
    return r.json;
  };
  const putMenu = async (lead: Client, kitchenId: string, lines: unknown[]) => {
    const r = await lead.request('PUT', `/api/v1/kitchens/${kitchenId}/menus/${DAY}`, { lines });
    if (r.status !== 200) throw new Error(`menu: ${r.status} ${r.text}`);
  };
  // A: published, then the menu grows and a new draft is solved (the overview must keep showing the published plan).
  await putMenu(c.leadA!, w.kitchenA.id, menu(0));
  const draftA = await solve(c.leadA!, w.kitchenA.id);
  const pub = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/plans/${draftA.id}/publish`);
  if (pub.status !== 200) throw new Error(`publish: ${pub.status} ${pub.text}`);
  plans.A = pub.json;
  await putMenu(c.leadA!, w.kitchenA.id, menu(120));
  plans.Adraft = await solve(c.leadA!, w.kitchenA.id);
  // B: a draft only.
  await putMenu(c.leadB!, w.kitchenB.id, menu(0));
  plans.B = await solve(c.leadB!, w.kitchenB.id);
});
afterAll(closeTestOrm);

const overview = (client: Client, date: string) => client.get(`/api/v1/organisation/overview?date=${date}`);
const rel = (a: number, b: number) => (b === 0 ? Math.abs(a) : Math.abs(a - b) / Math.abs(b));
const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);

describe('organisation overview', () => {
  let ov: J;

  it('a coordinator gets one row per kitchen: A shows its published plan, B its draft', async () => {
    const r = await overview(c.coordinator!, DAY);
    expect(r.status).toBe(200);
    ov = r.json;
    expect(ov.date).toBe(DAY);
    expect(ov.kitchens.map((k: J) => k.kitchenId).sort()).toEqual([w.kitchenA.id, w.kitchenB.id].sort());
    const rowA = ov.kitchens.find((k: J) => k.kitchenId === w.kitchenA.id);
    const rowB = ov.kitchens.find((k: J) => k.kitchenId === w.kitchenB.id);
    expect(rowA.plan).toMatchObject({ id: plans.A!.id, status: 'published', version: 1 });
    expect(rowA.plan.id).not.toBe(plans.Adraft!.id);
    expect(rowB.plan).toMatchObject({ id: plans.B!.id, status: 'draft' });
  });

  it("per kitchen, servings on the sun and on backup and the fuel equal the kitchen's plan", async () => {
    for (const [key, kitchenId] of [['A', w.kitchenA.id], ['B', w.kitchenB.id]] as const) {
      const plan = plans[key]!;
      const row = ov.kitchens.find((k: J) => k.kitchenId === kitchenId).plan;
      const backupIds = new Set(plan.result.backup.map((b: J) => b.batchId));
      const servingsOf = (pred: (b: J) => boolean) => sum(plan.batches.filter(pred).map((b: J) => b.servings));
      expect(row.servingsOnSun).toBe(plan.result.servingsOnSun);
      expect(row.servingsBackup).toBe(servingsOf((b) => backupIds.has(b.id)));
      expect(row.servingsTotal).toBe(servingsOf(() => true));
      expect(row.servingsOnSun + row.servingsBackup).toBe(row.servingsTotal);
      // The two 06:10 batches are on backup in both kitchens, with their dish names and reasons.
      expect(row.backupDishes.map((d: J) => d.dishName)).toEqual(expect.arrayContaining(['Sweet tea', 'Early beans']));
      for (const d of row.backupDishes) expect(d.reason).toBeTruthy();
      // The fuel is the plan's, and its totals are the sums over the backup batches.
      expect(row.fuel).toEqual(plan.fuel);
      const per = plan.fuel.perBatch as J[];
      expect(per.map((p) => p.batchId).sort()).toEqual([...backupIds].sort());
      for (const fuelId of ['lpg', 'wood']) {
        const amounts = per.filter((p) => p.fuelId === fuelId).map((p) => p.amount);
        expect(amounts.length).toBeGreaterThan(0);
        expect(rel(row.fuel.byFuel[fuelId].amount, sum(amounts))).toBeLessThan(1e-9);
      }
      expect(rel(row.fuel.total.co2Kg, sum(per.map((p) => p.co2Kg)))).toBeLessThan(1e-9);
      expect(rel(row.fuel.total.co2BiogenicKg, sum(per.map((p) => p.co2BiogenicKg)))).toBeLessThan(1e-9);
      expect(row.fuel.total.co2BiogenicKg).toBeGreaterThan(0); // the beans burn wood
    }
  });

  it('the organisation totals are the sums of the kitchens', async () => {
    const rows = ov.kitchens.map((k: J) => k.plan).filter(Boolean) as J[];
    const t = ov.totals;
    expect(t.servingsTotal).toBe(sum(rows.map((r) => r.servingsTotal)));
    expect(t.servingsOnSun).toBe(sum(rows.map((r) => r.servingsOnSun)));
    expect(t.servingsBackup).toBe(sum(rows.map((r) => r.servingsBackup)));
    expect(rel(t.co2Kg, sum(rows.map((r) => r.fuel.total.co2Kg)))).toBeLessThan(1e-9);
    expect(rel(t.co2BiogenicKg, sum(rows.map((r) => r.fuel.total.co2BiogenicKg)))).toBeLessThan(1e-9);
    for (const fuelId of ['lpg', 'wood']) {
      expect(rel(t.byFuel[fuelId].amount, sum(rows.map((r) => r.fuel.byFuel[fuelId]?.amount ?? 0)))).toBeLessThan(1e-9);
      expect(t.byFuel[fuelId].unit).toBe('kg');
    }
    expect(rel(t.woodAllKg, sum(rows.map((r) => r.fuel.allOnWood.woodKg)))).toBeLessThan(1e-9);
    // Cost only where it is known: kitchen A pays in XOF; kitchen B has no prices.
    const rowA = rows.find((r) => r.id === plans.A!.id)!;
    const rowB = rows.find((r) => r.id === plans.B!.id)!;
    expect(rowB.fuel.total.cost).toBeNull();
    expect(rowA.fuel.total.cost).toBeGreaterThan(0);
    expect(t.costByCurrency).toEqual({ XOF: rowA.fuel.total.cost });
  });

  it('a day without plans lists the kitchens with no plan and zero totals', async () => {
    const r = await overview(c.coordinator!, '2026-12-30');
    expect(r.status).toBe(200);
    expect(r.json.kitchens.map((k: J) => k.plan)).toEqual([null, null]);
    expect(r.json.totals).toMatchObject({ servingsTotal: 0, servingsOnSun: 0, co2Kg: 0 });
  });

  it('another organisation’s coordinator sees only their own kitchens', async () => {
    const r = await overview(c.otherCoordinator!, DAY);
    expect(r.status).toBe(200);
    expect(r.json.kitchens.map((k: J) => k.kitchenId)).toEqual([w.otherKitchen.id]);
    expect(r.json.kitchens[0].plan).toBeNull();
  });

  it.each(['leadA', 'cookA', 'leadB'] as const)('%s gets 403', async (who) => {
    expect((await overview(c[who]!, DAY)).status).toBe(403);
  });

  it('401 without a session', async () => {
    expect((await overview(new Client(), DAY)).status).toBe(401);
  });

  it.each([['16-12-2026'], ['2026-02-30'], ['2026-02-30x'], ['tomorrow'], ['']])('a bad date %j is 422 naming date', async (date) => {
    const r = await overview(c.coordinator!, date);
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('date');
  });

  it('a missing date or an unknown parameter is 422 naming it', async () => {
    const none = await c.coordinator!.get('/api/v1/organisation/overview');
    expect(none.status).toBe(422);
    expect(Object.keys(none.json.error.fields)).toContain('date');
    const extra = await c.coordinator!.get(`/api/v1/organisation/overview?date=${DAY}&kitchen=all`);
    expect(extra.status).toBe(422);
    expect(Object.keys(extra.json.error.fields)).toContain('kitchen');
  });
});
