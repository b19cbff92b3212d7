/**
 * Plans on a worker thread, so that a solve (seconds of CPU) does not hold up the web server's event
 * loop: while one kitchen re-plans, every other request — a cook's Today page, a check-in — is still
 * answered. One thread per process, started on first use, kept (HiGHS stays compiled in it) and
 * unref'd while idle; problems queue in it one after another.
 *
 * The thread runs a bundle of lib/planner (.next/planner-thread.mjs, made by
 * scripts/build-planner-thread.mjs with every build). Without the bundle, outside production
 * (`next dev` would run a stale bundle), with PLANNER_THREAD=0, or when the thread cannot start, the
 * plan is made inline with the same planDay.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { planDay } from './plan';
import type { PlannerProblem, PlannerResult } from './types';

export const PLANNER_THREAD_FILE = path.join(process.cwd(), '.next', 'planner-thread.mjs');

type Reply = { id: number; ok: true; result: PlannerResult } | { id: number; ok: false; name: string; message: string };

interface Waiting {
  resolve: (r: PlannerResult) => void;
  reject: (e: Error) => void;
}

let worker: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, Waiting>();

function failAll(err: Error): void {
  for (const w of waiting.values()) w.reject(err);
  waiting.clear();
}

function startWorker(file: string): Worker {
  const w = new Worker(/*turbopackIgnore: true*/ file);
  w.unref();
  w.on('message', (msg: Reply) => {
    const entry = waiting.get(msg.id);
    if (!entry) return;
    waiting.delete(msg.id);
    if (waiting.size === 0) w.unref();
    if (msg.ok) entry.resolve(msg.result);
    else {
      const e = msg.name === 'RangeError' ? new RangeError(msg.message) : new Error(msg.message);
      e.name = msg.name;
      entry.reject(e);
    }
  });
  const gone = (err: Error) => {
    if (worker === w) worker = null;
    failAll(err);
  };
  w.on('error', gone);
  w.on('exit', (code) => gone(new Error(`the planner thread stopped (exit code ${code})`)));
  return w;
}

/** Whether plans go to the thread here (the bundle exists, production, not switched off). */
export function plannerThreadEnabled(file = PLANNER_THREAD_FILE): boolean {
  if (process.env.PLANNER_THREAD === '0') return false;
  if (process.env.PLANNER_THREAD !== '1' && process.env.NODE_ENV !== 'production') return false;
  // The bundle is found at run time; the build must not trace the project for it.
  return existsSync(/*turbopackIgnore: true*/ file);
}

/**
 * planDay on the planner thread (inline where there is none). Same result and errors as planDay:
 * a RangeError (the problem refused) stays a RangeError.
 */
export async function planDayOffThread(problem: PlannerProblem, file = PLANNER_THREAD_FILE): Promise<PlannerResult> {
  if (!plannerThreadEnabled(file)) return planDay(problem);
  try {
    worker ??= startWorker(file);
  } catch {
    return planDay(problem);
  }
  const w = worker;
  const id = nextId++;
  const done = new Promise<PlannerResult>((resolve, reject) => waiting.set(id, { resolve, reject }));
  w.ref();
  w.postMessage({ id, problem });
  return done;
}

/** Stops the thread (tests; a server simply exits). */
export async function stopPlannerThread(): Promise<void> {
  const w = worker;
  worker = null;
  if (w) await w.terminate();
}
