/**
 * Upper bound on servings on the sun: an LP relaxation built from single-batch facts
 * (relaxation.ts), solved with HiGHS.
 *
 *   maximise Σ servings_b · x_bcp    over (b, c, p) where b is possible alone on pot p of cooker c
 *   s.t.  Σ_cp x_bcp ≤ 1                                       each batch at most once
 *         Σ_{b: serve-by ≤ τ} E_bcp · x_bcp ≤ H_c(T0) − H_c(T_floor) + η0·A·∫_{t0}^{τ} G dt
 *                                                             store energy, each cooker, each serve-by τ
 *         Σ_{b in window W} (dmin_bcp + turnaround) · x_bcp ≤ shift time in W + turnaround per shift
 *                                                             pot time, each pot, prefix and suffix windows
 *         0 ≤ x ≤ 1
 *
 * E_bcp is the sensible heat of contents and pot from the warmest air to the dish minimum (a lower
 * bound of what the batch draws); H_c is the store enthalpy (from a simulated cool-down) and
 * T_floor the lowest dish minimum among those batches less FLOOR_MARGIN_K. The energy row assumes a
 * store does not end a batch's hold more than FLOOR_MARGIN_K below that dish's minimum (the pot is
 * heated only by the store; its own heat capacity can carry it briefly above a cooling store) —
 * stated, not proven. Everything else is a true relaxation of the simulated plan.
 */
import type { Highs, ModelData } from 'highs';
import type { PBatch, PModel } from './model';
import type { Relaxation } from './relaxation';
import { solveModel } from './master';
import { STEP_MS } from './validate';

export const FLOOR_MARGIN_K = 20;

export const BOUND_METHOD_LP =
  'LP relaxation: each batch at most once on a (cooker, pot) where it is feasible alone (no-load store reaches the dish minimum in its window; ' +
  'heat-up with the store at its max safe temperature plus hold fits); per cooker and serve-by, sensible heat of the batches due ≤ store enthalpy ' +
  `down to (lowest dish minimum − ${FLOOR_MARGIN_K} K) + loss-free collector gain η0·A·∫G dt; per pot, (quickest occupation + turnaround) ≤ shift time in prefix/suffix windows`;
export const BOUND_METHOD_EXACT =
  'exact: every subset of batches decided for every cooker by depth-first search over pots and grid starts with the simulator; set-packing master over all feasible subsets solved to optimality by HiGHS';
export const BOUND_METHOD_SIMPLE = 'sum of servings of batches feasible alone on some (cooker, pot) (no-load store reaches the dish minimum in its window; quickest heat-up plus hold fits)';

export interface BoundResult {
  bound: number;
  method: string;
  /** LP value per batch (x summed over cookers and pots), for diagnostics. */
  lpStatus: number | null;
}

/** Rows per family (cooker energy, pot prefix, pot suffix): fewer rows only loosen the bound. */
const MAX_ROWS_PER_FAMILY = 6;

/** Up to k values spread over a sorted list, always keeping the last one. */
function thin(sorted: number[], k: number): number[] {
  if (sorted.length <= k) return sorted;
  const out: number[] = [];
  for (let i = 1; i <= k; i++) out.push(sorted[Math.round((i * sorted.length) / k) - 1] as number);
  return [...new Set(out)];
}

function shiftTime(m: PModel, a: number, z: number): number {
  let t = 0;
  for (const s of m.shifts) {
    const lo = Math.max(a, s.startMs);
    const hi = Math.min(z, s.endMs);
    if (hi > lo) t += hi - lo + m.turnMs;
  }
  return t;
}

export function computeBound(h: Highs | null, m: PModel, relax: Relaxation, timeLimitS: number): BoundResult {
  const integral = m.batches.every((b) => Number.isInteger(b.servings));
  const simple = m.doneServings + m.batches.reduce((s, b) => s + (relax.possible[b.idx]?.some((pc) => pc.some((x) => x)) ? b.servings : 0), 0);
  if (!h) return { bound: simple, method: BOUND_METHOD_SIMPLE, lpStatus: null };

  interface V {
    b: number;
    c: number;
    p: number;
  }
  const vars: V[] = [];
  for (const b of m.batches) {
    if (b.fixed?.done) continue;
    m.cookers.forEach((c) =>
      c.pots.forEach((p) => {
        if (relax.possible[b.idx]?.[c.idx]?.[p.idx]) vars.push({ b: b.idx, c: c.idx, p: p.idx });
      }),
    );
  }
  if (vars.length === 0) return { bound: m.doneServings, method: BOUND_METHOD_LP, lpStatus: null };
  // Rows as sparse lists of (var, coef).
  const rows: { idx: number[]; val: number[]; ub: number }[] = [];
  const byBatch = new Map<number, number[]>();
  vars.forEach((v, k) => {
    const l = byBatch.get(v.b) ?? [];
    l.push(k);
    byBatch.set(v.b, l);
  });
  for (const ks of byBatch.values()) rows.push({ idx: ks, val: ks.map(() => 1), ub: 1 });

  for (const c of m.cookers) {
    const ks = vars.map((v, k) => k).filter((k) => (vars[k] as V).c === c.idx);
    if (ks.length === 0) continue;
    const H = relax.enthalpyJ[c.idx] as (t: number) => number;
    const gain = relax.gainCumJ[c.idx] as Float64Array;
    const taus = thin([...new Set(ks.map((k) => (m.batches[(vars[k] as V).b] as PBatch).serveBy))].sort((a, z) => a - z), MAX_ROWS_PER_FAMILY);
    for (const tau of taus) {
      const inRow = ks.filter((k) => (m.batches[(vars[k] as V).b] as PBatch).serveBy <= tau);
      const floor = Math.min(...inRow.map((k) => (m.batches[(vars[k] as V).b] as PBatch).raw.minTempC)) - FLOOR_MARGIN_K;
      const gi = Math.max(0, Math.min(c.n, Math.ceil((tau - c.t0) / STEP_MS)));
      const cap = Math.max(0, H(c.raw.initialStoreTempC) - H(floor) + (gain[gi] as number));
      rows.push({ idx: inRow, val: inRow.map((k) => relax.energyLowJ[(vars[k] as V).b]?.[c.idx]?.[(vars[k] as V).p] ?? 0), ub: cap });
    }
    for (const p of c.pots) {
      const kp = ks.filter((k) => (vars[k] as V).p === p.idx && !(m.batches[(vars[k] as V).b] as PBatch).fixed);
      if (kp.length < 2) continue;
      const occ = (k: number) => (relax.dminMs[(vars[k] as V).b]?.[c.idx]?.[p.idx] ?? 0) + m.turnMs;
      const bat = (k: number) => m.batches[(vars[k] as V).b] as PBatch;
      const ends = thin([...new Set(kp.map((k) => bat(k).serveBy))].sort((a, z) => a - z), MAX_ROWS_PER_FAMILY);
      for (const z of ends) {
        const inRow = kp.filter((k) => bat(k).serveBy <= z);
        const a = Math.max(c.t0, Math.min(...inRow.map((k) => bat(k).earliest)));
        rows.push({ idx: inRow, val: inRow.map(occ), ub: shiftTime(m, a, Math.min(z, c.tEnd)) });
      }
      const begins = thin([...new Set(kp.map((k) => bat(k).earliest))].sort((a, z) => a - z), MAX_ROWS_PER_FAMILY);
      for (const a of begins) {
        const inRow = kp.filter((k) => bat(k).earliest >= a);
        const z = Math.min(c.tEnd, Math.max(...inRow.map((k) => bat(k).serveBy)));
        rows.push({ idx: inRow, val: inRow.map(occ), ub: shiftTime(m, Math.max(a, c.t0), z) });
      }
    }
  }
  // A capacity row that holds even with every variable at 1 is redundant: drop it. If none is left,
  // the LP optimum is the simple bound.
  const nBatchRows = byBatch.size;
  const kept = rows.filter((row, r) => r < nBatchRows || row.val.reduce((a, v) => a + v, 0) > row.ub * (1 + 1e-9));
  if (kept.length === nBatchRows) return { bound: simple, method: BOUND_METHOD_LP, lpStatus: 7 };
  rows.length = 0;
  rows.push(...kept);
  // CSC matrix.
  const n = vars.length;
  const colEntries: { r: number; v: number }[][] = vars.map(() => []);
  rows.forEach((row, r) => row.idx.forEach((k, j) => (colEntries[k] as { r: number; v: number }[]).push({ r, v: row.val[j] as number })));
  const starts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  for (const es of colEntries) {
    for (const e of es) {
      if (e.v === 0) continue;
      indices.push(e.r);
      values.push(e.v);
    }
    starts.push(indices.length);
  }
  // Scale energy rows to MJ and time rows to hours for conditioning.
  const rowScale = rows.map((row) => {
    const mx = Math.max(1e-12, ...row.val.map(Math.abs), Math.abs(row.ub) === Infinity ? 0 : Math.abs(row.ub));
    return mx > 1e3 ? 1 / mx : 1;
  });
  for (let k = 0; k < indices.length; k++) values[k] = (values[k] as number) * (rowScale[indices[k] as number] as number);
  const data: ModelData = {
    numCols: n,
    numRows: rows.length,
    sense: h.constants.objectiveSense.maximize,
    colCost: vars.map((v) => (m.batches[v.b] as PBatch).servings),
    colLower: new Array<number>(n).fill(0),
    colUpper: new Array<number>(n).fill(1),
    rowLower: new Array<number>(rows.length).fill(-h.infinity),
    rowUpper: rows.map((r, i) => r.ub * (rowScale[i] as number)),
    matrix: { format: 'csc', numRows: rows.length, numCols: n, starts, indices, values },
  };
  const out = solveModel(h, data, timeLimitS);
  if (out.status !== 7) return { bound: simple, method: BOUND_METHOD_SIMPLE, lpStatus: out.status };
  // A slightly loose LP tolerance must not cut a serving: round up with a tolerance, then floor for integral servings.
  let bound = m.doneServings + out.objective * (1 + 1e-7) + 1e-6;
  if (integral) bound = Math.floor(bound);
  return { bound: Math.min(bound, simple), method: BOUND_METHOD_LP, lpStatus: out.status };
}
