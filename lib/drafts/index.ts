/**
 * Commands on a kitchen's plans: solve a new draft for a day, move one slot of a draft, publish a
 * draft. Each writes in one transaction under the kitchen's plan lock; publishing then runs the one
 * alert step (lib/alerts/reschedule.ts) after its commit. Reading plans is lib/plans/queries.ts.
 */
import { randomUUID } from 'node:crypto';
import { LockMode, type EntityManager } from '@mikro-orm/postgresql';
import { PlanSchema, type Kitchen, type Plan, type StoredResult } from '@/entities';
import { recordAudit } from '@/lib/audit';
import { conflict, notFound, unprocessable } from '@/lib/http/errors';
import { rescheduleAlertsAfterCommit } from '@/lib/alerts/reschedule';
import { checkSlotMove, type PlannerResult } from '@/lib/planner';
import { planDayOffThread } from '@/lib/planner-thread';
import { prepareProblem, type PreparedProblem } from '@/lib/plans/problem';
import { describePlan, getPlan } from '@/lib/plans/queries';
import { cookerViews, fuelView, numberInCookingOrder } from '@/lib/plans/views';

/** Who acts on which kitchen's plans: a signed-in lead (from the guard), or the demo loader (actor null). */
export interface PlanActor {
  em: EntityManager;
  kitchen: Kitchen;
  actorId: string | null;
}

/** A day's clock time in the kitchen, for the "too late" sentence. */
const clockTime = (ms: number, timeZone: string) => new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(ms));

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

/** The planner's result with the batches too late to cook today added to backup fuel. */
function withTooLate(prepared: PreparedProblem, result: PlannerResult, timeZone: string): StoredResult {
  if (!prepared.tooLate.length) return result;
  return {
    ...result,
    backup: [
      ...result.backup,
      ...prepared.tooLate.map(({ batch, notBeforeMs }) => ({
        batchId: batch.id,
        reason: 'too-late' as const,
        detail: `planned at ${clockTime(notBeforeMs, timeZone)} or later, this batch can no longer be cooked on the sun by ${clockTime(batch.serveByMs, timeZone)}`,
      })),
    ],
  };
}

/**
 * Solves and stores a new draft for the day, replacing the day's previous draft. A day that has
 * already begun is planned from now on: no pot goes on before now plus the kitchen's lead time.
 */
export async function solveDraft(actor: PlanActor, date: string, timeLimitS: number, nowMs = Date.now()): Promise<Plan> {
  const { em, kitchen, actorId } = actor;
  const prepared = await prepareProblem(em, kitchen, date, timeLimitS, { nowMs });
  if (!prepared.problem.cookers.length) throw unprocessable('This kitchen has no cookers yet. Register a cooker first.', { cookers: 'No cookers.' });
  const planned = await planDayOffThread(prepared.problem).catch((err: unknown) => {
    // The planner checks its problem (e.g. a dish served before the shift starts): say so, do not fail.
    if (err instanceof RangeError) throw unprocessable(`The day cannot be planned as entered: ${err.message}`, { date: err.message });
    throw err;
  });
  const result = withTooLate(prepared, planned, kitchen.timeZone);
  const batches = numberInCookingOrder(prepared.menuBatches, result);
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
      batches,
      result,
      fuel: fuelView(kitchen, batches, result.backup.map((b) => b.batchId)),
      cookers: cookerViews(prepared.problem, batches, prepared.cookers, result),
    });
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId, action: 'plan.solve', entityType: 'Plan', entityId: p.id, details: { date, servingsOnSun: result.servingsOnSun, status: result.status, gap: result.gap } });
    return p;
  });
}

/** Moves one slot of a draft after re-simulating the cookers it touches; refuses with a reason a cook understands. */
export async function moveDraftSlot(actor: PlanActor, planId: string, move: { batchId: string; cookerId: string; potId: string; startMs: number }) {
  const { em, kitchen, actorId } = actor;
  const plan = await getPlan(actor, planId);
  if (plan.status !== 'draft') throw conflict(`Plan version ${plan.version} is published and cannot change. Re-plan to make a new draft.`);
  if (!plan.batches.some((b) => b.id === move.batchId)) throw notFound('Batch');
  // Batches too late to cook on the sun when the draft was solved stay on backup: the planner never saw them.
  const tooLate = new Set(plan.result.backup.filter((b) => b.reason === 'too-late').map((b) => b.batchId));
  const prepared = await prepareProblem(em, kitchen, plan.date, 2, { batches: plan.batches.filter((b) => !tooLate.has(b.id)) });
  if (!prepared.problem.cookers.some((c) => c.id === move.cookerId)) throw unprocessable('That cooker is not in this kitchen.', { cookerId: 'Unknown cooker.' });
  const startMs = Math.round(move.startMs / 60_000) * 60_000;
  const plannerSide: PlannerResult = { ...plan.result, backup: plan.result.backup.flatMap((b) => (b.reason === 'too-late' ? [] : [{ ...b, reason: b.reason }])) };
  let check;
  try {
    check = await checkSlotMove(prepared.problem, plannerSide, { ...move, startMs });
  } catch (err) {
    if (err instanceof RangeError) throw unprocessable(err.message, { potId: err.message });
    throw err;
  }
  if (!check.ok || !check.plan) throw conflict(`This move does not work: ${check.reason ?? 'the simulation refused it'}.`);
  const result: StoredResult = { ...check.plan, backup: [...check.plan.backup, ...plan.result.backup.filter((b) => tooLate.has(b.batchId))] };
  const batches = numberInCookingOrder(plan.batches, result);
  const fuel = fuelView(kitchen, batches, result.backup.map((b) => b.batchId));
  const cookers = cookerViews(prepared.problem, batches, prepared.cookers, result);
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
    await tx.nativeUpdate(PlanSchema, { id: plan.id }, { batches, result, fuel, cookers, updatedAt });
    recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId, action: 'plan.move-slot', entityType: 'Plan', entityId: plan.id, details: { ...move } });
  });
  return { ...describePlan(plan), batches, result, fuel, cookers, updatedAt: updatedAt.toISOString() };
}

/**
 * Publishes a draft as the next numbered version; the previous published version is superseded.
 * After the commit the day's alerts follow the new version (lib/alerts/reschedule.ts).
 */
export async function publishDraft(actor: PlanActor, planId: string): Promise<Plan> {
  const { em, kitchen, actorId } = actor;
  await getPlan(actor, planId); // 404 for an id that is not this kitchen's plan (or not an id at all)
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
  await rescheduleAlertsAfterCommit(em, kitchen, published.date);
  return published;
}
