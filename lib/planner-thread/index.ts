/**
 * Plans on a worker thread, so that a solve (seconds of CPU) does not hold up the web server's event
 * loop: while one kitchen re-plans, every other request — a cook's Today page, a check-in — is still
 * answered. One thread per process, started on first use, kept (HiGHS stays compiled in it) and
 * unref'd while idle; problems queue in it and are planned one after another.
 *
 * The adapter between the web server and the planner core (lib/planner knows nothing of threads, builds
 * or the environment). The thread runs a bundle of lib/planner (.next/planner-thread.mjs, made by
 * scripts/build-planner-thread.mjs with every build). It is used by the production server (`next
 * start`: NODE_ENV production and Next's NEXT_RUNTIME nodejs) when the bundle is there; scripts (the
 * demo loader), `next dev` (its bundle could be stale) and PLANNER_THREAD=0 plan inline with the same
 * planDay, and so does a process whose thread could not start (the problems it held are planned
 * inline too).
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { planDay } from '@/lib/planner';
import type { PlannerProblem, PlannerResult } from '@/lib/planner';

export const PLANNER_THREAD_FILE = path.join(process.cwd(), '.next', 'planner-thread.mjs');

type Reply = { id: number; ok: true; result: PlannerResult } | { id: number; ok: false; name: string; message: string };

interface Job {
  problem: PlannerProblem;
  resolve: (r: PlannerResult) => void;
  reject: (e: Error) => void;
}

interface PlannerThread {
  worker: Worker;
  jobs: Map<number, Job>;
}

let thread: PlannerThread | null = null;
/** Set when a thread failed before it came online: this process plans inline from then on. */
let unusable = false;
let nextId = 1;

function startThread(file: string): PlannerThread {
  const worker = new Worker(/*turbopackIgnore: true*/ file);
  worker.unref();
  const t: PlannerThread = { worker, jobs: new Map() };
  let online = false;
  worker.on('online', () => {
    online = true;
  });
  worker.on('message', (msg: Reply) => {
    const job = t.jobs.get(msg.id);
    if (!job) return;
    t.jobs.delete(msg.id);
    if (t.jobs.size === 0) worker.unref();
    if (msg.ok) job.resolve(msg.result);
    else {
      const e = msg.name === 'RangeError' ? new RangeError(msg.message) : new Error(msg.message);
      e.name = msg.name;
      job.reject(e);
    }
  });
  // 'error' and then 'exit' may both come: the jobs are settled once (the map is emptied).
  const gone = (err: Error) => {
    if (thread === t) thread = null;
    const jobs = [...t.jobs.values()];
    t.jobs.clear();
    if (!online) {
      // The bundle did not load (or the thread could not run at all): plan inline from now on.
      unusable = true;
      for (const job of jobs) planDay(job.problem).then(job.resolve, job.reject);
    } else for (const job of jobs) job.reject(err);
  };
  worker.on('error', gone);
  worker.on('exit', (code) => gone(new Error(`the planner thread stopped (exit code ${code})`)));
  return t;
}

/** Whether plans go to the thread here (production server, the bundle exists, not switched off). */
export function plannerThreadEnabled(file = PLANNER_THREAD_FILE): boolean {
  const flag = process.env.PLANNER_THREAD;
  if (flag === '0' || unusable) return false;
  if (flag !== '1' && (process.env.NODE_ENV !== 'production' || process.env.NEXT_RUNTIME !== 'nodejs')) return false;
  // The bundle is found at run time; the build must not trace the project for it.
  return existsSync(/*turbopackIgnore: true*/ file);
}

/**
 * planDay on the planner thread (inline where there is none). Same result and errors as planDay:
 * a RangeError (the problem refused) stays a RangeError.
 */
export async function planDayOffThread(problem: PlannerProblem, file = PLANNER_THREAD_FILE): Promise<PlannerResult> {
  if (!plannerThreadEnabled(file)) return planDay(problem);
  let t: PlannerThread;
  try {
    t = thread ??= startThread(file);
  } catch {
    unusable = true;
    return planDay(problem);
  }
  const id = nextId++;
  const done = new Promise<PlannerResult>((resolve, reject) => t.jobs.set(id, { problem, resolve, reject }));
  try {
    t.worker.postMessage({ id, problem });
  } catch {
    // A problem the thread cannot be sent (not plain data): plan it here.
    t.jobs.delete(id);
    return planDay(problem);
  }
  t.worker.ref();
  return done;
}

/** Stops the thread (tests; a server simply exits). */
export async function stopPlannerThread(): Promise<void> {
  const t = thread;
  thread = null;
  if (t) await t.worker.terminate();
}
