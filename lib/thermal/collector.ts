/**
 * Collector useful gain [W] in the two forms of BRIEF.md §Physics 2.
 *
 * The collector's own thermal loss is inside the useful gain (it is the heat delivered to the store). Reverse flow is
 * not modelled: when the useful gain would be negative (night, cloud, a store hotter than the collector's stagnation
 * temperature) it is taken as 0 — the collector loop stops (thermosyphon or pump off) or the aperture is covered.
 */
import type { CollectorSpec } from './types';

/**
 * ISO 9806 quasi-steady collector model (EN 12975 form): Q = A·(η0·G − a1·(Tm − Ta) − a2·(Tm − Ta)²).
 * Tm, the mean fluid temperature in the collector, is taken as the temperature of the store node it heats.
 * @param apertureM2 aperture area A [m²]; @param eta0 zero-loss efficiency [–]
 * @param a1 [W/(m²·K)]; @param a2 [W/(m²·K²)]; @param gWm2 irradiance on the aperture [W/m²]
 * @param tMeanC Tm [°C]; @param tAirC Ta [°C]
 * @returns useful gain [W] (may be negative; see collectorGainW for the clipped value)
 */
export function collectorGainIso9806W(
  apertureM2: number,
  eta0: number,
  a1: number,
  a2: number,
  gWm2: number,
  tMeanC: number,
  tAirC: number,
): number {
  const d = tMeanC - tAirC;
  return apertureM2 * (eta0 * gWm2 - a1 * d - a2 * d * d);
}

/**
 * Lumped collector model: Q = η0·A·G − U_loss·(T − Ta).
 * @param apertureM2 [m²]; @param eta0 [–]; @param uLossWPerK [W/K]; @param gWm2 [W/m²]; @param tC store node [°C]; @param tAirC [°C]
 * @returns useful gain [W] (may be negative)
 */
export function collectorGainLumpedW(
  apertureM2: number,
  eta0: number,
  uLossWPerK: number,
  gWm2: number,
  tC: number,
  tAirC: number,
): number {
  return eta0 * apertureM2 * gWm2 - uLossWPerK * (tC - tAirC);
}

/**
 * Useful gain for a collector spec, clipped at 0 (no reverse flow; file comment).
 * @returns gain [W] ≥ 0
 */
export function collectorGainW(spec: CollectorSpec, gWm2: number, tC: number, tAirC: number): number {
  const q =
    spec.model === 'iso9806'
      ? collectorGainIso9806W(spec.apertureM2, spec.eta0, spec.a1, spec.a2, gWm2, tC, tAirC)
      : collectorGainLumpedW(spec.apertureM2, spec.eta0, spec.uLossWPerK, gWm2, tC, tAirC);
  return q > 0 ? q : 0;
}

/**
 * Slope dQ/dT [W/K] of the unclipped useful gain with respect to the store-node temperature, used to linearise the
 * gain over one step (ISO 9806: −A·(a1 + 2·a2·(T − Ta)); lumped: −U_loss). 0 where the clipped gain is 0.
 */
export function collectorGainSlopeWPerK(spec: CollectorSpec, gWm2: number, tC: number, tAirC: number): number {
  if (collectorGainW(spec, gWm2, tC, tAirC) <= 0) return 0;
  return spec.model === 'iso9806' ? -spec.apertureM2 * (spec.a1 + 2 * spec.a2 * (tC - tAirC)) : -spec.uLossWPerK;
}
