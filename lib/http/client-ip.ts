import type { NextRequest } from 'next/server';
import { getEnv } from '@/lib/env';

/**
 * The caller's address for throttling, or null when it cannot be trusted. Next.js passes a client's
 * own X-Forwarded-For through unchanged, so the header is only believed behind a reverse proxy the
 * operator declares (TRUST_PROXY=1): the proxy appends the address it saw, so the last hop is its own
 * record. Without that, sign-in is throttled per account only.
 */
export function clientIp(req: NextRequest): string | null {
  if (getEnv().TRUST_PROXY !== '1') return null;
  const hops = req.headers.get('x-forwarded-for')?.split(',').map((h) => h.trim()).filter(Boolean) ?? [];
  return hops.at(-1) ?? req.headers.get('x-real-ip') ?? null;
}
