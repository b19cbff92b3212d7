import { describe, expect, it } from 'vitest';
import {
  OILS,
  OIL_VISCOSITY_SHAPE,
  fitVogelFulcherTammann,
  sunflowerOil,
  palmOil,
} from '@/lib/materials';

const mPaS = (pas: number) => pas * 1000;

describe('sunflower oil properties against published ranges', () => {
  it('density: Codex Stan 210-1999 relative density 0.918–0.923 at 20 °C (× 998.2 kg/m³ water), secondary', () => {
    const rho = sunflowerOil.density(20);
    expect(rho).toBeGreaterThanOrEqual(0.918 * 998.2 - 2); // tolerance 2 kg/m³ for the ≈ 920 round value
    expect(rho).toBeLessThanOrEqual(0.923 * 998.2 + 2);
  });

  it('density falls ≈ 0.65 kg/m³ per K from ≈ 920 at 20 °C (Esteban et al. 2012, from memory)', () => {
    // 920 − 0.65·80 = 868 at 100 °C; 920 − 0.65·160 = 816 at 180 °C; tolerance ±8 kg/m³ (≈ 1 %) for the memory value.
    expect(sunflowerOil.density(100)).toBeCloseTo(868, -1);
    expect(Math.abs(sunflowerOil.density(100) - 868)).toBeLessThanOrEqual(8);
    expect(Math.abs(sunflowerOil.density(180) - 816)).toBeLessThanOrEqual(8);
    const slope = (sunflowerOil.density(180) - sunflowerOil.density(20)) / 160;
    expect(slope).toBeGreaterThan(-0.75);
    expect(slope).toBeLessThan(-0.55);
  });

  it('specific heat: linear ≈ 2.0 kJ/(kg·K) at 40 °C to ≈ 2.4 at 180 °C (Fasina & Colley 2008, from memory)', () => {
    expect(Math.abs(sunflowerOil.specificHeat(40) - 2000)).toBeLessThanOrEqual(50);
    expect(Math.abs(sunflowerOil.specificHeat(180) - 2400)).toBeLessThanOrEqual(50);
    // 20 °C (extrapolated below the 35 °C data) and 100 °C on the line: 1943 and 2171 J/(kg·K); band ±100.
    expect(sunflowerOil.specificHeat(20)).toBeGreaterThan(1850);
    expect(sunflowerOil.specificHeat(20)).toBeLessThan(2050);
    expect(sunflowerOil.specificHeat(100)).toBeGreaterThan(2100);
    expect(sunflowerOil.specificHeat(100)).toBeLessThan(2250);
  });

  it('conductivity: 0.16–0.17 W/(m·K) at 25 °C, falling slowly (Turgut et al. 2009, from memory)', () => {
    const k25 = sunflowerOil.conductivity(25);
    expect(k25).toBeGreaterThanOrEqual(0.16);
    expect(k25).toBeLessThanOrEqual(0.17);
    const k20 = sunflowerOil.conductivity(20);
    const k100 = sunflowerOil.conductivity(100);
    const k180 = sunflowerOil.conductivity(180);
    expect(k20).toBeGreaterThanOrEqual(0.16);
    expect(k20).toBeLessThanOrEqual(0.175);
    // "falling slowly": lose less than 25 % from 25 to 180 °C (from memory); bands 0.14–0.165 and 0.12–0.16.
    expect(k100).toBeGreaterThan(0.14);
    expect(k100).toBeLessThan(0.165);
    expect(k180).toBeGreaterThan(0.12);
    expect(k180).toBeLessThan(0.16);
    expect(k180).toBeLessThan(k100);
  });

  it('viscosity: ≈ 50 mPa·s at 25 °C and ≈ 7 at 100 °C (Fasina & Colley 2008; mixed), within 2.6–192.6 mPa·s over 278–453 K (Stanciu)', () => {
    expect(mPaS(sunflowerOil.viscosity(25))).toBeGreaterThan(40);
    expect(mPaS(sunflowerOil.viscosity(25))).toBeLessThan(60);
    expect(mPaS(sunflowerOil.viscosity(100))).toBeGreaterThan(6);
    expect(mPaS(sunflowerOil.viscosity(100))).toBeLessThan(8.5);
    for (const t of [20, 100, 180]) {
      expect(mPaS(sunflowerOil.viscosity(t))).toBeGreaterThanOrEqual(2.6);
      expect(mPaS(sunflowerOil.viscosity(t))).toBeLessThanOrEqual(192.6);
    }
    expect(mPaS(sunflowerOil.viscosity(180))).toBeLessThan(5); // 453 K is the low end of Stanciu's span
  });

  it('kinematic viscosity at 38 °C reproduces 33.9 mm²/s (Demirbas 2003, from memory) within 1e-9 relative', () => {
    const nu = sunflowerOil.viscosity(38) / sunflowerOil.density(38);
    expect(Math.abs(nu / 33.9e-6 - 1)).toBeLessThan(1e-9);
  });
});

describe('all five oils', () => {
  it('lists sunflower, palm, soybean, rapeseed and cottonseed', () => {
    expect(OILS.map((o) => o.id)).toEqual(['sunflower-oil', 'palm-oil', 'soybean-oil', 'rapeseed-oil', 'cottonseed-oil']);
  });

  it.each(OILS.map((o) => [o.id, o] as const))('%s: properties in the vegetable-oil ranges at 40, 100 and 180 °C', (_id, oil) => {
    for (const t of [40, 100, 180]) {
      // Density 800–930 kg/m³ (Codex Stan 210 at 20 °C less 0.65 kg/m³/K, from memory); cp 1.9–2.5 kJ/(kg·K)
      // (Fasina & Colley 2008, from memory); k 0.12–0.17 W/(m·K) (Turgut 2009, from memory);
      // viscosity in Stanciu's 2.6–192.6 mPa·s span.
      expect(oil.density(t)).toBeGreaterThan(800);
      expect(oil.density(t)).toBeLessThan(930);
      expect(oil.specificHeat(t)).toBeGreaterThan(1900);
      expect(oil.specificHeat(t)).toBeLessThan(2500);
      expect(oil.conductivity(t)).toBeGreaterThan(0.12);
      expect(oil.conductivity(t)).toBeLessThan(0.17);
      expect(mPaS(oil.viscosity(t))).toBeGreaterThanOrEqual(2.6);
      expect(mPaS(oil.viscosity(t))).toBeLessThanOrEqual(192.6);
    }
    expect(oil.viscosity(60)).toBeLessThan(oil.viscosity(40));
  });

  it.each(OILS.map((o) => [o.id, o] as const))('%s: recommendedMaxC below the smoke point, flash point above it', (_id, oil) => {
    expect(oil.smokePointC).toBeDefined();
    expect(oil.recommendedMaxC).toBeLessThan(oil.smokePointC!);
    expect(oil.flashPointC!).toBeGreaterThan(oil.smokePointC!);
    // Smoke points within the handbook ranges of lib/REFERENCES.md (secondary): 204–254 °C for refined oils.
    expect(oil.smokePointC!).toBeGreaterThanOrEqual(204);
    expect(oil.smokePointC!).toBeLessThanOrEqual(254);
    expect(oil.kind).toBe('oil');
    expect(oil.sources.length).toBeGreaterThan(0);
  });

  it.each(OILS.map((o) => [o.id, o] as const))('%s: enthalpy is 0 at 0 °C, its derivative is specificHeat, and temperatureAt inverts it', (_id, oil) => {
    expect(Math.abs(oil.enthalpy(0))).toBeLessThan(1e-9);
    for (let t = -20; t <= 260; t += 7.3) {
      const dh = (oil.enthalpy(t + 1e-3) - oil.enthalpy(t - 1e-3)) / 2e-3;
      expect(Math.abs(dh - oil.specificHeat(t))).toBeLessThan(1e-3); // J/(kg·K), finite-difference tolerance
      expect(Math.abs(oil.temperatureAt(oil.enthalpy(t)) - t)).toBeLessThan(1e-9);
    }
  });

  it('palm oil is semi-solid below ≈ 36 °C (Codex slip melting point 33–39 °C, from memory): viscosity NaN', () => {
    expect(Number.isNaN(palmOil.viscosity(25))).toBe(true);
    expect(Number.isFinite(palmOil.viscosity(50))).toBe(true);
  });
});

describe('fitVogelFulcherTammann', () => {
  it('passes exactly through its three anchor points (within 1e-12 relative)', () => {
    const pts = [
      [25, 0.05],
      [100, 0.007],
      [180, 0.003],
    ] as const;
    const { a, bK, t0K } = fitVogelFulcherTammann(pts);
    for (const [t, mu] of pts) {
      expect(Math.abs(Math.exp(a + bK / (t + 273.15 - t0K)) / mu - 1)).toBeLessThan(1e-12);
    }
    // Hand computation (this file's author): T0 ≈ 193.1 K, B ≈ 496 K for these anchors; tolerance 0.5 K / 2 K.
    expect(Math.abs(OIL_VISCOSITY_SHAPE.t0K - 193.1)).toBeLessThan(0.5);
    expect(Math.abs(OIL_VISCOSITY_SHAPE.bK - 496)).toBeLessThan(2);
  });
});
