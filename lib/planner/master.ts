/**
 * HiGHS (Huangfu & Hall 2018, "Parallelizing the dual revised simplex method", Math. Prog. Comp.
 * 10:119–142; MIP solver by Galabova, Hall et al.) compiled to WebAssembly (npm `highs`).
 *
 * The Wasm module compiles slowly the first time, so it is loaded once per process and kept in a
 * module variable; warmPlanner() loads it and runs a tiny model so the first real plan is fast.
 * Its heap is capped at 2 GiB: every model is disposed right after its solve.
 *
 * The master problem chooses at most one simulated sequence (column) per cooker and, from it, any
 * subset of its batches — taking batches out of a feasible sequence keeps it feasible (less heat is
 * drawn, no deadline gets shorter), so every subset of a column is a column too:
 *   maximise Σ_{k,b∈k} v_bk·z_bk
 *   s.t. Σ_{k of cooker c} y_k ≤ 1 (each cooker),  Σ_{k∋b} z_bk ≤ 1 (each batch),  z_bk ≤ y_k,
 *        y_k ∈ {0, 1}, 0 ≤ z_bk ≤ 1
 * with v_bk the batch's objective value in sequence k (its completion time there; a subset finishes
 * no later, so this only errs on the tie-break). For fixed y the z-part is a bipartite assignment, so
 * z is integral at a vertex and needs no integrality.
 */
import type { Highs, ModelData } from 'highs';
import type { Column } from './search';

let highsPromise: Promise<Highs> | null = null;

/** The process-wide HiGHS instance (loaded on first use). */
export function loadHighs(): Promise<Highs> {
  if (!highsPromise) {
    highsPromise = import('highs')
      .then((mod) => {
        const loader = (mod as unknown as { default: (o?: object) => Promise<Highs> }).default;
        return loader();
      })
      .catch((err: unknown) => {
        highsPromise = null;
        throw err;
      });
  }
  return highsPromise;
}

/**
 * Heap size above which the process-wide instance is replaced by a fresh one before the next plan.
 * The WebAssembly heap only grows (measured: 20 MiB after loading, 264 MiB after one 20-s 12 × 60
 * plan, its large masters) and HiGHS aborts at 2 GiB.
 */
export const HIGHS_RECYCLE_BYTES = 512 * 2 ** 20;

/**
 * Heap size above which a plan stops sending masters to the instance it holds (a fresh instance
 * cannot be had without waiting; the next plan gets one). Measured: one 60-s 12 × 60 plan ended at
 * 1.2 GiB; in another a single master solve went from under 1.25 GiB past 2 GiB and aborted (handled
 * by solveModel), hence the margin.
 */
export const HIGHS_STOP_BYTES = 768 * 2 ** 20;

/** The instance's WebAssembly heap [bytes] (0 when it does not say). */
export function highsHeapBytes(h: Highs | null): number {
  return (h as { memoryBytes?: number } | null)?.memoryBytes ?? 0;
}

/** After a plan: lets the next one load a fresh instance when `h`'s heap has grown past the limit. */
export function recycleHighsIfLarge(h: Highs | null, limitBytes = HIGHS_RECYCLE_BYTES): boolean {
  if (!h || highsHeapBytes(h) <= limitBytes) return false;
  failed.add(h);
  highsPromise = null;
  return true;
}

/** Loads HiGHS and solves a two-variable MIP once, so later solves skip the Wasm warm-up. */
export async function warmPlanner(): Promise<void> {
  const h = await loadHighs();
  solveModel(
    h,
    {
      numCols: 2,
      numRows: 1,
      sense: h.constants.objectiveSense.maximize,
      colCost: [1, 2],
      colLower: [0, 0],
      colUpper: [1, 1],
      rowLower: [-h.infinity],
      rowUpper: [1],
      matrix: { format: 'csc', numRows: 1, numCols: 2, starts: [0, 1, 2], indices: [0, 0], values: [1, 1] },
      integrality: [1, 1],
    },
    1,
  );
}

export interface SolveOutcome {
  /** HiGHS model status code (7 optimal, 13 time limit, …). */
  status: number;
  objective: number;
  x: Float64Array | null;
  /** MIP dual bound (for MIPs), else the objective. */
  dualBound: number;
}

/**
 * HiGHS instances that failed (a WebAssembly abort — e.g. its 2 GiB heap exhausted — leaves the
 * module unusable): no more models go to them, and the next loadHighs() makes a fresh instance.
 */
const failed = new WeakSet<Highs>();

/** Whether `h` still answers (it has not failed in this process). */
export function highsUsable(h: Highs | null): h is Highs {
  return !!h && !failed.has(h);
}

/** Status of a solve that HiGHS could not run (the instance failed): no solution, callers go on without it. */
export const STATUS_SOLVER_FAILED = -1;

/**
 * Solves one model and disposes it. A failure inside HiGHS does not reach the caller: the instance is
 * marked failed (a new one is loaded next time) and the outcome has status STATUS_SOLVER_FAILED and no x.
 */
export function solveModel(h: Highs, data: ModelData, timeLimitS: number, start?: number[]): SolveOutcome {
  const none: SolveOutcome = { status: STATUS_SOLVER_FAILED, objective: Number.NaN, x: null, dualBound: Number.NaN };
  if (failed.has(h)) return none;
  try {
    return runModel(h, data, timeLimitS, start);
  } catch (err) {
    failed.add(h);
    if (highsPromise) highsPromise = null;
    console.error('[planner] HiGHS failed; going on without it for this plan, a fresh instance next time:', err instanceof Error ? err.message : err);
    return none;
  }
}

function runModel(h: Highs, data: ModelData, timeLimitS: number, start?: number[]): SolveOutcome {
  const model = h.createModel(data);
  try {
    model.options.set({ output_flag: false, time_limit: Math.max(0.02, timeLimitS), mip_rel_gap: 1e-9, random_seed: 1 });
    if (start) model.setSolution({ colValue: start });
    model.run();
    const status = model.getModelStatus() as number;
    const sol = model.getSolution();
    const hasX = sol.colValue.length === data.numCols && (status === 7 || status === 13 || status === 14 || status === 16 || status === 17);
    let dualBound = Number.NaN;
    try {
      dualBound = Number(model.info.get('mip_dual_bound'));
    } catch {
      dualBound = Number.NaN;
    }
    return { status, objective: model.getObjectiveValue(), x: hasX ? Float64Array.from(sol.colValue) : null, dualBound };
  } finally {
    try {
      model.dispose();
    } catch {
      // An aborted instance cannot free its model either; it is dropped as a whole.
    }
  }
}

export interface MasterResult {
  chosen: Column[];
  objective: number;
  status: number;
}

/**
 * Set-packing master over all columns. `incumbent` (one column per cooker, or fewer) is passed as
 * the MIP start, so HiGHS never returns anything worse than it.
 */
export function solveMaster(h: Highs, nCookers: number, columns: readonly Column[], incumbent: ReadonlySet<string>, timeLimitS: number): MasterResult | null {
  if (columns.length === 0) return null;
  const batchRow = new Map<number, number>();
  for (const col of columns) for (const b of col.batches) if (!batchRow.has(b)) batchRow.set(b, nCookers + batchRow.size);
  const nY = columns.length;
  const nZ = columns.reduce((s, c) => s + c.batches.length, 0);
  const linkRow0 = nCookers + batchRow.size;
  const numRows = linkRow0 + nZ;
  const n = nY + nZ;
  // CSC: y_k has the cooker row and −1 in each of its link rows; z_bk has its batch row and +1 in its link row.
  const starts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  const cost: number[] = [];
  const integrality: (0 | 1)[] = [];
  let link = linkRow0;
  const firstLink: number[] = [];
  for (const col of columns) {
    firstLink.push(link);
    indices.push(col.c);
    values.push(1);
    for (let j = 0; j < col.batches.length; j++) {
      indices.push(link + j);
      values.push(-1);
    }
    link += col.batches.length;
    starts.push(indices.length);
    cost.push(0);
    integrality.push(1);
  }
  columns.forEach((col, k) => {
    col.batches.forEach((b, j) => {
      indices.push(batchRow.get(b) as number, (firstLink[k] as number) + j);
      values.push(1, 1);
      starts.push(indices.length);
      cost.push(col.values[j] as number);
      integrality.push(0);
    });
  });
  const rowUpper = new Array<number>(numRows).fill(1);
  for (let r = linkRow0; r < numRows; r++) rowUpper[r] = 0;
  const data: ModelData = {
    numCols: n,
    numRows,
    sense: h.constants.objectiveSense.maximize,
    colCost: cost,
    colLower: new Array<number>(n).fill(0),
    colUpper: new Array<number>(n).fill(1),
    rowLower: new Array<number>(numRows).fill(-h.infinity),
    rowUpper,
    matrix: { format: 'csc', numRows, numCols: n, starts, indices, values },
    integrality,
  };
  const start: number[] = columns.map((c) => (incumbent.has(c.key) ? 1 : 0));
  columns.forEach((col, k) => col.batches.forEach(() => start.push(start[k] as number)));
  const out = solveModel(h, data, timeLimitS, start);
  if (!out.x) return null;
  const chosen: Column[] = [];
  let z = nY;
  columns.forEach((col, k) => {
    const use = (out.x as Float64Array)[k] as number;
    const keep: number[] = [];
    const keepVals: number[] = [];
    col.batches.forEach((b, j) => {
      if (use > 0.5 && ((out.x as Float64Array)[z] as number) > 0.5) {
        keep.push(b);
        keepVals.push(col.values[j] as number);
      }
      z++;
    });
    if (use <= 0.5) return;
    const keepSet = new Set(keep);
    const fixedOrKept = col.loads.filter((l) => keepSet.has(l.b) || !col.batches.includes(l.b));
    chosen.push({ c: col.c, loads: fixedOrKept, value: keepVals.reduce((a, v) => a + v, 0), batches: keep, values: keepVals, key: col.key });
  });
  return { chosen, objective: out.objective, status: out.status };
}
