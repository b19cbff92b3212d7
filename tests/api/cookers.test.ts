/**
 * Cooker register over HTTP: role and kitchen guard, validation with the field named, the
 * prediction route and POST /api/v1/simulations.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import { DEMO_COOKERS } from '../../lib/demo/cookers';

let w: World;
const c: Record<string, Client> = {};
const valid = () => structuredClone(DEMO_COOKERS.baobab![0]!);

beforeAll(async () => {
  w = await createWorld();
  for (const who of ['coordinator', 'leadA', 'cookA', 'leadB', 'otherLead'] as const) c[who] = await new Client().signIn(w.emails[who], PASSWORD);
});
afterAll(closeTestOrm);

const base = () => `/api/v1/kitchens/${w.kitchenA.id}/cookers`;

describe('cooker register', () => {
  let cookerId = '';

  it('a kitchen lead registers a cooker; an audit event is written', async () => {
    const r = await c.leadA!.post(base(), valid());
    expect(r.status).toBe(201);
    expect(r.json.mediumName).toMatch(/Sunflower/);
    expect(r.json.pots).toHaveLength(2);
    cookerId = r.json.id;
    const list = await c.cookA!.get(base());
    expect(list.json.cookers.map((x: { id: string }) => x.id)).toContain(cookerId);
  });

  it.each([
    ['cookA', 403],
    ['coordinator', 403],
    ['leadB', 404],
    ['otherLead', 404],
  ] as const)('%s cannot register a cooker in kitchen A (%i)', async (who, status) => {
    expect((await c[who]!.post(base(), valid())).status).toBe(status);
  });

  it('ids that are not UUIDs are 404, not a database error', async () => {
    expect((await c.cookA!.get(`${base()}/${'0'.repeat(36)}`)).status).toBe(404);
    expect((await c.cookA!.get(`${base()}/${'-'.repeat(36)}`)).status).toBe(404);
    expect((await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/plans/abc/publish`, {})).status).toBe(404);
  });

  it('other kitchens cannot read it; its own cook can', async () => {
    expect((await c.leadB!.get(`${base()}/${cookerId}`)).status).toBe(404);
    expect((await c.otherLead!.get(`${base()}/${cookerId}`)).status).toBe(404);
    expect((await c.cookA!.get(`${base()}/${cookerId}`)).status).toBe(200);
    // The cooker id under another kitchen's path is not found either.
    expect((await c.leadB!.get(`/api/v1/kitchens/${w.kitchenB.id}/cookers/${cookerId}`)).status).toBe(404);
  });

  it.each([
    ['apertureM2', -2, 'apertureM2'],
    ['mediumId', 'whale-oil', 'mediumId'],
    ['eta0', 1.4, 'eta0'],
    ['maxSafeTempC', 260, 'maxSafeTempC'], // above the sunflower oil's recommended limit
    ['minUsefulTempC', 193, 'minUsefulTempC'], // not 5 °C below the safe limit
    ['pots', [], 'pots'],
    ['kind', 'rocket', 'kind'],
  ])('refuses %s = %j with 422 naming the field', async (field, value, named) => {
    const body = { ...valid(), [field]: value };
    const r = await c.leadA!.post(base(), body);
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(named);
  });

  it('an unknown medium error lists the known ones', async () => {
    const r = await c.leadA!.post(base(), { ...valid(), mediumId: 'whale-oil' });
    expect(r.json.error.fields.mediumId).toMatch(/sunflower-oil/);
  });

  it('edits and archives; a cook cannot', async () => {
    expect((await c.cookA!.patch(`${base()}/${cookerId}`, { name: 'X' })).status).toBe(403);
    const r = await c.leadA!.patch(`${base()}/${cookerId}`, { name: 'Dish renamed', storeMassKg: 200 });
    expect(r.status).toBe(200);
    expect(r.json.name).toBe('Dish renamed');
    expect(r.json.storeMassKg).toBe(200);
    // Regression: a PATCH that names only the name must not reset the loss coefficients to their defaults.
    expect(r.json.a1).toBe(0.6);
    expect(r.json.a2).toBe(0.002);
    const bad = await c.leadA!.patch(`${base()}/${cookerId}`, { minUsefulTempC: 194 });
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields).toHaveProperty('minUsefulTempC');
  });

  it('predicts a day: series cover 24 h, charge within 0–1, the energy balance closes within 0.1 %', async () => {
    const r = await c.cookA!.get(`${base()}/${cookerId}/prediction?date=2026-12-10`);
    expect(r.status).toBe(200);
    expect(r.json.date).toBe('2026-12-10');
    expect(r.json.series.t).toHaveLength(145); // 10-min step boundaries, local midnight to midnight
    expect(r.json.series.t[1] - r.json.series.t[0]).toBe(600_000);
    for (const q of r.json.series.charge) {
      expect(q).toBeGreaterThanOrEqual(0);
      expect(q).toBeLessThanOrEqual(1);
    }
    expect(r.json.balance.relativeError).toBeLessThan(1e-3);
    // Night: no sun on the aperture at local midnight (the kitchen is at 12° N in UTC+0).
    expect(r.json.series.gApertureWm2[0]).toBe(0);
    // Daytime sun on the aperture: clear sky × the kitchen's default December clearness (no forecast stored).
    expect(Math.max(...r.json.series.gApertureWm2)).toBeGreaterThan(200);
    expect(r.json.source).toBe('clear-sky');
    const bad = await c.cookA!.get(`${base()}/${cookerId}/prediction?date=10-12-2026`);
    expect(bad.status).toBe(422);
    expect(bad.json.error.fields).toHaveProperty('date');
  });

  it('custom media: a lead defines one from a table; unsorted rows are refused with the row named', async () => {
    const rows = [
      { tC: 20, density: 900, cp: 2000, k: 0.17, viscosity: 0.05 },
      { tC: 200, density: 800, cp: 2500, k: 0.15, viscosity: 0.003 },
    ];
    const ok = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/media`, { name: 'Local blend', rows, smokePointC: 230 });
    expect(ok.status).toBe(201);
    const media = await c.leadB!.get(`/api/v1/kitchens/${w.kitchenB.id}/media`);
    expect(media.json.media.map((m: { name: string }) => m.name)).toContain('Local blend'); // shared across the organisation
    const other = await c.otherLead!.get(`/api/v1/kitchens/${w.otherKitchen.id}/media`);
    expect(other.json.media.map((m: { name: string }) => m.name)).not.toContain('Local blend');
    const bad = await c.leadA!.post(`/api/v1/kitchens/${w.kitchenA.id}/media`, { name: 'Bad', rows: [rows[1], rows[0]] });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.json.error.fields)).toContain('rows.1.tC');
    const withCustom = await c.leadA!.post(base(), { ...valid(), mediumId: 'custom', customMediumId: ok.json.id, maxSafeTempC: 190 });
    expect(withCustom.status).toBe(201);
    expect(withCustom.json.mediumName).toBe('Local blend');
  });
});

describe('POST /api/v1/simulations', () => {
  const steps = (n: number, stepS = 60, g = 800) =>
    Array.from({ length: n }, (_, i) => ({ t: new Date(Date.UTC(2026, 11, 3, 8) + i * stepS * 1000).toISOString(), gApertureWm2: g, tAirC: 25 }));

  it('runs an inline cooker on aperture steps and closes the energy balance', async () => {
    const r = await c.cookA!.post('/api/v1/simulations', { cooker: valid(), weather: { kind: 'aperture', steps: steps(240) }, initialStoreTempC: 100, altitudeM: 300 });
    expect(r.status).toBe(200);
    expect(r.json.balance.relativeError).toBeLessThan(1e-3);
    const temps: number[] = r.json.series.storeTempC;
    expect(temps[temps.length - 1]).toBeGreaterThan(temps[0]!); // 4 h of strong sun warm the store
  });

  it('runs a stored cooker by id with hourly weather at its kitchen', async () => {
    const list = await c.leadA!.get(base());
    const id = list.json.cookers[0].id;
    const hours = Array.from({ length: 24 }, (_, h) => ({ t: new Date(Date.UTC(2026, 11, 3, h)).toISOString(), cloudOkta: 2, tAirC: 28 }));
    const r = await c.cookA!.post('/api/v1/simulations', { cookerId: id, weather: { kind: 'hourly', hours }, initialStoreTempC: 120 });
    expect(r.status).toBe(200);
    expect(r.json.series.storeTempC.length).toBeGreaterThan(100);
    // Another organisation cannot run it (no leak of existence).
    const other = await c.otherLead!.post('/api/v1/simulations', { cookerId: id, weather: { kind: 'hourly', hours }, initialStoreTempC: 120 });
    expect(other.status).toBe(404);
  });

  it.each([
    ['a negative area', 'cooker.apertureM2', { cooker: { ...valid(), apertureM2: -1 } }],
    ['an unknown medium', 'cooker.mediumId', { cooker: { ...valid(), mediumId: 'lard' } }],
    ['an unsorted series', 'weather.steps.1.t', { weather: { kind: 'aperture', steps: [...steps(3)].reverse() } }],
    ['a gapped series', 'weather.steps.3.t', { weather: { kind: 'aperture', steps: [...steps(3), ...steps(8).slice(5)] } }],
    ['negative irradiance', 'weather.steps.0.gApertureWm2', { weather: { kind: 'aperture', steps: steps(3, 60, -5) } }],
    ['no cooker at all', 'cooker', { cooker: undefined }],
    ['a pot the cooker lacks', 'loads.0.potId', { loads: [{ id: 'b1', potId: 'nope', start: steps(1)[0]!.t, foodKg: 1, waterKg: 5, minTempC: 90, holdS: 600, maxEnd: steps(240)[239]!.t }] }],
  ] as const)('refuses %s with 422 naming %s', async (_what, field, patch) => {
    const body = { cooker: valid(), weather: { kind: 'aperture', steps: steps(240) }, initialStoreTempC: 100, ...patch };
    const r = await c.cookA!.post('/api/v1/simulations', body);
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(field);
  });

  it('401 without a session', async () => {
    expect((await new Client().post('/api/v1/simulations', {})).status).toBe(401);
  });
});
