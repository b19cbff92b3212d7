/**
 * Password-reset timing benchmark: POST /api/v1/password-resets for a registered and an unknown address, in
 * turn, against the production build (started here with the test database and the local SMTP fake). Prints the
 * median answer time of each and their difference; asserts nothing. Before the reset work moved after the
 * answer, a registered address took a median 125 ms against 12 ms for an unknown one. The code path that keeps
 * them alike is tested in tests/lib/http/password-reset-route.test.ts.
 */
import { spawn } from 'node:child_process';
import { randomBytes, randomUUID } from 'node:crypto';
import { mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { startSmtpFake } from '../../lib/fakes/smtp';

const port = Number(process.env.BENCH_PORT ?? 3991);
const base = `http://127.0.0.1:${port}`;
const rounds = Number(process.env.BENCH_ROUNDS ?? 15);
const registered = process.env.BENCH_EMAIL ?? 'coordinator@example.org'; // a demo account (lib/demo/seed.ts)
const smtp = await startSmtpFake({ port: 0, dir: await mkdtemp(path.join(tmpdir(), 'hearthcast-bench-mail-')) });
const server = spawn('node_modules/.bin/next', ['start', '-H', '127.0.0.1', '-p', String(port)], {
  env: { ...process.env, NODE_ENV: 'production', SESSION_SECRET: randomBytes(32).toString('base64url'), APP_URL: base, SMTP_URL: `smtp://127.0.0.1:${smtp.port}`, NEXT_TELEMETRY_DISABLED: '1' },
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
  const time = async (email: string) => {
    const start = performance.now();
    const r = await fetch(`${base}/api/v1/password-resets`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email }) });
    await r.arrayBuffer();
    if (r.status !== 202) throw new Error(`password reset answered ${r.status}`);
    return performance.now() - start;
  };
  await time(registered); // warm-up
  const known: number[] = [];
  const unknown: number[] = [];
  for (let i = 0; i < rounds; i++) {
    unknown.push(await time(`nobody.${i}.${randomUUID().slice(0, 8)}@example.org`));
    known.push(await time(registered));
  }
  const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
  console.log(`POST /api/v1/password-resets, ${rounds} rounds each, alternating`);
  console.log(`  median ms  registered ${median(known).toFixed(1)}  unknown ${median(unknown).toFixed(1)}  difference ${(median(known) - median(unknown)).toFixed(1)}`);
} finally {
  server.kill('SIGTERM');
  await smtp.close();
}
