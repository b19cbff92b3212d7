/**
 * Conduction limit of melting: the enthalpy method of lib/materials (h(T), T(h), k(T) of the erythritol model and the
 * melt fraction liquidFractionEnthalpyMethod) in a 1-D finite-volume slab, checked against Neumann's one-phase
 * solution of the Stefan problem.
 *
 * Neumann's solution (Carslaw & Jaeger 1959, "Conduction of Heat in Solids", 2nd ed., §11.2; Alexiades & Solomon 1993,
 * "Mathematical Modeling of Melting and Freezing Processes", §2.1): a solid at its melting point T_m, face x = 0 held
 * at T_w > T_m from t = 0. The melt front is at s(t) = 2λ·√(α_l·t), where λ solves λ·e^{λ²}·erf(λ) = Ste/√π with the
 * liquid Stefan number Ste = c_l·(T_w − T_m)/L.
 *
 * The slab below is the test's own explicit scheme (the code under test is the medium's enthalpy, its inverse, its
 * conductivity and the melt fraction). The model melts over a ±1 K range around T_m (a modelling choice of pcm.ts),
 * and its sensible cp blends from the solid to the liquid value across that range, so it cannot match the sharp-front
 * solution exactly; a test material with equal phase properties and a ±0.05 K range checks the scheme itself tightly.
 */
import { describe, expect, it } from 'vitest';
import { createPhaseChangeMaterial, erythritol, ERYTHRITOL_LATENT_J_PER_KG, ERYTHRITOL_MELT_C, liquidFractionEnthalpyMethod, type StorageMedium } from '@/lib/materials';

/** erf by its Maclaurin series (Abramowitz & Stegun 1964, Eq. 7.1.5); converges fast for x < 2. */
function erf(x: number): number {
  let term = x;
  let sum = x;
  for (let n = 1; n < 60; n++) {
    term *= (-x * x) / n;
    sum += term / (2 * n + 1);
  }
  return (2 / Math.sqrt(Math.PI)) * sum;
}

/** λ of Neumann's one-phase solution: λ·e^{λ²}·erf(λ) = Ste/√π, by bisection on (0, 2). */
function neumannLambda(ste: number): number {
  const target = ste / Math.sqrt(Math.PI);
  let lo = 0;
  let hi = 2;
  for (let i = 0; i < 100; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid * Math.exp(mid * mid) * erf(mid) < target) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe("Neumann's melting solution (conduction limit)", () => {
  it('the root λ matches the small-Stefan expansion λ ≈ √(Ste/2)·(1 − Ste/6)', () => {
    // Derived here from the Maclaurin series: λ·e^{λ²}·erf λ ≈ (2/√π)·λ²·(1 + 2λ²/3), so λ² ≈ (Ste/2)·(1 − Ste/3);
    // the next term is O(Ste²), about 1e-5 relative at Ste = 0.01.
    const ste = 0.01;
    const approx = Math.sqrt(ste / 2) * (1 - ste / 6);
    expect(Math.abs(neumannLambda(ste) - approx) / approx).toBeLessThan(1e-4);
    expect(erf(1)).toBeCloseTo(0.8427007929, 9); // A&S Table 7.1
  });

  /**
   * Melt depth Σ f·Δx [m] of a slab of `medium` (density rho held constant), all solid at its solidus, with the face
   * x = 0 held at tw [°C]: explicit finite volumes, Δx = 1 mm, Δt = 0.5 s (stable: Δt < Δx²/(2·α_max) ≈ 1.2 s for
   * erythritol's solid), harmonic-mean face conductivities, insulated far face 12 cm away (the front stays far from it).
   */
  function meltDepthsM(medium: StorageMedium, rho: number, tw: number, hours: number[]): number[] {
    const melt = medium.melting!;
    const dx = 1e-3;
    const dt = 0.5;
    const n = 120;
    const hVol = new Float64Array(n).fill(rho * medium.enthalpy(melt.solidusC));
    const t = new Float64Array(n).fill(melt.solidusC);
    const k = new Float64Array(n);
    const q = new Float64Array(n + 1);
    const out: number[] = [];
    let steps = 0;
    for (const h of hours) {
      const until = Math.round((h * 3600) / dt);
      for (; steps < until; steps++) {
        for (let i = 0; i < n; i++) k[i] = medium.conductivity(t[i]!);
        q[0] = (k[0]! * (tw - t[0]!)) / (dx / 2); // face held at T_w, half a cell away
        for (let i = 1; i < n; i++) q[i] = ((2 * k[i - 1]! * k[i]!) / (k[i - 1]! + k[i]!)) * ((t[i - 1]! - t[i]!) / dx);
        q[n] = 0;
        for (let i = 0; i < n; i++) {
          hVol[i] = hVol[i]! + (dt * (q[i]! - q[i + 1]!)) / dx;
          t[i] = medium.temperatureAt(hVol[i]! / rho);
        }
      }
      let melted = 0;
      for (let i = 0; i < n; i++) melted += liquidFractionEnthalpyMethod(medium, t[i]!) * dx;
      out.push(melted);
    }
    return out;
  }

  const hours = [2, 4, 6];

  it('a PCM with equal solid and liquid properties and a ±0.05 K range: melt depth within 0.5 % of 2λ√(α·t) at 2, 4, 6 h', () => {
    // Test material (invented): cp 2000 J/(kg·K), k 0.5 W/(m·K), ρ 1000 kg/m³ in both phases, L 200 kJ/kg at 100 °C.
    const c = 2000;
    const kk = 0.5;
    const rho = 1000;
    const latent = 200e3;
    const pcm = createPhaseChangeMaterial({
      id: 'test-pcm', name: 'test PCM', solidusC: 99.95, liquidusC: 100.05, latentJPerKg: latent,
      cpSolid: { refC: 0, value: c, slopePerK: 0 }, cpLiquid: { refC: 0, value: c, slopePerK: 0 },
      densitySolid: { refC: 0, value: rho, slopePerK: 0 }, densityLiquid: { refC: 0, value: rho, slopePerK: 0 },
      kSolid: { refC: 0, value: kk, slopePerK: 0 }, kLiquid: { refC: 0, value: kk, slopePerK: 0 },
      viscosityLiquid: () => 0.01, recommendedMaxC: 200, validRangeC: { min: 0, max: 300 }, sources: [], notes: [],
    });
    const tw = 140;
    const lambda = neumannLambda((c * (tw - 100)) / latent); // Ste = 0.4
    const alpha = kk / (rho * c);
    meltDepthsM(pcm, rho, tw, hours).forEach((depth, i) => {
      const s = 2 * lambda * Math.sqrt(alpha * hours[i]! * 3600);
      expect(Math.abs(depth - s) / s).toBeLessThan(0.005);
    });
  });

  it('the erythritol model melted from a 150 °C face: melt depth within 5 % of 2λ√(α_l·t) at 2, 4, 6 h', () => {
    // 5 %: the model's ±1 K melting range (solid starts 1 K below T_m, conductivity and cp blend across the range) is
    // worth ≈ 1 K of the 33 K superheat, ≈ 3 % on the depth; the grid adds < 0.5 % (checked at Δx = 0.25 mm; the model gives +3.3 %).
    const m = erythritol;
    const tw = 150;
    const tm = ERYTHRITOL_MELT_C; // centre of the ±1 K melting range
    const rho = 1300; // liquid density at 140 °C held constant (Neumann's solution has one density)
    const cl = m.specificHeat(140);
    const alphaL = m.conductivity(140) / (rho * cl);
    const lambda = neumannLambda((cl * (tw - tm)) / ERYTHRITOL_LATENT_J_PER_KG);
    meltDepthsM(m, rho, tw, hours).forEach((depth, i) => {
      const s = 2 * lambda * Math.sqrt(alphaL * hours[i]! * 3600);
      expect(Math.abs(depth - s) / s).toBeLessThan(0.05);
    });
  });
});

describe('liquidFractionEnthalpyMethod', () => {
  it('is 0 at and below the solidus, 1 at and above the liquidus, linear between (latent heat spread uniformly)', () => {
    const { solidusC, liquidusC } = erythritol.melting!;
    expect(liquidFractionEnthalpyMethod(erythritol, solidusC - 5)).toBe(0);
    expect(liquidFractionEnthalpyMethod(erythritol, liquidusC + 5)).toBe(1);
    expect(liquidFractionEnthalpyMethod(erythritol, 0.75 * solidusC + 0.25 * liquidusC)).toBeCloseTo(0.25, 12);
    // The latent part of the model's enthalpy grows by f·L across the range (enthalpy method; Voller & Prakash 1987):
    // h(T) − h(solidus) − sensible = f·L, the sensible part bounded by c_p,max·ΔT ≤ 2765·2 J/kg.
    const tMid = 0.5 * (solidusC + liquidusC);
    const dh = erythritol.enthalpy(tMid) - erythritol.enthalpy(solidusC);
    expect(Math.abs(dh - 0.5 * ERYTHRITOL_LATENT_J_PER_KG)).toBeLessThan(2765 * (tMid - solidusC));
  });
});
