import type { Role } from '@/entities/base';

/**
 * What each role may do inside a kitchen it can see. Reading is open to every member; writing is
 * split by job: cooks log what happens at the cooker, leads plan, coordinators set up.
 */
export const ACTIONS = {
  /** See the kitchen, its cookers, plans, forecasts. */
  read: ['coordinator', 'lead', 'cook'],
  /** Check-ins and thermometer readings. */
  'log-cooking': ['lead', 'cook'],
  /** Cookers, dishes, menus, plans, uploads. */
  plan: ['lead'],
  /** See draft plans (cooks work from published plans only). */
  'see-drafts': ['coordinator', 'lead'],
  /** Kitchen settings (location, time zone), create kitchens. */
  'manage-kitchen': ['coordinator'],
  /** Invite people to the kitchen (leads may invite cooks only; see canInviteRole). */
  'invite-people': ['coordinator', 'lead'],
  /** See the organisation-wide overview. */
  'view-organisation': ['coordinator'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof ACTIONS;

export function roleCan(role: Role, action: Action): boolean {
  return (ACTIONS[action] as readonly Role[]).includes(role);
}

/** Coordinators invite any role; leads invite cooks and leads to their own kitchens; cooks invite nobody. */
export function canInviteRole(inviter: Role, invitee: Role): boolean {
  if (inviter === 'coordinator') return true;
  if (inviter === 'lead') return invitee === 'cook' || invitee === 'lead';
  return false;
}
