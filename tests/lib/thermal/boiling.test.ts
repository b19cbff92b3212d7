import { describe, expect, it } from 'vitest';
import {
  boilingPointAtAltitudeC,
  evaporatedMassKg,
  pressureIsa1975Pa,
  waterBoilingPointAntoineC,
  waterVapourPressureAntoinePa,
} from '@/lib/thermal';

describe('boiling point of water vs altitude (ISA + Antoine)', () => {
  it('is 100 °C ± 0.3 at sea level (standard steam tables: 99.97 °C at 101.325 kPa)', () => {
    expect(Math.abs(boilingPointAtAltitudeC(0) - 100)).toBeLessThanOrEqual(0.3);
  });

  it('is ≈ 95 °C at 1500 m and ≈ 90 °C at 3000 m (ISA 84.56 / 70.11 kPa; steam tables: p_sat(95 °C) = 84.61 kPa, p_sat(90 °C) = 70.18 kPa, Çengel & Boles Table A-4, from memory)', () => {
    expect(Math.abs(boilingPointAtAltitudeC(1500) - 95)).toBeLessThanOrEqual(0.3);
    expect(Math.abs(boilingPointAtAltitudeC(3000) - 90)).toBeLessThanOrEqual(0.3);
    // Intermediate step: the saturation temperature at the steam-table pressures.
    expect(Math.abs(waterBoilingPointAntoineC(84_609) - 95)).toBeLessThanOrEqual(0.3);
    expect(Math.abs(waterBoilingPointAntoineC(70_183) - 90)).toBeLessThanOrEqual(0.3);
  });

  it('falls about 1 °C per ≈ 300 m (lib/REFERENCES.md, secondary): 0.9–1.2 K per 300 m up to 3000 m', () => {
    const perThreeHundred = ((boilingPointAtAltitudeC(0) - boilingPointAtAltitudeC(3000)) / 3000) * 300;
    expect(perThreeHundred).toBeGreaterThan(0.9);
    expect(perThreeHundred).toBeLessThan(1.2);
  });

  it('ISA pressure: 101325 Pa at 0 m, 84.56 kPa at 1500 m, 70.11 kPa at 3000 m (ICAO standard atmosphere table, from memory; ±50 Pa)', () => {
    expect(pressureIsa1975Pa(0)).toBe(101325);
    expect(Math.abs(pressureIsa1975Pa(1500) - 84_556)).toBeLessThan(50);
    expect(Math.abs(pressureIsa1975Pa(3000) - 70_109)).toBeLessThan(50);
  });

  it('Antoine vapour pressure and boiling point are inverse (1e-9 K) and give 101.3 kPa at 100 °C (±0.2 %)', () => {
    for (const t of [40, 70, 90, 100]) expect(Math.abs(waterBoilingPointAntoineC(waterVapourPressureAntoinePa(t)) - t)).toBeLessThan(1e-9);
    expect(Math.abs(waterVapourPressureAntoinePa(100) / 101_325 - 1)).toBeLessThan(0.002);
  });

  it('evaporates 1 kg per 2.257 MJ (latent heat at 100 °C, steam tables)', () => {
    expect(evaporatedMassKg(2.257e6)).toBeCloseTo(1, 12);
    expect(evaporatedMassKg(-5)).toBe(0);
  });
});
