/**
 * A failure inside HiGHS (e.g. a WebAssembly abort when its 2 GiB heap runs out) must not fail a
 * plan: the solve reports no solution, the instance is set aside, and the next load is a fresh one.
 */
import { describe, expect, it } from 'vitest';
import type { Highs } from 'highs';
import { HIGHS_RECYCLE_BYTES, highsUsable, loadHighs, recycleHighsIfLarge, solveMaster, solveModel, STATUS_SOLVER_FAILED } from '@/lib/planner/master';

function abortingHighs(): Highs {
  const real = { infinity: Infinity, constants: { objectiveSense: { maximize: -1, minimize: 1 } } };
  return {
    ...real,
    createModel() {
      throw new WebAssembly.RuntimeError('Aborted(). Build with -sASSERTIONS for more info.');
    },
  } as unknown as Highs;
}

describe('HiGHS failure', () => {
  it('a model HiGHS aborts on gives status STATUS_SOLVER_FAILED and no solution; the instance is not used again', () => {
    const h = abortingHighs();
    const data = {
      numCols: 1,
      numRows: 1,
      sense: -1 as never,
      colCost: [1],
      colLower: [0],
      colUpper: [1],
      rowLower: [-Infinity],
      rowUpper: [1],
      matrix: { format: 'csc' as const, numRows: 1, numCols: 1, starts: [0, 1], indices: [0], values: [1] },
    };
    expect(highsUsable(h)).toBe(true);
    const out = solveModel(h, data, 1);
    expect(out.status).toBe(STATUS_SOLVER_FAILED);
    expect(out.x).toBeNull();
    expect(highsUsable(h)).toBe(false);
  });

  it('the master over a failed instance answers null (the search goes on without it)', () => {
    const h = abortingHighs();
    const cols = [{ c: 0, loads: [], value: 1, batches: [0], values: [1], key: '0|a' }];
    expect(solveMaster(h, 1, cols, new Set(['0|a']), 1)).toBeNull();
    expect(highsUsable(h)).toBe(false);
  });

  it('after a failure the next load is a fresh, working instance', async () => {
    const first = await loadHighs();
    // Fail the process-wide instance the way an abort would.
    const broken = first as unknown as { createModel: unknown };
    const keep = broken.createModel;
    broken.createModel = () => {
      throw new WebAssembly.RuntimeError('Aborted()');
    };
    try {
      const cols = [{ c: 0, loads: [], value: 1, batches: [0], values: [1], key: '0|a' }];
      expect(solveMaster(first, 1, cols, new Set(), 1)).toBeNull();
    } finally {
      broken.createModel = keep;
    }
    const second = await loadHighs();
    expect(second).not.toBe(first);
    expect(highsUsable(second)).toBe(true);
    const cols = [
      { c: 0, loads: [], value: 3, batches: [0, 1], values: [2, 1], key: '0|a' },
      { c: 0, loads: [], value: 2, batches: [2], values: [2], key: '0|b' },
    ];
    // One sequence per cooker: the one worth 3 (hand count).
    const res = solveMaster(second, 1, cols, new Set(), 5);
    expect(res?.objective).toBeCloseTo(3, 9);
    expect(res?.chosen.map((c) => c.key)).toEqual(['0|a']);
  }, 60_000);

  it('an instance whose heap grew past the limit is retired after the plan; a small one is kept', async () => {
    const small = { memoryBytes: 100 * 2 ** 20 } as unknown as Highs;
    const large = { memoryBytes: HIGHS_RECYCLE_BYTES + 1 } as unknown as Highs;
    expect(recycleHighsIfLarge(small)).toBe(false);
    expect(highsUsable(small)).toBe(true);
    expect(recycleHighsIfLarge(large)).toBe(true);
    expect(highsUsable(large)).toBe(false);
    // The real instance reports its heap, so the check works on it (just loaded: well under the limit).
    const h = await loadHighs();
    expect((h as unknown as { memoryBytes: number }).memoryBytes).toBeGreaterThan(0);
    expect(recycleHighsIfLarge(h)).toBe(false);
  }, 60_000);
});
