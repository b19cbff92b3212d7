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

/** A request of the outbox that gets no answer within this time counts as offline (a dead link may never fail). */
export const SEND_TIMEOUT_MS = 15_000;

let flushing: Promise<FlushResult> | null = null;
const flushListeners = new Set<(r: FlushResult) => void>();

/**
 * Sends pending entries oldest first. Stops at the first network failure, 401 (signed out), 429 or
 * 5xx, to try again later; marks an entry 'rejected' on any other refusal (e.g. 422) and goes on.
 * One flush at a time per page: a call during a flush gets that flush's result. Every result goes to the
 * retry schedules of `keepSending`. A request without an answer in SEND_TIMEOUT_MS counts as offline.
 */
export function flushOutbox(kitchenId: string, userId: string): Promise<FlushResult> {
  if (flushing) return flushing;
  flushing = (async () => {
    let sent = 0;
    try {
      for (const e of await listEntries(kitchenId, userId)) {
        if (e.state !== 'pending') continue;
        let res: Response;
        try {
          res = await fetch(e.url, {
            method: 'POST',
            headers: { 'content-type': 'application/json' },
            body: JSON.stringify(e.body),
            credentials: 'same-origin',
            signal: AbortSignal.timeout(SEND_TIMEOUT_MS),
          });
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
  const notify = (r: FlushResult) => flushListeners.forEach((l) => l(r));
  void flushing.then(notify, () => notify({ sent: 0, stopped: 'offline' }));
  return flushing;
}

/** Retry delays [ms]: 2 s doubling per failure up to 60 s, each times a random factor in [0.5, 1) ("equal jitter"). */
export const RETRY = { firstMs: 2_000, maxMs: 60_000 } as const;

/**
 * Delay before the next try after `failures` failed flushes in a row (≥ 1): exponential back-off with equal jitter
 * (M. Brooker, "Exponential Backoff And Jitter", AWS Architecture Blog, 2015), so phones that come back together
 * do not all retry in the same second.
 */
export function retryDelayMs(failures: number, random: () => number = Math.random): number {
  const base = Math.min(RETRY.maxMs, RETRY.firstMs * 2 ** Math.max(0, failures - 1));
  return base / 2 + (base / 2) * random();
}

export interface RetryDeps {
  setTimer: (fn: () => void, ms: number) => unknown;
  clearTimer: (handle: unknown) => void;
  random: () => number;
}

/**
 * When to flush again: after a flush that stopped offline or at a server error, a timer with back-off; a sign
 * that the network works (`networkOk`, e.g. any successful request) tries at once. A flush that got through,
 * or stopped at a sign-out (only signing in helps), ends the retries. `run` is the page's flush (which also
 * refreshes what it shows); the result of every flush, its own or another's, comes back through `noteResult`.
 */
export function retrySchedule(run: () => Promise<FlushResult>, deps: RetryDeps) {
  let failures = 0;
  let timer: unknown = null;
  let stopped = false;
  const clear = () => {
    if (timer !== null) deps.clearTimer(timer);
    timer = null;
  };
  const tryNow = () => {
    clear();
    if (!stopped) void run().catch(() => undefined);
  };
  const noteResult = (r: FlushResult) => {
    if (stopped) return;
    if (r.stopped === 'offline' || r.stopped === 'server') {
      failures++;
      clear();
      timer = deps.setTimer(tryNow, retryDelayMs(failures, deps.random));
    } else {
      failures = 0;
      clear();
    }
  };
  return {
    noteResult,
    /** The network answered something: if a flush is waiting for a retry, try now. */
    networkOk: () => {
      if (failures > 0) tryNow();
    },
    /** Flushes waiting for a retry (0 when none). */
    get failures() {
      return failures;
    },
    stop: () => {
      stopped = true;
      clear();
    },
  };
}

/**
 * Keeps a page's outbox going out: retries with back-off after a failed flush (whoever started it), and at once
 * when the service worker reports an answer from the network (public/sw.js `network-ok`), since a phone back
 * from a tunnel may never fire `online`. Returns the function that stops it (an effect's clean-up).
 */
export function keepSending(run: () => Promise<FlushResult>): () => void {
  const schedule = retrySchedule(run, { setTimer: (fn, ms) => setTimeout(fn, ms), clearTimer: (h) => clearTimeout(h as ReturnType<typeof setTimeout>), random: Math.random });
  flushListeners.add(schedule.noteResult);
  const onMessage = (ev: MessageEvent) => {
    if ((ev.data as { type?: string } | null)?.type === 'network-ok') schedule.networkOk();
  };
  navigator.serviceWorker?.addEventListener('message', onMessage);
  return () => {
    schedule.stop();
    flushListeners.delete(schedule.noteResult);
    navigator.serviceWorker?.removeEventListener('message', onMessage);
  };
}
