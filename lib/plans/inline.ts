import type { z } from 'zod';
import type { PlannerProblem } from '@/lib/planner';
import { planDayOffThread } from '@/lib/planner-thread';
import { normalisePots, toCookerSpec } from '@/lib/cookers/spec';
import { unprocessable } from '@/lib/http/errors';
import type { inlineProblemSchema } from '@/lib/validations/planner';

/** Solves an inline problem (POST /api/v1/planner/solve); model refusals become 422 with the message. */
export async function solveInlineProblem(input: z.infer<typeof inlineProblemSchema>) {
  const problem: PlannerProblem = {
    cookers: input.cookers.map((c) => ({
      id: c.id,
      name: c.cooker.name,
      spec: toCookerSpec({ ...c.cooker, pots: normalisePots(c.cooker.pots) }),
      weather: c.weather.map((s) => ({ t: Date.parse(s.t), gApertureWm2: s.gApertureWm2, tAirC: s.tAirC, ...(s.windMS !== undefined ? { windMS: s.windMS } : {}) })),
      initialStoreTempC: c.initialStoreTempC,
    })),
    batches: input.batches.map((b) => ({
      id: b.id,
      dishId: b.id,
      dishName: b.dishName,
      servings: b.servings,
      method: b.method,
      potVolumeNeededL: b.potVolumeNeededL,
      foodKg: b.foodKg,
      foodCpJPerKgK: b.foodCpJPerKgK,
      waterKg: b.waterKg,
      minTempC: b.minTempC,
      holdS: b.holdMin * 60,
      lidOn: b.lidOn,
      earliestStartMs: Date.parse(b.earliestStart),
      serveByMs: Date.parse(b.serveBy),
    })),
    shifts: input.shifts.map((s) => ({ startMs: Date.parse(s.start), endMs: Date.parse(s.end) })),
    turnaroundS: input.turnaroundMin * 60,
    slotMinutes: input.slotMinutes,
    altitudeM: input.altitudeM,
    timeLimitS: input.timeLimitS,
    timeZone: input.timeZone,
  };
  try {
    const r = await planDayOffThread(problem);
    return { status: r.status, slots: r.slots.map((s) => ({ ...s, start: new Date(s.startMs).toISOString(), ready: new Date(s.readyMs).toISOString(), done: new Date(s.doneMs).toISOString() })), backup: r.backup, servingsOnSun: r.servingsOnSun, upperBound: r.upperBound, boundMethod: r.boundMethod, gap: r.gap, greedyServings: r.greedyServings, solveTimeMs: r.solveTimeMs };
  } catch (err) {
    if (err instanceof RangeError) throw unprocessable(`The planner refused the problem: ${err.message}`, { '(body)': err.message });
    throw err;
  }
}
