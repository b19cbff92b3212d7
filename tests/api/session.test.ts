import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';
import { THROTTLE } from '../../lib/auth/throttle';

let w: World;
beforeAll(async () => {
  w = await createWorld();
});
afterAll(closeTestOrm);

describe('POST/DELETE /api/v1/session', () => {
  it('signs in, sets an HttpOnly SameSite=Lax cookie, and /me returns the user and memberships', async () => {
    const c = new Client();
    const r = await c.post('/api/v1/session', { email: w.emails.leadA.toUpperCase(), password: PASSWORD });
    expect(r.status).toBe(200);
    const setCookie = r.headers.getSetCookie().find((s) => s.startsWith('hc_session='))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    const me = await c.get('/api/v1/me');
    expect(me.status).toBe(200);
    expect(me.json.user.email).toBe(w.emails.leadA);
    expect(me.json.memberships).toEqual([
      expect.objectContaining({ role: 'lead', kitchen: { id: w.kitchenA.id, name: w.kitchenA.name } }),
    ]);
    expect(JSON.stringify(me.json)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('signs out: the cookie is cleared and /me answers 401', async () => {
    const c = await new Client().signIn(w.emails.cookA, PASSWORD);
    expect((await c.del('/api/v1/session')).status).toBe(204);
    expect((await c.get('/api/v1/me')).status).toBe(401);
  });

  it('gives the same message for a wrong password and an unknown address', async () => {
    const a = await new Client().post('/api/v1/session', { email: w.emails.cookB, password: 'wrong-password-x' });
    const b = await new Client().post('/api/v1/session', { email: 'nobody.here@example.org', password: 'wrong-password-x' });
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect(a.json.error.message).toBe(b.json.error.message);
  });

  it('throttles repeated failures per account with 429 and Retry-After, even from new addresses', async () => {
    const email = w.emails.leadB;
    for (let i = 0; i < THROTTLE.perAccount; i++) {
      const r = await new Client().post('/api/v1/session', { email, password: `wrong-${i}-password` });
      expect(r.status).toBe(401);
    }
    const blocked = await new Client().post('/api/v1/session', { email, password: PASSWORD });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0);
    expect(blocked.json.error.message).toMatch(/wait/i);
  });

  it('throttles repeated failures per address across accounts', async () => {
    const c = new Client();
    let last = 0;
    for (let i = 0; i <= THROTTLE.perAddress; i++) {
      last = (await c.post('/api/v1/session', { email: `guess${i}@example.org`, password: 'wrong-password-x' })).status;
    }
    expect(last).toBe(429);
  });
});

describe('GET /api/v1/kitchens', () => {
  it('401 without a session', async () => {
    const r = await new Client().get('/api/v1/kitchens');
    expect(r.status).toBe(401);
    expect(r.json.error.code).toBe('unauthorized');
  });

  it.each([
    ['coordinator', ['kitchenA', 'kitchenB']],
    ['leadA', ['kitchenA']],
    ['cookB', ['kitchenB']],
    ['otherCook', ['otherKitchen']],
  ] as const)('%s sees exactly their kitchens', async (who, expected) => {
    const c = await new Client().signIn(w.emails[who], PASSWORD);
    const r = await c.get('/api/v1/kitchens');
    expect(r.status).toBe(200);
    const ids = (r.json.kitchens as { id: string }[]).map((k) => k.id).sort();
    expect(ids).toEqual(expected.map((k) => w[k].id).sort());
  });
});

describe('what the API refuses before reading a body', () => {
  it('a body that is not declared JSON is 415 (a cross-site form cannot sign anyone in)', async () => {
    const r = await new Client().request('POST', '/api/v1/session', undefined, {
      raw: JSON.stringify({ email: w.emails.leadA, password: PASSWORD }),
      headers: { 'content-type': 'text/plain' },
    });
    expect(r.status).toBe(415);
    expect(r.json.error.message).toMatch(/application\/json/);
    expect(r.headers.getSetCookie().some((c) => c.startsWith('hc_session='))).toBe(false);
  });

  it('an unknown API path answers 404 in the error shape, for every method', async () => {
    for (const m of ['GET', 'POST', 'DELETE']) {
      const r = await new Client().request(m, '/api/v1/no-such-thing/here');
      expect(r.status).toBe(404);
      expect(r.json.error.code).toBe('not_found');
    }
  });
});
