import { describe, expect, it } from 'vitest';
import { collectorGainIso9806W, collectorGainLumpedW, collectorGainSlopeWPerK, collectorGainW } from '@/lib/thermal';

describe('collector gain', () => {
  it('ISO 9806 form Q = A·(η0·G − a1·ΔT − a2·ΔT²) at a hand-computed point', () => {
    // A = 2, η0 = 0.6, a1 = 1.5, a2 = 0.01, G = 800, Tm = 120, Ta = 30 → ΔT = 90:
    // 2·(480 − 135 − 81) = 528 W (arithmetic by hand). Tolerance 1e-9 W.
    expect(collectorGainIso9806W(2, 0.6, 1.5, 0.01, 800, 120, 30)).toBeCloseTo(528, 9);
  });

  it('lumped form Q = η0·A·G − U·(T − Ta) at a hand-computed point', () => {
    // 0.6·2·800 − 4·90 = 960 − 360 = 600 W.
    expect(collectorGainLumpedW(2, 0.6, 4, 800, 120, 30)).toBeCloseTo(600, 9);
  });

  it('clips negative gain to 0 (no reverse flow) and its slope then is 0', () => {
    const spec = { model: 'lumped' as const, apertureM2: 2, eta0: 0.6, uLossWPerK: 4 };
    expect(collectorGainW(spec, 0, 120, 30)).toBe(0);
    expect(collectorGainSlopeWPerK(spec, 0, 120, 30)).toBe(0);
    expect(collectorGainSlopeWPerK(spec, 800, 120, 30)).toBe(-4);
  });

  it('ISO 9806 slope matches a central difference of the gain (1e-6 W/K)', () => {
    const spec = { model: 'iso9806' as const, apertureM2: 2, eta0: 0.6, a1: 1.5, a2: 0.01 };
    const d = (collectorGainW(spec, 800, 120.001, 30) - collectorGainW(spec, 800, 119.999, 30)) / 0.002;
    expect(Math.abs(collectorGainSlopeWPerK(spec, 800, 120, 30) - d)).toBeLessThan(1e-6);
  });
});
