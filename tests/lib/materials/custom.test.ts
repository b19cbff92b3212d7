import { describe, expect, it } from 'vitest';
import { createCustomMedium, type CustomMediumRow } from '@/lib/materials';

const row = (tC: number, cp: number, density = 900, k = 0.15, viscosity = 0.01): CustomMediumRow => ({ tC, density, cp, k, viscosity });

describe('custom medium from a table', () => {
  const m = createCustomMedium({ name: 'test oil', rows: [row(0, 2000, 920, 0.17, 0.08), row(100, 2200, 860, 0.15, 0.008), row(200, 2400, 800, 0.13, 0.003)] });

  it('interpolates linearly between rows and holds end values beyond', () => {
    expect(m.density(50)).toBeCloseTo(890, 12);
    expect(m.conductivity(150)).toBeCloseTo(0.14, 12);
    expect(m.viscosity(-10)).toBeCloseTo(0.08, 12);
    expect(m.specificHeat(300)).toBeCloseTo(2400, 12);
  });

  it('integrates cp exactly for enthalpy (hand values: trapezoids of a linear cp)', () => {
    // ∫0^50 (2000 + 2T) dT = 100000 + 2500 = 102500 J/kg; ∫0^100 = 210000; ∫0^200 = 210000 + 230000 = 440000;
    // beyond the table cp is held at 2400: h(250) = 440000 + 50·2400 = 560000. Tolerance 1e-6 J/kg.
    expect(m.enthalpy(50)).toBeCloseTo(102500, 6);
    expect(m.enthalpy(100)).toBeCloseTo(210000, 6);
    expect(m.enthalpy(200)).toBeCloseTo(440000, 6);
    expect(m.enthalpy(250)).toBeCloseTo(560000, 6);
    expect(m.enthalpy(-10)).toBeCloseTo(-20000, 6);
    for (const t of [-10, 0, 33.3, 100, 150.5, 250]) expect(Math.abs(m.temperatureAt(m.enthalpy(t)) - t)).toBeLessThan(1e-9);
  });

  it('a single row gives a constant-property medium', () => {
    const c = createCustomMedium({ name: 'const', rows: [row(20, 2000)] });
    expect(c.enthalpy(100)).toBeCloseTo(200000, 6);
    expect(c.temperatureAt(300000)).toBeCloseTo(150, 9);
    expect(c.kind).toBe('custom');
  });

  it('rejects unsorted rows, duplicates, non-positive values and NaN, naming the field', () => {
    expect(() => createCustomMedium({ name: 'x', rows: [] })).toThrow(/customTable\.rows must contain/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(100, 2000), row(50, 2000)] })).toThrow(/rows\[1\]\.tC/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(50, 2000), row(50, 2000)] })).toThrow(/rows\[1\]\.tC/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(0, 2000), row(50, -1)] })).toThrow(/rows\[1\]\.cp must be positive/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(0, 2000, 0)] })).toThrow(/rows\[0\]\.density/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(Number.NaN, 2000)] })).toThrow(/rows\[0\]\.tC must be finite/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(0, 2000, 900, 0.1, Number.NaN)] })).toThrow(/rows\[0\]\.viscosity/);
    expect(() => createCustomMedium({ name: 'x', rows: [row(0, 2000)] }, 'custom', 'store.customTable')).not.toThrow();
    expect(() => createCustomMedium({ name: 'x', rows: [row(0, 0)] }, 'custom', 'store.customTable')).toThrow(/store\.customTable\.rows\[0\]\.cp/);
  });
});
