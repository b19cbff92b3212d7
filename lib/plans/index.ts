import { isUuid } from '@/lib/auth/guard';
import { randomUUID } from 'node:crypto';
import { LockMode, type EntityManager } from '@mikro-orm/postgresql';
import { PlanSchema, type Cooker, type Kitchen, type Plan } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, unprocessable } from '@/lib/http/errors';
import { toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import { prepareDay } from '@/lib/prediction/predict-day';
import { checkSlotMove, type PlannerBatch, type PlannerProblem, type PlannerResult } from '@/lib/planner';
import { planDayOffThread } from '@/lib/planner/thread';
import { simulateCooker, type PotLoad } from '@/lib/thermal';
import { compareWithAllOnWood, planBackupFuel, STOVES, type FuelTotals, type StoveId } from '@/lib/fuel';
import { toBackupBatchInput } from '@/lib/fuel/plan';
import { zonedTimeToUtcMs } from '@/lib/time';
import { getMenuLines, hm, splitIntoBatches, type MenuBatch } from '@/lib/menus';
import { cookerMedium, getActiveCookers } from '@/lib/cookers';
import { getPlanningWeather, kitchenSite } from './weather';
import { meltingRangeForMediumName, safetyNotesForSlot, type SafetyNote } from '@/lib/safety/notes';

export interface PlanCookerView {
  id: string;
  name: string;
  pots: { id: string; name: string; volumeL: number }[];
  minUsefulTempC: number;
  maxSafeTempC: number;
  medium: { kind: 'oil' | 'pcm' | 'custom'; name: string; smokePointC: number | null };
  series: { t: number[]; storeTempC: number[]; charge: number[] };
}

export interface PlanFuelView {
  currency: string;
  perBatch: { batchId: string; stoveId: string; fuelId: string; amount: number; unit: 'kg' | 'kWh'; cost: number | null; co2Kg: number; co2BiogenicKg: number; usefulKWh: number }[];
  byFuel: Record<string, { amount: number; unit: 'kg' | 'kWh'; cost: number | null; co2Kg: number; co2BiogenicKg: number }>;
  total: { cost: number | null; co2Kg: number; co2BiogenicKg: number; usefulKWh: number };
  allOnWood: { woodKg: number; co2BiogenicKg: number; cost: number | null };
  solarShareOfHeat: number;
}

interface Prepared {
  problem: PlannerProblem;
  menuBatches: MenuBatch[];
  cookers: Cooker[];
  weatherSource: string;
}

const shiftsOf = (k: Kitchen, date: string) => [
  { startMs: zonedTimeToUtcMs(date, k.timeZone, ...hm(k.planning.shiftStart)), endMs: zonedTimeToUtcMs(date, k.timeZone, ...hm(k.planning.shiftEnd)) },
];

/** Builds the planner's problem for a kitchen and day from the register, the menu (or given batches) and the weather. */
async function prepareProblem(em: EntityManager, kitchen: Kitchen, date: string, timeLimitS: number, batchesFromPlan?: MenuBatch[]): Promise<Prepared> {
  const cookers = await getActiveCookers(em, kitchen.id);
  let menuBatches = batchesFromPlan;
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
  // A menu batch carries every field the planner reads (and a few more it ignores).
  const batches: PlannerBatch[] = menuBatches;
  const problem: PlannerProblem = {
    cookers: plannerCookers,
    batches,
    shifts: shiftsOf(kitchen, date),
    turnaroundS: kitchen.planning.turnaroundMin * 60,
    slotMinutes: 15,
    altitudeM: kitchen.altitudeM,
    timeLimitS,
    seed: 1,
    timeZone: kitchen.timeZone,
  };
  return { problem, menuBatches, cookers, weatherSource: weather.meta.source };
}

/** Each cooker's store through the day under the plan's loads (full simulation), at 10-min resolution. */
function cookerViews(prepared: Prepared, result: PlannerResult): PlanCookerView[] {
  const byBatch = new Map(prepared.problem.batches.map((b) => [b.id, b]));
  return prepared.problem.cookers.map((pc) => {
    const c = prepared.cookers.find((x) => x.id === pc.id)!;
    // Same end rule as the planner: serve-by, or the next batch on the pot less the turnaround.
    const mine = result.slots.filter((s) => s.cookerId === pc.id && s.startMs >= (pc.weather[0]?.t ?? 0)).sort((a, b) => a.startMs - b.startMs);
    const loads: PotLoad[] = mine.map((s) => {
      const b = byBatch.get(s.batchId)!;
      const next = mine.find((o) => o.potId === s.potId && o.startMs > s.startMs);
      const maxEndMs = Math.min(b.serveByMs, next ? next.startMs - prepared.problem.turnaroundS * 1000 : Infinity, pc.weather[pc.weather.length - 1]?.t ?? Infinity);
      return { id: b.id, potId: s.potId, startMs: s.startMs, foodKg: b.foodKg, foodCpJPerKgK: b.foodCpJPerKgK, waterKg: b.waterKg, lidOn: b.lidOn, minTempC: b.minTempC, holdS: b.holdS, maxEndMs };
    });
    const sim = simulateCooker(pc.spec, pc.weather, { initialStoreTempC: pc.initialStoreTempC, altitudeM: prepared.problem.altitudeM, loads });
    const pick = <T,>(a: T[]) => a.filter((_, i) => i % 10 === 0);
    return {
      id: c.id,
      name: c.name,
      pots: c.pots.map((p) => ({ id: p.id, name: p.name, volumeL: p.volumeL })),
      minUsefulTempC: c.minUsefulTempC,
      maxSafeTempC: c.maxSafeTempC,
      medium: cookerMedium(c),
      series: { t: pick(sim.series.t), storeTempC: pick(sim.series.storeTempC).map((v) => Math.round(v * 10) / 10), charge: pick(sim.series.charge).map((v) => Math.round(v * 1000) / 1000) },
    };
  });
}

/** Backup fuel for the batches the sun cannot serve, each on its dish's stove if the kitchen has it, else the kitchen's first. */
export function fuelView(kitchen: Kitchen, menuBatches: MenuBatch[], backupIds: string[]): PlanFuelView {
  const fuels = kitchen.planning.fuels;
  const onHand = new Map(fuels.map((f) => [f.stoveId, f]));
  const stoveFor = (b: MenuBatch) => (onHand.has(b.backupStove) ? b.backupStove : (fuels[0]?.stoveId ?? 'lpg')) as StoveId;
  const opts = (stoveId: StoveId) => {
    const f = onHand.get(stoveId);
    const base = STOVES[stoveId];
    return {
      ambientC: 25,
      altitudeM: kitchen.altitudeM,
      timeZone: kitchen.timeZone,
      currency: kitchen.planning.currency,
      stove: { ...base, efficiency: f?.efficiency ?? base.efficiency },
      prices: f?.price !== undefined ? { [base.fuelId]: f.price } : {},
    };
  };
  const ids = new Set(backupIds);
  const backup = menuBatches.filter((b) => ids.has(b.id));
  const groups = new Map<StoveId, MenuBatch[]>();
  for (const b of backup) groups.set(stoveFor(b), [...(groups.get(stoveFor(b)) ?? []), b]);
  const view: PlanFuelView = { currency: kitchen.planning.currency, perBatch: [], byFuel: {}, total: { cost: 0, co2Kg: 0, co2BiogenicKg: 0, usefulKWh: 0 }, allOnWood: { woodKg: 0, co2BiogenicKg: 0, cost: null }, solarShareOfHeat: 0 };
  for (const [stoveId, list] of groups) {
    const r = planBackupFuel(list.map(toBackupBatchInput), opts(stoveId));
    for (const bf of r.perBatch) {
      view.perBatch.push({ batchId: bf.batchId, stoveId, fuelId: bf.fuelId, amount: bf.amount, unit: bf.unit, cost: bf.cost, co2Kg: bf.co2Kg, co2BiogenicKg: bf.co2BiogenicKg, usefulKWh: bf.heat.usefulJ / 3.6e6 });
      const f = (view.byFuel[bf.fuelId] ??= { amount: 0, unit: bf.unit, cost: 0, co2Kg: 0, co2BiogenicKg: 0 });
      f.amount += bf.amount;
      f.cost = f.cost === null || bf.cost === null ? null : f.cost + bf.cost;
      f.co2Kg += bf.co2Kg;
      f.co2BiogenicKg += bf.co2BiogenicKg;
      view.total.cost = view.total.cost === null || bf.cost === null ? null : view.total.cost + bf.cost;
      view.total.co2Kg += bf.co2Kg;
      view.total.co2BiogenicKg += bf.co2BiogenicKg;
      view.total.usefulKWh += bf.heat.usefulJ / 3.6e6;
    }
  }
  if (menuBatches.length) {
    const wood = onHand.get('three-stone-wood') ?? onHand.get('improved-wood');
    const cmp = compareWithAllOnWood(menuBatches.map(toBackupBatchInput), ids, { ...opts(stoveFor(menuBatches[0]!)), prices: wood?.price !== undefined ? { wood: wood.price } : {} });
    const woodTotals: FuelTotals = cmp.allOnWood;
    view.allOnWood = { woodKg: woodTotals.amountByFuel.wood ?? 0, co2BiogenicKg: woodTotals.co2BiogenicKg, cost: woodTotals.cost };
    view.solarShareOfHeat = cmp.solarShareOfHeat;
  }
  return view;
}

/** Safety notes of every slot, from the dish, the cooker's medium and the store's predicted peak during the slot. */
export function slotSafetyNotes(batches: MenuBatch[], result: PlannerResult, cookers: PlanCookerView[]): Record<string, SafetyNote[]> {
  const out: Record<string, SafetyNote[]> = {};
  for (const s of result.slots) {
    const b = batches.find((x) => x.id === s.batchId);
    const c = cookers.find((x) => x.id === s.cookerId);
    if (!b || !c) continue;
    let peak = -Infinity;
    c.series.t.forEach((t, i) => {
      if (t >= s.startMs - 600_000 && t <= s.doneMs + 600_000) peak = Math.max(peak, c.series.storeTempC[i] ?? -Infinity);
    });
    // Plans stored before the medium was recorded fall back to the oil cautions (the stricter set).
    const medium = c.medium ?? { kind: 'oil', smokePointC: null };
    out[s.batchId] = safetyNotesForSlot({
      method: b.method,
      mediumKind: medium.kind,
      smokePointC: medium.smokePointC,
      predictedStoreMaxC: Number.isFinite(peak) ? peak : null,
      melting: medium.kind === 'pcm' && 'name' in medium ? meltingRangeForMediumName(medium.name) : null,
      maxSafeTempC: c.maxSafeTempC,
      safeCoreTempC: b.safeCoreTempC,
    });
  }
  return out;
}

export function describePlan(p: Plan) {
  const batches = p.batches as MenuBatch[];
  const result = p.result as PlannerResult;
  const cookers = p.cookers as PlanCookerView[];
  return {
    id: p.id,
    kitchenId: p.kitchen.id,
    date: p.date,
    version: p.version,
    status: p.status,
    weatherSource: p.weatherSource,
    createdAt: p.createdAt.toISOString(),
    publishedAt: p.publishedAt?.toISOString() ?? null,
    batches,
    result,
    fuel: p.fuel as PlanFuelView,
    cookers,
    safety: slotSafetyNotes(batches, result, cookers),
  };
}

async function nextPublishedVersion(em: EntityManager, kitchenId: string, date: string) {
  const last = await em.findOne(PlanSchema, { kitchen: kitchenId, date, status: { $ne: 'draft' } }, { orderBy: { version: 'desc' } });
  return (last?.version ?? 0) + 1;
}

/**
 * Serialises the writes of a kitchen's plans (replace the draft, publish) with a row lock on the
 * kitchen, taken first in both so they cannot deadlock. Without it, two solves at the same moment
 * each deleted the (old) draft and inserted their own: two drafts for one day.
 */
async function lockKitchenPlans(tx: EntityManager, kitchenId: string): Promise<void> {
  await tx.execute('select id from kitchens where id = ? for update', [kitchenId]);
}

/** Solves a new draft for the day (replacing the previous draft of that day). */
export async function solveDraft(access: KitchenAccess, date: string, timeLimitS: number) {
  return describePlan(await createDraft(access.em, access.kitchen, access.user.id, date, timeLimitS));
}

/** Solves and stores a draft; also used by the demo loader (actor null). */
export async function createDraft(em: EntityManager, kitchen: Kitchen, actorId: string | null, date: string, timeLimitS: number): Promise<Plan> {
  const prepared = await prepareProblem(em, kitchen, date, timeLimitS);
  if (!prepared.problem.cookers.length) throw unprocessable('This kitchen has no cookers yet. Register a cooker first.', { cookers: 'No cookers.' });
  const result = await planDayOffThread(prepared.problem).catch((err: unknown) => {
    // The planner checks its problem (e.g. a dish served before the shift starts): say so, do not fail.
    if (err instanceof RangeError) throw unprocessable(`The day cannot be planned as entered: ${err.message}`, { date: err.message });
    throw err;
  });
  const version = await nextPublishedVersion(em, kitchen.id, date);
  return em.transactional(async (tx) => {
    await lockKitchenPlans(tx, kitchen.id);
    await tx.nativeDelete(PlanSchema, { kitchen: kitchen.id, date, status: 'draft' });
    const p = tx.create(PlanSchema, {
      id: randomUUID(),
      kitchen,
      date,
      version,
      status: 'draft',
      createdBy: actorId ? (tx.getReference('User', actorId) as never) : null,
      publishedAt: null,
      publishedBy: null,
      weatherSource: prepared.weatherSource,
      batches: prepared.menuBatches,
      result,
      fuel: fuelView(kitchen, prepared.menuBatches, result.backup.map((b) => b.batchId)),
      cookers: cookerViews(prepared, result),
    });
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId, action: 'plan.solve', entityType: 'Plan', entityId: p.id, details: { date, servingsOnSun: result.servingsOnSun, status: result.status, gap: result.gap } });
    return p;
  });
}

export async function getPlan(access: KitchenAccess, planId: string): Promise<Plan> {
  const p = isUuid(planId) ? await access.em.findOne(PlanSchema, { id: planId, kitchen: access.kitchen.id }, { populate: ['kitchen'] }) : null;
  if (!p) throw notFound('Plan');
  return p;
}

/** The day's current draft and latest published plan (either may be missing). */
export async function getPlansForDate(access: KitchenAccess, date: string) {
  const [draft, published] = await Promise.all([
    access.em.findOne(PlanSchema, { kitchen: access.kitchen.id, date, status: 'draft' }, { populate: ['kitchen'] }),
    access.em.findOne(PlanSchema, { kitchen: access.kitchen.id, date, status: 'published' }, { populate: ['kitchen'], orderBy: { version: 'desc' } }),
  ]);
  return { draft: draft ? describePlan(draft) : null, published: published ? describePlan(published) : null };
}

/** Moves one slot of a draft after re-simulating the cookers it touches; refuses with a reason a cook understands. */
export async function moveSlot(access: KitchenAccess, planId: string, move: { batchId: string; cookerId: string; potId: string; startMs: number }) {
  const { em, kitchen } = access;
  const plan = await getPlan(access, planId);
  if (plan.status !== 'draft') throw conflict(`Plan version ${plan.version} is published and cannot change. Re-plan to make a new draft.`);
  const batches = plan.batches as MenuBatch[];
  if (!batches.some((b) => b.id === move.batchId)) throw notFound('Batch');
  const prepared = await prepareProblem(em, kitchen, plan.date, 2, batches);
  if (!prepared.problem.cookers.some((c) => c.id === move.cookerId)) throw unprocessable('That cooker is not in this kitchen.', { cookerId: 'Unknown cooker.' });
  const startMs = Math.round(move.startMs / 60_000) * 60_000;
  let check;
  try {
    check = await checkSlotMove(prepared.problem, plan.result as PlannerResult, { ...move, startMs });
  } catch (err) {
    if (err instanceof RangeError) throw unprocessable(err.message, { potId: err.message });
    throw err;
  }
  if (!check.ok || !check.plan) throw conflict(`This move does not work: ${check.reason ?? 'the simulation refused it'}.`);
  const result = check.plan;
  const fuel = fuelView(kitchen, batches, result.backup.map((b) => b.batchId));
  const cookers = cookerViews(prepared, result);
  // The check above takes a while; the plan may have been published, re-planned or moved meanwhile.
  // Write only if it is still the draft that was checked (same row version), under the kitchen's
  // plan lock; otherwise a move could land on a plan just published and change it.
  const updatedAt = new Date();
  await em.transactional(async (tx) => {
    await lockKitchenPlans(tx, kitchen.id);
    const rows: { status: string; version: number; updated_at: Date }[] = await tx.execute('select status, version, updated_at from plans where id = ? for update', [plan.id]);
    const cur = rows[0];
    if (!cur) throw notFound('Plan');
    if (cur.status !== 'draft') throw conflict(`Plan version ${cur.version} was published while the move was checked and cannot change. Re-plan to make a new draft.`);
    if (new Date(cur.updated_at).getTime() !== plan.updatedAt.getTime()) throw conflict('The plan changed while this move was checked (another move or a re-plan); reload it and try again.');
    await tx.nativeUpdate(PlanSchema, { id: plan.id }, { result, fuel, cookers, updatedAt });
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'plan.move-slot', entityType: 'Plan', entityId: plan.id, details: { ...move } });
  });
  return { ...describePlan(plan), result, fuel, cookers };
}

/** Publishes a draft as the next numbered version; the previous published version is superseded. */
export async function publishPlan(access: KitchenAccess, planId: string) {
  await getPlan(access, planId); // 404 for an id that is not this kitchen's plan (or not an id at all)
  return describePlan(await publishDraft(access.em, access.kitchen, access.user.id, planId));
}

/**
 * Publishing without a request (also used by the demo loader). After the transaction the plan's ready
 * alerts are scheduled (lib/alerts; pg-boss has its own connection, so it cannot join the transaction).
 */
export async function publishDraft(em: EntityManager, kitchen: Kitchen, actorId: string | null, planId: string): Promise<Plan> {
  const published = await em.transactional(async (tx) => {
    await lockKitchenPlans(tx, kitchen.id);
    // FOR UPDATE (waits): a second publish of the same draft sees it published and gets 409. Not
    // lockMode 4 (PESSIMISTIC_PARTIAL_WRITE = SKIP LOCKED), which skipped the locked row and answered 404.
    const plan = await tx.findOne(PlanSchema, { id: planId, kitchen: kitchen.id }, { populate: ['kitchen'], lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!plan) throw notFound('Plan');
    if (plan.status !== 'draft') throw conflict(`Plan version ${plan.version} is already ${plan.status}.`);
    await tx.nativeUpdate(PlanSchema, { kitchen: kitchen.id, date: plan.date, status: 'published' }, { status: 'superseded' });
    plan.version = await nextPublishedVersion(tx, kitchen.id, plan.date);
    plan.status = 'published';
    plan.publishedAt = new Date();
    plan.publishedBy = actorId ? (tx.getReference('User', actorId) as never) : null;
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId, action: 'plan.publish', entityType: 'Plan', entityId: plan.id, details: { date: plan.date, version: plan.version } });
    await tx.flush();
    return plan;
  });
  const { scheduleAfterPublish } = await import('@/lib/alerts/publish-hook');
  await scheduleAfterPublish(em, published.id);
  return published;
}
