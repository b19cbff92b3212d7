import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

/** A failed sign-in, kept briefly to throttle guessing per account and per address. */
export interface LoginAttempt extends Base {
  /** "email:<address>" or "ip:<address>" */
  key: string;
}

export const LoginAttemptSchema = new EntitySchema<LoginAttempt>({
  name: 'LoginAttempt',
  tableName: 'login_attempts',
  properties: {
    ...baseProperties,
    key: { type: 'string', length: 400 },
  },
  indexes: [{ properties: ['key', 'createdAt'] }],
});
