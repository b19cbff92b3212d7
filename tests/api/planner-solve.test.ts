/**
 * POST /api/v1/planner/solve: a whole planning problem inline. One demo cooker (lib/demo/cookers.ts)
 * on 1-minute clear-sky aperture steps made with lib/solar (Ineichen–Perez 2002 clear sky →
 * aperture), a few batches; the answer's quality fields, the backup reasons, and validation.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import { DEMO_COOKERS } from '../../lib/demo/cookers';
import { clearSkyHourly, resolveWeatherToAperture, type Site } from '../../lib/solar';

let w: World;
let cook: Client;

beforeAll(async () => {
  w = await createWorld();
  cook = await new Client().signIn(w.emails.cookA, PASSWORD); // any signed-in user may solve inline problems
});
afterAll(closeTestOrm);

/** The test kitchens' place (tests/helpers/fixtures.ts): 12.37° N, 1.52° W, 300 m; UTC+0. */
const SITE: Site = { latitudeDeg: 12.37, longitudeDeg: -1.52, altitudeM: 300 };
const DAY0 = Date.UTC(2026, 11, 10); // 10 December 2026, 00:00 UTC
const at = (h: number, m = 0) => new Date(DAY0 + (h * 60 + m) * 60_000).toISOString();

const cooker = () => structuredClone(DEMO_COOKERS.baobab![0]!); // 5 m² two-axis dish, sunflower store, two 40 L pots

/** A day of 1-minute steps on the dish's aperture (two-axis tracking, beam only). */
function apertureDay() {
  const hourly = clearSkyHourly(SITE, DAY0, DAY0 + 24 * 3_600_000, { tAirC: { minC: 18, maxC: 32 } });
  const steps = resolveWeatherToAperture(SITE, { tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 0, beamOnly: true }, hourly, 60);
  return steps.map((s) => ({ t: new Date(s.t).toISOString(), gApertureWm2: s.gApertureWm2, tAirC: s.tAirC, ...(s.windMS !== undefined ? { windMS: s.windMS } : {}) }));
}
const WEATHER = apertureDay();

const batch = (id: string, patch: Record<string, unknown> = {}) => ({
  id,
  dishName: `Dish ${id}`,
  servings: 100,
  method: 'boil',
  potVolumeNeededL: 33,
  foodKg: 6,
  foodCpJPerKgK: 1800,
  waterKg: 25,
  minTempC: 90,
  holdMin: 20,
  lidOn: true,
  earliestStart: at(7),
  serveBy: at(12, 30),
  ...patch,
});

const problem = (patch: Record<string, unknown> = {}, cookerPatch: Record<string, unknown> = {}) => ({
  cookers: [{ id: 'dish-1', cooker: cooker(), initialStoreTempC: 120, weather: WEATHER, ...cookerPatch }],
  batches: [batch('b1', { serveBy: at(10) }), batch('b2', { servings: 120, waterKg: 30, potVolumeNeededL: 39 }), batch('b3', { method: 'simmer', minTempC: 88, earliestStart: at(12), serveBy: at(16) })],
  shifts: [{ start: at(6), end: at(19) }],
  turnaroundMin: 15,
  slotMinutes: 15,
  altitudeM: 300,
  timeLimitS: 1,
  timeZone: 'Africa/Ouagadougou',
  ...patch,
});

const solve = (body: unknown, client = cook) => client.post('/api/v1/planner/solve', body);

describe('POST /api/v1/planner/solve', () => {
  it('the aperture weather is a full day of 1-minute steps with night at both ends', () => {
    expect(WEATHER).toHaveLength(1440);
    expect(Date.parse(WEATHER[1]!.t) - Date.parse(WEATHER[0]!.t)).toBe(60_000);
    expect(WEATHER[0]!.gApertureWm2).toBe(0);
    expect(WEATHER[1439]!.gApertureWm2).toBe(0);
    expect(Math.max(...WEATHER.map((s) => s.gApertureWm2))).toBeGreaterThan(600); // clear-sky beam at noon, 12° N
  });

  it('solves a small problem: status, slots, bound ≥ servings on the sun, gap in [0, 1]', async () => {
    const r = await solve(problem());
    expect(r.status).toBe(200);
    const res = r.json;
    expect(['optimal', 'time-limit', 'converged', 'greedy-only']).toContain(res.status);
    expect(res.slots.length).toBeGreaterThanOrEqual(1);
    expect(res.upperBound).toBeGreaterThanOrEqual(res.servingsOnSun);
    expect(res.gap).toBeGreaterThanOrEqual(0);
    expect(res.gap).toBeLessThanOrEqual(1);
    expect(res.gap).toBeCloseTo(res.upperBound > 0 ? (res.upperBound - res.servingsOnSun) / res.upperBound : 0, 12);
    expect(res.greedyServings).toBeLessThanOrEqual(res.servingsOnSun); // the search never loses the greedy plan
    expect(typeof res.boundMethod).toBe('string');
    // Every batch once, placed or backup.
    expect([...res.slots.map((s: { batchId: string }) => s.batchId), ...res.backup.map((b: { batchId: string }) => b.batchId)].sort()).toEqual(['b1', 'b2', 'b3']);
    const servings: Record<string, number> = { b1: 100, b2: 120, b3: 100 };
    expect(res.servingsOnSun).toBe(res.slots.reduce((s: number, x: { batchId: string }) => s + servings[x.batchId]!, 0));
    const serveBy: Record<string, string> = { b1: at(10), b2: at(12, 30), b3: at(16) };
    const byPot = new Map<string, { startMs: number; doneMs: number }[]>();
    for (const s of res.slots) {
      expect(s.cookerId).toBe('dish-1');
      expect(['p1', 'p2']).toContain(s.potId);
      expect(s.readyMs).toBeGreaterThanOrEqual(s.startMs);
      expect(s.doneMs).toBeLessThanOrEqual(Date.parse(serveBy[s.batchId]!));
      expect(s.startMs % (15 * 60_000)).toBe(0); // on the 15-min grid
      expect(s.start).toBe(new Date(s.startMs).toISOString());
      expect(s.done).toBe(new Date(s.doneMs).toISOString());
      byPot.set(s.potId, [...(byPot.get(s.potId) ?? []), s]);
    }
    for (const list of byPot.values()) {
      list.sort((a, b) => a.startMs - b.startMs);
      for (let i = 1; i < list.length; i++) expect(list[i]!.startMs).toBeGreaterThanOrEqual(list[i - 1]!.doneMs + 15 * 60_000);
    }
  });

  it('a batch no cooker can heat before sunrise, from a cold store, goes to backup with the reason', async () => {
    const r = await solve(
      problem({
        batches: [
          // 06:00–06:30 is inside the shift and long enough for the hold, but the store is at 30 °C before sunrise.
          batch('dawn', { earliestStart: at(5), serveBy: at(6, 30), holdMin: 15 }),
          // 06:00–06:10 leaves no shift time for a 15-min hold at all.
          batch('too-early', { earliestStart: at(5), serveBy: at(6, 10), holdMin: 15 }),
          // 45 L fits neither 40 L pot.
          batch('too-big', { potVolumeNeededL: 45 }),
        ],
      }, { initialStoreTempC: 30 }),
    );
    expect(r.status).toBe(200);
    expect(r.json.slots).toEqual([]);
    expect(r.json.servingsOnSun).toBe(0);
    const reason = (id: string) => r.json.backup.find((b: { batchId: string }) => b.batchId === id);
    expect(reason('dawn')).toMatchObject({ reason: 'no-cooker-hot-enough' });
    expect(reason('dawn').detail).toMatch(/90 °C/); // what the dish needs, against the store it would find
    expect(reason('dawn').detail).toMatch(/06:30/);
    expect(reason('too-early')).toMatchObject({ reason: 'outside-shift' });
    expect(reason('too-early').detail).toMatch(/05:00.*06:10/); // between its earliest start and serve-by
    expect(reason('too-big')).toMatchObject({ reason: 'pot-too-small' });
    expect(reason('too-big').detail).toMatch(/45 L.*40 L/);
  });

  it('no batches: status empty', async () => {
    const r = await solve(problem({ batches: [] }));
    expect(r.status).toBe(200);
    expect(r.json).toMatchObject({ status: 'empty', slots: [], backup: [], servingsOnSun: 0, gap: 0 });
  });

  it('weather with a 2-minute gap is 422 naming cookers.0.weather.N.t', async () => {
    const N = 600;
    const gapped = [...WEATHER.slice(0, N), ...WEATHER.slice(N + 1)]; // step N (10:00) missing
    const r = await solve(problem({}, { weather: gapped }));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(`cookers.0.weather.${N}.t`);
    expect(r.json.error.fields[`cookers.0.weather.${N}.t`]).toMatch(/120 s/);
  });

  it.each([
    ['duplicate batch ids', { batches: [batch('b1'), batch('b1', { serveBy: at(16) })] }, 'batches.1.id'],
    ['serve-by before the earliest start', { batches: [batch('b1', { serveBy: at(6) })] }, 'batches.0.serveBy'],
    ['a shift that ends before it starts', { shifts: [{ start: at(19), end: at(6) }] }, 'shifts.0.end'],
    ['a time without its offset', { batches: [batch('b1', { serveBy: '2026-12-10T12:30:00' })] }, 'batches.0.serveBy'],
    ['an unknown method', { batches: [batch('b1', { method: 'grill' })] }, 'batches.0.method'],
    ['no cookers', { cookers: [] }, 'cookers'],
    ['a time limit of 10 minutes', { timeLimitS: 600 }, 'timeLimitS'],
  ])('%s is 422 naming %s', async (_what, patch, field) => {
    const r = await solve(problem(patch));
    expect(r.status).toBe(422);
    expect(Object.keys(r.json.error.fields)).toContain(field);
  });

  it('inputs only the planner can refuse are 422 with its message, not 500', async () => {
    // Steps 30 s off the minute: the schema sees even 60-s steps, the planner needs whole minutes.
    const shifted = WEATHER.map((s) => ({ ...s, t: new Date(Date.parse(s.t) + 30_000).toISOString() }));
    const r1 = await solve(problem({}, { weather: shifted }));
    expect(r1.status).toBe(422);
    expect(r1.json.error.message).toMatch(/whole minute/);
    // A batch with neither food nor water.
    const r2 = await solve(problem({ batches: [batch('b1', { foodKg: 0, waterKg: 0 })] }));
    expect(r2.status).toBe(422);
    expect(r2.json.error.message).toMatch(/foodKg \+ waterKg/);
    // An unknown time zone.
    const r3 = await solve(problem({ timeZone: 'Mars/Olympus_Mons' }));
    expect(r3.status).toBe(422);
    expect(r3.json.error.message).toMatch(/timeZone/);
  });

  it('401 without a session', async () => {
    expect((await solve(problem(), new Client())).status).toBe(401);
  });
});
