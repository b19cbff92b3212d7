/**
 * Entry of the planner thread (bundled by scripts/build-planner-thread.mjs into
 * .next/planner-thread.mjs; see lib/planner/thread.ts). Plans each posted problem with planDay and
 * posts the result back; a refusal keeps its error name so the caller can tell bad input (RangeError)
 * from a fault.
 */
import { parentPort } from 'node:worker_threads';
import { planDay, warmPlanner } from './plan';
import type { PlannerProblem } from './types';

const port = parentPort;
if (port) {
  // HiGHS is compiled in this thread once, before the first problem arrives.
  const warm = warmPlanner().catch(() => undefined);
  port.on('message', (msg: { id: number; problem: PlannerProblem }) => {
    void warm
      .then(() => planDay(msg.problem))
      .then(
        (result) => port.postMessage({ id: msg.id, ok: true, result }),
        (err: unknown) => {
          const e = err instanceof Error ? err : new Error(String(err));
          port.postMessage({ id: msg.id, ok: false, name: e.name, message: e.message });
        },
      );
  });
}
