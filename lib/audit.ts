import type { EntityManager } from '@mikro-orm/postgresql';
import { AuditEventSchema } from '@/entities';

/** Records a change in the same unit of work as the change itself (flushed with it). */
export function recordAudit(
  em: EntityManager,
  e: { organisationId: string; kitchenId?: string | null; actorId: string | null; action: string; entityType: string; entityId: string; details?: Record<string, unknown> },
): void {
  em.create(AuditEventSchema, {
    organisationId: e.organisationId,
    kitchenId: e.kitchenId ?? null,
    actorId: e.actorId,
    action: e.action,
    entityType: e.entityType,
    entityId: e.entityId,
    details: e.details ?? null,
  });
}
