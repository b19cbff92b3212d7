import { LockMode } from '@mikro-orm/core';
import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/postgresql';
import {
  InvitationSchema,
  KitchenSchema,
  MembershipSchema,
  OrganisationSchema,
  PasswordResetSchema,
  UserSchema,
  type Locale,
  type Role,
  type User,
} from '@/entities';
import { hashPassword, verifyPassword } from '@/lib/auth/password';
import { beginAttempt, clearFailures, endAttemptWithSuccess } from '@/lib/auth/throttle';
import { createOneTimeToken, hashToken } from '@/lib/auth/tokens';
import { canInviteRole } from '@/lib/auth/permissions';
import { rolesForKitchen, requireCoordinatorOrg, type Viewer } from '@/lib/auth/guard';
import { HttpError, forbidden, notFound, unauthorized, unprocessable } from '@/lib/http/errors';
import { sendMail } from '@/lib/mail';
import { inviteMail, resetMail } from '@/lib/mail/templates';
import { recordAudit } from '@/lib/audit';
import { getEnv } from '@/lib/env';

const INVITE_TTL_MS = 7 * 24 * 3600 * 1000;
const RESET_TTL_MS = 3600 * 1000;

/** The one message for a failed sign-in: it never says whether the address is registered. */
export const SIGN_IN_FAILED = 'The e-mail address or the password is not right.';

export async function signIn(em: EntityManager, email: string, password: string, ip: string | null): Promise<User> {
  const attempt = await beginAttempt(em, email, ip);
  const user = await em.findOne(UserSchema, { email });
  const ok = await verifyPassword(password, user?.passwordHash ?? null);
  if (!user || !ok) throw unauthorized(SIGN_IN_FAILED); // the attempt stays counted as a failure
  await endAttemptWithSuccess(em, email, attempt);
  return user;
}

export async function createInvitation(
  viewer: Viewer,
  input: { email: string; role: Role; kitchenId?: string | null },
): Promise<{ id: string; expiresAt: Date }> {
  const { em, user } = viewer;
  let organisationId: string;
  let kitchenId: string | null = null;
  if (input.role === 'coordinator') {
    organisationId = requireCoordinatorOrg(viewer);
  } else {
    const kitchen = await em.findOne(KitchenSchema, { id: input.kitchenId! }, { populate: ['organisation'] });
    const roles = kitchen ? rolesForKitchen(viewer.memberships, kitchen) : [];
    if (!kitchen || !roles.length) throw notFound('Kitchen');
    if (!roles.some((r) => canInviteRole(r, input.role))) throw forbidden(`Your role cannot invite a ${input.role}.`);
    organisationId = kitchen.organisation.id;
    kitchenId = kitchen.id;
  }
  const { token, tokenHash } = createOneTimeToken();
  const org = await em.findOneOrFail(OrganisationSchema, { id: organisationId });
  const invitation = em.create(InvitationSchema, {
    id: randomUUID(),
    email: input.email,
    tokenHash,
    role: input.role,
    organisation: org,
    kitchen: kitchenId ? em.getReference(KitchenSchema, kitchenId) : null,
    invitedBy: user,
    expiresAt: new Date(Date.now() + INVITE_TTL_MS),
    acceptedAt: null,
  });
  recordAudit(em, { organisationId, kitchenId, actorId: user.id, action: 'invitation.create', entityType: 'Invitation', entityId: invitation.id, details: { email: input.email, role: input.role } });
  await em.flush();
  const link = `${getEnv().APP_URL}/invite/${token}`;
  const mail = inviteMail(user.locale, org.name, input.role, link);
  await sendMail({ to: input.email, subject: mail.subject, text: mail.text });
  return { id: invitation.id, expiresAt: invitation.expiresAt };
}

/** Accepts an invitation: creates or completes the account and the membership in one transaction. */
export async function acceptInvitation(em: EntityManager, input: { token: string; name: string; password: string }, locale: Locale = 'en'): Promise<User> {
  const passwordHash = await hashPassword(input.password);
  return em.transactional(async (tx) => {
    const inv = await tx.findOne(InvitationSchema, { tokenHash: hashToken(input.token) }, { populate: ['organisation', 'kitchen'], lockMode: LockMode.PESSIMISTIC_WRITE /* waits; 4 would be SKIP LOCKED */ });
    if (!inv || inv.acceptedAt || inv.expiresAt.getTime() < Date.now()) {
      throw new HttpError(410, 'link_expired', 'This invitation link is no longer valid. Ask for a new invitation.');
    }
    let user = await tx.findOne(UserSchema, { email: inv.email });
    if (user && user.passwordHash) {
      // An existing account: the membership is added; the password is not changed by an invitation.
    } else if (user) {
      user.passwordHash = passwordHash;
      user.name = input.name;
    } else {
      // The id is set here, not at flush: the audit event below names the new user as its actor.
      user = tx.create(UserSchema, { id: randomUUID(), email: inv.email, passwordHash, name: input.name, locale, temperatureUnit: 'C' });
    }
    const existing = await tx.findOne(MembershipSchema, { user, organisation: inv.organisation, kitchen: inv.kitchen, role: inv.role });
    if (!existing) {
      const m = tx.create(MembershipSchema, { id: randomUUID(), user, organisation: inv.organisation, kitchen: inv.kitchen, role: inv.role });
      recordAudit(tx, { organisationId: inv.organisation.id, kitchenId: inv.kitchen?.id ?? null, actorId: user.id, action: 'membership.create', entityType: 'Membership', entityId: m.id, details: { role: inv.role, via: 'invitation' } });
    }
    inv.acceptedAt = new Date();
    return user;
  });
}

/**
 * Starts a reset. Always resolves the same way, whether or not the address is registered, but not
 * in the same time (a row and a mail for a registered one): run it after answering the request
 * (the route uses next/server `after`), so its duration does not tell which addresses exist.
 */
export async function requestPasswordReset(em: EntityManager, email: string): Promise<void> {
  const user = await em.findOne(UserSchema, { email });
  if (!user) return;
  const { token, tokenHash } = createOneTimeToken();
  em.create(PasswordResetSchema, { user, tokenHash, expiresAt: new Date(Date.now() + RESET_TTL_MS), usedAt: null });
  await em.flush();
  const mail = resetMail(user.locale, `${getEnv().APP_URL}/reset/${token}`);
  await sendMail({ to: user.email, subject: mail.subject, text: mail.text });
}

export async function confirmPasswordReset(em: EntityManager, input: { token: string; password: string }): Promise<void> {
  const passwordHash = await hashPassword(input.password);
  await em.transactional(async (tx) => {
    // Waits for a concurrent confirm of the same link, which then finds it used.
    const reset = await tx.findOne(PasswordResetSchema, { tokenHash: hashToken(input.token) }, { populate: ['user'], lockMode: LockMode.PESSIMISTIC_WRITE });
    if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
      throw new HttpError(410, 'link_expired', 'This reset link is no longer valid. Ask for a new one.');
    }
    reset.usedAt = new Date();
    reset.user.passwordHash = passwordHash;
    // Every session sealed before the change is signed out (a stolen cookie does not outlive a reset).
    reset.user.sessionVersion += 1;
    await clearFailures(tx, reset.user.email);
  });
}

/** The caller's profile and memberships, as the API returns them. */
export function describeViewer(viewer: Viewer) {
  const { user, memberships } = viewer;
  return {
    user: { id: user.id, email: user.email, name: user.name, locale: user.locale, temperatureUnit: user.temperatureUnit },
    memberships: memberships.map((m) => ({
      id: m.id,
      role: m.role,
      organisation: { id: m.organisation.id, name: m.organisation.name },
      kitchen: m.kitchen ? { id: m.kitchen.id, name: m.kitchen.name } : null,
    })),
  };
}

export function assertInvitationInput(role: Role, kitchenId: string | null | undefined) {
  if (role !== 'coordinator' && !kitchenId) throw unprocessable('Choose the kitchen.', { kitchenId: 'Choose the kitchen for a kitchen lead or cook.' });
}
