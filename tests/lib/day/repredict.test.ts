/**
 * Re-predicting a cooker's day from a reading (lib/day/repredict.ts): the re-simulation from the model's own
 * state reproduces the plan, a hotter store brings the ready time forward, a colder one pushes it back
 * (or past the serve-by), a measured pot temperature counts for a batch already cooking, and skipped
 * or finished batches stop drawing heat. The cooker and weather are the thermal tests' fixtures.
 */
import { describe, expect, it } from 'vitest';
import { simulateCooker } from '@/lib/thermal';
import { loadsFromMarks, repredictFromReading, storeTempAt, type RepredictBatch, type RepredictInput, type PlannedTimes } from '@/lib/day/repredict';
import { HOUR_MS, MIN_MS, T0_MS, referenceCooker, variedWeather } from '../thermal/fixtures';

const spec = referenceCooker('sunflower-oil');
// The cooks' shift: the whole simulated day (the shift's own clip is tested below).
const shifts = [{ startMs: T0_MS, endMs: T0_MS + 48 * HOUR_MS }];
// Day 2 of a seeded two-day weather series (the first day only shapes nothing here; a clear-ish day).
const steps = variedWeather(1, 11);
const rice: RepredictBatch = { foodKg: 4, foodCpJPerKgK: 1800, waterKg: 8, lidOn: true, minTempC: 90, holdS: 1200, serveByMs: T0_MS + 14 * HOUR_MS };
const beans: RepredictBatch = { foodKg: 5, foodCpJPerKgK: 3200, waterKg: 6, lidOn: true, minTempC: 85, holdS: 2400, serveByMs: T0_MS + 19 * HOUR_MS };

/** The plan as the planner would record it: the baseline simulation's ready and done times. */
function plannedSlots(initialStoreTempC: number): PlannedTimes[] {
  const draft: PlannedTimes[] = [
    { batchId: 'rice', potId: 'big', startMs: T0_MS + 11 * HOUR_MS, readyMs: 0, doneMs: 0 },
    { batchId: 'beans', potId: 'big', startMs: T0_MS + 15 * HOUR_MS, readyMs: 0, doneMs: 0 },
  ];
  const loads = loadsFromMarks({ slots: draft, batches: { rice, beans }, status: {}, turnaroundS: 900, steps, shifts });
  const sim = simulateCooker(spec, steps, { stepS: 60, initialStoreTempC, altitudeM: 300, loads });
  return draft.map((s) => {
    const o = sim.loads.find((l) => l.id === s.batchId)!;
    return { ...s, readyMs: o.reachedMs!, doneMs: o.doneMs! };
  });
}

const base = (over: Partial<RepredictInput> = {}): RepredictInput => ({
  spec,
  steps,
  initialStoreTempC: 120,
  altitudeM: 300,
  turnaroundS: 900,
  shifts,
  slots: plannedSlots(120),
  batches: { rice, beans },
  status: {},
  reading: null,
  ...over,
});

describe('repredictFromReading', () => {
  it('the plan stands without a reading (and with a reading outside the day)', () => {
    const input = base();
    const r = repredictFromReading(input);
    expect(r.fromMs).toBeNull();
    expect(r.slots.rice).toEqual({ batchId: 'rice', readyMs: input.slots[0]!.readyMs, doneMs: input.slots[0]!.doneMs, source: 'plan' });
    const outside = repredictFromReading(base({ reading: { atMs: T0_MS - HOUR_MS, storeC: 150 } }));
    expect(outside.fromMs).toBeNull();
  });

  it('a reading equal to the model’s own store temperature reproduces the plan (within two steps)', () => {
    const input = base();
    const r0 = repredictFromReading({ ...input, reading: null });
    const at = T0_MS + 9 * HOUR_MS;
    const storeAt9 = storeTempAt(r0, at)!;
    const r = repredictFromReading({ ...input, reading: { atMs: at, storeC: storeAt9 } });
    expect(r.fromMs).toBe(at);
    expect(r.slots.rice!.source).toBe('reading');
    // Step-boundary rounding only: the same model from the same state (tolerance 2 min, our choice).
    expect(Math.abs(r.slots.rice!.readyMs! - input.slots[0]!.readyMs)).toBeLessThanOrEqual(2 * MIN_MS);
    expect(Math.abs(r.slots.beans!.readyMs! - input.slots[1]!.readyMs)).toBeLessThanOrEqual(2 * MIN_MS);
  });

  it('a store measured hotter than predicted brings the ready time forward; colder pushes it back', () => {
    const input = base();
    const at = T0_MS + 9 * HOUR_MS;
    const predicted = storeTempAt(repredictFromReading(input), at)!;
    const hot = repredictFromReading({ ...input, reading: { atMs: at, storeC: predicted + 25 } });
    const cold = repredictFromReading({ ...input, reading: { atMs: at, storeC: predicted - 25 } });
    const planned = input.slots[0]!.readyMs;
    expect(hot.slots.rice!.readyMs!).toBeLessThan(planned);
    expect(cold.slots.rice!.readyMs === null || cold.slots.rice!.readyMs > planned).toBe(true);
    // The re-predicted store starts at the measured value.
    expect(hot.series.storeTempC[0]).toBeCloseTo(predicted + 25, 6);
  });

  it('a store far too cold for the dish: the batch is predicted not to be ready (null)', () => {
    const r = repredictFromReading(base({ reading: { atMs: T0_MS + 10 * HOUR_MS + 50 * MIN_MS, storeC: 40 } }));
    expect(r.slots.rice!.readyMs).toBeNull();
  });

  it('a batch already cooking continues from the measured pot temperature: hotter pot, earlier ready', () => {
    const input = base({ status: { rice: { startedMs: T0_MS + 11 * HOUR_MS } } });
    const at = T0_MS + 11 * HOUR_MS + 10 * MIN_MS;
    const store = storeTempAt(repredictFromReading(input), at)!;
    const warm = repredictFromReading({ ...input, reading: { atMs: at, storeC: store, potC: 80, potId: 'big' } });
    const cool = repredictFromReading({ ...input, reading: { atMs: at, storeC: store, potC: 40, potId: 'big' } });
    expect(warm.slots.rice!.readyMs!).toBeLessThan(cool.slots.rice!.readyMs!);
    expect(warm.slots.rice!.readyMs!).toBeGreaterThanOrEqual(at);
  });

  it('a batch that was already hot keeps its ready time and holds only what is left', () => {
    const input = base();
    const ready = input.slots[0]!.readyMs;
    const at = ready + 5 * MIN_MS;
    const store = storeTempAt(repredictFromReading(input), at)!;
    const r = repredictFromReading({ ...input, reading: { atMs: at, storeC: store } });
    expect(r.slots.rice!.readyMs).toBe(ready);
    // Done about holdS after ready (tolerance 3 min: the pot restarts from the baseline's temperature).
    expect(Math.abs(r.slots.rice!.doneMs! - (ready + rice.holdS * 1000))).toBeLessThanOrEqual(3 * MIN_MS);
  });

  it('skipped batches leave the simulation; a done check-in takes the pot off at that time', () => {
    const input = base({ status: { rice: { skippedMs: T0_MS + 10 * HOUR_MS } } });
    expect(loadsFromMarks(input).map((l) => l.id)).toEqual(['beans']);
    expect(repredictFromReading(input).slots.rice).toBeUndefined();
    const done = loadsFromMarks(base({ status: { rice: { startedMs: T0_MS + 11 * HOUR_MS, doneMs: T0_MS + 12 * HOUR_MS } } }));
    expect(done.find((l) => l.id === 'rice')!.maxEndMs).toBe(T0_MS + 12 * HOUR_MS);
  });

  it('a late start moves the load; one running into the next batch on its pot is left out', () => {
    const late = loadsFromMarks(base({ status: { rice: { startedMs: T0_MS + 11 * HOUR_MS + 40 * MIN_MS } } }));
    expect(late.find((l) => l.id === 'rice')!.startMs).toBe(T0_MS + 11 * HOUR_MS + 40 * MIN_MS);
    const tooLate = loadsFromMarks(base({ status: { rice: { startedMs: T0_MS + 15 * HOUR_MS - 10 * MIN_MS } } }));
    expect(tooLate.map((l) => l.id)).toEqual(['beans']);
  });
});

describe('loadsFromMarks: the planner’s pot-load rule', () => {
  // Regression: the day's re-prediction let a pot run past the end of the cooks' shift (the planner
  // stops it there); the rule now lives in one place (lib/planner/pot-loads.ts).
  const late: PlannedTimes = { batchId: 'beans', potId: 'big', startMs: T0_MS + 15 * HOUR_MS, readyMs: 0, doneMs: 0 };
  const shiftEnd = T0_MS + 16 * HOUR_MS;
  const short = [{ startMs: T0_MS + 6 * HOUR_MS, endMs: shiftEnd }];

  it('a batch not yet started comes off at its shift’s end, before its serve-by', () => {
    const [l] = loadsFromMarks({ slots: [late], batches: { beans }, status: {}, turnaroundS: 900, steps, shifts: short });
    expect(beans.serveByMs).toBeGreaterThan(shiftEnd);
    expect(l!.maxEndMs).toBe(shiftEnd);
  });

  it('a started batch is where it is: its shift does not clip it, its serve-by and a “done” mark do', () => {
    const started = loadsFromMarks({ slots: [late], batches: { beans }, status: { beans: { startedMs: late.startMs } }, turnaroundS: 900, steps, shifts: short });
    expect(started[0]!.maxEndMs).toBe(beans.serveByMs);
    const done = loadsFromMarks({ slots: [late], batches: { beans }, status: { beans: { startedMs: late.startMs, doneMs: late.startMs + HOUR_MS / 2 } }, turnaroundS: 900, steps, shifts: short });
    expect(done[0]!.maxEndMs).toBe(late.startMs + HOUR_MS / 2);
  });

  it('the next batch on the same pot, less the turnaround, ends the one before', () => {
    const first: PlannedTimes = { batchId: 'rice', potId: 'big', startMs: T0_MS + 9 * HOUR_MS, readyMs: 0, doneMs: 0 };
    const loads = loadsFromMarks({ slots: [late, first], batches: { rice, beans }, status: {}, turnaroundS: 900, steps, shifts });
    expect(loads.map((l) => l.id)).toEqual(['rice', 'beans']);
    expect(loads[0]!.maxEndMs).toBe(Math.min(rice.serveByMs, late.startMs - 900_000));
  });
});
