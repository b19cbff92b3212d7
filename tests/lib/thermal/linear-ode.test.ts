import { describe, expect, it } from 'vitest';
import { exchangeHeatJ, integrateOneNode, integrateTwoNode, phi1, phi2 } from '@/lib/thermal';

/** Classic RK4 on the two-node system, integrating T_s and T_p alongside (reference solution). */
function rk4TwoNode(cs: number, bs: number, as: number, ts0: number, cp: number, bp: number, ap: number, tp0: number, g: number, h: number, n = 20000) {
  const f = (ts: number, tp: number): [number, number] => [(as - bs * ts - g * (ts - tp)) / cs, (ap - bp * tp + g * (ts - tp)) / cp];
  let ts = ts0;
  let tp = tp0;
  let is = 0;
  let ip = 0;
  const dt = h / n;
  for (let i = 0; i < n; i++) {
    const [k1s, k1p] = f(ts, tp);
    const [k2s, k2p] = f(ts + (dt / 2) * k1s, tp + (dt / 2) * k1p);
    const [k3s, k3p] = f(ts + (dt / 2) * k2s, tp + (dt / 2) * k2p);
    const [k4s, k4p] = f(ts + dt * k3s, tp + dt * k3p);
    const nts = ts + (dt / 6) * (k1s + 2 * k2s + 2 * k3s + k4s);
    const ntp = tp + (dt / 6) * (k1p + 2 * k2p + 2 * k3p + k4p);
    is += (dt / 2) * (ts + nts); // trapezoid on the RK4 path (error O(dt²) ≈ 1e-9 relative here)
    ip += (dt / 2) * (tp + ntp);
    ts = nts;
    tp = ntp;
  }
  return { ts, tp, is, ip };
}

describe('exact linear integration', () => {
  it('φ1 and φ2 are continuous across the series/expm1 switch (1e-12 relative)', () => {
    for (const z of [1e-5, 1e-2]) {
      for (const s of [1 - 1e-9, 1 + 1e-9]) {
        const lam = (-z * s) / 60;
        expect(Math.abs(phi1(lam, 60) / (Math.expm1(lam * 60) / lam) - 1)).toBeLessThan(1e-12);
      }
    }
    expect(phi1(0, 60)).toBe(60);
    expect(phi2(0, 60)).toBe(1800);
    // φ2 at z = −0.02 (expm1 branch) vs the series at z = −0.0099999: smooth within 1e-5 relative over that gap.
    expect(Math.abs(phi2(-0.02 / 60, 60) / phi2(-0.0099999 / 60, 60) - 1)).toBeLessThan(0.004);
  });

  it('one node: ∫T over a step equals the analytic integral of T = T∞ + (T0 − T∞)·e^(−bt/C) (1e-10 relative)', () => {
    const c = 1e5;
    const b = 5;
    const a = 5 * 25 + 600; // T∞ = a/b = 145
    const h = 3600;
    const tInf = a / b;
    const tau = c / b;
    const exact = tInf * h + (20 - tInf) * tau * (1 - Math.exp(-h / tau));
    expect(Math.abs(integrateOneNode(c, b, a, 20, h) / exact - 1)).toBeLessThan(1e-10);
  });

  it('two nodes: integrals match a fine RK4 reference (1e-8 relative) for soft and stiff coupling', () => {
    const out = new Float64Array(2);
    const cases = [
      [1.2e5, 4, 900, 130, 4.2e4, 0.6, 0.6 * 25, 25, 15, 60],
      [1.2e5, 4, 900, 130, 4.2e3, 0.6, 0.6 * 25, 25, 800, 60], // stiff pot (λh ≈ −12)
      [1.2e5, 0, 0, 130, 4.2e4, 0, 0, 25, 15, 600], // no losses: λ1 = 0
    ] as const;
    for (const [cs, bs, as, ts0, cp, bp, ap, tp0, g, h] of cases) {
      integrateTwoNode(cs, bs, as, ts0, cp, bp, ap, tp0, g, h, out);
      const ref = rk4TwoNode(cs, bs, as, ts0, cp, bp, ap, tp0, g, h);
      expect(Math.abs(out[0]! / ref.is - 1)).toBeLessThan(1e-8);
      expect(Math.abs(out[1]! / ref.ip - 1)).toBeLessThan(1e-8);
    }
  });

  it('two nodes without sources conserve energy: C_s·ΔT_s + C_p·ΔT_p = 0 through the integrals (1e-9 J relative)', () => {
    const out = new Float64Array(2);
    const cs = 1e5;
    const cp = 3e4;
    const g = 20;
    integrateTwoNode(cs, 0, 0, 150, cp, 0, 0, 30, g, 60, out);
    const draw = g * (out[0]! - out[1]!);
    const ref = rk4TwoNode(cs, 0, 0, 150, cp, 0, 0, 30, g, 60);
    expect(Math.abs(cs * (ref.ts - 150) + draw) / draw).toBeLessThan(1e-8);
    expect(Math.abs(cp * (ref.tp - 30) - draw) / draw).toBeLessThan(1e-8);
  });

  it('exchange between two capacities cannot overshoot and moves heat down the gradient', () => {
    const q = exchangeHeatJ(1e4, 1e4, 1e6, 10, 60); // huge conductance → equalise: q = ΔT·C/2 = 50 000 J
    expect(q).toBeCloseTo(50_000, 6);
    expect(exchangeHeatJ(1e4, 2e4, 5, -10, 60)).toBeLessThan(0);
  });
});
