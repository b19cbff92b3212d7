/**
 * Clear-sky irradiance models and the monthly Linke turbidity defaults.
 *
 * Conventions (lib/GLOSSARY.md): irradiance [W/m²], zenith [°] (apparent), altitude [m].
 */
import { DEG_TO_RAD } from './angles';
import { SOLAR_CONSTANT_WM2, airMassKastenYoung1989 } from './irradiance';

/** Clear-sky irradiance components [W/m²]. */
export interface ClearSkyIrradiance {
  /** Global horizontal irradiance [W/m²]. */
  ghiWm2: number;
  /** Direct normal irradiance [W/m²]. */
  dniWm2: number;
  /** Diffuse horizontal irradiance [W/m²]. */
  dhiWm2: number;
}

/**
 * Clear-sky global horizontal irradiance, Haurwitz model.
 * Method: B. Haurwitz, "Insolation in relation to cloudiness and cloud density", Journal of Meteorology
 * 2:154–166, 1945: GHI = 1098·cos z·exp(−0.059/cos z), 0 for z ≥ 90°.
 * (Empirical, fitted at Blue Hill, MA; no site or turbidity inputs; no beam/diffuse split.)
 * @param zenithDeg apparent solar zenith [°]
 * @returns global horizontal irradiance [W/m²]
 */
export function clearSkyHaurwitz1945(zenithDeg: number): { ghiWm2: number } {
  if (!(zenithDeg < 90)) return { ghiWm2: 0 };
  const cosZ = Math.cos(zenithDeg * DEG_TO_RAD);
  return { ghiWm2: 1098 * cosZ * Math.exp(-0.059 / cosZ) };
}

/** Inputs of {@link clearSkyIneichenPerez2002}. */
export interface IneichenPerezInput {
  /** Apparent solar zenith [°]. */
  zenithDeg: number;
  /** Site elevation above sea level [m]. */
  altitudeM: number;
  /** Linke turbidity at air mass 2 [–] (≈ 2 very clean … 6+ hazy). */
  linkeTurbidity: number;
  /** Extraterrestrial normal irradiance [W/m²]; default the solar constant 1361. */
  i0Wm2?: number;
}

/**
 * Clear-sky irradiance, Ineichen–Perez model.
 * Method: P. Ineichen and R. Perez, "A new airmass independent formulation for the Linke turbidity
 * coefficient", Solar Energy 73(3):151–157, 2002:
 *   GHI = cg1·I0·cos z·exp[−cg2·AM·(fh1 + fh2·(TL − 1))],
 *   cg1 = 5.09e-5·h + 0.868, cg2 = 3.92e-5·h + 0.0387, fh1 = exp(−h/8000), fh2 = exp(−h/1250);
 *   beam: b = 0.664 + 0.163/fh1, DNI = b·I0·exp(−0.09·AM·(TL − 1)).
 * AM is the relative air mass of Kasten & Young 1989; the altitude enters through cg1, cg2, fh1, fh2. (Some
 * implementations pass a pressure-corrected air mass instead, which counts altitude twice; and the paper's
 * later exp(0.01·AM^1.8) enhancement is omitted, as it misbehaves at low Sun.)
 * DNI is limited so that DNI·cos z ≤ GHI, hence DHI = GHI − DNI·cos z ≥ 0.
 * @param input zenith [°], altitude [m], Linke turbidity [–], extraterrestrial normal irradiance [W/m²]
 * @returns ghiWm2, dniWm2, dhiWm2 [W/m²]; all 0 for z ≥ 90°
 */
export function clearSkyIneichenPerez2002(input: IneichenPerezInput): ClearSkyIrradiance {
  const { zenithDeg, altitudeM, linkeTurbidity: tl } = input;
  const i0 = input.i0Wm2 ?? SOLAR_CONSTANT_WM2;
  if (!(zenithDeg < 90)) return { ghiWm2: 0, dniWm2: 0, dhiWm2: 0 };
  const am = airMassKastenYoung1989(zenithDeg);
  const cosZ = Math.cos(zenithDeg * DEG_TO_RAD);
  const cg1 = 5.09e-5 * altitudeM + 0.868;
  const cg2 = 3.92e-5 * altitudeM + 0.0387;
  const fh1 = Math.exp(-altitudeM / 8000);
  const fh2 = Math.exp(-altitudeM / 1250);
  const ghi = Math.max(0, cg1 * i0 * cosZ * Math.exp(-cg2 * am * (fh1 + fh2 * (tl - 1))));
  const b = 0.664 + 0.163 / fh1;
  let dni = Math.max(0, b * i0 * Math.exp(-0.09 * am * (tl - 1)));
  if (dni * cosZ > ghi) dni = ghi / cosZ;
  return { ghiWm2: ghi, dniWm2: dni, dhiWm2: ghi - dni * cosZ };
}

/** Clear-sky models offered by {@link getClearSky}. */
export const CLEAR_SKY_MODELS = ['ineichen-perez-2002', 'haurwitz-1945'] as const;
export type ClearSkyModel = (typeof CLEAR_SKY_MODELS)[number];

/** Result of {@link getClearSky}; Haurwitz gives no beam/diffuse split (null). */
export interface ClearSkyResult {
  model: ClearSkyModel;
  /** [W/m²] */
  ghiWm2: number;
  /** [W/m²], null for Haurwitz */
  dniWm2: number | null;
  /** [W/m²], null for Haurwitz */
  dhiWm2: number | null;
}

/**
 * Clear-sky irradiance by the chosen model; fills defaults (altitude 0 m, Linke turbidity 3, I0 = 1361 W/m²).
 * Methods: 'ineichen-perez-2002' → {@link clearSkyIneichenPerez2002} (Ineichen & Perez 2002);
 * 'haurwitz-1945' → {@link clearSkyHaurwitz1945} (Haurwitz 1945).
 * @param args model, zenith [°], altitude [m], Linke turbidity [–], extraterrestrial normal irradiance [W/m²]
 * @returns ghi, dni, dhi [W/m²] (dni/dhi null for Haurwitz)
 * @throws RangeError for an unknown model (the message lists the choices) or a bad turbidity/altitude
 */
export function getClearSky(args: {
  model?: ClearSkyModel;
  zenithDeg: number;
  altitudeM?: number;
  linkeTurbidity?: number;
  i0Wm2?: number;
}): ClearSkyResult {
  const model = args.model ?? 'ineichen-perez-2002';
  if (model === 'ineichen-perez-2002') {
    const tl = args.linkeTurbidity ?? 3;
    if (!Number.isFinite(tl) || tl < 1 || tl > 10) throw new RangeError(`linkeTurbidity must be within [1, 10], got ${tl}`);
    const altitudeM = args.altitudeM ?? 0;
    if (!Number.isFinite(altitudeM)) throw new RangeError(`altitudeM must be a finite number, got ${altitudeM}`);
    const r = clearSkyIneichenPerez2002({
      zenithDeg: args.zenithDeg,
      altitudeM,
      linkeTurbidity: tl,
      ...(args.i0Wm2 === undefined ? {} : { i0Wm2: args.i0Wm2 }),
    });
    return { model, ...r };
  }
  if (model === 'haurwitz-1945') {
    return { model, ghiWm2: clearSkyHaurwitz1945(args.zenithDeg).ghiWm2, dniWm2: null, dhiWm2: null };
  }
  throw new RangeError(`model must be one of ${CLEAR_SKY_MODELS.map((m) => `'${m}'`).join(', ')}; got '${String(model)}'`);
}

/**
 * Default monthly Linke turbidity, January … December, for a sunny, dry northern-hemisphere site.
 * Source: common practice, no source — a plain, documented default (lower in the cool dry season, higher in the
 * hot hazy/humid season), not a climatology. Kitchens should override it with 12 monthly values for their site
 * (e.g. from the SoDa/Meteotest Linke turbidity maps). For southern-hemisphere sites it is shifted by 6 months.
 */
export const DEFAULT_LINKE_TURBIDITY_MONTHLY: readonly number[] = [3.0, 3.2, 3.5, 3.8, 4.1, 4.4, 4.5, 4.4, 4.0, 3.6, 3.2, 3.0];

/**
 * Validates 12 monthly Linke turbidity values.
 * @param values the kitchen's override, January … December [–]
 * @param name field name used in the error message
 * @throws RangeError naming the field if not 12 finite values within [1, 10]
 */
export function assertLinkeTurbidityMonthly(values: readonly number[], name = 'linkeTurbidity'): void {
  if (!Array.isArray(values) || values.length !== 12) {
    throw new RangeError(`${name} must hold 12 monthly values (January…December), got ${Array.isArray(values) ? values.length : typeof values}`);
  }
  values.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 1 || v > 10) {
      throw new RangeError(`${name}[${i}] must be within [1, 10], got ${String(v)}`);
    }
  });
}

/**
 * Linke turbidity for a month at a site: the kitchen's 12 values if given, else the default table
 * (shifted by six months south of the equator).
 * @param monthIndex 0 = January … 11 = December
 * @param latitudeDeg site latitude [°]
 * @param override optional 12 monthly values [–]
 * @returns Linke turbidity [–]
 */
export function linkeTurbidityForMonth(monthIndex: number, latitudeDeg: number, override?: readonly number[]): number {
  const m = ((Math.floor(monthIndex) % 12) + 12) % 12;
  if (override) {
    assertLinkeTurbidityMonthly(override);
    return override[m] as number;
  }
  const idx = latitudeDeg < 0 ? (m + 6) % 12 : m;
  return DEFAULT_LINKE_TURBIDITY_MONTHLY[idx] as number;
}
