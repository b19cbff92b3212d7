/**
 * Steering a cooker's day by what was measured: re-simulates the store and the pots from the latest
 * reading (its time, its store temperature) instead of from the morning's predicted state, so the
 * ready times and the lead's warnings follow the real store. Pure: no ORM, no framework.
 *
 * Method: the day is simulated once from midnight as planned (the baseline: lib/thermal simulateCooker
 * with the plan's loads, actual start times from the check-ins). At a reading at t₀ the store is set
 * to the measured temperature (every layer) and the rest of the day is simulated again from t₀. A
 * batch already on the store at t₀ continues from its pot temperature at t₀: the measured pot
 * temperature when the reading gives one for that pot, else the baseline's (an estimate); if it had
 * already reached its minimum temperature, it keeps that ready time and holds for what is left.
 */
import { simulateCooker, type CookerSpec, type PotLoad, type SimulationResult, type WeatherStep } from '@/lib/thermal';

export interface SteerSlot {
  batchId: string;
  potId: string;
  /** Planned start, ready (pot ≥ minimum) and done times [epoch ms]. */
  startMs: number;
  readyMs: number;
  doneMs: number;
}

export interface SteerBatch {
  foodKg: number;
  foodCpJPerKgK: number;
  waterKg: number;
  lidOn: boolean;
  /** Dish's minimum pot temperature [°C] held for holdS [s]. */
  minTempC: number;
  holdS: number;
  serveByMs: number;
}

/** What the cooks marked: when a batch was started, finished or skipped [epoch ms]. */
export interface SteerStatus {
  startedMs?: number;
  doneMs?: number;
  skippedMs?: number;
}

export interface SteerReading {
  atMs: number;
  /** Measured store temperature [°C]; null for a pot-only reading. */
  storeC: number | null;
  /** Measured pot temperature [°C] and its pot, when given. */
  potC?: number | null;
  potId?: string | null;
}

export interface SteerInput {
  spec: CookerSpec;
  /** The local day's aperture weather, contiguous 60-s steps (lib/prediction prepareDay). */
  steps: WeatherStep[];
  /** Store temperature at steps[0] [°C] (prepareDay's midnight state). */
  initialStoreTempC: number;
  altitudeM: number;
  turnaroundS: number;
  /** This cooker's slots of the published plan. */
  slots: SteerSlot[];
  batches: Record<string, SteerBatch>;
  status: Record<string, SteerStatus>;
  /** Latest reading of this cooker today, or null. */
  reading: SteerReading | null;
}

export interface SteeredSlot {
  batchId: string;
  /** When the pot reaches (or reached) the dish's minimum [epoch ms]; null when the prediction says it will not. */
  readyMs: number | null;
  /** When the hold completes [epoch ms]; null when it will not before the pot must come off. */
  doneMs: number | null;
  /** 'plan': no reading, the published times; 'reading': re-simulated from the reading. */
  source: 'plan' | 'reading';
}

export interface SteerResult {
  slots: Record<string, SteeredSlot>;
  /** Time the prediction starts from [epoch ms]: the reading's, or null for the plan. */
  fromMs: number | null;
  /** Predicted store temperature [°C] at each 60-s step boundary from fromMs (or midnight). */
  series: { t: number[]; storeTempC: number[] };
  /** Highest predicted store temperature from fromMs on [°C]. */
  maxStoreTempC: number;
}

/** The simulator's loads for a cooker's slots: skipped batches left out, actual starts used, hard stops as the planner sets them. */
export function buildLoads(input: Pick<SteerInput, 'slots' | 'batches' | 'status' | 'turnaroundS' | 'steps'>): PotLoad[] {
  const endOfDay = (input.steps[input.steps.length - 1]?.t ?? 0) + 60_000;
  const live = input.slots
    .filter((s) => !input.status[s.batchId]?.skippedMs && input.batches[s.batchId])
    .map((s) => ({ s, startMs: input.status[s.batchId]?.startedMs ?? s.startMs }))
    .sort((a, b) => a.startMs - b.startMs);
  const loads: PotLoad[] = [];
  for (const { s, startMs } of live) {
    const b = input.batches[s.batchId]!;
    const next = live.find((o) => o.s.potId === s.potId && o.startMs > startMs);
    const doneAt = input.status[s.batchId]?.doneMs;
    const maxEndMs = Math.min(b.serveByMs, next ? next.startMs - input.turnaroundS * 1000 : Infinity, doneAt ?? Infinity, endOfDay);
    // A batch started so late that it runs into the next one on its pot is left out (the simulator refuses overlaps).
    if (maxEndMs <= startMs + 60_000) continue;
    loads.push({ id: s.batchId, potId: s.potId, startMs, foodKg: b.foodKg, foodCpJPerKgK: b.foodCpJPerKgK, waterKg: b.waterKg, lidOn: b.lidOn, minTempC: b.minTempC, holdS: b.holdS, maxEndMs });
  }
  return loads;
}

const fromPlan = (slots: SteerSlot[], status: Record<string, SteerStatus>): Record<string, SteeredSlot> =>
  Object.fromEntries(slots.filter((s) => !status[s.batchId]?.skippedMs).map((s) => [s.batchId, { batchId: s.batchId, readyMs: s.readyMs, doneMs: s.doneMs, source: 'plan' as const }]));

/** Re-simulates a cooker's day from its latest reading; without one (or one outside the day) the plan's times stand. */
export function steerCooker(input: SteerInput): SteerResult {
  const { steps } = input;
  const t0Day = steps[0]?.t ?? 0;
  const loads = buildLoads(input);
  const baseline: SimulationResult = simulateCooker(input.spec, steps, { stepS: 60, initialStoreTempC: input.initialStoreTempC, altitudeM: input.altitudeM, loads });
  const r = input.reading;
  const lastT = steps[steps.length - 1]?.t ?? t0Day;
  if (!r || r.atMs < t0Day || r.atMs > lastT) {
    return { slots: fromPlan(input.slots, input.status), fromMs: null, series: { t: baseline.series.t, storeTempC: baseline.series.storeTempC }, maxStoreTempC: Math.max(...baseline.series.storeTempC) };
  }

  // The step boundary at or after the reading: the simulator works on whole steps.
  const i0 = Math.min(steps.length - 1, Math.max(0, Math.ceil((r.atMs - t0Day) / 60_000)));
  const rest = steps.slice(i0);
  const t0 = rest[0]!.t;
  const storeAt = r.storeC ?? baseline.series.storeTempC[i0] ?? input.initialStoreTempC;
  const base = new Map(baseline.loads.map((o) => [o.id, o]));
  const alreadyReady = new Map<string, number>();
  const inProgress = loads.filter((l) => l.startMs < t0 && l.maxEndMs > t0);
  const loads2: PotLoad[] = [];
  for (const l of loads) {
    if (l.maxEndMs <= t0) continue; // finished (or stopped) before the reading
    if (l.startMs >= t0) {
      loads2.push(l);
      continue;
    }
    const o = base.get(l.id);
    if (o?.doneMs != null && o.doneMs <= t0) continue; // held long enough already
    const measured = r.potC != null && (r.potId ? r.potId === l.potId : inProgress.length === 1) ? r.potC : undefined;
    const basePot = baseline.series.potTempC[l.potId]?.[i0];
    let holdS = l.holdS;
    if (o?.reachedMs != null && o.reachedMs <= t0) {
      alreadyReady.set(l.id, o.reachedMs);
      holdS = Math.max(0, l.holdS - (t0 - o.reachedMs) / 1000);
    }
    loads2.push({ ...l, startMs: t0, holdS, initialTempC: measured ?? (basePot !== undefined && Number.isFinite(basePot) ? basePot : undefined) });
  }
  const sim = simulateCooker(input.spec, rest, { stepS: 60, initialStoreTempC: storeAt, altitudeM: input.altitudeM, loads: loads2 });
  const out = fromPlan(input.slots, input.status);
  for (const o of sim.loads) {
    const ready = alreadyReady.get(o.id) ?? o.reachedMs;
    out[o.id] = { batchId: o.id, readyMs: ready, doneMs: o.doneMs, source: 'reading' };
  }
  // Batches that ended before the reading keep the baseline's times (what happened, as far as we know).
  for (const l of loads) {
    if (out[l.id]?.source === 'reading') continue;
    const o = base.get(l.id);
    if (o && l.maxEndMs <= t0) out[l.id] = { batchId: l.id, readyMs: o.reachedMs, doneMs: o.doneMs, source: 'plan' };
  }
  return { slots: out, fromMs: t0, series: { t: sim.series.t, storeTempC: sim.series.storeTempC }, maxStoreTempC: Math.max(...sim.series.storeTempC) };
}

/** Predicted store temperature at an instant [°C] from a steering result's series (nearest earlier step). */
export function storeTempAt(result: SteerResult, atMs: number): number | null {
  const { t, storeTempC } = result.series;
  if (!t.length || atMs < t[0]!) return null;
  const i = Math.min(t.length - 1, Math.floor((atMs - t[0]!) / 60_000));
  return storeTempC[i] ?? null;
}
