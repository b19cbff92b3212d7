import { describe, expect, it } from 'vitest';
import {
  SOLAR_CONSTANT_WM2,
  airMassKastenYoung1989,
  apertureIrradiance,
  apertureIrradianceWm2,
  clearnessIndex,
  cloudFactorKastenCzeplak1980,
  dayOfYearUtc,
  decomposeErbs1982,
  diffuseFractionErbs1982,
  extraterrestrialNormalFromDistance,
  extraterrestrialNormalSpencer1971,
  meanCosZenithOverHourAngles,
  surfaceOrientation,
} from '@/lib/solar/irradiance';
import { solarPositionSpa } from '@/lib/solar/position';
import { mulberry32 } from '@/lib/random';

const D = Math.PI / 180;


describe('airMassKastenYoung1989', () => {
  // Kasten & Young 1989, Applied Optics 28(22):4735, eq. 3, evaluated independently here.
  const ky = (z: number) => 1 / (Math.cos(z * D) + 0.50572 * (96.07995 - z) ** -1.6364);

  it('≈ 1.0 at z = 0 and ≈ 1.99 at z = 60° (Kasten & Young 1989)', () => {
    expect(Math.abs(airMassKastenYoung1989(0) - ky(0))).toBeLessThan(1e-12);
    expect(Math.abs(airMassKastenYoung1989(0) - 1.0)).toBeLessThan(1e-3);
    expect(Math.abs(airMassKastenYoung1989(60) - ky(60))).toBeLessThan(1e-12);
    expect(Math.abs(airMassKastenYoung1989(60) - 1.99)).toBeLessThan(0.01);
  });

  it('≈ 37.9 at the horizon and NaN below it', () => {
    // Kasten & Young 1989 eq. 3 at z = 90°: 1/(0.50572·6.07995^−1.6364) ≈ 37.92 (computed).
    expect(Math.abs(airMassKastenYoung1989(90) - 37.92)).toBeLessThan(0.01);
    expect(airMassKastenYoung1989(90.5)).toBeNaN();
    expect(airMassKastenYoung1989(NaN)).toBeNaN();
  });
});

describe('extraterrestrial irradiance', () => {
  it('Spencer 1971 series matches its formula and the SPA Earth–Sun distance within 0.1 %', () => {
    // Spencer 1971, Search 2(5):172: (r0/r)² = 1.000110 + 0.034221 cos Γ + 0.001280 sin Γ + 0.000719 cos 2Γ + 0.000077 sin 2Γ.
    for (const n of [1, 80, 172, 185, 266, 355]) {
      const g = (2 * Math.PI * (n - 1)) / 365;
      const e0 = 1.00011 + 0.034221 * Math.cos(g) + 0.00128 * Math.sin(g) + 0.000719 * Math.cos(2 * g) + 0.000077 * Math.sin(2 * g);
      expect(Math.abs(extraterrestrialNormalSpencer1971(n) - 1361 * e0)).toBeLessThan(1e-9);
      const r = solarPositionSpa({ timeMs: Date.UTC(2023, 0, n, 12), latitudeDeg: 0, longitudeDeg: 0 }).earthSunDistanceAu;
      const fromR = extraterrestrialNormalFromDistance(r);
      // Tolerance: Spencer's series is quoted with a max error ~1e-4 in (r0/r)² (Iqbal 1983, from memory); allow 0.1 %.
      expect(Math.abs(extraterrestrialNormalSpencer1971(n) / fromR - 1)).toBeLessThan(1e-3);
    }
    expect(SOLAR_CONSTANT_WM2).toBe(1361); // Kopp & Lean 2011; IAU 2015 B3
  });

  it('dayOfYearUtc counts from 1 on 1 January', () => {
    expect(dayOfYearUtc(Date.UTC(2024, 0, 1, 0, 0))).toBe(1);
    expect(dayOfYearUtc(Date.UTC(2024, 11, 31, 23, 59))).toBe(366);
  });
});

describe('diffuseFractionErbs1982', () => {
  // Erbs, Klein & Duffie 1982, Solar Energy 28(4):293–302, eq. 1 (coefficients as in lib/REFERENCES.md).
  const poly = (kt: number, c4: number) => 0.9511 - 0.1604 * kt + 4.388 * kt ** 2 - 16.638 * kt ** 3 + c4 * kt ** 4;

  it('low branch kt ≤ 0.22: 1 − 0.09·kt', () => {
    expect(Math.abs(diffuseFractionErbs1982(0) - 1)).toBeLessThan(1e-15);
    expect(Math.abs(diffuseFractionErbs1982(0.1) - 0.991)).toBeLessThan(1e-12);
    expect(Math.abs(diffuseFractionErbs1982(0.22) - (1 - 0.09 * 0.22))).toBeLessThan(1e-12);
  });

  it('middle branch 0.22 < kt ≤ 0.80: the quartic with 12.336', () => {
    for (const kt of [0.3, 0.5, 0.65, 0.8]) {
      expect(Math.abs(diffuseFractionErbs1982(kt) - poly(kt, 12.336))).toBeLessThan(1e-12);
    }
  });

  it('guards the published 12.336 against the 12.334 typo', () => {
    // At kt = 0.8 the two differ by 0.002·0.8⁴ ≈ 8.2e-4.
    expect(Math.abs(diffuseFractionErbs1982(0.8) - poly(0.8, 12.334))).toBeGreaterThan(8e-4);
    expect(Math.abs(diffuseFractionErbs1982(0.5) - poly(0.5, 12.334))).toBeGreaterThan(1e-4);
  });

  it('high branch kt > 0.80: 0.165, and the branches nearly meet', () => {
    expect(diffuseFractionErbs1982(0.81)).toBe(0.165);
    expect(diffuseFractionErbs1982(1.2)).toBe(0.165);
    // Continuity at the joins within 0.01 (Erbs et al. 1982 fit is near-continuous; common practice, no source).
    expect(Math.abs(diffuseFractionErbs1982(0.2200001) - diffuseFractionErbs1982(0.22))).toBeLessThan(0.01);
    expect(Math.abs(diffuseFractionErbs1982(0.8) - 0.165)).toBeLessThan(0.01);
  });
});

describe('decomposeErbs1982 and clearnessIndex', () => {
  it('splits GHI so that GHI = DHI + DNI·cos z, with DHI = fd(kt)·GHI', () => {
    const i0 = 1361;
    for (const [ghi, z] of [
      [800, 30],
      [300, 60],
      [50, 80],
      [120, 20],
    ] as const) {
      const d = decomposeErbs1982(ghi, z, i0);
      const kt = ghi / (i0 * Math.cos(z * D)); // definition (Liu & Jordan 1960)
      expect(Math.abs(d.kt - kt)).toBeLessThan(1e-12);
      const fd = kt <= 0.22 ? 1 - 0.09 * kt : kt <= 0.8 ? 0.9511 - 0.1604 * kt + 4.388 * kt ** 2 - 16.638 * kt ** 3 + 12.336 * kt ** 4 : 0.165;
      expect(Math.abs(d.dhiWm2 - fd * ghi)).toBeLessThan(1e-9);
      expect(Math.abs(d.dhiWm2 + d.dniWm2 * Math.cos(z * D) - ghi)).toBeLessThan(1e-9);
    }
  });

  it('puts everything in the diffuse near the horizon and returns zeros for no light', () => {
    const d = decomposeErbs1982(20, 88, 1361);
    expect(d.dniWm2).toBe(0);
    expect(d.dhiWm2).toBe(20);
    expect(decomposeErbs1982(0, 40, 1361)).toEqual({ kt: 0, dniWm2: 0, dhiWm2: 0 });
  });

  it('clearnessIndex floors cos z at 0.065 and caps the result', () => {
    expect(Math.abs(clearnessIndex(10, 89, 1000) - 10 / (1000 * 0.065))).toBeLessThan(1e-12);
    expect(clearnessIndex(1000, 89.9, 1000)).toBe(2);
    expect(clearnessIndex(1000, 89.9, 1000, 1)).toBe(1);
  });
});

describe('cloudFactorKastenCzeplak1980', () => {
  it('matches 1 − 0.75·(N/8)^3.4 (Kasten & Czeplak 1980)', () => {
    for (let n = 0; n <= 8; n++) {
      expect(Math.abs(cloudFactorKastenCzeplak1980(n) - (1 - 0.75 * (n / 8) ** 3.4))).toBeLessThan(1e-15);
    }
    expect(cloudFactorKastenCzeplak1980(0)).toBe(1);
    expect(Math.abs(cloudFactorKastenCzeplak1980(8) - 0.25)).toBeLessThan(1e-15);
  });

  it('throws RangeError naming okta outside 0–8', () => {
    expect(() => cloudFactorKastenCzeplak1980(8.5)).toThrow(RangeError);
    expect(() => cloudFactorKastenCzeplak1980(-1)).toThrow(/okta/);
    expect(() => cloudFactorKastenCzeplak1980(NaN)).toThrow(/okta/);
  });
});

describe('aperture irradiance', () => {
  it('a horizontal box-cooker aperture receives GHI', () => {
    const ghi = 700;
    const z = 35;
    const dni = 750;
    const dhi = ghi - dni * Math.cos(z * D);
    const r = apertureIrradiance({ dniWm2: dni, dhiWm2: dhi, ghiWm2: ghi, zenithDeg: z, azimuthDeg: 140, tracking: 'fixed', tiltDeg: 0, surfaceAzimuthDeg: 180, beamOnly: false });
    expect(Math.abs(r.gApertureWm2 - ghi)).toBeLessThan(1e-9);
    expect(r.groundReflectedWm2).toBeCloseTo(0, 12);
  });

  it('tilted fixed aperture: beam·cos θ + DHI(1+cos β)/2 + ρ·GHI(1−cos β)/2 (Liu & Jordan 1963; Duffie & Beckman 2013)', () => {
    const z = 40;
    const az = 200;
    const beta = 30;
    const gamma = 170;
    const cosT = Math.cos(z * D) * Math.cos(beta * D) + Math.sin(z * D) * Math.sin(beta * D) * Math.cos((az - gamma) * D);
    const expected = 800 * cosT + (100 * (1 + Math.cos(beta * D))) / 2 + (0.3 * 713 * (1 - Math.cos(beta * D))) / 2;
    const r = apertureIrradiance({ dniWm2: 800, dhiWm2: 100, ghiWm2: 713, zenithDeg: z, azimuthDeg: az, tracking: 'fixed', tiltDeg: beta, surfaceAzimuthDeg: gamma, beamOnly: false, groundAlbedo: 0.3 });
    expect(Math.abs(r.gApertureWm2 - expected)).toBeLessThan(1e-9);
    // Same geometry as SPA eq. 47 (incidence on a surface).
    expect(Math.abs(r.incidenceDeg - Math.acos(cosT) / D)).toBeLessThan(1e-9);
  });

  it('a concentrator (beamOnly) uses only the beam, and nothing from behind or below the horizon', () => {
    const base = { dniWm2: 800, dhiWm2: 100, ghiWm2: 600, azimuthDeg: 180, tiltDeg: 30, surfaceAzimuthDeg: 180, beamOnly: true } as const;
    expect(apertureIrradiance({ ...base, zenithDeg: 30, tracking: 'two-axis' }).gApertureWm2).toBeCloseTo(800, 9);
    expect(apertureIrradiance({ ...base, zenithDeg: 95, tracking: 'two-axis' }).gApertureWm2).toBe(0);
    expect(apertureIrradiance({ ...base, zenithDeg: 60, azimuthDeg: 0, tracking: 'fixed', tiltDeg: 80 }).gApertureWm2).toBe(0);
  });

  it('one-axis (horizontal N–S axis) incidence equals √(cos²z + cos²δ·sin²ω) (Duffie & Beckman 2013, sec. 1.7)', () => {
    const rnd = mulberry32(7);
    for (let k = 0; k < 200; k++) {
      const lat = -60 + 120 * rnd();
      const decl = -23.44 + 46.88 * rnd();
      const w = -120 + 240 * rnd();
      const cosZ = Math.sin(lat * D) * Math.sin(decl * D) + Math.cos(lat * D) * Math.cos(decl * D) * Math.cos(w * D);
      if (cosZ <= 0.01) continue;
      const z = Math.acos(cosZ) / D;
      // Azimuth east of north from the textbook sun vector (east = −cos δ sin ω, north = cos φ sin δ − sin φ cos δ cos ω).
      const east = -Math.cos(decl * D) * Math.sin(w * D);
      const north = Math.cos(lat * D) * Math.sin(decl * D) - Math.sin(lat * D) * Math.cos(decl * D) * Math.cos(w * D);
      const az = Math.atan2(east, north) / D;
      const o = surfaceOrientation('one-axis', z, az, 0, 180);
      const expected = Math.sqrt(cosZ ** 2 + Math.cos(decl * D) ** 2 * Math.sin(w * D) ** 2);
      expect(Math.abs(o.cosIncidence - expected)).toBeLessThan(1e-9);
    }
  });

  it('tracking receives at least as much beam as fixed: two-axis pointwise; one-axis over a day', () => {
    // Common practice, no source: ideal tracking can only raise cos θ (two-axis: cos θ = 1).
    const rnd = mulberry32(11);
    for (let k = 0; k < 300; k++) {
      const z = 89 * rnd();
      const az = 360 * rnd();
      const tilt = 90 * rnd();
      const saz = 360 * rnd();
      const args = { dniWm2: 700, dhiWm2: 0, ghiWm2: 0, zenithDeg: z, azimuthDeg: az, tiltDeg: tilt, surfaceAzimuthDeg: saz, beamOnly: true } as const;
      const two = apertureIrradiance({ ...args, tracking: 'two-axis' }).gApertureWm2;
      const one = apertureIrradiance({ ...args, tracking: 'one-axis' }).gApertureWm2;
      const fixed = apertureIrradiance({ ...args, tracking: 'fixed' }).gApertureWm2;
      expect(two + 1e-9).toBeGreaterThanOrEqual(one);
      expect(two + 1e-9).toBeGreaterThanOrEqual(fixed);
    }
    let one = 0;
    let fixed = 0;
    for (let m = 0; m < 1440; m += 5) {
      const p = solarPositionSpa({ timeMs: Date.UTC(2024, 2, 20, 0, m), latitudeDeg: 15, longitudeDeg: 0 });
      const args = { dniWm2: 800, dhiWm2: 0, ghiWm2: 0, zenithDeg: p.zenithDeg, azimuthDeg: p.azimuthDeg, tiltDeg: 15, surfaceAzimuthDeg: 180, beamOnly: true } as const;
      one += apertureIrradiance({ ...args, tracking: 'one-axis' }).gApertureWm2;
      fixed += apertureIrradiance({ ...args, tracking: 'fixed' }).gApertureWm2;
    }
    expect(one).toBeGreaterThan(fixed);
  });

  it('the allocation-free apertureIrradianceWm2 agrees with apertureIrradiance', () => {
    const rnd = mulberry32(3);
    for (let k = 0; k < 500; k++) {
      const tracking = (['fixed', 'one-axis', 'two-axis'] as const)[k % 3] ?? 'fixed';
      const args = {
        dniWm2: 900 * rnd(),
        dhiWm2: 200 * rnd(),
        ghiWm2: 1000 * rnd(),
        zenithDeg: 100 * rnd(),
        azimuthDeg: 360 * rnd(),
        tracking,
        tiltDeg: 90 * rnd(),
        surfaceAzimuthDeg: 360 * rnd(),
        beamOnly: rnd() < 0.5,
        groundAlbedo: 0.4 * rnd(),
      };
      const a = apertureIrradiance(args).gApertureWm2;
      const b = apertureIrradianceWm2(
        args.dniWm2,
        args.dhiWm2,
        args.ghiWm2,
        args.zenithDeg,
        args.azimuthDeg,
        args.tracking,
        args.tiltDeg,
        args.surfaceAzimuthDeg,
        args.beamOnly,
        args.groundAlbedo,
      );
      expect(Math.abs(a - b)).toBeLessThan(1e-9);
    }
  });
});

describe('meanCosZenithOverHourAngles', () => {
  // Numerical reference: midpoint rule with 20 000 panels of max(0, sin φ sin δ + cos φ cos δ cos ω).
  const numeric = (lat: number, decl: number, w1: number, w2: number) => {
    const n = 20000;
    let s = 0;
    let up = 0;
    for (let i = 0; i < n; i++) {
      const w = w1 + ((i + 0.5) * (w2 - w1)) / n;
      const c = Math.sin(lat * D) * Math.sin(decl * D) + Math.cos(lat * D) * Math.cos(decl * D) * Math.cos(w * D);
      if (c > 0) {
        s += c;
        up++;
      }
    }
    return { meanCosZ: s / n, sunUpFraction: up / n };
  };

  it('matches numerical integration for midday, sunrise and polar cases (Duffie & Beckman 2013, eq. 1.10.4)', () => {
    const cases: [number, number, number, number][] = [
      [15, 0, -7.5, 7.5],
      [15, 0, -97.5, -82.5], // sunrise hour
      [15, 0, 82.5, 97.5], // sunset hour
      [40, 20, 170, 185], // around midnight
      [75, 23, 170, 185], // polar day around midnight
      [75, -23, -7.5, 7.5], // polar night at noon
      [-30, -15, -110, -95],
    ];
    for (const [lat, decl, w1, w2] of cases) {
      const a = meanCosZenithOverHourAngles(lat, decl, w1, w2);
      const b = numeric(lat, decl, w1, w2);
      expect(Math.abs(a.meanCosZ - b.meanCosZ)).toBeLessThan(1e-6);
      expect(Math.abs(a.sunUpFraction - b.sunUpFraction)).toBeLessThan(1e-3);
    }
  });
});
