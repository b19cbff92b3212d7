import { describe, expect, it } from 'vitest';
import { createCustomMedium, sunflowerOil, erythritol } from '@/lib/materials';
import {
  filmProperties,
  hLayerHeatedFromBelowGlobeDropkin1959,
  nusseltChurchillChu1975,
  nusseltGlobeDropkin1959,
  potCouplingNaturalConvectionWPerK,
  potGeometryFromVolume,
  rayleighNumber,
} from '@/lib/thermal';

// Hand values below were computed with a calculator from the published formulas (this file's author).
describe('natural-convection correlations at a point', () => {
  it('Globe & Dropkin 1959: Nu = 0.069·Ra^(1/3)·Pr^0.074 → 45.0314 at Ra = 1e8, Pr = 100', () => {
    expect(nusseltGlobeDropkin1959(1e8, 100)).toBeCloseTo(45.031432, 5);
  });

  it('Churchill & Chu 1975: 122.857 at Ra = 1e9, Pr = 0.71 (air) and 81.762 at Ra = 1e8, Pr = 100 (oil)', () => {
    expect(nusseltChurchillChu1975(1e9, 0.71)).toBeCloseTo(122.856535, 5);
    expect(nusseltChurchillChu1975(1e8, 100)).toBeCloseTo(81.762430, 5);
  });

  it('Rayleigh number g·β·ΔT·L³/(ν·α)', () => {
    // 9.80665·1e-3·10·1/(1e-5·1e-7) = 9.80665e10
    expect(rayleighNumber(1e-3, 10, 1, 1e-5, 1e-7)).toBeCloseTo(9.80665e10, -2);
  });

  it('film properties of sunflower oil at 100 °C: β = 0.65/ρ (linear density), Pr in the oil range 50–300', () => {
    const p = filmProperties(sunflowerOil, 100)!;
    expect(p.betaPerK).toBeCloseTo(0.65 / sunflowerOil.density(100), 12);
    expect(p.pr).toBeGreaterThan(50);
    expect(p.pr).toBeLessThan(300);
    expect(filmProperties(erythritol, 60)).toBeNull(); // solid
  });

  // A constant-property test fluid with a linear density so every number can be done by hand:
  // ρ = 1000 − 0.5·T, cp = 2000, k = 0.15, μ = 0.01 → at 100 °C: ρ = 950, β = 0.5/950, ν = 1.05263e-5,
  // α = 7.89474e-8, Pr = 133.333.
  const fluid = createCustomMedium({
    name: 'test fluid',
    rows: [
      { tC: 0, density: 1000, cp: 2000, k: 0.15, viscosity: 0.01 },
      { tC: 200, density: 900, cp: 2000, k: 0.15, viscosity: 0.01 },
    ],
  });

  it('layer heated from below: h = 0.069·k·(gβΔT/(να))^(1/3)·Pr^0.074 = 74.173 W/(m²·K) at ΔT = 20 K, film 100 °C', () => {
    const p = filmProperties(fluid, 100)!;
    expect(p.pr).toBeCloseTo(133.333333, 5);
    expect(hLayerHeatedFromBelowGlobeDropkin1959(p, 20)).toBeCloseTo(74.173167, 4);
  });

  it('pot coupling: Globe & Dropkin on the bottom + Churchill & Chu on the wetted wall = 9.998 W/K (10 L pot, store 110 °C, pot 90 °C)', () => {
    // Pot 10 L as a cylinder with H = D: D = 0.233509 m, bottom 0.0428249 m²; contact = bottom + 0.05 m² wall →
    // wetted height 0.0681580 m, Ra = 3.93308e7, Nu_CC·k/L = 136.4358 W/(m²·K);
    // UA = 74.17317·0.0428249 + 136.4358·0.05 = 9.99825 W/K.
    const g = potGeometryFromVolume(10);
    expect(g.diameterM).toBeCloseTo(0.2335089, 6);
    const ua = potCouplingNaturalConvectionWPerK(fluid, 110, 90, g.bottomAreaM2 + 0.05, 10);
    expect(Math.abs(ua - 9.99825)).toBeLessThan(1e-3);
  });

  it('pot coupling falls back to conduction through a solid PCM (h = k/(D/4))', () => {
    const g = potGeometryFromVolume(10);
    const ua = potCouplingNaturalConvectionWPerK(erythritol, 60, 40, 0.1, 10);
    expect(ua).toBeCloseTo((erythritol.conductivity(50) / (g.diameterM / 4)) * 0.1, 9);
  });

  it('grows with the temperature difference like ΔT^(1/3) on the bottom (Globe & Dropkin)', () => {
    const g = potGeometryFromVolume(10);
    const ua8 = potCouplingNaturalConvectionWPerK(fluid, 104, 96, g.bottomAreaM2, 10);
    const ua64 = potCouplingNaturalConvectionWPerK(fluid, 132, 68, g.bottomAreaM2, 10);
    expect(ua64 / ua8).toBeCloseTo(2, 6); // (64/8)^(1/3) = 2, same film temperature
  });
});
