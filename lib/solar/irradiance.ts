/**
 * Irradiance: extraterrestrial irradiance, air mass, diffuse-fraction decomposition, cloud attenuation and the
 * irradiance reaching a cooker's aperture (fixed, one-axis or two-axis tracking; beam-only or global).
 *
 * Conventions (lib/GLOSSARY.md): irradiance [W/m²] (ghi, dni, dhi), angles [°], azimuth eastward from north,
 * kt = clearness index [–], okta = cloud cover in eighths.
 */
import { DEG_TO_RAD, RAD_TO_DEG, acosd, clamp, cosd, sind } from './angles';

/**
 * Solar constant [W/m²]: total solar irradiance at 1 AU.
 * Source: G. Kopp and J. L. Lean, "A new, lower value of total solar irradiance: Evidence and climate
 * significance", Geophysical Research Letters 38, L01706, 2011 (1360.8 ± 0.5 W/m² at solar minimum);
 * IAU 2015 Resolution B3 nominal value 1361 W/m².
 */
export const SOLAR_CONSTANT_WM2 = 1361;

/** Default ground reflectance [–] for the ground-reflected component (common practice, no source: 0.2). */
export const DEFAULT_GROUND_ALBEDO = 0.2;

function requireFinite(name: string, x: number): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new RangeError(`${name} must be a finite number, got ${String(x)}`);
}

/**
 * Day of the year, 1 on 1 January (UTC).
 * @param timeMs instant [epoch ms UTC]
 * @returns day of year [d], 1–366
 */
export function dayOfYearUtc(timeMs: number): number {
  const d = new Date(timeMs);
  return Math.floor((timeMs - Date.UTC(d.getUTCFullYear(), 0, 1)) / 86_400_000) + 1;
}

/**
 * Extraterrestrial normal irradiance from the day of the year.
 * Method: J. W. Spencer, "Fourier series representation of the position of the sun", Search 2(5):172, 1971:
 * (r0/r)² = 1.000110 + 0.034221·cos Γ + 0.001280·sin Γ + 0.000719·cos 2Γ + 0.000077·sin 2Γ, Γ = 2π(n − 1)/365.
 * @param dayOfYear day number n [d], 1–366
 * @param solarConstantWm2 solar constant [W/m²], default 1361 (Kopp & Lean 2011)
 * @returns extraterrestrial irradiance on a plane normal to the Sun's rays [W/m²]
 */
export function extraterrestrialNormalSpencer1971(dayOfYear: number, solarConstantWm2 = SOLAR_CONSTANT_WM2): number {
  requireFinite('dayOfYear', dayOfYear);
  const g = (2 * Math.PI * (dayOfYear - 1)) / 365;
  return (
    solarConstantWm2 *
    (1.00011 + 0.034221 * Math.cos(g) + 0.00128 * Math.sin(g) + 0.000719 * Math.cos(2 * g) + 0.000077 * Math.sin(2 * g))
  );
}

/**
 * Extraterrestrial normal irradiance from the Earth–Sun distance (inverse-square law).
 * Method: I0 = S/R², with R from the SPA (Reda & Andreas, NREL/TP-560-34302, 2004, eq. 11) and
 * S = 1361 W/m² (Kopp & Lean 2011).
 * @param earthSunDistanceAu Earth–Sun distance R [AU]
 * @param solarConstantWm2 solar constant [W/m²]
 * @returns extraterrestrial normal irradiance [W/m²]
 */
export function extraterrestrialNormalFromDistance(earthSunDistanceAu: number, solarConstantWm2 = SOLAR_CONSTANT_WM2): number {
  return solarConstantWm2 / (earthSunDistanceAu * earthSunDistanceAu);
}

/**
 * Relative optical air mass.
 * Method: F. Kasten and A. T. Young, "Revised optical air mass tables and approximation formula",
 * Applied Optics 28(22):4735–4738, 1989, eq. 3: AM = 1 / [cos z + 0.50572·(96.07995° − z)^−1.6364].
 * Pitfall: the formula takes the apparent (refracted) zenith in degrees inside the bracket; beyond 90° it is
 * not defined, so NaN is returned there and callers treat the Sun as down.
 * @param zenithDeg apparent solar zenith [°]
 * @returns relative air mass [–] (≈ 1.0 at z = 0, ≈ 1.99 at z = 60°, ≈ 38 at 90°), NaN for z > 90°
 */
export function airMassKastenYoung1989(zenithDeg: number): number {
  if (!(zenithDeg >= 0 && zenithDeg <= 90)) return NaN;
  return 1 / (Math.cos(zenithDeg * DEG_TO_RAD) + 0.50572 * Math.pow(96.07995 - zenithDeg, -1.6364));
}

/**
 * Clearness index kt = GHI / (I0·cos z).
 * Method: definition (Liu & Jordan 1960); the cos z floor of 0.065 (z ≈ 86.3°) and the cap follow the common
 * guard used in pvlib's clearness_index (Holmgren, Hansen & Mikofski 2018, J. Open Source Softw. 3(29):884),
 * because near the horizon the ratio blows up.
 * @param ghiWm2 global horizontal irradiance [W/m²]
 * @param zenithDeg solar zenith [°]
 * @param i0Wm2 extraterrestrial normal irradiance [W/m²]
 * @param maxKt cap on the result [–], default 2
 * @returns clearness index kt [–], in [0, maxKt]
 */
export function clearnessIndex(ghiWm2: number, zenithDeg: number, i0Wm2: number, maxKt = 2): number {
  const cosZ = Math.max(Math.cos(zenithDeg * DEG_TO_RAD), 0.065);
  return clamp(ghiWm2 / (i0Wm2 * cosZ), 0, maxKt);
}

/**
 * Diffuse fraction of global horizontal irradiance from the clearness index.
 * Method: D. G. Erbs, S. A. Klein and J. A. Duffie, "Estimation of the diffuse radiation fraction for hourly,
 * daily and monthly-average global radiation", Solar Energy 28(4):293–302, 1982, eq. 1:
 * kt ≤ 0.22: 1 − 0.09·kt; 0.22 < kt ≤ 0.80: 0.9511 − 0.1604·kt + 4.388·kt² − 16.638·kt³ + 12.336·kt⁴;
 * kt > 0.80: 0.165.
 * Pitfall: some code carries the typo 12.334 for the quartic coefficient; the published value is 12.336
 * (guarded in tests/lib/solar/irradiance.test.ts).
 * @param kt clearness index [–]
 * @returns diffuse fraction DHI/GHI [–]
 */
export function diffuseFractionErbs1982(kt: number): number {
  if (kt <= 0.22) return 1 - 0.09 * kt;
  if (kt <= 0.8) return 0.9511 + kt * (-0.1604 + kt * (4.388 + kt * (-16.638 + kt * 12.336)));
  return 0.165;
}

/** Beam/diffuse split of a global horizontal irradiance. */
export interface Decomposition {
  /** Clearness index [–]. */
  kt: number;
  /** Direct normal irradiance [W/m²]. */
  dniWm2: number;
  /** Diffuse horizontal irradiance [W/m²]. */
  dhiWm2: number;
}

/** Above this zenith the Erbs split puts everything in the diffuse (pvlib erbs max_zenith = 87°). */
export const ERBS_MAX_ZENITH_DEG = 87;

/**
 * Split global horizontal irradiance into direct normal and diffuse horizontal.
 * Method: Erbs, Klein & Duffie 1982 (Solar Energy 28(4):293–302, eq. 1) for DHI = fd(kt)·GHI, then
 * DNI = (GHI − DHI)/cos z. Near the horizon (z > 87°) DNI is set to 0 and DHI = GHI, and DNI is capped at
 * the extraterrestrial value with DHI adjusted so that GHI = DHI + DNI·cos z still holds.
 * @param ghiWm2 global horizontal irradiance [W/m²] (≥ 0)
 * @param zenithDeg solar zenith [°]
 * @param i0Wm2 extraterrestrial normal irradiance [W/m²]
 * @returns kt [–], dniWm2 [W/m²], dhiWm2 [W/m²]
 */
export function decomposeErbs1982(ghiWm2: number, zenithDeg: number, i0Wm2: number): Decomposition {
  if (!(ghiWm2 > 0)) return { kt: 0, dniWm2: 0, dhiWm2: 0 };
  const kt = clearnessIndex(ghiWm2, zenithDeg, i0Wm2);
  const dhi = diffuseFractionErbs1982(kt) * ghiWm2;
  if (zenithDeg > ERBS_MAX_ZENITH_DEG) return { kt, dniWm2: 0, dhiWm2: ghiWm2 };
  const cosZ = Math.cos(zenithDeg * DEG_TO_RAD);
  let dni = (ghiWm2 - dhi) / cosZ;
  if (dni > i0Wm2) dni = i0Wm2;
  return { kt, dniWm2: dni, dhiWm2: ghiWm2 - dni * cosZ };
}

/**
 * Cloud attenuation factor of global irradiance.
 * Method: F. Kasten and G. Czeplak, "Solar and terrestrial radiation dependent on the amount and type of
 * cloud", Solar Energy 24:177–189, 1980: G/G_clear = 1 − 0.75·(N/8)^3.4.
 * @param okta total cloud cover N [okta], 0–8
 * @returns factor [–], 1 at 0 okta, 0.25 at 8 okta
 * @throws RangeError naming okta outside 0–8 or non-finite
 */
export function cloudFactorKastenCzeplak1980(okta: number): number {
  requireFinite('okta', okta);
  if (okta < 0 || okta > 8) throw new RangeError(`okta must be within [0, 8], got ${okta}`);
  return 1 - 0.75 * Math.pow(okta / 8, 3.4);
}

/** Tracking modes of a cooker aperture. */
export const TRACKING_MODES = ['fixed', 'one-axis', 'two-axis'] as const;
export type TrackingMode = (typeof TRACKING_MODES)[number];

/** Orientation of the aperture at one instant. */
export interface SurfaceOrientation {
  /** Aperture slope from horizontal [°]. */
  tiltDeg: number;
  /** Aperture azimuth, eastward from north [°]. */
  surfaceAzimuthDeg: number;
  /** Cosine of the angle of incidence of the beam [–] (may be negative: Sun behind the aperture). */
  cosIncidence: number;
}

/**
 * Aperture orientation and beam incidence for a tracking mode.
 * Methods:
 * - fixed: cos θ = cos z·cos β + sin z·sin β·cos(γs − γ) (Duffie & Beckman, "Solar Engineering of Thermal
 *   Processes", 4th ed., 2013, eq. 1.6.3; identical to Reda & Andreas 2004 eq. 47);
 * - one-axis, horizontal north–south axis, ideal east–west tracking (no backtracking, no rotation limit):
 *   rotation R = atan2(sin z·sin γs, cos z), cos θ = √(1 − sin²z·cos²γs) (Duffie & Beckman 2013, section 1.7,
 *   horizontal north–south axis with continuous adjustment);
 * - two-axis: normal to the Sun, cos θ = 1, tilt = z (Duffie & Beckman 2013, section 1.7).
 * For the tracking modes the given tilt/azimuth are ignored.
 * @param tracking 'fixed' | 'one-axis' | 'two-axis'
 * @param zenithDeg solar zenith [°]
 * @param azimuthDeg solar azimuth, eastward from north [°]
 * @param tiltDeg fixed aperture slope [°]
 * @param surfaceAzimuthDeg fixed aperture azimuth, eastward from north [°]
 * @returns aperture tilt [°], azimuth [°] and cos of the incidence angle [–]
 */
export function surfaceOrientation(
  tracking: TrackingMode,
  zenithDeg: number,
  azimuthDeg: number,
  tiltDeg: number,
  surfaceAzimuthDeg: number,
): SurfaceOrientation {
  const zr = zenithDeg * DEG_TO_RAD;
  const sinZ = Math.sin(zr);
  const cosZ = Math.cos(zr);
  if (tracking === 'two-axis') {
    return { tiltDeg: zenithDeg, surfaceAzimuthDeg: azimuthDeg, cosIncidence: 1 };
  }
  if (tracking === 'one-axis') {
    const ar = azimuthDeg * DEG_TO_RAD;
    const east = sinZ * Math.sin(ar); // Sun vector component toward east
    const north = sinZ * Math.cos(ar);
    const rot = Math.atan2(east, cosZ) * RAD_TO_DEG; // + toward east
    return {
      tiltDeg: Math.abs(rot),
      surfaceAzimuthDeg: rot >= 0 ? 90 : 270,
      cosIncidence: Math.sqrt(Math.max(0, 1 - north * north)),
    };
  }
  const br = tiltDeg * DEG_TO_RAD;
  return {
    tiltDeg,
    surfaceAzimuthDeg,
    cosIncidence: cosZ * Math.cos(br) + sinZ * Math.sin(br) * Math.cos((azimuthDeg - surfaceAzimuthDeg) * DEG_TO_RAD),
  };
}

/** Inputs of {@link apertureIrradiance}. */
export interface ApertureIrradianceInput {
  /** Direct normal irradiance [W/m²]. */
  dniWm2: number;
  /** Diffuse horizontal irradiance [W/m²]. */
  dhiWm2: number;
  /** Global horizontal irradiance [W/m²]. */
  ghiWm2: number;
  /** Apparent solar zenith [°]. */
  zenithDeg: number;
  /** Solar azimuth, eastward from north [°]. */
  azimuthDeg: number;
  tracking: TrackingMode;
  /** Fixed aperture slope [°] (ignored when tracking). */
  tiltDeg: number;
  /** Fixed aperture azimuth, eastward from north [°] (ignored when tracking). */
  surfaceAzimuthDeg: number;
  /** true for concentrators (only beam is usable); false for box cookers and flat collectors. */
  beamOnly: boolean;
  /** Ground reflectance [–]; default 0.2. */
  groundAlbedo?: number;
}

/** Result of {@link apertureIrradiance}, all [W/m²] except the angles. */
export interface ApertureIrradiance {
  /** Irradiance usable on the aperture [W/m²]. */
  gApertureWm2: number;
  /** Beam on the aperture [W/m²]. */
  beamWm2: number;
  /** Isotropic sky diffuse on the aperture [W/m²] (0 when beamOnly). */
  skyDiffuseWm2: number;
  /** Ground-reflected on the aperture [W/m²] (0 when beamOnly). */
  groundReflectedWm2: number;
  /** Angle of incidence of the beam [°]. */
  incidenceDeg: number;
  /** Aperture slope [°] and azimuth [°] at this instant. */
  tiltDeg: number;
  surfaceAzimuthDeg: number;
}

/**
 * Irradiance on a cooker aperture.
 * Method: beam = DNI·max(0, cos θ) with θ from {@link surfaceOrientation}; for non-concentrating apertures add
 * the isotropic sky diffuse DHI·(1 + cos β)/2 (B. Y. H. Liu and R. C. Jordan, "The long-term average
 * performance of flat-plate solar-energy collectors", Solar Energy 7(2):53–74, 1963) and the ground-reflected
 * GHI·ρ·(1 − cos β)/2 (Duffie & Beckman 2013, section 2.15, isotropic sky). Concentrators (beamOnly) use the beam only.
 * @param input irradiance components [W/m²], solar angles [°], geometry and ground albedo [–]
 * @returns usable aperture irradiance and its parts [W/m²], incidence [°], aperture orientation [°]
 */
export function apertureIrradiance(input: ApertureIrradianceInput): ApertureIrradiance {
  const o = surfaceOrientation(input.tracking, input.zenithDeg, input.azimuthDeg, input.tiltDeg, input.surfaceAzimuthDeg);
  const sunUp = input.zenithDeg < 90;
  const beam = sunUp ? input.dniWm2 * Math.max(0, o.cosIncidence) : 0;
  let sky = 0;
  let ground = 0;
  if (!input.beamOnly) {
    const cb = cosd(o.tiltDeg);
    sky = (input.dhiWm2 * (1 + cb)) / 2;
    ground = (input.ghiWm2 * (input.groundAlbedo ?? DEFAULT_GROUND_ALBEDO) * (1 - cb)) / 2;
  }
  return {
    gApertureWm2: beam + sky + ground,
    beamWm2: beam,
    skyDiffuseWm2: sky,
    groundReflectedWm2: ground,
    incidenceDeg: acosd(o.cosIncidence),
    tiltDeg: o.tiltDeg,
    surfaceAzimuthDeg: o.surfaceAzimuthDeg,
  };
}

/**
 * Usable aperture irradiance only, without allocating: the same method and units as {@link apertureIrradiance}
 * (beam on the aperture + isotropic sky diffuse + ground reflection, or beam only), for per-step loops.
 * @param dniWm2 direct normal [W/m²]
 * @param dhiWm2 diffuse horizontal [W/m²]
 * @param ghiWm2 global horizontal [W/m²]
 * @param zenithDeg apparent solar zenith [°]
 * @param azimuthDeg solar azimuth, eastward from north [°]
 * @param tracking tracking mode
 * @param tiltDeg fixed aperture slope [°]
 * @param surfaceAzimuthDeg fixed aperture azimuth [°]
 * @param beamOnly concentrator (beam only)
 * @param groundAlbedo ground reflectance [–]
 * @returns usable aperture irradiance [W/m²], ≥ 0
 */
export function apertureIrradianceWm2(
  dniWm2: number,
  dhiWm2: number,
  ghiWm2: number,
  zenithDeg: number,
  azimuthDeg: number,
  tracking: TrackingMode,
  tiltDeg: number,
  surfaceAzimuthDeg: number,
  beamOnly: boolean,
  groundAlbedo = DEFAULT_GROUND_ALBEDO,
): number {
  if (!(zenithDeg < 90) && (beamOnly || (dhiWm2 <= 0 && ghiWm2 <= 0))) return 0;
  const zr = zenithDeg * DEG_TO_RAD;
  const sinZ = Math.sin(zr);
  const cosZ = Math.cos(zr);
  let cosI: number;
  let cosTilt: number;
  if (tracking === 'two-axis') {
    cosI = 1;
    cosTilt = cosZ;
  } else if (tracking === 'one-axis') {
    const ar = azimuthDeg * DEG_TO_RAD;
    const north = sinZ * Math.cos(ar);
    cosI = Math.sqrt(Math.max(0, 1 - north * north));
    cosTilt = cosI > 0 ? cosZ / cosI : 1; // cos of the rotation = cos z / √(east² + cos²z) = cos z / cos θ
  } else {
    const br = tiltDeg * DEG_TO_RAD;
    cosTilt = Math.cos(br);
    cosI = cosZ * cosTilt + sinZ * Math.sin(br) * Math.cos((azimuthDeg - surfaceAzimuthDeg) * DEG_TO_RAD);
  }
  const beam = zenithDeg < 90 && cosI > 0 ? dniWm2 * cosI : 0;
  if (beamOnly) return beam;
  const g = beam + (dhiWm2 * (1 + cosTilt)) / 2 + (ghiWm2 * groundAlbedo * (1 - cosTilt)) / 2;
  return g > 0 ? g : 0;
}

/**
 * Mean of max(0, cos z) over an hour-angle interval, geometric (no refraction), and the fraction of the
 * interval with the Sun up.
 * Method: integral of cos z = sin φ·sin δ + cos φ·cos δ·cos ω over ω, clipped at the sunrise/sunset hour angle
 * ωs = arccos(−tan φ·tan δ) (Duffie & Beckman 2013, eqs. 1.6.10 and 1.10.4), δ held constant over the interval.
 * @param latitudeDeg latitude φ [°]
 * @param declinationDeg declination δ [°]
 * @param omega1Deg hour angle at the start [°]
 * @param omega2Deg hour angle at the end [°], > omega1Deg
 * @returns meanCosZ [–] and fraction of the interval with the Sun above the geometric horizon [–]
 */
export function meanCosZenithOverHourAngles(
  latitudeDeg: number,
  declinationDeg: number,
  omega1Deg: number,
  omega2Deg: number,
): { meanCosZ: number; sunUpFraction: number } {
  const a = sind(latitudeDeg) * sind(declinationDeg);
  const b = cosd(latitudeDeg) * cosd(declinationDeg);
  const w1 = omega1Deg * DEG_TO_RAD;
  const w2 = omega2Deg * DEG_TO_RAD;
  const span = w2 - w1;
  if (!(span > 0)) return { meanCosZ: 0, sunUpFraction: 0 };
  const integral = (x: number, y: number): number => a * (y - x) + b * (Math.sin(y) - Math.sin(x));
  if (b < 1e-12) return a > 0 ? { meanCosZ: a, sunUpFraction: 1 } : { meanCosZ: 0, sunUpFraction: 0 };
  const c = -a / b;
  if (c <= -1) return { meanCosZ: integral(w1, w2) / span, sunUpFraction: 1 }; // polar day
  if (c >= 1) return { meanCosZ: 0, sunUpFraction: 0 }; // polar night
  const ws = Math.acos(c);
  let sum = 0;
  let up = 0;
  const kLo = Math.floor((w1 - ws) / (2 * Math.PI)) - 1;
  const kHi = Math.ceil((w2 + ws) / (2 * Math.PI)) + 1;
  for (let k = kLo; k <= kHi; k++) {
    const lo = Math.max(w1, -ws + 2 * Math.PI * k);
    const hi = Math.min(w2, ws + 2 * Math.PI * k);
    if (hi > lo) {
      sum += integral(lo, hi);
      up += hi - lo;
    }
  }
  return { meanCosZ: Math.max(0, sum / span), sunUpFraction: up / span };
}
