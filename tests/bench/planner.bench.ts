/**
 * Planner benchmark (a plain script, not a test): `npx tsx tests/bench/planner.bench.ts`.
 *
 * Seeded instances (cookers × batches) from tests/lib/planner/fixtures.ts — varied cookers, clear-sky
 * beam curve times a seeded Kasten–Czeplak cloud factor, lunch and dinner batches on a 15-min grid.
 * Each instance is planned with its short time limit and again with a long one (BENCH_LONG_S,
 * default 60 s) to see how much the extra time buys. Prints figures; asserts nothing.
 *
 * Goals on a 2-core machine: 12×60 within 2 s at ≥ 98 % of the long run and never below greedy;
 * 24×150 within 10 s. Measured warm (HiGHS loaded, one unmeasured plan first), as in a running server.
 * Env: BENCH_LONG_S (seconds for the long run, 0 skips it), BENCH_SEEDS (comma-separated, default 1),
 * BENCH_ONLY (e.g. "12x60").
 */
import { planDay, warmPlanner } from '@/lib/planner';
import type { PlannerResult } from '@/lib/planner/types';
import { makeInstance } from '../lib/planner/fixtures';

const SIZES: { cookers: number; batches: number; limitS: number }[] = [
  { cookers: 3, batches: 10, limitS: 2 },
  { cookers: 6, batches: 30, limitS: 2 },
  { cookers: 12, batches: 60, limitS: 2 },
  { cookers: 24, batches: 150, limitS: 10 },
];

function pad(s: string | number, n: number): string {
  return String(s).padStart(n);
}

async function main(): Promise<void> {
  const longS = Number(process.env.BENCH_LONG_S ?? 60);
  const seeds = (process.env.BENCH_SEEDS ?? '1').split(',').map(Number);
  const only = process.env.BENCH_ONLY;
  const t = performance.now();
  await warmPlanner();
  // One more 1-s plan of an unmeasured 12×60 instance, so that every measured plan runs compiled
  // code, as in a long-running server (the first large plan of a fresh process searches less).
  await planDay(makeInstance(12, 60, 999, 1));
  console.log(`HiGHS loaded and planner warmed in ${(performance.now() - t).toFixed(0)} ms (once per process)`);
  console.log(
    ['instance', 'seed', 'limit s', 'time s', 'status', 'servings', 'bound', 'gap %', 'greedy', `long(${longS}s)`, 'long time s', 'short/long %', 'iters'].map((h, i) => pad(h, i === 0 ? 9 : 11)).join(' '),
  );
  for (const size of SIZES) {
    const name = `${size.cookers}x${size.batches}`;
    if (only && only !== name) continue;
    for (const seed of seeds) {
      const p = makeInstance(size.cookers, size.batches, seed, size.limitS);
      const r: PlannerResult = await planDay(p);
      let long: PlannerResult | null = null;
      if (longS > 0) long = await planDay({ ...p, timeLimitS: longS });
      const ratio = long && long.servingsOnSun > 0 ? (100 * r.servingsOnSun) / long.servingsOnSun : Number.NaN;
      console.log(
        [
          pad(name, 9),
          pad(seed, 11),
          pad(size.limitS, 11),
          pad((r.solveTimeMs / 1000).toFixed(2), 11),
          pad(r.status, 11),
          pad(r.servingsOnSun, 11),
          pad(r.upperBound, 11),
          pad((100 * r.gap).toFixed(1), 11),
          pad(r.greedyServings, 11),
          pad(long ? long.servingsOnSun : '-', 11),
          pad(long ? (long.solveTimeMs / 1000).toFixed(1) : '-', 11),
          pad(Number.isNaN(ratio) ? '-' : ratio.toFixed(1), 11),
          pad(r.iterations, 11),
        ].join(' '),
      );
      if (r.servingsOnSun < r.greedyServings) console.log(`  !! ${name} seed ${seed}: below greedy`);
    }
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exitCode = 1;
});
