import { zonedDayBoundsMs } from '@/lib/time';
import { randomUUID } from 'node:crypto';
import { CheckInSchema, PlanSchema, type CheckIn } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { notFound, unprocessable } from '@/lib/http/errors';
import type { MenuBatch } from '@/lib/menus';
import type { PlannerResult } from '@/lib/planner';
import { fuelView } from '@/lib/plans';
import type { CheckInInput } from '@/lib/validations/cooks';
import { CLOCK_SKEW_MS } from './day';
import { idempotent } from './idempotency';
import { afterCooksWrite } from './after-write';

export function describeCheckIn(c: CheckIn) {
  return { id: c.id, planId: c.planId, date: c.date, batchId: c.batchId, cookerId: c.cookerId, kind: c.kind, at: c.at.toISOString(), userId: c.user?.id ?? null };
}
export type CheckInDto = ReturnType<typeof describeCheckIn>;

/**
 * Records a cook's check-in on a batch of a published plan, once per idempotency key (201 the first
 * time, 200 with the same answer on a retry). Plans superseded since the phone loaded them are
 * accepted: the batch ids carry over, and the cook did what they did. Then the batch's alerts follow
 * (skipped or done: ready alert cancelled; skipped: the lead is told).
 */
export async function recordCheckIn(access: KitchenAccess, input: CheckInInput, nowMs = Date.now()) {
  const { em, kitchen, user } = access;
  const atMs = input.at ? Date.parse(input.at) : nowMs;
  if (atMs > nowMs + CLOCK_SKEW_MS) throw unprocessable('That time is in the future; check the phone’s clock.', { at: 'In the future.' });
  let fuel = '';
  let planDate = '';
  const r = await idempotent(em, { kitchenId: kitchen.id, key: input.idempotencyKey, scope: 'check-in', request: { planId: input.planId, batchId: input.batchId, kind: input.kind, at: input.at ?? null } }, async (tx) => {
    const plan = await tx.findOne(PlanSchema, { id: input.planId, kitchen: kitchen.id, status: { $in: ['published', 'superseded'] } });
    if (!plan) throw notFound('Plan');
    const batches = plan.batches as MenuBatch[];
    const batch = batches.find((b) => b.id === input.batchId);
    if (!batch) throw notFound('Batch');
    // A phone whose clock fell back to an earlier day would mark the pot started long ago and "ready".
    const dayStartMs = zonedDayBoundsMs(plan.date, kitchen.timeZone)[0];
    if (atMs < dayStartMs - CLOCK_SKEW_MS) throw unprocessable('That time is before the plan’s day; check the phone’s clock.', { at: 'Before the day of the plan.' });
    const slot = (plan.result as PlannerResult).slots.find((s) => s.batchId === input.batchId);
    if (!slot && input.kind === 'skipped') throw unprocessable('This batch is already on backup fuel.', { batchId: 'Planned on backup fuel; nothing to skip.' });
    const c = tx.create(CheckInSchema, { id: randomUUID(), kitchen, planId: plan.id, date: plan.date, batchId: batch.id, cookerId: slot?.cookerId ?? null, kind: input.kind, at: new Date(atMs), user });
    if (input.kind === 'skipped') {
      const f = fuelView(kitchen, batches, [batch.id]).perBatch[0];
      fuel = f ? `${f.fuelId}:${Math.round(f.amount * 10) / 10}:${f.unit}` : '';
      recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: user.id, action: 'batch.skip', entityType: 'Plan', entityId: plan.id, details: { batchId: batch.id, fuel } });
    }
    planDate = plan.date;
    return { status: 201, body: describeCheckIn(c) };
  });
  if (!r.replay) await afterCooksWrite({ kind: 'check-in', em, kitchen, planDate, batchId: r.body.batchId, checkKind: r.body.kind, who: user.name, fuel }, { now: () => nowMs });
  return r;
}
