import { isUuid } from '@/lib/auth/guard';
import { createHash, randomBytes, randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import { CookerApiKeySchema, type CookerApiKey } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { getCooker } from '@/lib/cookers';
import { HttpError, notFound } from '@/lib/http/errors';

/** Keys look like "hck_" + 43 base64url characters (32 random bytes). */
const KEY_RE = /^hck_[A-Za-z0-9_-]{43}$/;
export const hashApiKey = (key: string) => createHash('sha256').update(key).digest('hex');

export function describeApiKey(k: CookerApiKey) {
  return { id: k.id, label: k.label, prefix: k.prefix, createdAt: k.createdAt.toISOString(), lastUsedAt: k.lastUsedAt?.toISOString() ?? null, revokedAt: k.revokedAt?.toISOString() ?? null };
}

export async function listApiKeys(access: KitchenAccess, cookerId: string) {
  const cooker = await getCooker(access, cookerId);
  const keys = await access.em.find(CookerApiKeySchema, { cooker: cooker.id }, { orderBy: { createdAt: 'desc' } });
  return keys.map(describeApiKey);
}

/** Makes a key for a cooker's sensor; the key itself is in this answer only (the database keeps its SHA-256). */
export async function createApiKey(access: KitchenAccess, cookerId: string, label: string) {
  const { em, kitchen } = access;
  const cooker = await getCooker(access, cookerId);
  const key = `hck_${randomBytes(32).toString('base64url')}`;
  const row = em.create(CookerApiKeySchema, { id: randomUUID(), kitchen, cooker, label, keyHash: hashApiKey(key), prefix: key.slice(0, 10), createdBy: access.user, revokedAt: null, lastUsedAt: null });
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'cooker-api-key.create', entityType: 'CookerApiKey', entityId: row.id, details: { cookerId: cooker.id, label } });
  await em.flush();
  return { ...describeApiKey(row), key };
}

export async function revokeApiKey(access: KitchenAccess, cookerId: string, keyId: string) {
  const { em, kitchen } = access;
  const cooker = await getCooker(access, cookerId);
  const row = isUuid(keyId) ? await em.findOne(CookerApiKeySchema, { id: keyId, cooker: cooker.id }) : null;
  if (!row) throw notFound('API key');
  if (!row.revokedAt) {
    row.revokedAt = new Date();
    recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'cooker-api-key.revoke', entityType: 'CookerApiKey', entityId: row.id, details: { cookerId: cooker.id } });
    await em.flush();
  }
}

const unauthorizedKey = (message: string) => new HttpError(401, 'unauthorized', message, undefined, { 'WWW-Authenticate': 'Bearer realm="hearthcast-readings"' });

/**
 * The cooker API key of a sensor request (`Authorization: Bearer <key>`): 401 when missing, malformed,
 * unknown or revoked. Only the key's hash is looked up.
 */
export async function authenticateApiKey(em: EntityManager, authorization: string | null): Promise<CookerApiKey> {
  const m = /^Bearer\s+(\S+)\s*$/i.exec(authorization ?? '');
  if (!m) throw unauthorizedKey('Send the cooker API key as "Authorization: Bearer <key>".');
  const key = m[1]!;
  const row = KEY_RE.test(key) ? await em.findOne(CookerApiKeySchema, { keyHash: hashApiKey(key) }, { populate: ['cooker', 'kitchen', 'kitchen.organisation'] }) : null;
  if (!row || row.revokedAt) throw unauthorizedKey('This API key is not valid (unknown or revoked). Ask the kitchen lead for a new one.');
  if (row.cooker.archived) throw notFound('Cooker');
  return row;
}
