import { createHash } from 'node:crypto';
import type { Agent } from 'node:https';
import webpush from 'web-push';
import type { VapidKeys } from './vapid';

/** What the service worker receives (JSON, encrypted aes128gcm per RFC 8291). */
export interface PushPayload {
  title: string;
  body: string;
  /** Replaces an earlier notification with the same tag on the phone. */
  tag: string;
  /** Page to open when the notification is tapped. */
  url: string;
  kind: string;
  /** High-stakes alerts stay on screen until the cook acts. */
  requireInteraction?: boolean;
}

export interface PushTarget {
  endpoint: string;
  p256dh: string;
  auth: string;
}

/** The push service's answer, in our words (the rest of the app never sees web-push's error type). */
export type PushOutcome =
  | { kind: 'delivered'; status: number }
  /** 404/410: the subscription is gone for good; remove it. */
  | { kind: 'gone'; status: number }
  /** 429, 5xx or a network failure: try again later (Retry-After when the service gave one) [s]. */
  | { kind: 'retry'; status: number | null; retryAfterS: number | null; message: string }
  /** Any other refusal (400, 403 bad VAPID, 413 too large): retrying would not help. */
  | { kind: 'failed'; status: number; message: string };

/** Retry-After as seconds: delta-seconds or an HTTP date (RFC 9110 §10.2.3). */
export function parseRetryAfter(value: string | undefined | null, nowMs = Date.now()): number | null {
  if (!value) return null;
  if (/^\d+$/.test(value.trim())) return Number(value.trim());
  const at = Date.parse(value);
  return Number.isFinite(at) ? Math.max(0, Math.ceil((at - nowMs) / 1000)) : null;
}

/** RFC 8030 Topic: at most 32 base64url characters; one pending message per topic is kept by the service. */
export const topicFor = (tag: string) => createHash('sha256').update(tag).digest('base64url').slice(0, 32);

/**
 * Sends one Web Push message (RFC 8030) with aes128gcm encryption (RFC 8291) and VAPID (RFC 8292)
 * through the `web-push` library, and classifies the answer.
 */
export async function sendWebPush(
  target: PushTarget,
  payload: PushPayload,
  vapid: VapidKeys,
  opts: { ttlS: number; urgency?: 'very-low' | 'low' | 'normal' | 'high'; agent?: Agent; timeoutMs?: number },
): Promise<PushOutcome> {
  try {
    const res = await webpush.sendNotification({ endpoint: target.endpoint, keys: { p256dh: target.p256dh, auth: target.auth } }, JSON.stringify(payload), {
      vapidDetails: { subject: vapid.subject, publicKey: vapid.publicKey, privateKey: vapid.privateKey },
      TTL: opts.ttlS,
      urgency: opts.urgency ?? 'normal',
      topic: topicFor(payload.tag),
      contentEncoding: 'aes128gcm',
      timeout: opts.timeoutMs ?? 10_000,
      ...(opts.agent ? { agent: opts.agent } : {}),
    });
    return { kind: 'delivered', status: res.statusCode };
  } catch (err) {
    if (err instanceof webpush.WebPushError) {
      const status = err.statusCode;
      const retryAfter = parseRetryAfter(headerValue(err.headers, 'retry-after'));
      if (status === 404 || status === 410) return { kind: 'gone', status };
      if (status === 429 || status >= 500) return { kind: 'retry', status, retryAfterS: retryAfter, message: err.body || err.message };
      return { kind: 'failed', status, message: err.body || err.message };
    }
    // Connection refused, reset, timeout, TLS: the service may be back later.
    return { kind: 'retry', status: null, retryAfterS: null, message: err instanceof Error ? err.message : String(err) };
  }
}

function headerValue(headers: unknown, name: string): string | undefined {
  if (!headers || typeof headers !== 'object') return undefined;
  for (const [k, v] of Object.entries(headers as Record<string, unknown>)) {
    if (k.toLowerCase() === name) return Array.isArray(v) ? String(v[0]) : String(v);
  }
  return undefined;
}
