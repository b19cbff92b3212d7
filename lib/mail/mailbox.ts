import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { StoredMail } from '@/lib/fakes/smtp';

/** Reads what the local SMTP fake kept, newest first (dev tools and tests only). */
export async function readMailbox(dir: string, limit = 50): Promise<StoredMail[]> {
  let files: string[];
  try {
    files = (await readdir(dir)).filter((f) => f.endsWith('.json')).sort().reverse().slice(0, limit);
  } catch {
    return [];
  }
  const mails = await Promise.all(files.map(async (f) => JSON.parse(await readFile(path.join(dir, f), 'utf8')) as StoredMail));
  return mails;
}

/** Decodes a quoted-printable body enough to read links in tests and the dev page. */
export function mailText(raw: string): string {
  const body = raw.split(/\r?\n\r?\n/).slice(1).join('\n\n');
  if (!/Content-Transfer-Encoding: quoted-printable/i.test(raw)) return body;
  const s = body.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < s.length; i++) {
    const hex = s.slice(i + 1, i + 3);
    if (s[i] === '=' && /^[0-9A-F]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(s[i] ?? ''));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}
