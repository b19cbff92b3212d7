/**
 * Local push-service fake: the Web Push wire protocol on loopback HTTPS, so the real sender (web-push
 * with VAPID and aes128gcm) cannot tell it from a browser vendor's push service.
 *
 * - RFC 8030: POST /push/<subscription id> with a TTL header (400 without one), an encrypted body of at
 *   most 4096 bytes (413 beyond), answered 201 Created with a Location.
 * - RFC 8291: Content-Encoding aes128gcm; the body starts with salt (16), record size (4), key-id length
 *   (1) and the sender's P-256 public key (65): checked; the payload stays encrypted (only the
 *   subscription's private key, in the browser or the test, can read it).
 * - RFC 8292: `Authorization: vapid t=<JWT>, k=<public key>`; the JWT's ES256 signature is verified
 *   against k, its aud must be this origin and exp in the next 24 h (401/403 otherwise).
 * - Each request is kept (memory and one JSON file per delivery in `dir`, for the dev push page).
 * - Control: POST /_fake/subscriptions/<id>/responses {"statuses":[429],"retryAfterS":1,"repeat":false}
 *   makes the next requests for that subscription answer those statuses (e.g. 410 gone, 429, 500);
 *   GET /_fake/deliveries[?subscription=<id>] lists what arrived.
 *
 * HTTPS needs a certificate: a self-signed one (EC P-256, SAN 127.0.0.1 and localhost) is made at
 * start with the `openssl` command into `certDir` (kept out of git: .var/ or a temporary folder).
 * The sender trusts it only when PUSH_FAKE_CA points at it.
 */
import { createServer, type Server } from 'node:https';
import type { IncomingMessage, ServerResponse } from 'node:http';
import { createPublicKey, randomUUID, verify } from 'node:crypto';
import { execFile } from 'node:child_process';
import { mkdir, mkdtemp, readFile, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);

export interface PushDelivery {
  id: string;
  subscriptionId: string;
  receivedAt: string;
  /** What the fake answered. */
  status: number;
  ttl: number | null;
  urgency: string | null;
  topic: string | null;
  contentEncoding: string | null;
  /** The encrypted body (aes128gcm record), base64. */
  bodyBase64: string;
  bytes: number;
  vapid: { sub: string; aud: string; exp: number; k: string } | null;
  /** Why the request was refused, when it was. */
  error: string | null;
}

export interface PushFake {
  port: number;
  origin: string;
  /** PEM certificate to trust (PUSH_FAKE_CA). */
  caPath: string;
  endpointFor(subscriptionId: string): string;
  deliveries(subscriptionId?: string): PushDelivery[];
  respondWith(subscriptionId: string, statuses: number[], opts?: { retryAfterS?: number; repeat?: boolean }): void;
  close(): Promise<void>;
}

/** Makes a self-signed certificate for 127.0.0.1/localhost with the openssl command (Debian ships it). */
export async function makeSelfSignedCertificate(dir: string): Promise<{ certPath: string; keyPath: string }> {
  await mkdir(dir, { recursive: true });
  const certPath = path.join(dir, 'cert.pem');
  const keyPath = path.join(dir, 'key.pem');
  await run('openssl', [
    'req', '-x509', '-newkey', 'ec', '-pkeyopt', 'ec_paramgen_curve:prime256v1', '-nodes',
    '-keyout', keyPath, '-out', certPath, '-days', '30', '-subj', '/CN=Hearthcast push fake',
    '-addext', 'subjectAltName=IP:127.0.0.1,DNS:localhost', '-addext', 'basicConstraints=critical,CA:TRUE',
  ]);
  return { certPath, keyPath };
}

const b64url = (s: string) => Buffer.from(s, 'base64url');

/** Verifies an RFC 8292 VAPID Authorization header for this origin; returns its claims or why it is refused. */
export function verifyVapid(header: string | undefined, origin: string, nowS = Math.floor(Date.now() / 1000)): { ok: true; claims: NonNullable<PushDelivery['vapid']> } | { ok: false; status: 401 | 403; error: string } {
  const m = /^vapid\s+(.*)$/i.exec(header ?? '');
  if (!m) return { ok: false, status: 401, error: 'missing "Authorization: vapid t=…, k=…"' };
  const params = Object.fromEntries(m[1]!.split(',').map((p) => p.trim().split('=', 2).map((x) => x.trim()) as [string, string]));
  const t = params.t;
  const k = params.k;
  if (!t || !k) return { ok: false, status: 401, error: 'vapid header needs t and k' };
  const parts = t.split('.');
  if (parts.length !== 3) return { ok: false, status: 401, error: 't is not a JWT' };
  let head: { alg?: string; typ?: string };
  let claims: { aud?: string; exp?: number; sub?: string };
  try {
    head = JSON.parse(b64url(parts[0]!).toString('utf8'));
    claims = JSON.parse(b64url(parts[1]!).toString('utf8'));
  } catch {
    return { ok: false, status: 401, error: 'JWT parts are not base64url JSON' };
  }
  if (head.alg !== 'ES256') return { ok: false, status: 401, error: `JWT alg ${head.alg}, expected ES256` };
  const point = b64url(k);
  if (point.length !== 65 || point[0] !== 4) return { ok: false, status: 401, error: 'k is not an uncompressed P-256 point' };
  const key = createPublicKey({ key: { kty: 'EC', crv: 'P-256', x: point.subarray(1, 33).toString('base64url'), y: point.subarray(33).toString('base64url') }, format: 'jwk' });
  const signed = verify('sha256', Buffer.from(`${parts[0]}.${parts[1]}`), { key, dsaEncoding: 'ieee-p1363' }, b64url(parts[2]!));
  if (!signed) return { ok: false, status: 403, error: 'JWT signature does not verify against k' };
  if (claims.aud !== origin) return { ok: false, status: 403, error: `JWT aud ${claims.aud}, expected ${origin}` };
  if (typeof claims.exp !== 'number' || claims.exp <= nowS || claims.exp > nowS + 24 * 3600) return { ok: false, status: 403, error: 'JWT exp must be within the next 24 h' };
  if (typeof claims.sub !== 'string' || !/^(mailto:|https:)/.test(claims.sub)) return { ok: false, status: 403, error: 'JWT sub must be a mailto: or https: contact' };
  return { ok: true, claims: { sub: claims.sub, aud: claims.aud, exp: claims.exp, k } };
}

/** Checks the aes128gcm header of RFC 8188/8291: salt, record size, and the sender's 65-byte public key as key id. */
export function checkAes128gcmHeader(body: Buffer): string | null {
  if (body.length < 21 + 65 + 17) return 'body shorter than an aes128gcm header and one record';
  const rs = body.readUInt32BE(16);
  const idlen = body[20]!;
  if (rs < 18) return `record size ${rs} is below 18`;
  if (idlen !== 65 || body[21] !== 4) return 'key id is not the sender’s uncompressed P-256 public key (RFC 8291 §4)';
  return null;
}

async function readBody(req: IncomingMessage, limit: number): Promise<Buffer | null> {
  const chunks: Buffer[] = [];
  let size = 0;
  for await (const c of req) {
    size += (c as Buffer).length;
    if (size > limit) return null;
    chunks.push(c as Buffer);
  }
  return Buffer.concat(chunks);
}

export async function startPushFake(opts: { port: number; dir: string; certDir?: string }): Promise<PushFake> {
  await mkdir(opts.dir, { recursive: true });
  const certDir = opts.certDir ?? (await mkdtemp(path.join(tmpdir(), 'hearthcast-push-tls-')));
  const { certPath, keyPath } = await makeSelfSignedCertificate(certDir);
  const delivered: PushDelivery[] = [];
  const planned = new Map<string, { statuses: number[]; retryAfterS?: number; repeat: boolean }>();
  let origin = '';

  const send = (res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) => {
    res.writeHead(status, { 'content-type': 'application/json', ...headers });
    res.end(JSON.stringify(body));
  };

  async function handlePush(req: IncomingMessage, res: ServerResponse, subscriptionId: string) {
    const body = await readBody(req, 4096);
    const record = (status: number, error: string | null, extra: Partial<PushDelivery> = {}) => {
      const d: PushDelivery = {
        id: randomUUID(),
        subscriptionId,
        receivedAt: new Date().toISOString(),
        status,
        ttl: req.headers.ttl !== undefined ? Number(req.headers.ttl) : null,
        urgency: (req.headers.urgency as string | undefined) ?? null,
        topic: (req.headers.topic as string | undefined) ?? null,
        contentEncoding: (req.headers['content-encoding'] as string | undefined) ?? null,
        bodyBase64: body?.toString('base64') ?? '',
        bytes: body?.length ?? 0,
        vapid: null,
        error,
        ...extra,
      };
      delivered.push(d);
      return writeFile(path.join(opts.dir, `${Date.now()}-${d.id}.json`), JSON.stringify(d, null, 2)).then(() => d);
    };
    if (!body) {
      await record(413, 'body over 4096 bytes');
      return send(res, 413, { error: 'payload too large (RFC 8030 §7.2: 4096 bytes)' });
    }
    const auth = verifyVapid(req.headers.authorization, origin);
    if (!auth.ok) {
      await record(auth.status, auth.error);
      return send(res, auth.status, { error: auth.error });
    }
    if (req.headers.ttl === undefined || !/^\d+$/.test(String(req.headers.ttl))) {
      await record(400, 'TTL header missing', { vapid: auth.claims });
      return send(res, 400, { error: 'TTL header required (RFC 8030 §5.2)' });
    }
    if (req.headers['content-encoding'] !== 'aes128gcm') {
      await record(415, 'not aes128gcm', { vapid: auth.claims });
      return send(res, 415, { error: 'Content-Encoding must be aes128gcm (RFC 8291)' });
    }
    const bad = checkAes128gcmHeader(body);
    if (bad) {
      await record(400, bad, { vapid: auth.claims });
      return send(res, 400, { error: bad });
    }
    const plan = planned.get(subscriptionId);
    const forced = plan?.statuses.length ? (plan.repeat ? plan.statuses[0]! : plan.statuses.shift()!) : null;
    if (forced !== null) {
      await record(forced, `told to answer ${forced}`, { vapid: auth.claims });
      return send(res, forced, { error: `answering ${forced} as told` }, forced === 429 && plan?.retryAfterS !== undefined ? { 'retry-after': String(plan.retryAfterS) } : {});
    }
    const d = await record(201, null, { vapid: auth.claims });
    res.writeHead(201, { location: `${origin}/message/${d.id}`, ttl: String(d.ttl ?? 0) });
    res.end();
  }

  const server: Server = createServer({ cert: await readFile(certPath), key: await readFile(keyPath) }, (req, res) => {
    const url = new URL(req.url ?? '/', origin || 'https://127.0.0.1');
    const push = /^\/push\/([A-Za-z0-9_-]{1,200})$/.exec(url.pathname);
    const control = /^\/_fake\/subscriptions\/([A-Za-z0-9_-]{1,200})\/responses$/.exec(url.pathname);
    (async () => {
      if (req.method === 'POST' && push) return handlePush(req, res, push[1]!);
      if (req.method === 'POST' && control) {
        const body = JSON.parse((await readBody(req, 10_000))?.toString('utf8') || '{}') as { statuses?: number[]; retryAfterS?: number; repeat?: boolean };
        planned.set(control[1]!, { statuses: (body.statuses ?? []).map(Number), ...(body.retryAfterS !== undefined ? { retryAfterS: body.retryAfterS } : {}), repeat: Boolean(body.repeat) });
        return send(res, 200, { ok: true });
      }
      if (req.method === 'GET' && url.pathname === '/_fake/deliveries') {
        const sub = url.searchParams.get('subscription');
        return send(res, 200, { deliveries: delivered.filter((d) => !sub || d.subscriptionId === sub) });
      }
      send(res, 404, { error: 'not found' });
    })().catch((err: unknown) => send(res, 500, { error: String(err) }));
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, '127.0.0.1', () => resolve());
  });
  const a = server.address();
  const port = typeof a === 'object' && a ? a.port : opts.port;
  origin = `https://127.0.0.1:${port}`;
  return {
    port,
    origin,
    caPath: certPath,
    endpointFor: (id) => `${origin}/push/${id}`,
    deliveries: (id) => delivered.filter((d) => !id || d.subscriptionId === id),
    respondWith: (id, statuses, o = {}) => planned.set(id, { statuses: [...statuses], ...(o.retryAfterS !== undefined ? { retryAfterS: o.retryAfterS } : {}), repeat: Boolean(o.repeat) }),
    close: () => new Promise<void>((r) => server.close(() => r())),
  };
}
