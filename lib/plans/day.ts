/**
 * Loads a kitchen's day from the database and reads it through the day's model (lib/day/model.ts):
 * the published plan, the cooks' check-ins, each cooker's latest reading, and each cooker's day
 * re-predicted from that reading (lib/day/repredict.ts, with the cooker's prepared weather).
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { CheckInSchema, CookerSchema, type Cooker, type Kitchen, type Plan } from '@/entities';
import { toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import { buildKitchenDay, marksFromCheckIns, type CookMarks, type DayCheckIn, type KitchenDay, type LatestReading } from '@/lib/day/model';
import { repredictFromReading, type Reprediction } from '@/lib/day/repredict';
import { prepareDay, type PreparedDay } from '@/lib/prediction/predict-day';
import { localDateString, zonedDayBoundsMs } from '@/lib/time';
import { kitchenShifts } from './problem';
import { getPublishedPlan } from './queries';
import { fuelView } from './views';
import { getPlanningWeather, kitchenSite } from './weather';

/** Readings from more than this after "now" are ignored (a phone's clock may run a little fast) [ms]. */
export const CLOCK_SKEW_MS = 5 * 60_000;

/** The kitchen-local date of an instant. */
export const kitchenDate = (kitchen: Pick<Kitchen, 'timeZone'>, nowMs: number) => localDateString(nowMs, kitchen.timeZone);

/** The cooks' check-ins of a day, oldest first. */
export async function loadCheckIns(em: EntityManager, kitchenId: string, date: string): Promise<DayCheckIn[]> {
  const rows = await em.find(CheckInSchema, { kitchen: kitchenId, date }, { orderBy: { at: 'asc' }, populate: ['user'] });
  return rows.map((c) => ({ batchId: c.batchId, kind: c.kind, atMs: c.at.getTime(), recordedAtMs: c.createdAt.getTime(), userName: c.user?.name ?? null }));
}

/** The cooks' marks per batch of a day (what the alert worker re-checks before sending). */
export async function loadMarks(em: EntityManager, kitchenId: string, date: string): Promise<Record<string, CookMarks>> {
  return marksFromCheckIns(await loadCheckIns(em, kitchenId, date));
}

/** Each cooker's latest reading between two instants. */
export async function latestReadings(em: EntityManager, kitchenId: string, fromMs: number, toMs: number): Promise<Map<string, LatestReading>> {
  const rows = await em.execute<{ id: string; cooker_id: string; at: Date; store_c: number | null; pot_c: number | null; pot_id: string | null; source: 'manual' | 'sensor' }[]>(
    `select distinct on (cooker_id) id, cooker_id, at, store_c, pot_c, pot_id, source from readings
     where kitchen_id = ? and at >= ? and at <= ? order by cooker_id, at desc, created_at desc`,
    [kitchenId, new Date(fromMs), new Date(toMs)],
  );
  return new Map(rows.map((r) => [r.cooker_id, { id: r.id, cookerId: r.cooker_id, atMs: new Date(r.at).getTime(), storeC: r.store_c, potC: r.pot_c, potId: r.pot_id, source: r.source }]));
}

// prepareDay (weather to the aperture, a day of spin-up) is the costly part; a day's result is reused
// for a while. The cache's age is process time, not the kitchen's clock (tests move that clock).
const PREPARED_TTL_MS = 15 * 60_000;
const prepared = new Map<string, { at: number; day: PreparedDay }>();

async function preparedDayFor(em: EntityManager, kitchen: Kitchen, cooker: Cooker, date: string): Promise<PreparedDay> {
  const weather = await getPlanningWeather(em, kitchen, date);
  const key = `${kitchen.id}|${date}|${cooker.id}|${cooker.updatedAt.getTime()}|${weather.meta.source}|${weather.meta.fetchedAt ?? ''}|${kitchen.latitude},${kitchen.longitude},${kitchen.altitudeM},${kitchen.timeZone}`;
  const hit = prepared.get(key);
  if (hit && performance.now() - hit.at < PREPARED_TTL_MS) return hit.day;
  const day = prepareDay({ site: kitchenSite(kitchen), timeZone: kitchen.timeZone, date, spec: toCookerSpec(cooker, cooker.customMedium), geometry: toApertureGeometry(cooker), hourly: weather.hourly, weather: weather.meta, clearness: weather.clearness });
  if (prepared.size > 100) prepared.clear();
  prepared.set(key, { at: performance.now(), day });
  return day;
}

/** Re-predicts each cooker of the plan that has a reading; cookers without one keep the plan's times (absent from the map). */
async function repredictCookers(em: EntityManager, kitchen: Kitchen, date: string, plan: Plan, marks: Record<string, CookMarks>, readings: Map<string, LatestReading>): Promise<Map<string, Reprediction>> {
  const out = new Map<string, Reprediction>();
  const ids = plan.cookers.map((c) => c.id).filter((id) => readings.has(id));
  if (!ids.length) return out;
  const cookers = await em.find(CookerSchema, { id: { $in: ids }, kitchen: kitchen.id }, { populate: ['customMedium'] });
  const batches = Object.fromEntries(plan.batches.map((b) => [b.id, b]));
  for (const cooker of cookers) {
    const day = await preparedDayFor(em, kitchen, cooker, date);
    const reading = readings.get(cooker.id)!;
    const spec = toCookerSpec(cooker, cooker.customMedium);
    const potIds = new Set(spec.pots.map((p) => p.id));
    try {
      out.set(
        cooker.id,
        repredictFromReading({
          spec,
          steps: day.steps,
          initialStoreTempC: day.initialStoreTempC,
          altitudeM: kitchen.altitudeM,
          turnaroundS: kitchen.planning.turnaroundMin * 60,
          shifts: kitchenShifts(kitchen, date),
          slots: plan.result.slots.filter((s) => s.cookerId === cooker.id && potIds.has(s.potId)),
          batches,
          status: marks,
          reading: { atMs: reading.atMs, storeC: reading.storeC, potC: reading.potC, potId: reading.potId },
        }),
      );
    } catch (err) {
      // A cooker edited since the plan (e.g. a pot removed) can make the plan's loads invalid: keep the plan's times.
      if (!(err instanceof RangeError)) throw err;
      console.warn(`[day] re-prediction of a cooker skipped: ${err.message}`);
    }
  }
  return out;
}

/** A kitchen's day (default: the kitchen-local date of nowMs) as the day's model reads it. */
export async function loadKitchenDay(em: EntityManager, kitchen: Kitchen, nowMs: number, date = kitchenDate(kitchen, nowMs)): Promise<KitchenDay> {
  return (await loadKitchenDayWithPlan(em, kitchen, nowMs, date)).day;
}

/** The day and the published plan it was read from (null when none). */
export async function loadKitchenDayWithPlan(em: EntityManager, kitchen: Kitchen, nowMs: number, date = kitchenDate(kitchen, nowMs)): Promise<{ day: KitchenDay; plan: Plan | null }> {
  const [dayStart, dayEnd] = zonedDayBoundsMs(date, kitchen.timeZone);
  const [plan, checkIns, readings] = await Promise.all([
    getPublishedPlan(em, kitchen.id, date),
    loadCheckIns(em, kitchen.id, date),
    latestReadings(em, kitchen.id, dayStart, Math.min(dayEnd, nowMs + CLOCK_SKEW_MS)),
  ]);
  const marks = marksFromCheckIns(checkIns);
  const repredicted = plan ? await repredictCookers(em, kitchen, date, plan, marks, readings) : new Map<string, Reprediction>();
  const skippedIds = plan ? plan.result.slots.filter((s) => marks[s.batchId]?.skippedMs !== undefined).map((s) => s.batchId) : [];
  const day = buildKitchenDay({
    kitchen: { id: kitchen.id, name: kitchen.name, timeZone: kitchen.timeZone },
    date,
    nowMs,
    plan: plan ? { id: plan.id, version: plan.version, publishedAt: plan.publishedAt?.toISOString() ?? null, batches: plan.batches, result: plan.result, cookers: plan.cookers, fuel: plan.fuel } : null,
    checkIns,
    readings,
    repredicted,
    skippedFuel: plan && skippedIds.length ? fuelView(kitchen, plan.batches, skippedIds).perBatch : [],
  });
  return { day, plan };
}
