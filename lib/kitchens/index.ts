import { randomUUID } from 'node:crypto';
import { KitchenSchema, MembershipSchema, OrganisationSchema, type Kitchen } from '@/entities';
import { getVisibleKitchens, rolesForKitchen, requireCoordinatorOrg, type KitchenAccess, type Viewer } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { kitchenClearness } from '@/lib/forecast/clearness';
import type { z } from 'zod';
import type { createKitchenSchema, updateKitchenSchema } from '@/lib/validations/kitchens';

export function describeKitchen(k: Kitchen, role?: string) {
  return {
    id: k.id,
    name: k.name,
    organisation: { id: k.organisation.id, name: k.organisation.name },
    latitude: k.latitude,
    longitude: k.longitude,
    altitudeM: k.altitudeM,
    timeZone: k.timeZone,
    locale: k.locale,
    clearness: kitchenClearness(k),
    ...(role ? { role } : {}),
  };
}

export async function listKitchens(viewer: Viewer) {
  const kitchens = await getVisibleKitchens(viewer);
  return kitchens.map((k) => describeKitchen(k, rolesForKitchen(viewer.memberships, k)[0]));
}

export async function createKitchen(viewer: Viewer, input: z.infer<typeof createKitchenSchema>) {
  const orgId = requireCoordinatorOrg(viewer);
  const { em } = viewer;
  const kitchen = em.create(KitchenSchema, { id: randomUUID(), ...input, organisation: em.getReference(OrganisationSchema, orgId) });
  recordAudit(em, { organisationId: orgId, kitchenId: kitchen.id, actorId: viewer.user.id, action: 'kitchen.create', entityType: 'Kitchen', entityId: kitchen.id });
  await em.flush();
  await em.populate(kitchen, ['organisation']);
  return describeKitchen(kitchen, 'coordinator');
}

export async function updateKitchen(access: KitchenAccess, input: z.infer<typeof updateKitchenSchema>) {
  const { em, kitchen } = access;
  em.assign(kitchen, input);
  recordAudit(em, { organisationId: kitchen.organisation.id, kitchenId: kitchen.id, actorId: access.user.id, action: 'kitchen.update', entityType: 'Kitchen', entityId: kitchen.id, details: input });
  await em.flush();
  return describeKitchen(kitchen, access.role);
}

export async function listKitchenMembers(access: KitchenAccess) {
  const { em, kitchen } = access;
  const members = await em.find(
    MembershipSchema,
    { $or: [{ kitchen: kitchen.id }, { organisation: kitchen.organisation.id, kitchen: null }] },
    { populate: ['user'], orderBy: { role: 'asc' } },
  );
  return members.map((m) => ({ id: m.id, role: m.role, user: { id: m.user.id, name: m.user.name, email: m.user.email } }));
}
