import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe one-time token and the SHA-256 we store instead of it. */
export function createOneTimeToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
