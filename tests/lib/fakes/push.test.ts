/**
 * The push fake's checks against what the real sender produces (web-push 3.6.7): the VAPID header of
 * RFC 8292 verifies (ES256 over the JWT, aud = the fake's origin, exp within 24 h) and tampering is
 * refused; the aes128gcm body of RFC 8291 has the header the fake checks. No network.
 */
import { createECDH, randomBytes } from 'node:crypto';
import webpush from 'web-push';
import { describe, expect, it } from 'vitest';
import { checkAes128gcmHeader, verifyVapid } from '@/lib/fakes/push';
import { parseRetryAfter, topicFor } from '@/lib/push/send';

const origin = 'https://127.0.0.1:4443';
const keys = webpush.generateVAPIDKeys();
const header = (aud = origin, exp?: number) => webpush.getVapidHeaders(aud, 'mailto:test@example.org', keys.publicKey, keys.privateKey, 'aes128gcm', exp).Authorization;

describe('verifyVapid (RFC 8292)', () => {
  it('accepts the sender’s header and returns its claims', () => {
    const r = verifyVapid(header(), origin);
    expect(r.ok).toBe(true);
    if (r.ok) {
      expect(r.claims.aud).toBe(origin);
      expect(r.claims.sub).toBe('mailto:test@example.org');
      expect(r.claims.k).toBe(keys.publicKey);
    }
  });

  it('refuses another audience, an expired token, a forged signature, another key and a missing header', () => {
    expect(verifyVapid(header('https://push.example.org'), origin)).toMatchObject({ ok: false, status: 403 });
    const now = Math.floor(Date.now() / 1000);
    expect(verifyVapid(header(origin, now + 60), origin, now + 120)).toMatchObject({ ok: false, status: 403, error: expect.stringMatching(/exp/) });
    const h = header();
    const t = /t=([^,]+)/.exec(h)![1]!;
    const parts = t.split('.');
    const forged = h.replace(t, `${parts[0]}.${Buffer.from(JSON.stringify({ aud: origin, exp: now + 600, sub: 'mailto:x@example.org' })).toString('base64url')}.${parts[2]}`);
    expect(verifyVapid(forged, origin)).toMatchObject({ ok: false, status: 403, error: expect.stringMatching(/signature/) });
    const other = webpush.generateVAPIDKeys();
    expect(verifyVapid(h.replace(keys.publicKey, other.publicKey), origin)).toMatchObject({ ok: false, status: 403 });
    expect(verifyVapid(undefined, origin)).toMatchObject({ ok: false, status: 401 });
  });
});

describe('aes128gcm body (RFC 8291)', () => {
  it('the sender’s encrypted payload has salt, record size and its 65-byte key as key id', () => {
    const ua = createECDH('prime256v1');
    ua.generateKeys();
    const enc = webpush.encrypt(ua.getPublicKey().toString('base64url'), randomBytes(16).toString('base64url'), JSON.stringify({ title: 'x' }), 'aes128gcm');
    expect(checkAes128gcmHeader(enc.cipherText)).toBeNull();
    expect(checkAes128gcmHeader(enc.cipherText.subarray(0, 40))).toMatch(/shorter/);
  });
});

describe('send helpers', () => {
  it('Retry-After as seconds or an HTTP date (RFC 9110 §10.2.3)', () => {
    expect(parseRetryAfter('7')).toBe(7);
    expect(parseRetryAfter(new Date(Date.UTC(2026, 0, 1, 0, 1)).toUTCString(), Date.UTC(2026, 0, 1))).toBe(60);
    expect(parseRetryAfter(null)).toBeNull();
    expect(parseRetryAfter('soon')).toBeNull();
  });
  it('topics are at most 32 base64url characters (RFC 8030 §5.4)', () => {
    expect(topicFor('ready-abc')).toMatch(/^[A-Za-z0-9_-]{32}$/);
  });
});
