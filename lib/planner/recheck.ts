/**
 * Final re-check: every cooker's sequence simulated in full from its initial state with the full
 * simulator (the search may have used a surrogate). A batch that fails is moved (another start or
 * pot on its cooker, Search.tryInsert) or sent to backup with a sentence saying why (report.ts).
 */
import { CookerEvaluator, type Evaluation, type Load, type PBatch, type PModel } from './model';
import type { Relaxation } from './relaxation';
import { failureDetail } from './report';
import type { PotScreen } from './screen';
import { Search, type State } from './search';

/** Candidates simulated when moving a batch that failed the re-check on its cooker. Project choice. */
export const RECHECK_MOVE_EVALUATIONS = 12;

export interface Recheck {
  /** The plan as the full simulator sees it. */
  plan: State;
  /** Batches sent to backup by the re-check, with the reason in words. */
  failed: Map<number, string>;
}

/**
 * @param finalEvals evaluators with the full simulator
 * @param failedFixed fixed batches already dropped (they stay in `failed`)
 */
export function recheckPlan(
  m: PModel,
  st: State,
  finalEvals: CookerEvaluator[],
  relax: Relaxation,
  screens: PotScreen[],
  rng: () => number,
  failedFixed: ReadonlyMap<number, string>,
  say: (line: string) => void,
): Recheck {
  const failed = new Map<number, string>(failedFixed);
  const repairSearch = new Search(m, finalEvals, relax, screens, rng, Infinity);
  const plan: State = { evs: [] };
  for (const c of m.cookers) {
    const fe = finalEvals[c.idx] as CookerEvaluator;
    let loads = (st.evs[c.idx] as Evaluation).loads;
    const tried = new Set<number>();
    let ev = fe.evaluateFull(loads);
    while (!ev.ok) {
      const j = ev.failIdx;
      const l = loads[j] as Load;
      const b = m.batches[l.b] as PBatch;
      const detail = failureDetail(m, fe, ev, j);
      loads = loads.filter((_, k) => k !== j);
      ev = fe.evaluateFull(loads);
      if (ev.ok && !b.fixed && !tried.has(l.b)) {
        tried.add(l.b);
        // tryInsert only reads the sequences of the cookers it is given.
        const tmp: State = { evs: m.cookers.map(() => ev) };
        const r = repairSearch.tryInsert(tmp, b, [c.idx], RECHECK_MOVE_EVALUATIONS);
        if (r) {
          const full = fe.evaluateFull(r.ev.loads);
          if (full.ok) {
            say(`re-check: ${b.raw.dishName} (${b.id}) moved on ${c.name}`);
            loads = r.ev.loads;
            ev = full;
            continue;
          }
        }
      }
      failed.set(l.b, detail);
      say(`re-check: ${b.raw.dishName} (${b.id}) fails on ${c.name}: ${detail}`);
    }
    plan.evs.push(ev);
  }
  return { plan, failed };
}
