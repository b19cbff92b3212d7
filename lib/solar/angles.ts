/**
 * Degree-based trigonometry and angle-range helpers shared by the solar modules.
 * All angles are in degrees [°] unless a name says otherwise.
 */

/** Degrees to radians factor [rad/°]. */
export const DEG_TO_RAD = Math.PI / 180;
/** Radians to degrees factor [°/rad]. */
export const RAD_TO_DEG = 180 / Math.PI;

/** Sine of an angle given in degrees. @param deg angle [°] @returns sine [–] */
export function sind(deg: number): number {
  return Math.sin(deg * DEG_TO_RAD);
}

/** Cosine of an angle given in degrees. @param deg angle [°] @returns cosine [–] */
export function cosd(deg: number): number {
  return Math.cos(deg * DEG_TO_RAD);
}

/** Tangent of an angle given in degrees. @param deg angle [°] @returns tangent [–] */
export function tand(deg: number): number {
  return Math.tan(deg * DEG_TO_RAD);
}

/**
 * Arcsine in degrees; the argument is clamped to [−1, 1] so that rounding just outside the
 * domain (e.g. 1.0000000000000002) does not turn into NaN.
 * @param x sine [–] @returns angle [°] in [−90, 90]
 */
export function asind(x: number): number {
  return Math.asin(clamp(x, -1, 1)) * RAD_TO_DEG;
}

/**
 * Arccosine in degrees with the argument clamped to [−1, 1] (see {@link asind}).
 * @param x cosine [–] @returns angle [°] in [0, 180]
 */
export function acosd(x: number): number {
  return Math.acos(clamp(x, -1, 1)) * RAD_TO_DEG;
}

/** Arctangent in degrees. @param x tangent [–] @returns angle [°] in (−90, 90) */
export function atand(x: number): number {
  return Math.atan(x) * RAD_TO_DEG;
}

/** Two-argument arctangent in degrees. @param y ordinate @param x abscissa @returns angle [°] in (−180, 180] */
export function atan2d(y: number, x: number): number {
  return Math.atan2(y, x) * RAD_TO_DEG;
}

/** Clamp x to [lo, hi]. */
export function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}

/** Reduce an angle to [0, 360). @param deg angle [°] @returns angle [°] */
export function limitDegrees(deg: number): number {
  const r = deg % 360;
  if (r >= 0) return r;
  const w = r + 360;
  // −1e-14 + 360 rounds to exactly 360, which is outside the half-open range.
  return w >= 360 ? 0 : w;
}

/** Reduce an angle to [−180, 180). @param deg angle [°] @returns angle [°] */
export function limitDegrees180pm(deg: number): number {
  return limitDegrees(deg + 180) - 180;
}

/** Fractional part, mapping to [0, 1). @param x value @returns x − floor(x) */
export function limitZeroToOne(x: number): number {
  return x - Math.floor(x);
}
