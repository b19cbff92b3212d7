import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { User } from './user';

/** A browser's Web Push subscription (RFC 8030 endpoint, RFC 8291 keys) for one kitchen's alerts. */
export interface PushSubscription extends Base {
  user: User;
  kitchen: Kitchen;
  /** Push-service URL to POST messages to; unique. */
  endpoint: string;
  /** Browser's P-256 public key and auth secret (base64url). */
  p256dh: string;
  auth: string;
  lastSuccessAt: Date | null;
  /** Failed deliveries since the last success. */
  failures: number;
}

export const PushSubscriptionSchema = new EntitySchema<PushSubscription>({
  name: 'PushSubscription',
  tableName: 'push_subscriptions',
  properties: {
    ...baseProperties,
    user: { kind: 'm:1', entity: 'User', deleteRule: 'cascade' },
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    endpoint: { type: 'text' },
    p256dh: { type: 'string', length: 200 },
    auth: { type: 'string', length: 64 },
    lastSuccessAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
    failures: { type: 'integer', default: 0 },
  },
  // One browser has one push endpoint, and a person may follow several kitchens' alerts on it.
  uniques: [{ properties: ['endpoint', 'kitchen'] }],
  indexes: [{ properties: ['kitchen'] }],
});
