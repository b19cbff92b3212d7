/**
 * HTTP benchmark: GET /api/v1/kitchens for a signed-in user at 20 concurrent connections against
 * the production build (started here with the test database). Prints requests/s and latency
 * percentiles; asserts nothing (figures go in the closing note).
 */
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import autocannon from 'autocannon';
import { DEMO_PASSWORD } from '../../lib/demo/seed';

const port = Number(process.env.BENCH_PORT ?? 3990);
const base = `http://127.0.0.1:${port}`;
const server = spawn('node_modules/.bin/next', ['start', '-H', '127.0.0.1', '-p', String(port)], {
  env: { ...process.env, NODE_ENV: 'production', SESSION_SECRET: randomBytes(32).toString('base64url'), APP_URL: base, NEXT_TELEMETRY_DISABLED: '1' },
  stdio: 'ignore',
});

try {
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(`${base}/api/v1/health`)).ok) break;
    } catch {
      /* starting */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  const res = await fetch(`${base}/api/v1/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'coordinator@example.org', password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
  const cookie = res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');

  // Warm-up, then the measured run; every response time is kept so p95 is exact.
  await autocannon({ url: `${base}/api/v1/kitchens`, connections: 20, duration: 3, headers: { cookie } });
  const times: number[] = [];
  const r = await new Promise<autocannon.Result>((resolve, reject) => {
    const instance = autocannon({ url: `${base}/api/v1/kitchens`, connections: 20, duration: Number(process.env.BENCH_SECONDS ?? 15), headers: { cookie } }, (err, result) =>
      err ? reject(err) : resolve(result),
    );
    instance.on('response', (_client, _status, _bytes, responseTime) => times.push(responseTime));
  });
  times.sort((a, b) => a - b);
  const pct = (p: number) => times[Math.min(times.length - 1, Math.floor((p / 100) * times.length))] ?? NaN;
  console.log('GET /api/v1/kitchens, signed in as the coordinator, 20 connections');
  console.log(`  requests/s  mean ${r.requests.average.toFixed(0)}  (total ${r.requests.total}, non-2xx ${r.non2xx}, errors ${r.errors})`);
  console.log(`  latency ms  p50 ${pct(50).toFixed(1)}  p95 ${pct(95).toFixed(1)}  p99 ${pct(99).toFixed(1)}  max ${pct(100).toFixed(1)}`);
} finally {
  server.kill('SIGTERM');
}
