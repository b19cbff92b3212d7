/**
 * Entry of the planner thread (bundled by scripts/build-planner-thread.mjs into
 * .next/planner-thread.mjs; see lib/planner-thread/index.ts). Plans the posted problems one after another
 * with planDay — one at a time, so that each gets its whole time limit — and posts each result back;
 * a refusal keeps its error name so the caller can tell bad input (RangeError) from a fault.
 */
import { parentPort } from 'node:worker_threads';
import { planDay, warmPlanner } from '@/lib/planner';
import type { PlannerProblem } from '@/lib/planner';

const port = parentPort;
if (port) {
  // HiGHS is compiled in this thread once, before the first problem is planned.
  let queue: Promise<unknown> = warmPlanner().catch(() => undefined);
  const reply = (msg: object, id: number) => {
    try {
      port.postMessage(msg);
    } catch (err) {
      // A result that cannot be copied back: say so instead of losing the job.
      port.postMessage({ id, ok: false, name: 'Error', message: `the plan could not be sent back: ${err instanceof Error ? err.message : String(err)}` });
    }
  };
  port.on('message', (msg: { id: number; problem: PlannerProblem }) => {
    queue = queue
      .then(() => planDay(msg.problem))
      .then(
        (result) => reply({ id: msg.id, ok: true, result }, msg.id),
        (err: unknown) => {
          const e = err instanceof Error ? err : new Error(String(err));
          reply({ id: msg.id, ok: false, name: e.name, message: e.message }, msg.id);
        },
      );
  });
}
