import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { User } from './user';

/** A one-time password-reset token; only its SHA-256 is stored. */
export interface PasswordReset extends Base {
  user: User;
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
}

export const PasswordResetSchema = new EntitySchema<PasswordReset>({
  name: 'PasswordReset',
  tableName: 'password_resets',
  properties: {
    ...baseProperties,
    user: { kind: 'm:1', entity: 'User', deleteRule: 'cascade' },
    tokenHash: { type: 'string', length: 64, unique: true, hidden: true },
    expiresAt: { type: 'Date', columnType: 'timestamptz' },
    usedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
  },
});
