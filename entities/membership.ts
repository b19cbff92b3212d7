import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base, type Role } from './base';
import type { Organisation } from './organisation';
import type { Kitchen } from './kitchen';
import type { User } from './user';

/**
 * A user's role. Coordinators hold an organisation-wide membership (kitchen null);
 * leads and cooks hold one membership per kitchen.
 */
export interface Membership extends Base {
  user: User;
  organisation: Organisation;
  kitchen: Kitchen | null;
  role: Role;
}

export const MembershipSchema = new EntitySchema<Membership>({
  name: 'Membership',
  tableName: 'memberships',
  properties: {
    ...baseProperties,
    user: { kind: 'm:1', entity: 'User', deleteRule: 'cascade' },
    organisation: { kind: 'm:1', entity: 'Organisation', deleteRule: 'cascade' },
    kitchen: { kind: 'm:1', entity: 'Kitchen', nullable: true, deleteRule: 'cascade' },
    role: { type: 'string', length: 16 },
  },
  uniques: [{ properties: ['user', 'organisation', 'kitchen', 'role'] }],
});
