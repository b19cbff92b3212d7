import type { NextRequest } from 'next/server';

/** The caller's address for throttling: the first X-Forwarded-For hop behind a proxy, else a fixed local key. */
export function clientIp(req: NextRequest): string {
  const fwd = req.headers.get('x-forwarded-for');
  const first = fwd?.split(',')[0]?.trim();
  return first || req.headers.get('x-real-ip') || 'local';
}
