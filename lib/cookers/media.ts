import { randomUUID } from 'node:crypto';
import type { z } from 'zod';
import { OrganisationSchema, StorageMediumSchema } from '@/entities';
import type { KitchenAccess } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { unprocessable } from '@/lib/http/errors';
import { createCustomMedium } from '@/lib/materials';
import type { customMediumSchema } from '@/lib/validations/cookers';

/** Stores a custom medium after the materials library accepts its table (monotonic enthalpy etc.). */
export async function createCustomMediumForKitchen(access: KitchenAccess, input: z.infer<typeof customMediumSchema>) {
  try {
    createCustomMedium({ name: input.name, rows: input.rows, ...(input.smokePointC != null ? { smokePointC: input.smokePointC } : {}) });
  } catch (err) {
    throw unprocessable(`The table is not usable: ${(err as Error).message}`, { rows: (err as Error).message });
  }
  const { em, kitchen } = access;
  const medium = em.create(StorageMediumSchema, {
    id: randomUUID(),
    organisation: em.getReference(OrganisationSchema, kitchen.organisation.id),
    name: input.name,
    rows: input.rows,
    smokePointC: input.smokePointC ?? null,
    source: input.source ?? null,
  });
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'medium.create', entityType: 'StorageMedium', entityId: medium.id });
  await em.flush();
  return { id: medium.id, name: medium.name, kind: 'custom', builtIn: false, smokePointC: medium.smokePointC, rows: medium.rows };
}
