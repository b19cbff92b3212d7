import { createHash, randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { IdempotencyRecordSchema } from '@/entities';
import { conflict } from '@/lib/http/errors';

export interface IdempotentResult<T> {
  status: number;
  body: T;
  /** True when this is the stored answer to an earlier request with the same key. */
  replay: boolean;
}

/** JSON with sorted keys, so the same request hashes the same whatever the order of its fields. */
function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') return `{${Object.keys(v as object).sort().map((k) => `${JSON.stringify(k)}:${canonical((v as Record<string, unknown>)[k])}`).join(',')}}`;
  return JSON.stringify(v) ?? 'null';
}

export const requestHash = (v: unknown) => createHash('sha256').update(canonical(v)).digest('hex');

/**
 * Runs a write once per (kitchen, idempotency key). The key is claimed by inserting its record in the
 * same transaction as the write; a concurrent request with the same key waits on the unique index
 * until the first commits, then gets the first answer back (status 200). When the write fails, the
 * transaction rolls back with the claim, so a retry is evaluated afresh. A key reused for a different
 * request is refused (409): silently answering with another request's result would hide a client bug.
 */
export async function idempotent<T>(
  em: EntityManager,
  claim: { kitchenId: string; key: string; scope: string; request: unknown },
  write: (tx: EntityManager) => Promise<{ status: number; body: T }>,
): Promise<IdempotentResult<T>> {
  const hash = requestHash({ scope: claim.scope, request: claim.request });
  return em.transactional(async (tx) => {
    const claimed = await tx.execute<{ id: string }[]>(
      `insert into idempotency_records (id, created_at, updated_at, kitchen_id, key, scope, request_hash, status, response)
       values (?, now(), now(), ?, ?, ?, ?, 0, 'null'::jsonb) on conflict (kitchen_id, key) do nothing returning id`,
      [randomUUID(), claim.kitchenId, claim.key, claim.scope, hash],
    );
    if (!claimed.length) {
      const prev = await tx.findOneOrFail(IdempotencyRecordSchema, { kitchenId: claim.kitchenId, key: claim.key }, { refresh: true });
      if (prev.requestHash !== hash) throw conflict('This idempotency key was already used for a different request; send a new key.', { idempotencyKey: 'Already used for a different request.' });
      return { status: 200, body: prev.response as T, replay: true };
    }
    const r = await write(tx);
    await tx.flush();
    await tx.execute(`update idempotency_records set status = ?, response = ?::jsonb, updated_at = now() where id = ?`, [r.status, JSON.stringify(r.body), claimed[0]!.id]);
    return { ...r, replay: false };
  });
}
