/**
 * Re-predicting a cooker's day from what was measured: re-simulates the store and the pots from the latest
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
import { potLoadsForSlots, type PotLoadBatch } from '@/lib/planner/pot-loads';
import type { Shift } from '@/lib/planner/types';

export interface PlannedTimes {
  batchId: string;
  potId: string;
  /** Planned start, ready (pot ≥ minimum) and done times [epoch ms]. */
  startMs: number;
  readyMs: number;
  doneMs: number;
}

/** What the re-prediction needs of a batch: the pot load's fields and its serve-by time. */
export type RepredictBatch = PotLoadBatch;

/** What the cooks marked: when a batch was started, finished or skipped [epoch ms]. */
export interface CookMarks {
  startedMs?: number;
  doneMs?: number;
  skippedMs?: number;
}

export interface RepredictReading {
  atMs: number;
  /** Measured store temperature [°C]; null for a pot-only reading. */
  storeC: number | null;
  /** Measured pot temperature [°C] and its pot, when given. */
  potC?: number | null;
  potId?: string | null;
}

export interface RepredictInput {
  spec: CookerSpec;
  /** The local day's aperture weather, contiguous 60-s steps (lib/prediction prepareDay). */
  steps: WeatherStep[];
  /** Store temperature at steps[0] [°C] (prepareDay's midnight state). */
  initialStoreTempC: number;
  altitudeM: number;
  turnaroundS: number;
  /** The kitchen's shifts that day: a pot not yet started comes off at its shift's end. */
  shifts: readonly Shift[];
  /** This cooker's slots of the published plan. */
  slots: PlannedTimes[];
  batches: Record<string, RepredictBatch>;
  status: Record<string, CookMarks>;
  /** Latest reading of this cooker today, or null. */
  reading: RepredictReading | null;
}

export interface RepredictedSlot {
  batchId: string;
  /** When the pot reaches (or reached) the dish's minimum [epoch ms]; null when the prediction says it will not. */
  readyMs: number | null;
  /** When the hold completes [epoch ms]; null when it will not before the pot must come off. */
  doneMs: number | null;
  /** 'plan': no reading, the published times; 'reading': re-simulated from the reading. */
  source: 'plan' | 'reading';
}

export interface Reprediction {
  slots: Record<string, RepredictedSlot>;
  /** Time the prediction starts from [epoch ms]: the reading's, or null for the plan. */
  fromMs: number | null;
  /** Predicted store temperature [°C] at each 60-s step boundary from fromMs (or midnight). */
  series: { t: number[]; storeTempC: number[] };
  /** Highest predicted store temperature from fromMs on [°C]. */
  maxStoreTempC: number;
}

/**
 * The simulator's loads for a cooker's slots under the cooks' marks: skipped batches left out, actual
 * starts used (a started batch is where it is: not clipped by its shift), a batch marked done stops
 * then; the rest is the planner's pot-load rule (lib/planner/pot-loads.ts).
 */
export function loadsFromMarks(input: Pick<RepredictInput, 'slots' | 'batches' | 'status' | 'turnaroundS' | 'steps' | 'shifts'>): PotLoad[] {
  const weatherEndMs = (input.steps[input.steps.length - 1]?.t ?? 0) + 60_000;
  const slots = input.slots
    .filter((s) => !input.status[s.batchId]?.skippedMs && input.batches[s.batchId])
    .map((s) => {
      const marks = input.status[s.batchId];
      return { batchId: s.batchId, potId: s.potId, startMs: marks?.startedMs ?? s.startMs, fixed: marks?.startedMs !== undefined, ...(marks?.doneMs !== undefined ? { stopMs: marks.doneMs } : {}) };
    });
  const loads = potLoadsForSlots(slots, new Map(Object.entries(input.batches)), { shifts: input.shifts, turnaroundS: input.turnaroundS, weatherEndMs });
  // A batch started so late that it runs into the next one on its pot is left out (the simulator refuses overlaps).
  return loads.filter((l) => l.maxEndMs > l.startMs + 60_000);
}

const fromPlan = (slots: PlannedTimes[], status: Record<string, CookMarks>): Record<string, RepredictedSlot> =>
  Object.fromEntries(slots.filter((s) => !status[s.batchId]?.skippedMs).map((s) => [s.batchId, { batchId: s.batchId, readyMs: s.readyMs, doneMs: s.doneMs, source: 'plan' as const }]));

/** Re-simulates a cooker's day from its latest reading; without one (or one outside the day) the plan's times stand. */
export function repredictFromReading(input: RepredictInput): Reprediction {
  const { steps } = input;
  const t0Day = steps[0]?.t ?? 0;
  const loads = loadsFromMarks(input);
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

/** Predicted store temperature at an instant [°C] from a re-prediction's series (nearest earlier step). */
export function storeTempAt(result: Reprediction, atMs: number): number | null {
  const { t, storeTempC } = result.series;
  if (!t.length || atMs < t[0]!) return null;
  const i = Math.min(t.length - 1, Math.floor((atMs - t[0]!) / 60_000));
  return storeTempC[i] ?? null;
}
