import { zonedDayBoundsMs } from '@/lib/time';
import { randomUUID } from 'node:crypto';
import { CheckInSchema, PlanSchema, type CheckIn } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { notFound, unprocessable } from '@/lib/http/errors';
import { rescheduleAlertsAfterCommit } from '@/lib/alerts/reschedule';
import { CLOCK_SKEW_MS } from '@/lib/plans/day';
import type { CheckInInput } from '@/lib/validations/cooks';
import { idempotent } from './idempotency';

export function describeCheckIn(c: CheckIn) {
  return { id: c.id, planId: c.planId, date: c.date, batchId: c.batchId, cookerId: c.cookerId, kind: c.kind, at: c.at.toISOString(), userId: c.user?.id ?? null };
}
export type CheckInDto = ReturnType<typeof describeCheckIn>;

/**
 * Records a cook's check-in on a batch of a published plan, once per idempotency key (201 the first
 * time, 200 with the same answer on a retry). Plans superseded since the phone loaded them are
 * accepted: the batch ids carry over, and the cook did what they did. After the commit the day's alerts
 * follow (skipped or done: ready alert cancelled; skipped: the lead is told; started: the ready alert
 * follows the real start).
 */
export async function recordCheckIn(access: KitchenAccess, input: CheckInInput, nowMs = Date.now()) {
  const { em, kitchen, user } = access;
  const atMs = input.at ? Date.parse(input.at) : nowMs;
  if (atMs > nowMs + CLOCK_SKEW_MS) throw unprocessable('That time is in the future; check the phone’s clock.', { at: 'In the future.' });
  let planDate = '';
  const r = await idempotent(em, { kitchenId: kitchen.id, key: input.idempotencyKey, scope: 'check-in', request: { planId: input.planId, batchId: input.batchId, kind: input.kind, at: input.at ?? null } }, async (tx) => {
    const plan = await tx.findOne(PlanSchema, { id: input.planId, kitchen: kitchen.id, status: { $in: ['published', 'superseded'] } });
    if (!plan) throw notFound('Plan');
    const batch = plan.batches.find((b) => b.id === input.batchId);
    if (!batch) throw notFound('Batch');
    // A phone whose clock fell back to an earlier day would mark the pot started long ago and "ready".
    const dayStartMs = zonedDayBoundsMs(plan.date, kitchen.timeZone)[0];
    if (atMs < dayStartMs - CLOCK_SKEW_MS) throw unprocessable('That time is before the plan’s day; check the phone’s clock.', { at: 'Before the day of the plan.' });
    const slot = plan.result.slots.find((s) => s.batchId === input.batchId);
    if (!slot && input.kind === 'skipped') throw unprocessable('This batch is already on backup fuel.', { batchId: 'Planned on backup fuel; nothing to skip.' });
    const c = tx.create(CheckInSchema, { id: randomUUID(), kitchen, planId: plan.id, date: plan.date, batchId: batch.id, cookerId: slot?.cookerId ?? null, kind: input.kind, at: new Date(atMs), user });
    if (input.kind === 'skipped') recordAudit(tx, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: user.id, action: 'batch.skip', entityType: 'Plan', entityId: plan.id, details: { batchId: batch.id } });
    planDate = plan.date;
    return { status: 201, body: describeCheckIn(c) };
  });
  if (!r.replay) await rescheduleAlertsAfterCommit(em, kitchen, planDate, { now: () => nowMs });
  return r;
}
