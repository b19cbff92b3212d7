/**
 * Acceptance criterion of the large-neighbourhood search: which repaired plan replaces the current one.
 *
 * Rule (a project choice, not a published one): accept a repaired neighbourhood whose objective is
 * higher than before; accept one whose objective is equal (within VALUE_EPS) with probability
 * ACCEPT_SIDEWAYS_PROBABILITY, so the search moves along plateaus of equal value; reject a worse one.
 * It is a descent with random sideways moves, akin to the sideways flips of GSAT (Selman, Levesque &
 * Mitchell 1992, "A new method for solving hard satisfiability problems", AAAI-92), and not the
 * simulated-annealing acceptance Ropke & Pisinger (2006) use in their ALNS; worse plans are only
 * reached by the kicks of the iterated local search (ils.ts).
 */

/** Objective values closer than this are equal (the objective is servings plus a tie-break below one serving). */
export const VALUE_EPS = 1e-9;

/** Probability of accepting a repaired plan of equal objective (project choice). */
export const ACCEPT_SIDEWAYS_PROBABILITY = 0.3;

export type Verdict = 'improve' | 'sideways' | 'reject';

/**
 * Decides a repaired neighbourhood.
 * @param before objective of the destroyed cookers before the move
 * @param after objective of the same cookers after the repair
 * @param rng uniform [0, 1) generator, drawn only when the values are equal
 */
export function acceptRepair(before: number, after: number, rng: () => number): Verdict {
  if (after > before + VALUE_EPS) return 'improve';
  if (after > before - VALUE_EPS && rng() < ACCEPT_SIDEWAYS_PROBABILITY) return 'sideways';
  return 'reject';
}
