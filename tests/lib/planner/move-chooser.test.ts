/**
 * The adaptive move choice of the local search (move-chooser.ts MoveChooser, after Ropke & Pisinger 2006,
 * Transportation Science 40(4):455–472, §3.4: weights follow each move's recent record).
 */
import { describe, expect, it } from 'vitest';
import { MoveChooser } from '@/lib/planner/move-chooser';
import { mulberry32 } from '@/lib/random';

function shares(ch: MoveChooser, n: number, draws: number): number[] {
  const count = new Array<number>(n).fill(0);
  for (let i = 0; i < draws; i++) count[ch.draw()]! += 1;
  return count.map((c) => c / draws);
}

describe('MoveChooser', () => {
  it('draws every move equally before any record', () => {
    const s = shares(new MoveChooser(4, mulberry32(7)), 4, 20_000);
    for (const x of s) expect(x).toBeCloseTo(0.25, 1);
  });

  it('favours the move with more gain per unit of work, and keeps the others at the floor or above', () => {
    const ch = new MoveChooser(4, mulberry32(3));
    // Move 0 gains 40 per 10 units of work; the others gain nothing for the same work.
    for (let i = 0; i < 60; i++) for (let k = 0; k < 4; k++) ch.record(k, k === 0 ? 40 : 0, 10);
    const s = shares(ch, 4, 20_000);
    // Expected: floor 0.08 each, the remaining 0.68 almost all to move 0 (its score dominates).
    expect(s[0]).toBeGreaterThan(0.7);
    for (let k = 1; k < 4; k++) {
      expect(s[k]).toBeGreaterThan(0.07);
      expect(s[k]).toBeLessThan(0.1);
    }
  });

  it('gain per unit of work, not gain alone: a cheaper move with the same gain wins', () => {
    const ch = new MoveChooser(2, mulberry32(11));
    for (let i = 0; i < 60; i++) {
      ch.record(0, 20, 40);
      ch.record(1, 20, 10);
    }
    const s = shares(ch, 2, 20_000);
    // Scores 0.5 and 2 → p = 0.08 + 0.84 × (0.2, 0.8) = (0.248, 0.752).
    expect(s[0]).toBeCloseTo(0.248, 1);
    expect(s[1]).toBeCloseTo(0.752, 1);
  });
});
