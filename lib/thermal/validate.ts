/**
 * Input checks for simulateCooker. Every failure is a RangeError whose message starts with the offending field
 * (e.g. "collector.apertureM2", "weather[12].t", "loads[3].potId") so the API can return it as a 422 issue.
 */
import { createCustomMedium } from '../materials/custom';
import { getMedium, hasMedium, listMediumIds } from '../materials/registry';
import type { StorageMedium } from '../materials/types';
import type { CookerSpec, SimulateOptions, StoreSpec, WeatherStep } from './types';

/** Largest number of store layers accepted (performance guard; 10 is plenty for the physics). */
export const MAX_STORE_NODES = 200;
/** Altitude range of the ISA troposphere formula used for the boiling point [m]. */
export const ALTITUDE_RANGE_M = { min: -500, max: 11000 } as const;

/** True for a finite number (no NaN, no ±Infinity). */
function isFiniteNumber(v: unknown): v is number {
  return typeof v === 'number' && Number.isFinite(v);
}
/** The value if finite, else a RangeError naming the field; nonNegative and positive add their bound. */
function finite(v: unknown, field: string): number {
  if (typeof v !== 'number' || !Number.isFinite(v)) throw new RangeError(`${field} must be a finite number (got ${String(v)})`);
  return v;
}
function nonNegative(v: unknown, field: string): number {
  const x = finite(v, field);
  if (x < 0) throw new RangeError(`${field} must not be negative (got ${x})`);
  return x;
}
function positive(v: unknown, field: string): number {
  const x = finite(v, field);
  if (!(x > 0)) throw new RangeError(`${field} must be positive (got ${x})`);
  return x;
}

/**
 * The store's medium: a built-in one by id, or the inline custom table when mediumId === 'custom'.
 * @throws RangeError naming store.mediumId and listing the known ids
 */
export function resolveStoreMedium(store: StoreSpec): StorageMedium {
  if (store.mediumId === 'custom') {
    if (store.customTable === undefined) {
      throw new RangeError('store.customTable is required when store.mediumId is "custom"');
    }
    return createCustomMedium(store.customTable, 'custom', 'store.customTable');
  }
  if (typeof store.mediumId !== 'string' || !hasMedium(store.mediumId)) {
    throw new RangeError(
      `store.mediumId: unknown storage medium "${String(store.mediumId)}"; known ids: ${listMediumIds().join(', ')}, or "custom" with store.customTable`,
    );
  }
  return getMedium(store.mediumId);
}

export interface ResolvedSimulation {
  medium: StorageMedium;
  /** Step [s]. */
  stepS: number;
  /** Store layers (1 = well mixed). */
  nodes: number;
}

/**
 * Validate the cooker, weather and options; resolve the medium, the step and the number of store layers.
 * stepS: opts.stepS when given (it must equal the weather spacing); otherwise the weather spacing; 60 s for a single
 * weather step.
 * @throws RangeError naming the field
 */
export function validateSimulationInputs(spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions): ResolvedSimulation {
  if (spec === null || typeof spec !== 'object') throw new RangeError('spec must be a CookerSpec object');
  const c = spec.collector;
  if (c === null || typeof c !== 'object') throw new RangeError('collector is required');
  if (c.model !== 'iso9806' && c.model !== 'lumped') {
    throw new RangeError(`collector.model must be "iso9806" or "lumped" (got ${String((c as { model?: unknown }).model)})`);
  }
  nonNegative(c.apertureM2, 'collector.apertureM2');
  const eta0 = nonNegative(c.eta0, 'collector.eta0');
  if (eta0 > 1) throw new RangeError(`collector.eta0 must be at most 1 (got ${eta0})`);
  if (c.model === 'iso9806') {
    nonNegative(c.a1, 'collector.a1');
    nonNegative(c.a2, 'collector.a2');
  } else {
    nonNegative(c.uLossWPerK, 'collector.uLossWPerK');
  }

  const s = spec.store;
  if (s === null || typeof s !== 'object') throw new RangeError('store is required');
  const medium = resolveStoreMedium(s);
  positive(s.massKg, 'store.massKg');
  nonNegative(s.uaLossWPerK, 'store.uaLossWPerK');
  if (s.uaWindWPerKPerMS !== undefined) nonNegative(s.uaWindWPerKPerMS, 'store.uaWindWPerKPerMS');
  const nodes = s.nodes ?? 1;
  if (!Number.isInteger(nodes) || nodes < 1 || nodes > MAX_STORE_NODES) {
    throw new RangeError(`store.nodes must be an integer from 1 to ${MAX_STORE_NODES} (got ${String(nodes)})`);
  }
  const maxSafe = finite(s.maxSafeTempC, 'store.maxSafeTempC');
  const minUseful = finite(s.minUsefulTempC, 'store.minUsefulTempC');
  if (!(maxSafe > minUseful)) {
    throw new RangeError(`store.maxSafeTempC (${maxSafe}) must be above store.minUsefulTempC (${minUseful})`);
  }

  if (!Array.isArray(spec.pots)) throw new RangeError('pots must be an array (possibly empty)');
  const potIds = new Set<string>();
  spec.pots.forEach((p, i) => {
    const f = `pots[${i}]`;
    if (typeof p.id !== 'string' || p.id === '') throw new RangeError(`${f}.id must be a non-empty string`);
    if (potIds.has(p.id)) throw new RangeError(`${f}.id "${p.id}" is used by another pot`);
    potIds.add(p.id);
    positive(p.volumeL, `${f}.volumeL`);
    nonNegative(p.massKg, `${f}.massKg`);
    positive(p.cpJPerKgK, `${f}.cpJPerKgK`);
    nonNegative(p.lidAreaM2, `${f}.lidAreaM2`);
    nonNegative(p.lidUWPerM2K, `${f}.lidUWPerM2K`);
    const cp = p.coupling;
    if (cp?.kind === 'constant') nonNegative(cp.uaWPerK, `${f}.coupling.uaWPerK`);
    else if (cp?.kind === 'natural-convection') positive(cp.contactAreaM2, `${f}.coupling.contactAreaM2`);
    else throw new RangeError(`${f}.coupling.kind must be "constant" or "natural-convection"`);
  });

  if (!Array.isArray(weather) || weather.length === 0) throw new RangeError('weather must contain at least one step');
  let spacingMs = Number.NaN;
  // The weather loop runs for every step of every simulation: field names are only built when a check fails.
  for (let i = 0; i < weather.length; i++) {
    const w = weather[i]!;
    if (!isFiniteNumber(w.t)) finite(w.t, `weather[${i}].t`);
    if (!(isFiniteNumber(w.gApertureWm2) && w.gApertureWm2 >= 0)) nonNegative(w.gApertureWm2, `weather[${i}].gApertureWm2`);
    if (!isFiniteNumber(w.tAirC)) finite(w.tAirC, `weather[${i}].tAirC`);
    if (w.windMS !== undefined && !(isFiniteNumber(w.windMS) && w.windMS >= 0)) nonNegative(w.windMS, `weather[${i}].windMS`);
    if (i > 0) {
      const dt = w.t - weather[i - 1]!.t;
      if (!(dt > 0)) throw new RangeError(`weather[${i}].t must be later than weather[${i - 1}].t (steps sorted by time)`);
      if (i === 1) spacingMs = dt;
      else if (dt !== spacingMs) {
        throw new RangeError(
          `weather[${i}].t: steps must be contiguous and evenly spaced by ${spacingMs} ms (found ${dt} ms: a gap or an uneven step)`,
        );
      }
    }
  }
  let stepS: number;
  if (opts.stepS !== undefined) {
    stepS = positive(opts.stepS, 'opts.stepS');
    if (weather.length > 1 && Math.abs(stepS * 1000 - spacingMs) > 1e-6) {
      throw new RangeError(`opts.stepS (${stepS} s) must equal the weather step spacing (${spacingMs / 1000} s)`);
    }
  } else {
    stepS = weather.length > 1 ? spacingMs / 1000 : 60;
  }
  finite(opts.initialStoreTempC, 'opts.initialStoreTempC');
  const alt = finite(opts.altitudeM, 'opts.altitudeM');
  if (alt < ALTITUDE_RANGE_M.min || alt > ALTITUDE_RANGE_M.max) {
    throw new RangeError(`opts.altitudeM must be within ${ALTITUDE_RANGE_M.min}…${ALTITUDE_RANGE_M.max} m (got ${alt})`);
  }

  const loads = opts.loads ?? [];
  if (!Array.isArray(loads)) throw new RangeError('opts.loads must be an array');
  const loadIds = new Set<string>();
  const byPot = new Map<string, number[]>();
  loads.forEach((l, i) => {
    const f = `loads[${i}]`;
    if (typeof l.id !== 'string' || l.id === '') throw new RangeError(`${f}.id must be a non-empty string`);
    if (loadIds.has(l.id)) throw new RangeError(`${f}.id "${l.id}" is used by another load`);
    loadIds.add(l.id);
    if (!potIds.has(l.potId)) {
      throw new RangeError(`${f}.potId: unknown pot "${String(l.potId)}"; pots: ${[...potIds].join(', ') || '(none)'}`);
    }
    const start = finite(l.startMs, `${f}.startMs`);
    const end = finite(l.maxEndMs, `${f}.maxEndMs`);
    if (!(end > start)) throw new RangeError(`${f}.maxEndMs must be after ${f}.startMs`);
    nonNegative(l.foodKg, `${f}.foodKg`);
    positive(l.foodCpJPerKgK, `${f}.foodCpJPerKgK`);
    nonNegative(l.waterKg, `${f}.waterKg`);
    if (l.initialTempC !== undefined) finite(l.initialTempC, `${f}.initialTempC`);
    finite(l.minTempC, `${f}.minTempC`);
    nonNegative(l.holdS, `${f}.holdS`);
    if (typeof l.lidOn !== 'boolean') throw new RangeError(`${f}.lidOn must be true or false`);
    const pot = spec.pots.find((p) => p.id === l.potId)!;
    if (pot.massKg * pot.cpJPerKgK + l.foodKg * l.foodCpJPerKgK + l.waterKg <= 0) {
      throw new RangeError(`${f}: the pot and its contents have no heat capacity (foodKg, waterKg and pot massKg are all 0)`);
    }
    const list = byPot.get(l.potId) ?? [];
    list.push(i);
    byPot.set(l.potId, list);
  });
  for (const [potId, idx] of byPot) {
    idx.sort((a, b) => loads[a]!.startMs - loads[b]!.startMs);
    for (let j = 1; j < idx.length; j++) {
      const prev = loads[idx[j - 1]!]!;
      const cur = loads[idx[j]!]!;
      if (cur.startMs < prev.maxEndMs) {
        throw new RangeError(
          `loads[${idx[j]}].startMs: load "${cur.id}" overlaps load "${prev.id}" on pot "${potId}" (starts before the other's maxEndMs)`,
        );
      }
    }
  }
  return { medium, stepS, nodes };
}
