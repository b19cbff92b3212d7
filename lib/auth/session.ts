import { getIronSession, type SessionOptions } from 'iron-session';
import { cookies } from 'next/headers';
import { getEnv } from '@/lib/env';

export interface SessionData {
  userId?: string;
  /** The user's session version when the cookie was sealed; a password change bumps it (sign-out everywhere). */
  v?: number;
  /** Kitchen chosen in the switcher. */
  kitchenId?: string;
}

export const SESSION_COOKIE = 'hc_session';

export function sessionOptions(): SessionOptions {
  const env = getEnv();
  return {
    cookieName: SESSION_COOKIE,
    password: env.sessionSecret,
    ttl: 60 * 60 * 24 * 14,
    cookieOptions: { httpOnly: true, sameSite: 'lax', secure: env.cookieSecure, path: '/' },
  };
}

export async function getSession() {
  return getIronSession<SessionData>(await cookies(), sessionOptions());
}
