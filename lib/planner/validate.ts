/**
 * Structural checks of a PlannerProblem. The API layer validates shapes with zod; this catches
 * what would make the planner meaningless and names the field in a RangeError.
 */
import type { PlannerProblem } from './types';

const METHODS = ['boil', 'simmer', 'steam', 'bake', 'fry'];
/** Weather step the planner expects [ms] (60-s steps). */
export const STEP_MS = 60_000;

function finite(field: string, v: unknown, min = -Infinity, max = Infinity): void {
  if (typeof v !== 'number' || !Number.isFinite(v) || v < min || v > max) {
    const range = min > -Infinity && max < Infinity ? ` in [${min}, ${max}]` : min > -Infinity ? ` ≥ ${min}` : max < Infinity ? ` ≤ ${max}` : '';
    throw new RangeError(`${field} must be a finite number${range}, got ${String(v)}`);
  }
}

export function validateProblem(p: PlannerProblem): void {
  if (!p || typeof p !== 'object') throw new RangeError('problem must be an object');
  if (!Array.isArray(p.cookers)) throw new RangeError('cookers must be an array');
  if (!Array.isArray(p.batches)) throw new RangeError('batches must be an array');
  if (!Array.isArray(p.shifts)) throw new RangeError('shifts must be an array');
  finite('turnaroundS', p.turnaroundS, 0, 86_400);
  if (p.slotMinutes !== undefined) {
    finite('slotMinutes', p.slotMinutes, 1, 240);
    if (!Number.isInteger(p.slotMinutes)) throw new RangeError(`slotMinutes must be a whole number of minutes, got ${p.slotMinutes}`);
  }
  finite('altitudeM', p.altitudeM, -500, 9000);
  finite('timeLimitS', p.timeLimitS, 0, 3600);
  if (p.seed !== undefined) finite('seed', p.seed);
  if (p.timeZone !== undefined) {
    try {
      new Intl.DateTimeFormat('en-GB', { timeZone: p.timeZone });
    } catch {
      throw new RangeError(`timeZone must be an IANA time zone, got ${String(p.timeZone)}`);
    }
  }

  const cookerIds = new Set<string>();
  p.cookers.forEach((c, i) => {
    const f = `cookers[${i}]`;
    if (typeof c.id !== 'string' || c.id === '') throw new RangeError(`${f}.id must be a non-empty string`);
    if (cookerIds.has(c.id)) throw new RangeError(`${f}.id "${c.id}" is used twice`);
    cookerIds.add(c.id);
    finite(`${f}.initialStoreTempC`, c.initialStoreTempC, -50, 400);
    if (!c.spec || !Array.isArray(c.spec.pots)) throw new RangeError(`${f}.spec.pots must be an array`);
    const potIds = new Set<string>();
    c.spec.pots.forEach((pot, j) => {
      if (typeof pot.id !== 'string' || pot.id === '') throw new RangeError(`${f}.spec.pots[${j}].id must be a non-empty string`);
      if (potIds.has(pot.id)) throw new RangeError(`${f}.spec.pots[${j}].id "${pot.id}" is used twice`);
      potIds.add(pot.id);
      finite(`${f}.spec.pots[${j}].volumeL`, pot.volumeL, 0);
    });
    if (!c.spec.store) throw new RangeError(`${f}.spec.store is missing`);
    finite(`${f}.spec.store.maxSafeTempC`, c.spec.store.maxSafeTempC, 0, 500);
    if (!Array.isArray(c.weather) || c.weather.length < 2) throw new RangeError(`${f}.weather must have at least two 60-s steps`);
    const t0 = c.weather[0]?.t as number;
    finite(`${f}.weather[0].t`, t0);
    if (t0 % STEP_MS !== 0) throw new RangeError(`${f}.weather[0].t must fall on a whole minute`);
    for (let k = 0; k < c.weather.length; k++) {
      const w = c.weather[k];
      if (!w || w.t !== t0 + k * STEP_MS) throw new RangeError(`${f}.weather[${k}].t must be ${t0 + k * STEP_MS} (contiguous 60-s steps)`);
      if (!Number.isFinite(w.gApertureWm2) || w.gApertureWm2 < 0) throw new RangeError(`${f}.weather[${k}].gApertureWm2 must be ≥ 0`);
      if (!Number.isFinite(w.tAirC)) throw new RangeError(`${f}.weather[${k}].tAirC must be a finite number`);
    }
  });

  const batchIds = new Set<string>();
  p.batches.forEach((b, i) => {
    const f = `batches[${i}]`;
    if (typeof b.id !== 'string' || b.id === '') throw new RangeError(`${f}.id must be a non-empty string`);
    if (batchIds.has(b.id)) throw new RangeError(`${f}.id "${b.id}" is used twice`);
    batchIds.add(b.id);
    finite(`${f}.servings`, b.servings, 0);
    if (!METHODS.includes(b.method)) throw new RangeError(`${f}.method must be one of ${METHODS.join(', ')}, got ${String(b.method)}`);
    finite(`${f}.potVolumeNeededL`, b.potVolumeNeededL, 0);
    finite(`${f}.foodKg`, b.foodKg, 0);
    finite(`${f}.foodCpJPerKgK`, b.foodCpJPerKgK, 0);
    finite(`${f}.waterKg`, b.waterKg, 0);
    if (b.foodKg + b.waterKg <= 0) throw new RangeError(`${f}: foodKg + waterKg must be > 0`);
    finite(`${f}.minTempC`, b.minTempC, 0, 400);
    finite(`${f}.holdS`, b.holdS, 0, 86_400);
    if (typeof b.lidOn !== 'boolean') throw new RangeError(`${f}.lidOn must be true or false`);
    finite(`${f}.earliestStartMs`, b.earliestStartMs);
    finite(`${f}.serveByMs`, b.serveByMs);
    if (b.serveByMs <= b.earliestStartMs) throw new RangeError(`${f}.serveByMs must be after earliestStartMs`);
    if (b.fixed) {
      const c = p.cookers.find((x) => x.id === b.fixed?.cookerId);
      if (!c) throw new RangeError(`${f}.fixed.cookerId "${b.fixed.cookerId}" is not a cooker of this problem`);
      if (!c.spec.pots.some((pot) => pot.id === b.fixed?.potId)) throw new RangeError(`${f}.fixed.potId "${b.fixed.potId}" is not a pot of cooker ${c.id}`);
      finite(`${f}.fixed.startMs`, b.fixed.startMs);
      if (b.fixed.doneMs !== undefined) finite(`${f}.fixed.doneMs`, b.fixed.doneMs);
      if (b.fixed.contentsTempC !== undefined) finite(`${f}.fixed.contentsTempC`, b.fixed.contentsTempC, -50, 400);
    }
  });

  p.shifts.forEach((s, i) => {
    finite(`shifts[${i}].startMs`, s.startMs);
    finite(`shifts[${i}].endMs`, s.endMs);
    if (s.endMs <= s.startMs) throw new RangeError(`shifts[${i}].endMs must be after startMs`);
  });
  if (p.batches.some((b) => !b.fixed) && p.shifts.length === 0) throw new RangeError('shifts must list at least one shift');
}
