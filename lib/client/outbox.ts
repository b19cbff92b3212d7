'use client';

/**
 * The phone's outbox: check-ins and readings are written here first (IndexedDB) and sent from here,
 * so nothing a cook enters is lost when the connection drops or the page is closed. Each entry
 * carries its idempotency key; the server answers a repeated key with the first result, so sending
 * an entry twice (a retry after a lost answer) never records it twice.
 */

export type OutboxKind = 'check-in' | 'reading';

export interface OutboxEntry {
  /** The idempotency key (UUID), also the entry's id. */
  id: string;
  userId: string;
  kitchenId: string;
  kind: OutboxKind;
  url: string;
  body: Record<string, unknown>;
  createdAt: number;
  attempts: number;
  /** 'pending' until sent; 'rejected' when the server refused it (kept so the cook sees why). */
  state: 'pending' | 'rejected';
  error?: string;
}

const DB = 'hearthcast';
const STORE = 'outbox';

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(DB, 1);
    req.onupgradeneeded = () => {
      if (!req.result.objectStoreNames.contains(STORE)) req.result.createObjectStore(STORE, { keyPath: 'id' });
    };
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

async function tx<T>(mode: IDBTransactionMode, fn: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await open();
  try {
    return await new Promise<T>((resolve, reject) => {
      const t = db.transaction(STORE, mode);
      const req = fn(t.objectStore(STORE));
      t.oncomplete = () => resolve(req.result);
      t.onerror = () => reject(t.error);
      t.onabort = () => reject(t.error);
    });
  } finally {
    db.close();
  }
}

export const putEntry = (e: OutboxEntry) => tx('readwrite', (s) => s.put(e));
export const deleteEntry = (id: string) => tx('readwrite', (s) => s.delete(id));

export async function listEntries(kitchenId: string, userId: string): Promise<OutboxEntry[]> {
  const all = (await tx('readonly', (s) => s.getAll())) as OutboxEntry[];
  return all.filter((e) => e.kitchenId === kitchenId && e.userId === userId).sort((a, b) => a.createdAt - b.createdAt);
}

export function newEntry(input: { userId: string; kitchenId: string; kind: OutboxKind; url: string; body: Record<string, unknown> }): OutboxEntry {
  const id = crypto.randomUUID();
  return { ...input, id, body: { ...input.body, idempotencyKey: id }, createdAt: Date.now(), attempts: 0, state: 'pending' };
}

export type FlushResult = { sent: number; stopped: 'offline' | 'signed-out' | 'server' | null };

let flushing: Promise<FlushResult> | null = null;

/**
 * Sends pending entries oldest first. Stops at the first network failure, 401 (signed out), 429 or
 * 5xx, to try again later; marks an entry 'rejected' on any other refusal (e.g. 422) and goes on.
 * One flush at a time per page.
 */
export function flushOutbox(kitchenId: string, userId: string): Promise<FlushResult> {
  flushing ??= (async () => {
    let sent = 0;
    try {
      for (const e of await listEntries(kitchenId, userId)) {
        if (e.state !== 'pending') continue;
        let res: Response;
        try {
          res = await fetch(e.url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(e.body), credentials: 'same-origin' });
        } catch {
          return { sent, stopped: 'offline' as const };
        }
        if (res.ok) {
          await deleteEntry(e.id);
          sent++;
          continue;
        }
        await putEntry({ ...e, attempts: e.attempts + 1 });
        if (res.status === 401) return { sent, stopped: 'signed-out' as const };
        if (res.status === 429 || res.status >= 500) return { sent, stopped: 'server' as const };
        const body = (await res.json().catch(() => null)) as { error?: { message?: string } } | null;
        await putEntry({ ...e, attempts: e.attempts + 1, state: 'rejected', error: body?.error?.message ?? `HTTP ${res.status}` });
      }
      return { sent, stopped: null };
    } finally {
      flushing = null;
    }
  })();
  return flushing;
}
