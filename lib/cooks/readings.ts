import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { CookerApiKeySchema, ReadingSchema, type CookerApiKey, type Reading } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { getCooker } from '@/lib/cookers';
import { unprocessable } from '@/lib/http/errors';
import { localDateString, zonedDayBoundsMs } from '@/lib/time';
import type { ManualReadingInput, SensorReadingsInput } from '@/lib/validations/cooks';
import { rescheduleAlertsAfterCommit } from '@/lib/alerts/reschedule';
import { CLOCK_SKEW_MS } from '@/lib/plans/day';
import { idempotent } from './idempotency';

export function describeReading(r: Reading) {
  return { id: r.id, cookerId: r.cooker.id, at: r.at.toISOString(), storeC: r.storeC, potC: r.potC, potId: r.potId, source: r.source };
}
export type ReadingDto = ReturnType<typeof describeReading>;

/** A thermometer reading typed by a cook (or lead), once per idempotency key; then the cooker's alerts follow the measured store. */
export async function recordManualReading(access: KitchenAccess, input: ManualReadingInput, nowMs = Date.now()) {
  const { em, kitchen, user } = access;
  const atMs = input.at ? Date.parse(input.at) : nowMs;
  if (atMs > nowMs + CLOCK_SKEW_MS) throw unprocessable('That time is in the future; check the phone’s clock.', { at: 'In the future.' });
  const r = await idempotent(em, { kitchenId: kitchen.id, key: input.idempotencyKey, scope: 'reading', request: { cookerId: input.cookerId, at: input.at ?? null, storeC: input.storeC ?? null, potC: input.potC ?? null, potId: input.potId ?? null } }, async (tx) => {
    const cooker = await getCooker({ ...access, em: tx }, input.cookerId);
    if (input.potId && !cooker.pots.some((p) => p.id === input.potId)) throw unprocessable('That pot is not on this cooker.', { potId: 'Unknown pot.' });
    const row = tx.create(ReadingSchema, { id: randomUUID(), kitchen, cooker, at: new Date(atMs), storeC: input.storeC ?? null, potC: input.potC ?? null, potId: input.potId ?? null, source: 'manual', user, apiKeyId: null });
    return { status: 201, body: describeReading(row) };
  });
  // The reading's own day: a reading typed after midnight for the evening before re-predicts that day.
  if (!r.replay) await rescheduleAlertsAfterCommit(em, kitchen, localDateString(atMs, kitchen.timeZone), { now: () => nowMs });
  return r;
}

/**
 * A sensor's batch of readings, authenticated by its cooker API key: all rows or none. Refused rows
 * are named (`readings.3.at`): in the future, or not after the last reading this key sent (a
 * sensor's clock goes forward; a repeated batch is recognised by its idempotency key instead).
 */
export async function recordSensorReadings(em: EntityManager, key: CookerApiKey, input: SensorReadingsInput, nowMs = Date.now()) {
  const kitchen = key.kitchen;
  const fields: Record<string, string> = {};
  input.readings.forEach((x, i) => {
    if (Date.parse(x.at) > nowMs + CLOCK_SKEW_MS) fields[`readings.${i}.at`] ??= 'In the future; check the sensor’s clock.';
  });
  if (Object.keys(fields).length) throw unprocessable(`Check the field "${Object.keys(fields)[0]}": in the future.`, fields);
  const r = await idempotent(em, { kitchenId: kitchen.id, key: input.idempotencyKey, scope: 'sensor-readings', request: { apiKeyId: key.id, readings: input.readings } }, async (tx) => {
    const last = await tx.findOne(ReadingSchema, { apiKeyId: key.id }, { orderBy: { at: 'desc' } });
    const first = input.readings[0]!;
    if (last && Date.parse(first.at) <= last.at.getTime()) {
      throw unprocessable(`Out of order: this key already sent a reading at ${last.at.toISOString()}.`, { 'readings.0.at': `Out of order: must be after ${last.at.toISOString()}, the last reading this key sent.` });
    }
    const potIds = new Set(key.cooker.pots.map((p) => p.id));
    const bad = input.readings.findIndex((x) => x.potId !== undefined && !potIds.has(x.potId));
    if (bad >= 0) throw unprocessable('That pot is not on this cooker.', { [`readings.${bad}.potId`]: 'Unknown pot.' });
    for (const x of input.readings) {
      tx.create(ReadingSchema, { id: randomUUID(), kitchen, cooker: key.cooker, at: new Date(x.at), storeC: x.storeC ?? null, potC: x.potC ?? null, potId: x.potId ?? null, source: 'sensor', user: null, apiKeyId: key.id });
    }
    await tx.nativeUpdate(CookerApiKeySchema, { id: key.id }, { lastUsedAt: new Date(nowMs) });
    return { status: 201, body: { accepted: input.readings.length, cookerId: key.cooker.id, from: new Date(first.at).toISOString(), to: new Date(input.readings[input.readings.length - 1]!.at).toISOString() } };
  });
  if (!r.replay) await rescheduleAlertsAfterCommit(em, kitchen, localDateString(Date.parse(input.readings[input.readings.length - 1]!.at), kitchen.timeZone), { now: () => nowMs });
  return r;
}

/** A cooker's readings of a local day (default today), oldest first, for the chart against the prediction. */
export async function listReadings(access: KitchenAccess, cookerId: string, date?: string, nowMs = Date.now()) {
  const cooker = await getCooker(access, cookerId);
  const day = date ?? localDateString(nowMs, access.kitchen.timeZone);
  const [from, to] = zonedDayBoundsMs(day, access.kitchen.timeZone);
  const rows = await access.em.find(ReadingSchema, { cooker: cooker.id, at: { $gte: new Date(from), $lt: new Date(to) } }, { orderBy: { at: 'asc' }, limit: 5000, populate: ['cooker'] });
  return { date: day, cookerId: cooker.id, readings: rows.map(describeReading) };
}
