/**
 * A kitchen's day as the planner's problem: the register's cookers (their aperture weather for the
 * day, from lib/prediction), the menu's batches and the cooks' shift.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { DEFAULT_LEAD_TIME_MIN, type Cooker, type Kitchen } from '@/entities';
import { unprocessable } from '@/lib/http/errors';
import { toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import { getActiveCookers } from '@/lib/cookers';
import { getMenuLines, hm, splitIntoBatches, type MenuBatch } from '@/lib/menus';
import { prepareDay } from '@/lib/prediction/predict-day';
import type { PlannerProblem, Shift } from '@/lib/planner';
import { zonedTimeToUtcMs } from '@/lib/time';
import { getPlanningWeather, kitchenSite } from './weather';

export interface PreparedProblem {
  problem: PlannerProblem;
  /** Every batch of the day, including those too late to plan. */
  menuBatches: MenuBatch[];
  /** Batches that can no longer be done by their serve-by time when cooking starts at the earliest plannable moment. */
  tooLate: { batch: MenuBatch; notBeforeMs: number }[];
  cookers: Cooker[];
  weatherSource: string;
}

/** The cooks' shift of a local day [epoch ms]. */
export function kitchenShifts(k: Pick<Kitchen, 'timeZone' | 'planning'>, date: string): Shift[] {
  return [{ startMs: zonedTimeToUtcMs(date, k.timeZone, ...hm(k.planning.shiftStart)), endMs: zonedTimeToUtcMs(date, k.timeZone, ...hm(k.planning.shiftEnd)) }];
}

/**
 * No pot may be planned to go on before this moment [epoch ms]: the time of solving plus the
 * kitchen's lead time (cooks need a while to read the plan and fill the pots).
 */
export function earliestPlannableMs(kitchen: Pick<Kitchen, 'planning'>, nowMs: number): number {
  return nowMs + (kitchen.planning.leadTimeMin ?? DEFAULT_LEAD_TIME_MIN) * 60_000;
}

/** Builds the planner's problem for a kitchen and day from the register, the menu (or given batches) and the weather. */
export async function prepareProblem(em: EntityManager, kitchen: Kitchen, date: string, timeLimitS: number, opts: { batches?: MenuBatch[]; nowMs?: number } = {}): Promise<PreparedProblem> {
  const cookers = await getActiveCookers(em, kitchen.id);
  let menuBatches = opts.batches;
  if (!menuBatches) {
    const lines = await getMenuLines(em, kitchen.id, date);
    if (!lines.length) throw unprocessable(`There is no menu for ${date}. Enter the menu first.`, { date: 'No menu on this day.' });
    menuBatches = splitIntoBatches(lines, cookers, kitchen, date);
  }
  const weather = await getPlanningWeather(em, kitchen, date);
  const site = kitchenSite(kitchen);
  const plannerCookers = cookers.map((c) => {
    const spec = toCookerSpec(c, c.customMedium);
    const day = prepareDay({ site, timeZone: kitchen.timeZone, date, spec, geometry: toApertureGeometry(c), hourly: weather.hourly, weather: weather.meta, clearness: weather.clearness });
    return { id: c.id, name: c.name, spec, weather: day.steps, initialStoreTempC: day.initialStoreTempC };
  });
  // A same-day solve: nothing starts before now plus the lead time (a batch due earlier waits, or goes to backup fuel).
  const notBefore = opts.nowMs !== undefined ? earliestPlannableMs(kitchen, opts.nowMs) : -Infinity;
  const tooLate = menuBatches.filter((b) => b.serveByMs <= notBefore + b.holdS * 1000).map((batch) => ({ batch, notBeforeMs: notBefore }));
  const late = new Set(tooLate.map((x) => x.batch.id));
  const problem: PlannerProblem = {
    cookers: plannerCookers,
    // A menu batch carries every field the planner reads (and a few more it ignores).
    batches: menuBatches.filter((b) => !late.has(b.id)).map((b) => (b.earliestStartMs >= notBefore ? b : { ...b, earliestStartMs: notBefore })),
    shifts: kitchenShifts(kitchen, date),
    turnaroundS: kitchen.planning.turnaroundMin * 60,
    slotMinutes: 15,
    altitudeM: kitchen.altitudeM,
    timeLimitS,
    seed: 1,
    timeZone: kitchen.timeZone,
  };
  return { problem, menuBatches, tooLate, cookers, weatherSource: weather.meta.source };
}
