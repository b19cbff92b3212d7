import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';

/** Who changed what, when. Written in the same transaction as the change. */
export interface AuditEvent extends Base {
  organisationId: string;
  kitchenId: string | null;
  actorId: string | null;
  /** e.g. "membership.create", "plan.publish" */
  action: string;
  entityType: string;
  entityId: string;
  details: Record<string, unknown> | null;
}

export const AuditEventSchema = new EntitySchema<AuditEvent>({
  name: 'AuditEvent',
  tableName: 'audit_events',
  properties: {
    ...baseProperties,
    organisationId: { type: 'uuid', index: true },
    kitchenId: { type: 'uuid', nullable: true },
    actorId: { type: 'uuid', nullable: true },
    action: { type: 'string', length: 64 },
    entityType: { type: 'string', length: 64 },
    entityId: { type: 'string', length: 64 },
    details: { type: 'json', nullable: true },
  },
});
