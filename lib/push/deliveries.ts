import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { PushDelivery } from '@/lib/fakes/push';

/** Reads what the local push fake kept, newest first (dev tools only). */
export async function readPushDeliveries(dir: string, limit = 100): Promise<PushDelivery[]> {
  let files: string[];
  try {
    files = (await readdir(dir)).filter((f) => f.endsWith('.json')).sort().reverse().slice(0, limit);
  } catch {
    return [];
  }
  return Promise.all(files.map(async (f) => JSON.parse(await readFile(path.join(dir, f), 'utf8')) as PushDelivery));
}
