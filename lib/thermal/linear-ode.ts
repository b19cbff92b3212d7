/**
 * Exact integration of the linear one- and two-node heat balances over one step (properties frozen at the step
 * start), returning the time integrals of the node temperatures so that every energy flux over the step is an exact
 * linear function of them and the enthalpy bookkeeping closes by construction.
 *
 * One node:  C·dT/dt = a − b·T.
 * Two nodes: C_s·dT_s/dt = a_s − b_s·T_s − G·(T_s − T_p);  C_p·dT_p/dt = a_p − b_p·T_p + G·(T_s − T_p).
 * Written dx/dt = M·x + f, the solution's integral over [0, h] is ∫x = φ1(M)·x0 + φ2(M)·f with
 * φ1(λ) = (e^{λh} − 1)/λ and φ2(λ) = (e^{λh} − 1 − λh)/λ² (both finite at λ = 0: h and h²/2).
 * For the 2×2 case φ(M) follows from Sylvester's formula with the two real eigenvalues of M
 * (M = C⁻¹K with K symmetric, so they are real): φ(M) = d·M + (φ(λ1) − λ1·d)·I, d = (φ(λ1) − φ(λ2))/(λ1 − λ2)
 * (Moler & Van Loan 2003, "Nineteen dubious ways to compute the exponential of a matrix, twenty-five years later",
 * SIAM Review 45(1):3–49, §§ on polynomial/Lagrange interpolation methods).
 * Pitfall handled: λ1 is taken as det/λ2 to avoid cancellation when the node losses are tiny (det ≈ 0), and series
 * expansions replace expm1-based forms when |λh| is small.
 */

/**
 * φ1(λ) = (e^{λh} − 1)/λ = ∫₀ʰ e^{λs} ds [s].
 * @param lam eigenvalue [1/s]; @param h step [s]
 */
export function phi1(lam: number, h: number): number {
  const z = lam * h;
  if (z > -1e-5 && z < 1e-5) return h * (1 + z * (0.5 + z / 6));
  return Math.expm1(z) / lam;
}

/**
 * φ2(λ) = (e^{λh} − 1 − λh)/λ² = ∫₀ʰ (h − s)·e^{λs} ds [s²].
 * @param lam eigenvalue [1/s]; @param h step [s]
 */
export function phi2(lam: number, h: number): number {
  const z = lam * h;
  if (z > -1e-2 && z < 1e-2) {
    return h * h * (0.5 + z * (1 / 6 + z * (1 / 24 + z * (1 / 120 + z * (1 / 720 + z / 5040)))));
  }
  return (Math.expm1(z) - z) / (lam * lam);
}

/** Scratch for phiPair (module-level: integrateTwoNode allocates nothing). */
const PHI = new Float64Array(2);

/**
 * φ1(λ) and φ2(λ) together from one expm1 (out[0] = φ1, out[1] = φ2), with the same small-|λh| series as phi1/phi2.
 */
export function phiPair(lam: number, h: number, out: Float64Array): void {
  const z = lam * h;
  if (z > -1e-2 && z < 1e-2) {
    out[0] = h * (1 + z * (0.5 + z * (1 / 6 + z * (1 / 24 + z * (1 / 120 + z * (1 / 720 + z / 5040))))));
    out[1] = h * h * (0.5 + z * (1 / 6 + z * (1 / 24 + z * (1 / 120 + z * (1 / 720 + z / 5040)))));
    return;
  }
  const e = Math.expm1(z);
  out[0] = e / lam;
  out[1] = (e - z) / (lam * lam);
}

/**
 * Time integral ∫₀ʰ T dt [K·s] of one node C·dT/dt = a − b·T from T(0) = t0C.
 * @param capacityJPerK C [J/K] > 0; @param bWPerK b [W/K]; @param aW a [W]; @param t0C T(0) [°C]; @param h step [s]
 */
export function integrateOneNode(capacityJPerK: number, bWPerK: number, aW: number, t0C: number, h: number): number {
  phiPair(-bWPerK / capacityJPerK, h, PHI);
  return PHI[0]! * t0C + PHI[1]! * (aW / capacityJPerK);
}

/**
 * Time integrals of the two-node system (file comment), written into out[0] = ∫T_s dt and out[1] = ∫T_p dt [K·s].
 * Falls back to two uncoupled nodes when the coupling is too weak to resolve (|λ1 − λ2|·h < 1e-7): the draw
 * G·(∫T_s − ∫T_p) computed from them is still booked on both sides, so energy stays conserved.
 * @param cs store capacity [J/K]; @param bs [W/K]; @param as [W]; @param ts0 [°C]
 * @param cp pot capacity [J/K]; @param bp [W/K]; @param ap [W]; @param tp0 [°C]
 * @param g coupling G [W/K] ≥ 0; @param h step [s]
 * @param out Float64Array of length ≥ 2 (no allocation)
 */
export function integrateTwoNode(
  cs: number,
  bs: number,
  as: number,
  ts0: number,
  cp: number,
  bp: number,
  ap: number,
  tp0: number,
  g: number,
  h: number,
  out: Float64Array,
): void {
  const m11 = -(bs + g) / cs;
  const m12 = g / cs;
  const m21 = g / cp;
  const m22 = -(bp + g) / cp;
  const diff = m11 - m22;
  const s = Math.sqrt(diff * diff + 4 * m12 * m21);
  if (!(g > 0) || s * h < 1e-7) {
    out[0] = integrateOneNode(cs, bs + g, as + g * tp0, ts0, h);
    out[1] = integrateOneNode(cp, bp + g, ap + g * ts0, tp0, h);
    return;
  }
  const tr = m11 + m22;
  // det computed without cancellation: [(bs+g)(bp+g) − g²]/(cs·cp) = [bs·bp + g·(bs + bp)]/(cs·cp).
  const det = (bs * bp + g * (bs + bp)) / (cs * cp);
  const lam2 = tr < 0 ? 0.5 * (tr - s) : 0.5 * (tr + s); // the larger-magnitude eigenvalue
  const lam1 = lam2 !== 0 ? det / lam2 : 0.5 * (tr - s);
  const dl = lam1 - lam2;
  phiPair(lam1, h, PHI);
  const p1a = PHI[0]!;
  const p2a = PHI[1]!;
  phiPair(lam2, h, PHI);
  const p1b = PHI[0]!;
  const p2b = PHI[1]!;
  const d1 = (p1a - p1b) / dl;
  const e1 = p1a - lam1 * d1;
  const d2 = (p2a - p2b) / dl;
  const e2 = p2a - lam1 * d2;
  const fs = as / cs;
  const fp = ap / cp;
  // φ(M)·v = d·(M·v) + e·v
  out[0] = d1 * (m11 * ts0 + m12 * tp0) + e1 * ts0 + d2 * (m11 * fs + m12 * fp) + e2 * fs;
  out[1] = d1 * (m21 * ts0 + m22 * tp0) + e1 * tp0 + d2 * (m21 * fs + m22 * fp) + e2 * fp;
}

/**
 * Heat [J] passed from node i to node j over a step by a pure exchange G·(T_i − T_j) between two capacities,
 * exact: q = ΔT0·(1 − e^{−G·h·(1/C_i + 1/C_j)}) / (1/C_i + 1/C_j). It cannot overshoot (no inversion).
 * @param ci, cj capacities [J/K]; @param g conductance [W/K]; @param dT0 T_i − T_j at the start [K]; @param h step [s]
 */
export function exchangeHeatJ(ci: number, cj: number, g: number, dT0: number, h: number): number {
  const inv = 1 / ci + 1 / cj;
  return (-dT0 * Math.expm1(-g * h * inv)) / inv;
}
