/**
 * Invitation flow end to end over HTTP: invite → mail in the SMTP fake → accept from the link →
 * signed in with the membership. One-time links: a second use and an expired link are 410; only
 * the SHA-256 of a token is stored; the new membership is in the audit log.
 */
import { createHash, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, testOrm, PASSWORD, type World } from '../helpers/fixtures';
import { linkToken, mailsTo, waitForMail } from '../helpers/mailbox';
import { InvitationSchema } from '../../entities';

let w: World;
let coordinator: Client;
beforeAll(async () => {
  w = await createWorld();
  coordinator = await new Client().signIn(w.emails.coordinator, PASSWORD);
});
afterAll(closeTestOrm);

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const newAddress = (who: string) => `${who}.${randomUUID().slice(0, 8)}@example.org`;

async function sql<T = Record<string, unknown>>(query: string, params: unknown[] = []): Promise<T[]> {
  return (await testOrm()).em.getConnection().execute<T[]>(query, params);
}

/** Invites `email` and returns the invitation id and the token from the mailed link. */
async function invite(by: Client, body: { email: string; role: string; kitchenId?: string }) {
  const r = await by.post('/api/v1/invitations', body);
  expect(r.status, r.text).toBe(201);
  const mail = await waitForMail(body.email);
  const token = linkToken(mail.text, 'invite');
  return { id: r.json.id as string, expiresAt: r.json.expiresAt as string, response: r.text, mail, token };
}

describe('invitation of a kitchen lead', () => {
  const email = newAddress('new.lead');
  const name = 'Zawadi Mrema-Ñandú 🍲';
  const password = 'a-new-lead-password-1';
  let inv: Awaited<ReturnType<typeof invite>>;
  let invitee: Client;

  it('the coordinator invites a lead to kitchen A: 201, and a mail with a one-time link arrives', async () => {
    const before = Date.now();
    inv = await invite(coordinator, { email, role: 'lead', kitchenId: w.kitchenA.id });
    // 7 days (lib/accounts INVITE_TTL_MS); a minute's tolerance for the round trip.
    expect(Date.parse(inv.expiresAt) - before).toBeGreaterThan(7 * 86400_000 - 60_000);
    expect(Date.parse(inv.expiresAt) - before).toBeLessThan(7 * 86400_000 + 60_000);
    expect(inv.response).not.toContain(inv.token); // the token goes by mail only
    expect(inv.mail.to).toEqual([email]);
    expect(inv.mail.subject).toContain(w.org.name);
    expect(inv.mail.text).toContain('kitchen lead');
    expect(inv.mail.text).toContain(`${inject('baseUrl')}/invite/${inv.token}`);
    expect(await mailsTo(email)).toHaveLength(1);
  });

  it('only the SHA-256 of the token is stored', async () => {
    const [row] = await sql<{ token_hash: string; email: string; role: string; kitchen_id: string; accepted_at: string | null }>(
      'select * from invitations where id = ?',
      [inv.id],
    );
    expect(row).toMatchObject({ email, role: 'lead', kitchen_id: w.kitchenA.id, accepted_at: null });
    expect(row!.token_hash).not.toBe(inv.token);
    expect(row!.token_hash).toBe(sha256(inv.token));
    expect(JSON.stringify(row)).not.toContain(inv.token);
  });

  it('accepting with a name and password signs the invitee in', async () => {
    invitee = new Client();
    const r = await invitee.post('/api/v1/invitations/accept', { token: inv.token, name, password });
    expect(r.status, r.text).toBe(200);
    expect(r.json.user).toMatchObject({ email, name });
    expect(invitee.cookie).toMatch(/^hc_session=./);
  });

  it('GET /api/v1/me shows the lead membership of kitchen A, and the name unchanged', async () => {
    const me = await invitee.get('/api/v1/me');
    expect(me.status).toBe(200);
    expect(me.json.user).toMatchObject({ email, name });
    expect(me.json.memberships).toEqual([
      { id: expect.any(String), role: 'lead', organisation: { id: w.org.id, name: w.org.name }, kitchen: { id: w.kitchenA.id, name: w.kitchenA.name } },
    ]);
  });

  it('GET /api/v1/kitchens lists kitchen A only', async () => {
    const r = await invitee.get('/api/v1/kitchens');
    expect(r.status).toBe(200);
    expect(r.json.kitchens).toEqual([expect.objectContaining({ id: w.kitchenA.id, role: 'lead' })]);
    expect((await invitee.get(`/api/v1/kitchens/${w.kitchenB.id}`)).status).toBe(404);
  });

  it('the chosen password signs in afterwards', async () => {
    const again = await new Client().signIn(email, password);
    expect((await again.get('/api/v1/me')).json.user.email).toBe(email);
  });

  it('the invitation is marked accepted, and the membership and the invitation are in the audit log', async () => {
    const me = await invitee.get('/api/v1/me');
    const membershipId = me.json.memberships[0].id as string;
    const userId = me.json.user.id as string;
    const stored = await (await testOrm()).em.fork().findOneOrFail(InvitationSchema, { id: inv.id });
    expect(stored.acceptedAt).toBeInstanceOf(Date);
    expect(Math.abs(stored.acceptedAt!.getTime() - Date.now())).toBeLessThan(60_000);

    const membership = await sql<{ organisation_id: string; kitchen_id: string; actor_id: string; entity_type: string; details: Record<string, unknown> }>(
      "select * from audit_events where action = 'membership.create' and entity_id = ?",
      [membershipId],
    );
    expect(membership).toHaveLength(1);
    expect(membership[0]).toMatchObject({
      organisation_id: w.org.id,
      kitchen_id: w.kitchenA.id,
      actor_id: userId,
      entity_type: 'Membership',
      details: { role: 'lead', via: 'invitation' },
    });

    const created = await sql<{ actor_id: string; details: Record<string, unknown> }>(
      "select * from audit_events where action = 'invitation.create' and entity_id = ?",
      [inv.id],
    );
    expect(created).toHaveLength(1);
    expect(created[0]!.details).toEqual({ email, role: 'lead' });
    expect(JSON.stringify(created[0])).not.toContain(inv.token);
  });

  it('the same token a second time → 410, no session, and the password stays', async () => {
    const other = new Client();
    const r = await other.post('/api/v1/invitations/accept', { token: inv.token, name: 'Someone Else', password: 'another-password-2' });
    expect(r.status).toBe(410);
    expect(r.json.error.code).toBe('link_expired');
    expect(other.cookie).toBe('');
    expect((await new Client().post('/api/v1/session', { email, password: 'another-password-2' })).status).toBe(401);
    expect((await new Client().post('/api/v1/session', { email, password })).status).toBe(200);
  });
});

describe('links that do not work', () => {
  it('an expired invitation → 410, and no account is made', async () => {
    const email = newAddress('late.cook');
    const inv = await invite(coordinator, { email, role: 'cook', kitchenId: w.kitchenA.id });
    const em = (await testOrm()).em.fork();
    await em.nativeUpdate(InvitationSchema, { id: inv.id }, { expiresAt: new Date(Date.now() - 60_000) });

    const c = new Client();
    const r = await c.post('/api/v1/invitations/accept', { token: inv.token, name: 'Late Cook', password: 'a-late-password-1' });
    expect(r.status).toBe(410);
    expect(r.json.error).toEqual({ code: 'link_expired', message: expect.stringMatching(/no longer valid/) });
    expect(c.cookie).toBe('');
    expect(await sql('select id from users where email = ?', [email])).toHaveLength(0);
  });

  it('a garbage token → 422 naming token', async () => {
    const r = await new Client().post('/api/v1/invitations/accept', { token: 'not a token!', name: 'X', password: 'a-long-password-1' });
    expect(r.status).toBe(422);
    expect(r.json.error.fields).toHaveProperty('token');
  });

  it('a well-formed token that was never issued → 410', async () => {
    const r = await new Client().post('/api/v1/invitations/accept', { token: 'A'.repeat(43), name: 'X', password: 'a-long-password-1' });
    expect(r.status).toBe(410);
  });

  it('the token hash is not a token: sending the stored hash back → 410', async () => {
    const email = newAddress('hash.cook');
    const inv = await invite(coordinator, { email, role: 'cook', kitchenId: w.kitchenA.id });
    const r = await new Client().post('/api/v1/invitations/accept', { token: sha256(inv.token), name: 'X', password: 'a-long-password-1' });
    expect(r.status).toBe(410);
  });
});

describe('an invitation for an existing account', () => {
  it('adds the membership and signs in; the password in the form does not replace the account password', async () => {
    const inv = await invite(coordinator, { email: w.emails.leadB, role: 'cook', kitchenId: w.kitchenA.id });
    const c = new Client();
    const r = await c.post('/api/v1/invitations/accept', { token: inv.token, name: 'Renamed', password: 'not-the-account-password' });
    expect(r.status, r.text).toBe(200);
    const me = await c.get('/api/v1/me');
    expect(me.json.user.name).toBe('leadB');
    const held = (me.json.memberships as { role: string; kitchen: { id: string } }[]).map((m) => `${m.role}@${m.kitchen.id}`).sort();
    expect(held).toEqual([`cook@${w.kitchenA.id}`, `lead@${w.kitchenB.id}`].sort());
    expect((await new Client().post('/api/v1/session', { email: w.emails.leadB, password: PASSWORD })).status).toBe(200);
    expect((await new Client().post('/api/v1/session', { email: w.emails.leadB, password: 'not-the-account-password' })).status).toBe(401);
  });
});
