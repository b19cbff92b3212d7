/**
 * POST /api/v1/simulations with an inline cooker on a custom storage medium (mediumId "custom" + customMediumId):
 * the medium is looked up among the viewer's organisations; unknown or foreign ids are refused naming the field.
 * Simulations are open to every signed-in member (cooks included; lib/auth/permissions.ts has no simulation action).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import { DEMO_COOKERS } from '../../lib/demo/cookers';

let w: World;
const c: Record<string, Client> = {};
let mediumId = '';
let otherMediumId = '';

// A sunflower-like oil table (values of the same order as lib/materials/oils.ts; common practice, no source).
const rows = [
  { tC: 20, density: 920, cp: 2000, k: 0.17, viscosity: 0.05 },
  { tC: 250, density: 770, cp: 2600, k: 0.14, viscosity: 0.002 },
];

const steps = (n: number, g = 800) =>
  Array.from({ length: n }, (_, i) => ({ t: new Date(Date.UTC(2026, 11, 3, 8) + i * 60_000).toISOString(), gApertureWm2: g, tAirC: 25 }));

const body = (customMediumId: string | undefined) => ({
  cooker: { ...structuredClone(DEMO_COOKERS.baobab![0]!), mediumId: 'custom', ...(customMediumId !== undefined ? { customMediumId } : {}), maxSafeTempC: 200 },
  weather: { kind: 'aperture', steps: steps(240) },
  initialStoreTempC: 100,
  altitudeM: 300,
});

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['leadA', 'cookA', 'leadB', 'otherLead'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
  const mine = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/media`, { name: 'Kitchen blend', rows, smokePointC: 230 });
  expect(mine.status).toBe(201);
  mediumId = mine.json.id;
  const theirs = await c.otherLead!.post(`/api/v1/kitchens/${w.otherKitchen.id}/media`, { name: 'Other blend', rows });
  expect(theirs.status).toBe(201);
  otherMediumId = theirs.json.id;
});
afterAll(closeTestOrm);

describe('inline simulation on a custom medium', () => {
  it('a lead simulates with the custom medium just defined: 200, the balance closes, the store warms in the sun', async () => {
    const r = await c.leadA!.post('/api/v1/simulations', body(mediumId));
    expect(r.status).toBe(200);
    expect(r.json.balance.relativeError).toBeLessThan(1e-3);
    const temps: number[] = r.json.series.storeTempC;
    expect(temps[temps.length - 1]).toBeGreaterThan(temps[0]! + 1);
  });

  it('the medium is shared across the organisation: a lead of kitchen B and a cook of kitchen A may simulate with it', async () => {
    expect((await c.leadB!.post('/api/v1/simulations', body(mediumId))).status).toBe(200);
    expect((await c.cookA!.post('/api/v1/simulations', body(mediumId))).status).toBe(200);
  });

  it.each([
    ['an unknown id', () => randomUUID()],
    ["another organisation's medium", () => otherMediumId],
  ])('refuses %s with 422 naming cooker.customMediumId', async (_what, id) => {
    const r = await c.leadA!.post('/api/v1/simulations', body(id()));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('cooker.customMediumId');
  });

  it('the other organisation can use its own medium but not ours', async () => {
    expect((await c.otherLead!.post('/api/v1/simulations', body(otherMediumId))).status).toBe(200);
    const r = await c.otherLead!.post('/api/v1/simulations', body(mediumId));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('cooker.customMediumId');
  });

  it('refuses mediumId "custom" without customMediumId, naming the field', async () => {
    const r = await c.leadA!.post('/api/v1/simulations', body(undefined));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('cooker.customMediumId');
  });

  it('refuses a customMediumId that is not a UUID, naming the field', async () => {
    const r = await c.leadA!.post('/api/v1/simulations', body('not-a-uuid'));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain('cooker.customMediumId');
  });
});
