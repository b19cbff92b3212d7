import type { EntityManager } from '@mikro-orm/postgresql';
import { CheckInSchema, CookerSchema, PlanSchema, type CheckIn, type Cooker, type Kitchen, type Plan } from '@/entities';
import { toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import type { MenuBatch } from '@/lib/menus';
import type { PlannerResult } from '@/lib/planner';
import type { PlanCookerView } from '@/lib/plans';
import { getPlanningWeather, kitchenSite } from '@/lib/plans/weather';
import { prepareDay, type PreparedDay } from '@/lib/prediction/predict-day';
import { localDateString, zonedDayBoundsMs } from '@/lib/time';
import { steerCooker, type SteerResult, type SteerStatus } from './steer';

/** A reading as the day's logic uses it. */
export interface LatestReading {
  id: string;
  cookerId: string;
  atMs: number;
  storeC: number | null;
  potC: number | null;
  potId: string | null;
  source: 'manual' | 'sensor';
}

/** Everything known about a kitchen's day: the published plan, the cooks' check-ins and each cooker's latest reading. */
export interface DayState {
  kitchen: Kitchen;
  date: string;
  nowMs: number;
  plan: Plan | null;
  batches: MenuBatch[];
  result: PlannerResult | null;
  cookers: PlanCookerView[];
  checkIns: CheckIn[];
  status: Record<string, SteerStatus>;
  readings: Map<string, LatestReading>;
}

/** Readings from more than this after "now" are ignored (a phone's clock may run a little fast) [ms]. */
export const CLOCK_SKEW_MS = 5 * 60_000;

/** The kitchen-local date of an instant. */
export const kitchenDate = (kitchen: Pick<Kitchen, 'timeZone'>, nowMs: number) => localDateString(nowMs, kitchen.timeZone);

/** The day's latest published plan (the one cooks work from), or null. */
export async function getPublishedPlan(em: EntityManager, kitchenId: string, date: string): Promise<Plan | null> {
  return em.findOne(PlanSchema, { kitchen: kitchenId, date, status: 'published' }, { orderBy: { version: 'desc' }, populate: ['kitchen'] });
}

/** What the check-ins say per batch: the first time each mark was made. */
export function statusFromCheckIns(checkIns: Pick<CheckIn, 'batchId' | 'kind' | 'at'>[]): Record<string, SteerStatus> {
  const out: Record<string, SteerStatus> = {};
  for (const c of [...checkIns].sort((a, b) => a.at.getTime() - b.at.getTime())) {
    const s = (out[c.batchId] ??= {});
    const t = c.at.getTime();
    if (c.kind === 'started') s.startedMs ??= t;
    else if (c.kind === 'done') s.doneMs ??= t;
    else s.skippedMs ??= t;
  }
  return out;
}

export async function latestReadings(em: EntityManager, kitchenId: string, fromMs: number, toMs: number): Promise<Map<string, LatestReading>> {
  const rows = await em.execute<{ id: string; cooker_id: string; at: Date; store_c: number | null; pot_c: number | null; pot_id: string | null; source: 'manual' | 'sensor' }[]>(
    `select distinct on (cooker_id) id, cooker_id, at, store_c, pot_c, pot_id, source from readings
     where kitchen_id = ? and at >= ? and at <= ? order by cooker_id, at desc, created_at desc`,
    [kitchenId, new Date(fromMs), new Date(toMs)],
  );
  return new Map(rows.map((r) => [r.cooker_id, { id: r.id, cookerId: r.cooker_id, atMs: new Date(r.at).getTime(), storeC: r.store_c, potC: r.pot_c, potId: r.pot_id, source: r.source }]));
}

export async function loadDayState(em: EntityManager, kitchen: Kitchen, nowMs: number, date = kitchenDate(kitchen, nowMs)): Promise<DayState> {
  const [dayStart, dayEnd] = zonedDayBoundsMs(date, kitchen.timeZone);
  const [plan, checkIns, readings] = await Promise.all([
    getPublishedPlan(em, kitchen.id, date),
    em.find(CheckInSchema, { kitchen: kitchen.id, date }, { orderBy: { at: 'asc' }, populate: ['user'] }),
    latestReadings(em, kitchen.id, dayStart, Math.min(dayEnd, nowMs + CLOCK_SKEW_MS)),
  ]);
  return {
    kitchen,
    date,
    nowMs,
    plan,
    batches: (plan?.batches as MenuBatch[] | undefined) ?? [],
    result: (plan?.result as PlannerResult | undefined) ?? null,
    cookers: (plan?.cookers as PlanCookerView[] | undefined) ?? [],
    checkIns,
    status: statusFromCheckIns(checkIns),
    readings,
  };
}

// prepareDay (weather to the aperture, a day of spin-up) is the costly part; a day's result is reused for a while.
const PREPARED_TTL_MS = 15 * 60_000;
const prepared = new Map<string, { at: number; day: PreparedDay }>();

async function preparedDayFor(em: EntityManager, kitchen: Kitchen, cooker: Cooker, date: string): Promise<PreparedDay> {
  const weather = await getPlanningWeather(em, kitchen, date);
  const key = `${kitchen.id}|${date}|${cooker.id}|${cooker.updatedAt.getTime()}|${weather.meta.source}|${weather.meta.fetchedAt ?? ''}|${kitchen.latitude},${kitchen.longitude},${kitchen.altitudeM},${kitchen.timeZone}`;
  const hit = prepared.get(key);
  if (hit && Date.now() - hit.at < PREPARED_TTL_MS) return hit.day;
  const day = prepareDay({ site: kitchenSite(kitchen), timeZone: kitchen.timeZone, date, spec: toCookerSpec(cooker, cooker.customMedium), geometry: toApertureGeometry(cooker), hourly: weather.hourly, weather: weather.meta, clearness: weather.clearness });
  if (prepared.size > 100) prepared.clear();
  prepared.set(key, { at: Date.now(), day });
  return day;
}

/**
 * Re-simulates each cooker that has a reading today from that reading (lib/cooks/steer.ts); cookers
 * without one keep the plan's times (absent from the map). `only` limits the work to some cookers.
 */
export async function steerDay(em: EntityManager, state: DayState, only?: string[]): Promise<Map<string, SteerResult>> {
  const out = new Map<string, SteerResult>();
  if (!state.result) return out;
  const ids = state.cookers.map((c) => c.id).filter((id) => state.readings.has(id) && (!only || only.includes(id)));
  if (!ids.length) return out;
  const cookers = await em.find(CookerSchema, { id: { $in: ids }, kitchen: state.kitchen.id }, { populate: ['customMedium'] });
  const batches = Object.fromEntries(state.batches.map((b) => [b.id, b]));
  for (const cooker of cookers) {
    const day = await preparedDayFor(em, state.kitchen, cooker, state.date);
    const reading = state.readings.get(cooker.id)!;
    const spec = toCookerSpec(cooker, cooker.customMedium);
    const potIds = new Set(spec.pots.map((p) => p.id));
    const slots = state.result.slots.filter((s) => s.cookerId === cooker.id && potIds.has(s.potId));
    try {
      out.set(
        cooker.id,
        steerCooker({
          spec,
          steps: day.steps,
          initialStoreTempC: day.initialStoreTempC,
          altitudeM: state.kitchen.altitudeM,
          turnaroundS: state.kitchen.planning.turnaroundMin * 60,
          slots,
          batches,
          status: state.status,
          reading: { atMs: reading.atMs, storeC: reading.storeC, potC: reading.potC, potId: reading.potId },
        }),
      );
    } catch (err) {
      // A cooker edited since the plan (e.g. a pot removed) can make the plan's loads invalid: keep the plan's times.
      if (!(err instanceof RangeError)) throw err;
      console.warn(`[cooks] steering ${cooker.id} skipped: ${err.message}`);
    }
  }
  return out;
}
