/**
 * Bad input on every route under app/api/v1 that takes a body: malformed or empty JSON → 400;
 * a wrong shape → 422 naming the field; an unknown field → 422 naming it (schemas are strict); a
 * body over the limit → 413; never 500. Names in any script are accepted and come back unchanged.
 * None of the routes reads a query string today; when one does, add it to the table.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { createWorld, closeTestOrm, PASSWORD, type World } from '../helpers/fixtures';

type Body = Record<string, unknown>;
type Kind = 'string' | 'number';

interface Endpoint {
  method: 'POST' | 'PATCH';
  path: () => string;
  /** Who calls it (signed in where the route needs a session, so validation is what answers). */
  client: () => Client;
  /** A body that passes validation; each case breaks one thing in it. */
  valid: () => Body;
  /** Every accepted field and its JSON type. */
  fields: Record<string, Kind>;
  /** Fields that must be present, each named when missing. */
  required: string[];
  /** Required only because of another field (kitchenId for a lead or cook invitation). */
  requiredWith?: string[];
}

let w: World;
let coordinator: Client;
let lead: Client;
const anon = new Client();

beforeAll(async () => {
  w = await createWorld();
  coordinator = await new Client().signIn(w.emails.coordinator, PASSWORD);
  lead = await new Client().signIn(w.emails.leadA, PASSWORD);
});
afterAll(closeTestOrm);

const kitchenFields: Record<string, Kind> = { name: 'string', latitude: 'number', longitude: 'number', altitudeM: 'number', timeZone: 'string', locale: 'string' };
const wellFormedToken = 'A'.repeat(43); // the shape of a real token; no such invitation or reset exists

const endpoints: Record<string, Endpoint> = {
  'POST /api/v1/session': {
    method: 'POST',
    path: () => '/api/v1/session',
    client: () => anon,
    valid: () => ({ email: 'someone@example.org', password: 'a-password-1' }),
    fields: { email: 'string', password: 'string' },
    required: ['email', 'password'],
  },
  'PATCH /api/v1/me': {
    method: 'PATCH',
    path: () => '/api/v1/me',
    client: () => lead,
    valid: () => ({ name: 'Lead A' }),
    fields: { name: 'string', locale: 'string', temperatureUnit: 'string' },
    required: [],
  },
  'POST /api/v1/kitchens': {
    method: 'POST',
    path: () => '/api/v1/kitchens',
    client: () => coordinator,
    valid: () => ({ name: 'Kitchen C', latitude: -1.29, longitude: 36.82, altitudeM: 1795, timeZone: 'Africa/Nairobi', locale: 'en' }),
    fields: kitchenFields,
    required: Object.keys(kitchenFields),
  },
  'PATCH /api/v1/kitchens/{kitchenId}': {
    method: 'PATCH',
    path: () => `/api/v1/kitchens/${w.kitchenA.id}`,
    client: () => coordinator,
    valid: () => ({ altitudeM: 300 }),
    fields: kitchenFields,
    required: [],
  },
  'POST /api/v1/invitations': {
    method: 'POST',
    path: () => '/api/v1/invitations',
    client: () => coordinator,
    valid: () => ({ email: 'invitee@example.org', role: 'lead', kitchenId: w.kitchenA.id }),
    fields: { email: 'string', role: 'string', kitchenId: 'string' },
    required: ['email', 'role'],
    requiredWith: ['kitchenId'],
  },
  'POST /api/v1/invitations/accept': {
    method: 'POST',
    path: () => '/api/v1/invitations/accept',
    client: () => anon,
    valid: () => ({ token: wellFormedToken, name: 'New Person', password: 'a-long-password-1' }),
    fields: { token: 'string', name: 'string', password: 'string' },
    required: ['token', 'name', 'password'],
  },
  'POST /api/v1/password-resets': {
    method: 'POST',
    path: () => '/api/v1/password-resets',
    client: () => anon,
    valid: () => ({ email: 'someone@example.org' }),
    fields: { email: 'string' },
    required: ['email'],
  },
  'POST /api/v1/password-resets/confirm': {
    method: 'POST',
    path: () => '/api/v1/password-resets/confirm',
    client: () => anon,
    valid: () => ({ token: wellFormedToken, password: 'a-long-password-1' }),
    fields: { token: 'string', password: 'string' },
    required: ['token', 'password'],
  },
};
const names = Object.keys(endpoints);
const ep = (name: string) => endpoints[name]!;

const send = (name: string, body: unknown) => ep(name).client().request(ep(name).method, ep(name).path(), body);
const sendRaw = (name: string, raw: string | Buffer, headers?: Record<string, string>) =>
  ep(name).client().request(ep(name).method, ep(name).path(), undefined, { raw, headers });

type Res = Awaited<ReturnType<Client['request']>>;

/** 422 in the one error shape, naming `field` (and, when given, with that message). */
function expectInvalid(r: Res, field: string, message?: string | RegExp) {
  expect(r.status, r.text).toBe(422);
  expect(r.json.error.code).toBe('invalid');
  expect(r.json.error.fields, r.text).toHaveProperty([field]);
  if (message) expect(r.json.error.fields[field]).toMatch(message);
}

function expectBadRequest(r: Res, message: RegExp) {
  expect(r.status, r.text).toBe(400);
  expect(r.json.error.code).toBe('bad_request');
  expect(r.json.error.message).toMatch(message);
  expect(r.json.error.fields).toBeUndefined();
}

describe.each(names)('%s', (name) => {
  it.each([
    ['an unfinished object', '{"a": '],
    ['a trailing comma', '{"a": 1,}'],
    ['single quotes', "{'a': 1}"],
    ['a form-encoded body', 'a=1&b=2'],
    ['a byte-order mark before the object', '\uFEFF{"a": 1}'],
  ])('malformed JSON (%s) → 400', async (_what, raw) => {
    expectBadRequest(await sendRaw(name, raw), /not valid JSON/);
  });

  it.each([
    ['nothing', ''],
    ['spaces', '   '],
    ['a newline', '\r\n'],
  ])('an empty body (%s) → 400', async (_what, raw) => {
    expectBadRequest(await sendRaw(name, raw), /empty/);
  });

  it('no body and no content type → 400', async () => {
    const c = ep(name).client();
    const r = await c.request(ep(name).method, ep(name).path());
    expectBadRequest(r, /empty/);
  });

  it.each(['[]', 'null', '"text"', '42', 'true'])('a JSON body that is not an object (%s) → 422 naming (body)', async (raw) => {
    expectInvalid(await sendRaw(name, raw), '(body)');
  });

  const { required, requiredWith = [] } = ep(name);
  if (required.length) {
    it('{} → 422 naming every required field', async () => {
      const r = await send(name, {});
      for (const f of required) expectInvalid(r, f);
    });
  } else {
    it('{} → 422: at least one field to change', async () => {
      expectInvalid(await send(name, {}), '(body)', /at least one/);
    });
  }

  if (required.length + requiredWith.length) {
    it.each([...required, ...requiredWith])('missing %s → 422 naming it', async (field) => {
      const body = ep(name).valid();
      delete body[field];
      expectInvalid(await send(name, body), field);
    });
  }

  it.each(['extra', 'isAdmin', 'constructor', '__proto__'])('an unknown field (%s) → 422 naming it', async (extra) => {
    // Built as text: an object literal's "__proto__" would set the prototype instead of a key.
    const raw = JSON.stringify(ep(name).valid()).replace(/^\{/, `{${JSON.stringify(extra)}: {"x": 1},`);
    expectInvalid(await sendRaw(name, raw), extra, /Unknown field/);
  });

  const wrongValues = (kind: Kind): [string, unknown][] => [
    kind === 'string' ? ['a number', 42] : ['a string', '12'],
    ['a boolean', true],
    ['an empty array', []],
    ['an array', kind === 'string' ? ['text'] : [12]],
    ['an object', { value: 1 }],
    ['null', null],
  ];
  const typeCases = Object.entries(ep(name).fields).flatMap(([field, kind]) =>
    wrongValues(kind).map(([what, value]) => [field, what, value] as const),
  );
  it.each(typeCases)('%s as %s → 422 naming it', async (field, _what, value) => {
    expectInvalid(await send(name, { ...ep(name).valid(), [field]: value }), field);
  });

  it('a 10 MB body → 413, and the server stays up', async () => {
    const raw = Buffer.from(JSON.stringify({ ...ep(name).valid(), padding: 'x'.repeat(10 * 1024 * 1024) }));
    const r = await sendRaw(name, raw);
    expect(r.status).toBe(413);
    expect(r.json.error.code).toBe('too_large');
    expect((await new Client().get('/api/v1/health')).status).toBe(200);
  });

  it('a 10 MB body sent in chunks without Content-Length → 413, and the server stays up', async () => {
    const c = ep(name).client();
    const chunk = new TextEncoder().encode('x'.repeat(64 * 1024));
    let sent = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(ctl) {
        if (sent >= 10 * 1024 * 1024) return ctl.close();
        ctl.enqueue(sent === 0 ? new TextEncoder().encode('{"padding": "') : chunk);
        sent += chunk.byteLength;
      },
    });
    const headers: Record<string, string> = { 'content-type': 'application/json', 'x-forwarded-for': c.ip };
    if (c.cookie) headers.cookie = c.cookie;
    const res = await fetch(c.baseUrl + ep(name).path(), { method: ep(name).method, headers, body, duplex: 'half' } as RequestInit);
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe('too_large');
    expect((await new Client().get('/api/v1/health')).status).toBe(200);
  });
});

describe('body size limit', () => {
  it('just over 16 KiB → 413; a long field under the limit → 422 naming it', async () => {
    const over = await send('PATCH /api/v1/me', { name: 'x'.repeat(17 * 1024) });
    expect(over.status).toBe(413);
    expect(over.json.error.message).toMatch(/16 KiB/);
    expectInvalid(await send('PATCH /api/v1/me', { name: 'x'.repeat(15 * 1024) }), 'name', /200/);
  });
});

describe('field rules', () => {
  const cases: [endpoint: string, what: string, field: string, body: () => Body][] = [
    ['POST /api/v1/session', 'an address without @', 'email', () => ({ email: 'not-an-address', password: 'x' })],
    ['POST /api/v1/session', 'an address without a domain', 'email', () => ({ email: 'name@', password: 'x' })],
    ['POST /api/v1/session', 'an address over 320 characters', 'email', () => ({ email: `${'a'.repeat(320)}@example.org`, password: 'x' })],
    ['POST /api/v1/session', 'an empty password', 'password', () => ({ email: 'a@example.org', password: '' })],
    ['POST /api/v1/session', 'a password over 200 characters', 'password', () => ({ email: 'a@example.org', password: 'p'.repeat(201) })],
    ['PATCH /api/v1/me', 'an empty name', 'name', () => ({ name: '' })],
    ['PATCH /api/v1/me', 'a name of spaces only', 'name', () => ({ name: '   ' })],
    ['PATCH /api/v1/me', 'a name over 200 characters', 'name', () => ({ name: 'n'.repeat(201) })],
    ['PATCH /api/v1/me', 'a name with a NUL character', 'name', () => ({ name: 'Lead\u0000A' })],
    ['PATCH /api/v1/me', 'a name with a lone surrogate', 'name', () => ({ name: 'Lead \ud83c' })],
    ['PATCH /api/v1/me', 'an unknown language', 'locale', () => ({ locale: 'de' })],
    ['PATCH /api/v1/me', 'a temperature unit of K', 'temperatureUnit', () => ({ temperatureUnit: 'K' })],
    ['POST /api/v1/kitchens', 'a name with a NUL character', 'name', () => ({ ...ep('POST /api/v1/kitchens').valid(), name: 'Kitchen\u0000C' })],
    ['PATCH /api/v1/kitchens/{kitchenId}', 'a name with a line break inside', 'name', () => ({ name: 'Kitchen\nC' })],
    ['PATCH /api/v1/kitchens/{kitchenId}', 'a name of 201 characters', 'name', () => ({ name: 'k'.repeat(201) })],
    ['POST /api/v1/invitations', 'an unknown role', 'role', () => ({ email: 'x@example.org', role: 'admin', kitchenId: w.kitchenA.id })],
    ['POST /api/v1/invitations', 'a role in capitals', 'role', () => ({ email: 'x@example.org', role: 'Lead', kitchenId: w.kitchenA.id })],
    ['POST /api/v1/invitations', 'a kitchen id that is not a UUID', 'kitchenId', () => ({ email: 'x@example.org', role: 'cook', kitchenId: 'kitchen-a' })],
    ['POST /api/v1/invitations', 'a lead without a kitchen (null)', 'kitchenId', () => ({ email: 'x@example.org', role: 'lead', kitchenId: null })],
    ['POST /api/v1/invitations', 'a bad address', 'email', () => ({ email: 'x@@example.org', role: 'coordinator' })],
    ['POST /api/v1/invitations/accept', 'a short token', 'token', () => ({ token: 'abc', name: 'N', password: 'a-long-password-1' })],
    ['POST /api/v1/invitations/accept', 'a token with a path in it', 'token', () => ({ token: '../../../../etc/passwd/xxxxxxxx', name: 'N', password: 'a-long-password-1' })],
    ['POST /api/v1/invitations/accept', 'a token over 100 characters', 'token', () => ({ token: 'A'.repeat(101), name: 'N', password: 'a-long-password-1' })],
    ['POST /api/v1/invitations/accept', 'a 9-character password', 'password', () => ({ token: wellFormedToken, name: 'N', password: '123456789' })],
    ['POST /api/v1/invitations/accept', 'a password over 200 characters', 'password', () => ({ token: wellFormedToken, name: 'N', password: 'p'.repeat(201) })],
    ['POST /api/v1/invitations/accept', 'an empty name', 'name', () => ({ token: wellFormedToken, name: ' ', password: 'a-long-password-1' })],
    ['POST /api/v1/invitations/accept', 'a name with a NUL character', 'name', () => ({ token: wellFormedToken, name: 'New\u0000Person', password: 'a-long-password-1' })],
    ['POST /api/v1/password-resets', 'a bad address', 'email', () => ({ email: 'nobody' })],
    ['POST /api/v1/password-resets/confirm', 'a token with spaces', 'token', () => ({ token: 'a token with spaces in it', password: 'a-long-password-1' })],
    ['POST /api/v1/password-resets/confirm', 'a short password', 'password', () => ({ token: wellFormedToken, password: 'short' })],
  ];
  it.each(cases)('%s: %s → 422 naming %s', async (endpoint, _what, field, body) => {
    expectInvalid(await send(endpoint, body()), field);
  });

  it('a well-formed token that matches nothing → 410, not 422', async () => {
    expect((await send('POST /api/v1/invitations/accept', ep('POST /api/v1/invitations/accept').valid())).status).toBe(410);
    expect((await send('POST /api/v1/password-resets/confirm', ep('POST /api/v1/password-resets/confirm').valid())).status).toBe(410);
  });
});

describe('kitchen location and time zone', () => {
  const kitchenEndpoints = ['POST /api/v1/kitchens', 'PATCH /api/v1/kitchens/{kitchenId}'];
  const outOfRange: [field: string, value: number][] = [
    ['latitude', 90.0001],
    ['latitude', -90.5],
    ['latitude', 1000],
    ['longitude', 180.01],
    ['longitude', -181],
    ['altitudeM', 6000.5], // above the highest inhabited places
    ['altitudeM', -451], // below the Dead Sea shore (about −430 m)
  ];
  it.each(kitchenEndpoints.flatMap((e) => outOfRange.map(([f, v]) => [e, f, v] as const)))('%s: %s = %d → 422 naming it', async (endpoint, field, value) => {
    expectInvalid(await send(endpoint, { ...ep(endpoint).valid(), [field]: value }), field, /between|at least|at most/);
  });

  it.each(kitchenEndpoints)('%s: a number too large for a double (1e400) → 422 naming latitude', async (endpoint) => {
    const raw = JSON.stringify({ ...ep(endpoint).valid(), latitude: 0 }).replace('"latitude":0', '"latitude":1e400');
    expectInvalid(await sendRaw(endpoint, raw), 'latitude');
  });

  const badZones = ['UTC\u0000', 'Mars/Olympus', 'Africa/Nairob', '', '   ', 'GMT+25', 'Europe/Paris; drop table kitchens', 'x'.repeat(100)];
  it.each(kitchenEndpoints.flatMap((e) => badZones.map((z) => [e, z] as const)))('%s: time zone %j → 422 naming timeZone', async (endpoint, zone) => {
    expectInvalid(await send(endpoint, { ...ep(endpoint).valid(), timeZone: zone }), 'timeZone', /IANA/);
  });

  it('the edges of the ranges are accepted', async () => {
    const path = `/api/v1/kitchens/${w.kitchenB.id}`;
    for (const body of [
      { latitude: 90, longitude: 180, altitudeM: 6000 },
      { latitude: -90, longitude: -180, altitudeM: -450 },
      { latitude: 0, longitude: 0, altitudeM: 0, timeZone: 'UTC' },
    ]) {
      const r = await coordinator.patch(path, body);
      expect(r.status, r.text).toBe(200);
      expect(r.json).toMatchObject(body);
    }
    const back = await coordinator.patch(path, { latitude: 12.37, longitude: -1.52, altitudeM: 300, timeZone: 'Africa/Ouagadougou' });
    expect(back.status).toBe(200);
  });
});

describe('names in any script round-trip', () => {
  const unicodeNames = [
    'Zawadi Mrema-Ñandú 🍲',
    'مطبخ الحيّ المشترك', // Arabic, right to left, with a shadda
    'सामुदायिक रसोई', // Devanagari with combining vowel signs
    'Nguyễn Thị Hằng', // Vietnamese, stacked diacritics
    '👩🏾‍🍳 Chef', // a ZWJ sequence with a skin-tone modifier
  ];

  it.each(unicodeNames)('PATCH /api/v1/me with the name %j is stored and read back unchanged', async (n) => {
    const r = await lead.patch('/api/v1/me', { name: n });
    expect(r.status, r.text).toBe(200);
    expect(r.json.user.name).toBe(n);
    expect((await lead.get('/api/v1/me')).json.user.name).toBe(n);
  });

  it.each(unicodeNames)('POST /api/v1/kitchens with the name %j is stored and read back unchanged', async (n) => {
    const r = await coordinator.post('/api/v1/kitchens', { ...ep('POST /api/v1/kitchens').valid(), name: n });
    expect(r.status, r.text).toBe(201);
    expect(r.json.name).toBe(n);
    const got = await coordinator.get(`/api/v1/kitchens/${r.json.id}`);
    expect(got.json.name).toBe(n);
  });

  it.each(unicodeNames)('PATCH /api/v1/kitchens/{kitchenId} with the name %j is stored and read back unchanged', async (n) => {
    const r = await coordinator.patch(`/api/v1/kitchens/${w.kitchenB.id}`, { name: n });
    expect(r.status, r.text).toBe(200);
    expect((await coordinator.get(`/api/v1/kitchens/${w.kitchenB.id}`)).json.name).toBe(n);
  });

  it('a name of exactly 200 characters is accepted', async () => {
    const n = 'Ñ'.repeat(200);
    const r = await lead.patch('/api/v1/me', { name: n });
    expect(r.status, r.text).toBe(200);
    expect((await lead.get('/api/v1/me')).json.user.name).toBe(n);
  });
});
