import { Agent } from 'node:https';
import { readFileSync, statSync } from 'node:fs';
import { rootCertificates } from 'node:tls';
import { getEnv } from '@/lib/env';

let cached: { path: string; mtimeMs: number; agent: Agent } | null = null;

/**
 * The HTTPS agent push requests go through: Node's default (the public CAs) unless PUSH_FAKE_CA
 * names the local push fake's self-signed certificate, which is then trusted in addition. The file
 * is read when first needed (and again if it changes), so a worker started before the fake finds it.
 */
export function pushAgent(caPath = getEnv().PUSH_FAKE_CA): Agent | undefined {
  if (!caPath) return undefined;
  let mtimeMs: number;
  try {
    mtimeMs = statSync(caPath).mtimeMs;
  } catch {
    // Not written yet (the fake is still starting): this try fails TLS and is retried later.
    console.warn(`[push] PUSH_FAKE_CA ${caPath} does not exist (yet)`);
    return undefined;
  }
  if (cached && cached.path === caPath && cached.mtimeMs === mtimeMs) return cached.agent;
  // `ca` replaces Node's list: pass the public roots too, so real push services still verify.
  const agent = new Agent({ ca: [...rootCertificates, readFileSync(caPath, 'utf8')], keepAlive: true });
  cached = { path: caPath, mtimeMs, agent };
  return agent;
}
