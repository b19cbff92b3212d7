import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base, type Role } from './base';
import type { Organisation } from './organisation';
import type { Kitchen } from './kitchen';
import type { User } from './user';

/** A one-time invitation; only the SHA-256 of the token is stored. */
export interface Invitation extends Base {
  email: string;
  tokenHash: string;
  role: Role;
  organisation: Organisation;
  kitchen: Kitchen | null;
  invitedBy: User;
  expiresAt: Date;
  acceptedAt: Date | null;
}

export const InvitationSchema = new EntitySchema<Invitation>({
  name: 'Invitation',
  tableName: 'invitations',
  properties: {
    ...baseProperties,
    email: { type: 'string', length: 320 },
    tokenHash: { type: 'string', length: 64, unique: true, hidden: true },
    role: { type: 'string', length: 16 },
    organisation: { kind: 'm:1', entity: 'Organisation', deleteRule: 'cascade' },
    kitchen: { kind: 'm:1', entity: 'Kitchen', nullable: true, deleteRule: 'cascade' },
    invitedBy: { kind: 'm:1', entity: 'User', deleteRule: 'cascade' },
    expiresAt: { type: 'Date', columnType: 'timestamptz' },
    acceptedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
  },
});
