/**
 * Enthalpy from a piecewise-linear apparent specific heat, and its exact inverse.
 *
 * Method: the enthalpy method for phase change (e.g. Voller & Prakash 1987, Int. J. Heat Mass Transfer 30(8):1709)
 * written with an *apparent* specific heat c(T) [J/(kg·K)] that includes the latent heat spread uniformly over the
 * melting range. When c(T) is piecewise linear, h(T) = ∫₀ᵀ c dT is piecewise quadratic, so T(h) is found in closed
 * form with the numerically stable root d = 2r / (b + √(b² + 4ar)) of a·d² + b·d − r = 0 (no iteration), which makes
 * enthalpy() and temperatureAt() inverses to rounding error. Below the first and above the last node c(T) is held
 * constant, so h(T) stays strictly increasing over the whole real line.
 */

/** One segment of apparent specific heat, linear from c0 at t0C to c1 at t1C. */
export interface HeatCapacitySegment {
  /** Segment start and end temperature [°C], t1C > t0C. */
  t0C: number;
  t1C: number;
  /** Apparent specific heat at t0C and t1C [J/(kg·K)], both > 0. */
  c0: number;
  c1: number;
}

export interface PiecewiseEnthalpy {
  /** Apparent specific heat dh/dT [J/(kg·K)] at T [°C]. */
  apparentCp(tC: number): number;
  /** Specific enthalpy h(T) [J/kg] relative to 0 °C. */
  enthalpy(tC: number): number;
  /** Temperature [°C] at specific enthalpy h [J/kg] (exact inverse of enthalpy()). */
  temperatureAt(hJPerKg: number): number;
}

/**
 * Build h(T) and T(h) from contiguous segments of linear apparent specific heat (enthalpy method, see file comment).
 * Segments must be contiguous (each t0C equals the previous t1C), increasing, with positive c.
 * @throws RangeError naming the offending segment.
 */
export function createPiecewiseLinearEnthalpy(segments: readonly HeatCapacitySegment[]): PiecewiseEnthalpy {
  const n = segments.length;
  if (n === 0) throw new RangeError('segments: at least one heat-capacity segment is required');
  const t0 = new Float64Array(n);
  const t1 = new Float64Array(n);
  const c0 = new Float64Array(n);
  const halfSlope = new Float64Array(n); // (c1 − c0) / (2·Δt), the quadratic coefficient a
  const hStart = new Float64Array(n + 1); // enthalpy at each node, first node = 0 before re-referencing
  for (let i = 0; i < n; i++) {
    const s = segments[i]!;
    if (!(Number.isFinite(s.t0C) && Number.isFinite(s.t1C) && s.t1C > s.t0C)) {
      throw new RangeError(`segments[${i}]: t1C must be finite and greater than t0C (got ${s.t0C}..${s.t1C})`);
    }
    if (!(s.c0 > 0 && s.c1 > 0 && Number.isFinite(s.c0) && Number.isFinite(s.c1))) {
      throw new RangeError(`segments[${i}]: specific heat must be positive and finite (got ${s.c0}, ${s.c1})`);
    }
    if (i > 0 && s.t0C !== segments[i - 1]!.t1C) {
      throw new RangeError(`segments[${i}]: t0C must equal the previous segment's t1C (got ${s.t0C})`);
    }
    t0[i] = s.t0C;
    t1[i] = s.t1C;
    c0[i] = s.c0;
    halfSlope[i] = (s.c1 - s.c0) / (2 * (s.t1C - s.t0C));
    const dt = s.t1C - s.t0C;
    hStart[i + 1] = hStart[i]! + dt * (s.c0 + halfSlope[i]! * dt);
  }
  const tFirst = t0[0]!;
  const tLast = t1[n - 1]!;
  const cFirst = c0[0]!;
  const cLast = segments[n - 1]!.c1;

  // Raw enthalpy relative to the first node, then re-reference so that h(0 °C) = 0.
  const rawEnthalpy = (tC: number): number => {
    if (tC <= tFirst) return cFirst * (tC - tFirst);
    if (tC >= tLast) return hStart[n]! + cLast * (tC - tLast);
    const i = findSegment(t0, n, tC);
    const d = tC - t0[i]!;
    return hStart[i]! + d * (c0[i]! + halfSlope[i]! * d);
  };
  const offset = rawEnthalpy(0);
  for (let i = 0; i <= n; i++) hStart[i] = hStart[i]! - offset;
  const hFirst = hStart[0]!;
  const hLast = hStart[n]!;

  return {
    apparentCp(tC: number): number {
      if (tC <= tFirst) return cFirst;
      if (tC >= tLast) return cLast;
      const i = findSegment(t0, n, tC);
      return c0[i]! + 2 * halfSlope[i]! * (tC - t0[i]!);
    },
    enthalpy(tC: number): number {
      if (tC <= tFirst) return hFirst + cFirst * (tC - tFirst);
      if (tC >= tLast) return hLast + cLast * (tC - tLast);
      const i = findSegment(t0, n, tC);
      const d = tC - t0[i]!;
      return hStart[i]! + d * (c0[i]! + halfSlope[i]! * d);
    },
    temperatureAt(hJPerKg: number): number {
      if (hJPerKg <= hFirst) return tFirst + (hJPerKg - hFirst) / cFirst;
      if (hJPerKg >= hLast) return tLast + (hJPerKg - hLast) / cLast;
      const i = findSegment(hStart, n, hJPerKg);
      const r = hJPerKg - hStart[i]!;
      const b = c0[i]!;
      const a = halfSlope[i]!;
      // Stable root of a·d² + b·d − r = 0 (b > 0, r ≥ 0, b² + 4ar ≥ 0 inside the segment since c > 0 there).
      const d = (2 * r) / (b + Math.sqrt(b * b + 4 * a * r));
      const t = t0[i]! + d;
      return t > t1[i]! ? t1[i]! : t;
    },
  };
}

/** Index i with nodes[i] ≤ x < nodes[i+1] among the first n segments (binary search; linear for tiny n). */
function findSegment(nodes: Float64Array, n: number, x: number): number {
  if (n <= 4) {
    let i = 0;
    while (i < n - 1 && x >= nodes[i + 1]!) i++;
    return i;
  }
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (nodes[mid]! <= x) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}
