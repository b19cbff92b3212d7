import { describe, expect, it } from 'vitest';
import { createPiecewiseLinearEnthalpy } from '@/lib/materials';

describe('createPiecewiseLinearEnthalpy', () => {
  it('integrates a discontinuous piecewise-linear cp exactly and inverts it', () => {
    // cp = 1000 on [0, 10], jumps to 3000 rising to 5000 on [10, 20]: h(10) = 10000, h(20) = 10000 + 10·4000 = 50000.
    const e = createPiecewiseLinearEnthalpy([
      { t0C: 0, t1C: 10, c0: 1000, c1: 1000 },
      { t0C: 10, t1C: 20, c0: 3000, c1: 5000 },
    ]);
    expect(e.enthalpy(10)).toBeCloseTo(10000, 9);
    expect(e.enthalpy(20)).toBeCloseTo(50000, 9);
    expect(e.enthalpy(15)).toBeCloseTo(10000 + 5 * 3500, 9); // trapezoid 5·(3000 + 4000)/2
    expect(e.enthalpy(-5)).toBeCloseTo(-5000, 9);
    expect(e.enthalpy(25)).toBeCloseTo(75000, 9);
    for (const h of [-5000, 0, 9999.9, 10000, 27500, 49999, 60000]) expect(e.enthalpy(e.temperatureAt(h))).toBeCloseTo(h, 6);
    expect(e.apparentCp(15)).toBeCloseTo(4000, 9);
  });

  it('re-references to 0 °C when the first node is above zero', () => {
    const e = createPiecewiseLinearEnthalpy([{ t0C: 50, t1C: 150, c0: 2000, c1: 2000 }]);
    expect(e.enthalpy(0)).toBeCloseTo(0, 9);
    expect(e.enthalpy(100)).toBeCloseTo(200000, 9);
  });

  it('rejects gaps and non-positive cp', () => {
    expect(() => createPiecewiseLinearEnthalpy([])).toThrow(/at least one/);
    expect(() => createPiecewiseLinearEnthalpy([{ t0C: 0, t1C: 10, c0: 0, c1: 1 }])).toThrow(/segments\[0\]/);
    expect(() =>
      createPiecewiseLinearEnthalpy([
        { t0C: 0, t1C: 10, c0: 1, c1: 1 },
        { t0C: 11, t1C: 20, c0: 1, c1: 1 },
      ]),
    ).toThrow(/segments\[1\]/);
  });
});
