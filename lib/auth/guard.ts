import type { EntityManager } from '@mikro-orm/postgresql';
import { getEm } from '@/lib/db';
import { forbidden, notFound, unauthorized } from '@/lib/http/errors';
import { KitchenSchema, MembershipSchema, UserSchema, type Kitchen, type Membership, type Role, type User } from '@/entities';
import { getSession } from './session';
import { roleCan, type Action } from './permissions';

/** The signed-in user with every membership, resolved once per request. */
export interface Viewer {
  em: EntityManager;
  user: User;
  memberships: Membership[];
}

export interface KitchenAccess extends Viewer {
  kitchen: Kitchen;
  /** The strongest role the viewer holds for this kitchen. */
  role: Role;
}

/** Resolves session → user → memberships; 401 when nobody is signed in. */
export async function requireViewer(): Promise<Viewer> {
  const session = await getSession();
  if (!session.userId) throw unauthorized();
  const em = await getEm();
  // One joined query for the user and every membership (the hot path of every request).
  const memberships = await em.find(MembershipSchema, { user: session.userId }, { populate: ['user', 'organisation', 'kitchen'], strategy: 'joined' });
  const user = memberships[0]?.user ?? (await em.findOne(UserSchema, { id: session.userId }));
  if (!user || user.sessionVersion !== (session.v ?? 0)) throw unauthorized('Your session has ended; sign in again.');
  return { em, user, memberships };
}

const ROLE_RANK: Record<Role, number> = { coordinator: 3, lead: 2, cook: 1 };

/**
 * The roles a viewer holds for a kitchen: a coordinator membership of the kitchen's organisation,
 * or a lead/cook membership of the kitchen itself.
 */
export function rolesForKitchen(memberships: Membership[], kitchen: Kitchen): Role[] {
  const orgId = kitchen.organisation.id;
  return memberships
    .filter((m) =>
      m.role === 'coordinator' ? m.organisation.id === orgId && m.kitchen === null : m.kitchen?.id === kitchen.id,
    )
    .map((m) => m.role)
    .sort((a, b) => ROLE_RANK[b] - ROLE_RANK[a]);
}

/** Kitchens a viewer can see, by name. */
export async function getVisibleKitchens(viewer: Viewer): Promise<Kitchen[]> {
  const orgIds = viewer.memberships.filter((m) => m.role === 'coordinator').map((m) => m.organisation.id);
  const kitchenIds = viewer.memberships.filter((m) => m.kitchen).map((m) => m.kitchen!.id);
  if (!orgIds.length && !kitchenIds.length) return [];
  return viewer.em.find(
    KitchenSchema,
    { $or: [{ organisation: { $in: orgIds } }, { id: { $in: kitchenIds } }] },
    { orderBy: { name: 'asc' }, populate: ['organisation'] },
  );
}

const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** True for a well-formed UUID: anything else from a URL is a 404 before it reaches PostgreSQL (which would refuse it). */
export const isUuid = (id: string) => UUID_RE.test(id);

/**
 * The one guard for kitchen-scoped work: 401 without a session; 404 when the kitchen does not
 * exist or belongs to someone else (existence is not revealed); 403 when the viewer sees the
 * kitchen but the role does not allow the action.
 */
export async function requireKitchen(kitchenId: string, action: Action, viewer?: Viewer): Promise<KitchenAccess> {
  const v = viewer ?? (await requireViewer());
  if (!isUuid(kitchenId)) throw notFound('Kitchen');
  const kitchen = await v.em.findOne(KitchenSchema, { id: kitchenId }, { populate: ['organisation'] });
  if (!kitchen) throw notFound('Kitchen');
  const roles = rolesForKitchen(v.memberships, kitchen);
  const role = roles[0];
  if (!role) throw notFound('Kitchen');
  if (!roles.some((r) => roleCan(r, action))) throw forbidden();
  return { ...v, kitchen, role };
}

/** For organisation-level work (overview, creating kitchens): the viewer must coordinate the organisation. */
export function requireCoordinatorOrg(viewer: Viewer, organisationId?: string): string {
  const coord = viewer.memberships.filter((m) => m.role === 'coordinator');
  if (!coord.length) throw forbidden('Only a coordinator can do this.');
  if (organisationId) {
    if (!coord.some((m) => m.organisation.id === organisationId)) throw notFound('Organisation');
    return organisationId;
  }
  return coord[0]!.organisation.id;
}
