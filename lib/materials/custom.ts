/**
 * A storage medium given as a table of measured values (e.g. a supplier's data sheet or the kitchen's own oil).
 *
 * Method: properties are linearly interpolated between rows and held at the end values beyond the table; the
 * enthalpy is the exact integral of the piecewise-linear cp (trapezoid per interval — exact for a linear cp),
 * relative to 0 °C, and its inverse is closed-form (see ./enthalpy.ts). No latent heat: for a phase-change material
 * use lib/materials/pcm.ts.
 */
import { createPiecewiseLinearEnthalpy, type HeatCapacitySegment } from './enthalpy';
import type { StorageMedium } from './types';

export interface CustomMediumRow {
  /** Temperature [°C]. */
  tC: number;
  /** Density [kg/m³]. */
  density: number;
  /** Specific heat [J/(kg·K)]. */
  cp: number;
  /** Thermal conductivity [W/(m·K)]. */
  k: number;
  /** Dynamic viscosity [Pa·s]. */
  viscosity: number;
}

export interface CustomMediumTable {
  name: string;
  rows: CustomMediumRow[];
  smokePointC?: number;
  /** Highest recommended store temperature [°C]; default smoke point − 30 K, else the last row's temperature. */
  recommendedMaxC?: number;
}

/**
 * Check a custom table: at least one row, finite values, strictly increasing tC, positive density, cp, k, viscosity.
 * @param path prefix used in messages (e.g. "store.customTable")
 * @throws RangeError naming the field, e.g. `store.customTable.rows[2].cp must be positive and finite (got -5)`.
 */
export function validateCustomTable(table: CustomMediumTable, path = 'customTable'): void {
  if (table === null || typeof table !== 'object') throw new RangeError(`${path} must be an object with rows`);
  if (!Array.isArray(table.rows) || table.rows.length === 0) {
    throw new RangeError(`${path}.rows must contain at least one row`);
  }
  for (let i = 0; i < table.rows.length; i++) {
    const r = table.rows[i]!;
    if (!Number.isFinite(r.tC)) throw new RangeError(`${path}.rows[${i}].tC must be finite (got ${r.tC})`);
    for (const field of ['density', 'cp', 'k', 'viscosity'] as const) {
      const v = r[field];
      if (!(Number.isFinite(v) && v > 0)) {
        throw new RangeError(`${path}.rows[${i}].${field} must be positive and finite (got ${v})`);
      }
    }
    if (i > 0 && !(r.tC > table.rows[i - 1]!.tC)) {
      throw new RangeError(`${path}.rows[${i}].tC must be greater than rows[${i - 1}].tC (rows sorted by temperature, no duplicates)`);
    }
  }
  if (table.smokePointC !== undefined && !Number.isFinite(table.smokePointC)) {
    throw new RangeError(`${path}.smokePointC must be finite (got ${table.smokePointC})`);
  }
}

/** Linear interpolation of a tabulated property vs temperature [°C], held at the end values beyond the table (binary search). */
function interpolator(ts: Float64Array, vs: Float64Array): (tC: number) => number {
  const n = ts.length;
  return (tC: number): number => {
    if (tC <= ts[0]!) return vs[0]!;
    if (tC >= ts[n - 1]!) return vs[n - 1]!;
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (ts[mid]! <= tC) lo = mid;
      else hi = mid;
    }
    const f = (tC - ts[lo]!) / (ts[hi]! - ts[lo]!);
    return vs[lo]! + f * (vs[hi]! - vs[lo]!);
  };
}

/**
 * Create a custom medium from a table of values (linear interpolation; enthalpy by exact integration of cp).
 * @param id id echoed in the medium (default "custom")
 * @throws RangeError from validateCustomTable
 */
export function createCustomMedium(table: CustomMediumTable, id = 'custom', path = 'customTable'): StorageMedium {
  validateCustomTable(table, path);
  const rows = table.rows;
  const n = rows.length;
  const col = (get: (r: CustomMediumRow) => number): Float64Array => Float64Array.from(rows, get);
  const ts = col((r) => r.tC);
  const cps = col((r) => r.cp);
  const segments: HeatCapacitySegment[] = [];
  if (n === 1) {
    // One row: constant cp; a nominal 1 K segment keeps the engine's form.
    segments.push({ t0C: ts[0]!, t1C: ts[0]! + 1, c0: cps[0]!, c1: cps[0]! });
  } else {
    for (let i = 0; i < n - 1; i++) segments.push({ t0C: ts[i]!, t1C: ts[i + 1]!, c0: cps[i]!, c1: cps[i + 1]! });
  }
  const h = createPiecewiseLinearEnthalpy(segments);
  const smoke = table.smokePointC;
  const recommendedMaxC = table.recommendedMaxC ?? (smoke !== undefined ? smoke - 30 : ts[n - 1]!);
  return {
    id,
    name: table.name,
    kind: 'custom',
    density: interpolator(ts, col((r) => r.density)),
    specificHeat: interpolator(ts, cps),
    conductivity: interpolator(ts, col((r) => r.k)),
    viscosity: interpolator(ts, col((r) => r.viscosity)),
    enthalpy: h.enthalpy,
    temperatureAt: h.temperatureAt,
    validRangeC: { min: ts[0]!, max: ts[n - 1]! },
    smokePointC: smoke,
    recommendedMaxC,
    sources: [`User-supplied table "${table.name}" (${n} rows); linear interpolation, cp integrated exactly for enthalpy`],
    notes: ['Outside the table the properties are held at the end rows.'],
  };
}
