/*
 * Hearthcast service worker (plain JS, registered by the Today page).
 *
 * - Offline: the Today page's HTML, the static files it loads (/_next/static: scripts, styles, fonts)
 *   and today's plan JSON are kept in Cache Storage. Pages and the plan are network-first with a
 *   short timeout (a weak connection falls back to what was saved); static files are cache-first
 *   (their names change with their content). Answers from the cache carry `x-hc-from-cache` and
 *   `x-hc-cached-at` so the page can say "last synced HH:MM".
 * - Check-ins and readings are not queued here: the page keeps them in IndexedDB and sends them with
 *   idempotency keys when the connection returns (lib/client/outbox.ts). Each answer that comes from the
 *   network tells the pages so (`{ type: 'network-ok' }`): a phone back from a tunnel may never fire
 *   `online`, and its outbox then retries at once instead of at its next timer.
 * - Push: shows the alert sent by the server (JSON: title, body, tag, url) and opens its page on tap.
 * - Signing out (DELETE /api/v1/session) empties the caches: a shared phone keeps no one's plan.
 */
const VERSION = 'hc-1';
const SHELL = `${VERSION}-shell`;
const DATA = `${VERSION}-data`;
/** Pages wait this long for the network before the saved copy is shown; the plan JSON a little longer. */
const PAGE_TIMEOUT_MS = 4000;
const DATA_TIMEOUT_MS = 8000;
const MAX_SHELL_ENTRIES = 200;

const isTodayPage = (url) => /^\/kitchens\/[0-9a-f-]{36}\/today\/?$/i.test(url.pathname);
const isTodayData = (url) => /^\/api\/v1\/kitchens\/[0-9a-f-]{36}\/today$/i.test(url.pathname);
const isStatic = (url) => url.pathname.startsWith('/_next/static/');

self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys()) if (!name.startsWith(`${VERSION}-`)) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

/** Keeps a copy with the time it was saved. */
async function store(cacheName, request, response) {
  if (!response || !response.ok || response.redirected || response.type === 'opaque') return;
  const headers = new Headers(response.headers);
  headers.set('x-hc-cached-at', String(Date.now()));
  const body = await response.clone().arrayBuffer();
  const cache = await caches.open(cacheName);
  await cache.put(request, new Response(body, { status: response.status, statusText: response.statusText, headers }));
}

async function fromCache(cacheName, request) {
  const cache = await caches.open(cacheName);
  const hit = await cache.match(request, { ignoreVary: true });
  if (!hit) return null;
  const headers = new Headers(hit.headers);
  headers.set('x-hc-from-cache', '1');
  return new Response(await hit.arrayBuffer(), { status: hit.status, statusText: hit.statusText, headers });
}

function withTimeout(promise, ms) {
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('timeout')), ms);
    promise.then(
      (v) => {
        clearTimeout(timer);
        resolve(v);
      },
      (e) => {
        clearTimeout(timer);
        reject(e);
      },
    );
  });
}

/** Tells the open pages that a request reached the server (at most once a second). */
let lastNetworkOk = 0;
function networkOk() {
  const now = Date.now();
  if (now - lastNetworkOk < 1000) return;
  lastNetworkOk = now;
  self.clients
    .matchAll({ type: 'window' })
    .then((wins) => wins.forEach((w) => w.postMessage({ type: 'network-ok' })))
    .catch(() => undefined);
}

async function networkFirst(cacheName, request, timeoutMs) {
  const network = fetch(request);
  network.then((res) => res.ok && networkOk()).catch(() => undefined);
  try {
    const res = await withTimeout(network, timeoutMs);
    if (res.ok) {
      await store(cacheName, request, res.clone());
      return res;
    }
    // A server error: what was saved is more useful than an error page.
    if (res.status >= 500) return (await fromCache(cacheName, request)) || res;
    return res;
  } catch (err) {
    const hit = await fromCache(cacheName, request);
    if (hit) {
      // Still keep the network answer when it arrives late.
      network.then((res) => store(cacheName, request, res)).catch(() => undefined);
      return hit;
    }
    return network.catch(() => Response.error());
  }
}

async function cacheFirst(cacheName, request) {
  const cache = await caches.open(cacheName);
  const hit = await cache.match(request);
  if (hit) return hit;
  const res = await fetch(request);
  if (res.ok) {
    networkOk();
    await cache.put(request, res.clone());
  }
  return res;
}

async function trim(cacheName, max) {
  const cache = await caches.open(cacheName);
  const keys = await cache.keys();
  for (let i = 0; i < keys.length - max; i++) await cache.delete(keys[i]);
}

/** The page sends what it loaded before this worker controlled it (its own URL, scripts, styles, fonts). */
async function cacheUrls(urls) {
  for (const u of urls) {
    let url;
    try {
      url = new URL(u, self.location.origin);
    } catch {
      continue;
    }
    if (url.origin !== self.location.origin) continue;
    const cacheName = isTodayData(url) ? DATA : SHELL;
    if (!(isStatic(url) || isTodayPage(url) || isTodayData(url))) continue;
    // Static files never change under the same name: fetch only those not kept yet.
    if (isStatic(url) && (await (await caches.open(SHELL)).match(url.href))) continue;
    try {
      const res = await fetch(url.href, { credentials: 'same-origin' });
      await store(cacheName, new Request(url.href), res);
    } catch {
      /* offline: next time */
    }
  }
  await trim(SHELL, MAX_SHELL_ENTRIES);
}

async function clearAll() {
  for (const name of await caches.keys()) await caches.delete(name);
}

self.addEventListener('message', (event) => {
  const data = event.data || {};
  if (data.type === 'cache-urls' && Array.isArray(data.urls)) event.waitUntil(cacheUrls(data.urls));
  if (data.type === 'clear') event.waitUntil(clearAll());
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;
  if (request.method === 'DELETE' && url.pathname === '/api/v1/session') {
    event.respondWith(fetch(request).finally(() => clearAll()));
    return;
  }
  if (request.method !== 'GET') return;
  if (isStatic(url)) event.respondWith(cacheFirst(SHELL, request));
  else if (isTodayData(url)) event.respondWith(networkFirst(DATA, request, DATA_TIMEOUT_MS));
  else if (request.mode === 'navigate' && isTodayPage(url)) event.respondWith(networkFirst(SHELL, request, PAGE_TIMEOUT_MS));
});

self.addEventListener('push', (event) => {
  let data = {};
  try {
    data = event.data ? event.data.json() : {};
  } catch {
    data = { title: 'Hearthcast', body: event.data ? event.data.text() : '' };
  }
  event.waitUntil(
    self.registration.showNotification(data.title || 'Hearthcast', {
      body: data.body || '',
      tag: data.tag,
      renotify: Boolean(data.tag),
      requireInteraction: Boolean(data.requireInteraction),
      vibrate: [300, 100, 300],
      data: { url: data.url || '/' },
      icon: '/icon.svg',
    }),
  );
});

self.addEventListener('notificationclick', (event) => {
  event.notification.close();
  const target = new URL((event.notification.data && event.notification.data.url) || '/', self.location.origin).href;
  event.waitUntil(
    (async () => {
      const wins = await self.clients.matchAll({ type: 'window', includeUncontrolled: true });
      for (const w of wins) {
        if (w.url === target && 'focus' in w) return w.focus();
      }
      return self.clients.openWindow(target);
    })(),
  );
});
