import { randomUUID } from 'node:crypto';
import { getEm } from '@/lib/db';
import { KitchenSchema, MembershipSchema, OrganisationSchema, type Kitchen } from '@/entities';
import { requireCoordinatorOrg, type KitchenAccess, type Viewer } from '@/lib/auth/guard';
import { recordAudit } from '@/lib/audit';
import { kitchenClearness } from '@/lib/forecast/clearness';
import type { z } from 'zod';
import type { createKitchenSchema, updateKitchenSchema } from '@/lib/validations/kitchens';

type KitchenView = Pick<Kitchen, 'id' | 'name' | 'latitude' | 'longitude' | 'altitudeM' | 'timeZone' | 'locale' | 'clearness'> & { organisation: { id: string; name: string } };

export function describeKitchen(k: KitchenView, role?: string) {
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

/**
 * GET /api/v1/kitchens, the hottest read: the caller's kitchens and their strongest role in ONE
 * query (the same visibility rule as the guard: every kitchen of an organisation the user
 * coordinates, plus the kitchens they lead or cook in). Returns null when the user no longer exists or
 * the session was sealed before a password change.
 */
export async function listKitchensForUser(userId: string, sessionVersion: number) {
  const em = await getEm();
  const rows: Record<string, unknown>[] = await em.getConnection().execute(
    `with m as (select role, organisation_id, kitchen_id from memberships where user_id = ?)
     select k.id, k.name, k.latitude, k.longitude, k.altitude_m, k.time_zone, k.locale, k.clearness,
            o.id as org_id, o.name as org_name,
            case when exists (select 1 from m where m.role = 'coordinator' and m.kitchen_id is null and m.organisation_id = k.organisation_id) then 'coordinator'
                 when exists (select 1 from m where m.role = 'lead' and m.kitchen_id = k.id) then 'lead'
                 else 'cook' end as role
       from kitchens k join organisations o on o.id = k.organisation_id
      where k.organisation_id in (select organisation_id from m where role = 'coordinator' and kitchen_id is null)
         or k.id in (select kitchen_id from m where kitchen_id is not null)
      union all
     select null, null, null, null, null, null, null, null, null, null, 'user' from users where id = ? and session_version = ?
      order by 2 nulls first`,
    [userId, userId, sessionVersion],
  );
  if (!rows.length || rows[0]!.role !== 'user') return null;
  return rows.slice(1).map((r) =>
    describeKitchen(
      {
        id: r.id as string,
        name: r.name as string,
        latitude: r.latitude as number,
        longitude: r.longitude as number,
        altitudeM: r.altitude_m as number,
        timeZone: r.time_zone as string,
        locale: r.locale as Kitchen['locale'],
        clearness: (r.clearness as number[] | null) ?? null,
        organisation: { id: r.org_id as string, name: r.org_name as string },
      },
      r.role as string,
    ),
  );
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
