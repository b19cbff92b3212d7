/**
 * Complete column enumeration for small instances.
 *
 * For each cooker and each subset of the batches that could run on it, decide by depth-first search
 * whether some assignment of pots and grid starts works: batches are added one at a time, every
 * partial assignment is simulated, and a failing one is not extended (adding a batch only draws more
 * heat and shortens the deadline of the batch before it on its pot, so it cannot repair a failure).
 * Starts are pruned by the necessary tests of Search.starts (pot free, store hot enough, pot screen
 * in 'upper' mode). A subset is only tried when all its subsets one smaller work. Every subset that
 * works becomes a column; when all subsets of all cookers are decided within the budget, the
 * set-packing master over these columns is exact for servings (on the start grid, under the
 * simulator — for a stratified store, under the incremental restarts the search uses).
 */
import { insertLoad, type Evaluation, type PBatch, type PModel } from './model';
import type { Search, State } from './search';

export interface ExactOutcome {
  complete: boolean;
  columns: number;
  evaluations: number;
}

/** Cap on subsets per cooker (2^k). */
export const EXACT_MAX_SUBSETS = 1 << 11;

function popcount(x: number): number {
  let n = 0;
  for (let v = x; v; v &= v - 1) n++;
  return n;
}

export function enumerateExact(m: PModel, search: Search, fixedOnly: State, maxEvaluations: number, deadlineMs = Infinity): ExactOutcome {
  const st = fixedOnly;
  const members: number[][] = m.cookers.map((c) =>
    m.batches.filter((b) => !b.fixed && search.relax.possible[b.idx]?.[c.idx]?.some((x) => x)).map((b) => b.idx),
  );
  const total = members.reduce((s, mm) => s + (1 << mm.length), 0);
  if (members.some((mm) => 1 << mm.length > EXACT_MAX_SUBSETS) || total > 2 * EXACT_MAX_SUBSETS) return { complete: false, columns: 0, evaluations: 0 };
  const start = search.evalCount;
  let columns = 0;
  let aborted = false;
  for (const c of m.cookers) {
    const mem = members[c.idx] as number[];
    const k = mem.length;
    // Batches in window order: tighter pruning when early batches are placed first.
    mem.sort((a, z) => (m.batches[a] as PBatch).serveBy - (m.batches[z] as PBatch).serveBy || a - z);
    const ok = new Map<number, Evaluation>();
    ok.set(0, st.evs[c.idx] as Evaluation);
    const masks = Array.from({ length: 1 << k }, (_, i) => i).sort((a, z) => popcount(a) - popcount(z) || a - z);
    for (const mask of masks) {
      if (mask === 0) continue;
      if (search.evalCount - start > maxEvaluations || search.timeUp() || performance.now() > deadlineMs) {
        aborted = true;
        break;
      }
      let subsOk = true;
      for (let i = 0; i < k && subsOk; i++) if (mask & (1 << i) && !ok.has(mask & ~(1 << i))) subsOk = false;
      if (!subsOk) continue;
      // Quick try: extend a known assignment of a one-smaller subset.
      let found: Evaluation | null = null;
      for (let i = 0; i < k && !found; i++) {
        if (!(mask & (1 << i))) continue;
        const base = ok.get(mask & ~(1 << i)) as Evaluation;
        const trial: State = { evs: st.evs.slice() };
        trial.evs[c.idx] = base;
        const r = search.tryInsert(trial, m.batches[mem[i] as number] as PBatch, [c.idx], 4);
        if (r) found = r.ev;
      }
      // Otherwise a full depth-first search over assignments decides.
      if (!found) {
        const order = mem.filter((_, i) => mask & (1 << i));
        const dfs = (ev: Evaluation, j: number): Evaluation | null => {
          if (j === order.length) return ev;
          if (search.evalCount - start > maxEvaluations || search.timeUp() || performance.now() > deadlineMs) {
            aborted = true;
            return null;
          }
          const b = m.batches[order[j] as number] as PBatch;
          for (const pot of c.pots) {
            if (!search.relax.possible[b.idx]?.[c.idx]?.[pot.idx]) continue;
            for (const s of search.starts(ev, b, c.idx, pot.idx)) {
              const next = search.evaluateOn(c.idx, insertLoad(ev.loads, { b: b.idx, p: pot.idx, s }), ev);
              if (!next.ok) continue;
              const r = dfs(next, j + 1);
              if (r || aborted) return r;
            }
          }
          return null;
        };
        found = dfs(st.evs[c.idx] as Evaluation, 0);
        if (aborted) break;
      }
      if (found) {
        ok.set(mask, found);
        search.addColumn(c.idx, found);
        columns++;
      }
    }
    if (aborted) break;
  }
  return { complete: !aborted, columns, evaluations: search.evalCount - start };
}
