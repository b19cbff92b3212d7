/**
 * The bridge from hourly weather (forecast, measurements or a clear-sky fallback) to the cooker model's
 * per-step driving weather on the aperture ({@link WeatherStep}, lib/thermal/types.ts).
 *
 * Conventions (lib/GLOSSARY.md): epoch ms UTC, irradiance [W/m²], temperatures [°C], wind [m/s], angles [°].
 */
import type { WeatherStep } from '@/lib/weather-step';
import { DEG_TO_RAD, limitDegrees } from './angles';
import { assertLinkeTurbidityMonthly, clearSkyIneichenPerez2002, linkeTurbidityForMonth } from './clearsky';
import {
  SOLAR_CONSTANT_WM2,
  DEFAULT_GROUND_ALBEDO,
  TRACKING_MODES,
  apertureIrradianceWm2,
  cloudFactorKastenCzeplak1980,
  decomposeErbs1982,
  meanCosZenithOverHourAngles,
  type TrackingMode,
} from './irradiance';
import { DEFAULT_DELTA_T_S, SOLAR_POSITION_MODELS, solarPositionNoaa, solarPositionsSpaFast, type SolarPositionModel } from './position';

/** A kitchen's place. */
export interface Site {
  /** [°], positive north. */
  latitudeDeg: number;
  /** [°], positive east. */
  longitudeDeg: number;
  /** Elevation above sea level [m]. */
  altitudeM: number;
  /** Optional 12 monthly Linke turbidity values, January … December [–]. */
  linkeTurbidity?: number[];
}

/**
 * One hour of weather. Values describe the hour [t, t + 1 h): irradiances are hour means, temperature and
 * wind are representative of the hour (they are placed at mid-hour for interpolation).
 */
export interface HourlyWeather {
  /** Start of the hour [epoch ms UTC]. */
  t: number;
  /** Global horizontal irradiance [W/m²]. */
  ghiWm2?: number;
  /** Direct normal irradiance [W/m²]. */
  dniWm2?: number;
  /** Diffuse horizontal irradiance [W/m²]. */
  dhiWm2?: number;
  /** Total cloud cover [okta], 0–8. */
  cloudOkta?: number;
  /** Air temperature [°C]. */
  tAirC: number;
  /** Wind speed [m/s]. */
  windMS?: number;
}

/** The cooker's aperture. */
export interface ApertureGeometry {
  tracking: TrackingMode;
  /** Slope of a fixed aperture from horizontal [°] (ignored when tracking). */
  tiltDeg: number;
  /** Azimuth of a fixed aperture, eastward from north [°] (ignored when tracking). */
  surfaceAzimuthDeg: number;
  /** true for concentrators (beam only), false for box cookers (beam + diffuse + ground). */
  beamOnly: boolean;
  /** Ground reflectance [–]; default 0.2. */
  groundAlbedo?: number;
}

/** Options of {@link resolveWeatherToAperture} and {@link clearSkyHourly}. */
export interface SolarOptions {
  /** Solar position model; default 'spa' (fast interpolated SPA). */
  solarModel?: SolarPositionModel;
  /** ΔT = TT − UT1 [s] for SPA; default 69. */
  deltaTS?: number;
}

/** Per-step detail behind {@link resolveWeatherToAperture} (arrays aligned with steps). */
export interface ResolvedWeather {
  steps: WeatherStep[];
  /** Step mid-times [epoch ms UTC]. */
  midMs: Float64Array;
  /** Apparent (refracted) solar zenith at mid-step [°]; used for the beam direction and the sky models. */
  zenithDeg: Float64Array;
  /** Geometric solar zenith at mid-step [°]; used for the extraterrestrial horizontal irradiance I0·cos z. */
  zenithNoRefractionDeg: Float64Array;
  /** Solar azimuth at mid-step, eastward from north [°]. */
  azimuthDeg: Float64Array;
  /** Extraterrestrial normal irradiance [W/m²]. */
  i0Wm2: Float64Array;
  /** Global horizontal, direct normal, diffuse horizontal irradiance [W/m²]. */
  ghiWm2: Float64Array;
  dniWm2: Float64Array;
  dhiWm2: Float64Array;
  /** Which input drove each hour: 'beam-diffuse' (DNI+DHI), 'global' (GHI → Erbs), 'cloud' (okta → clear sky). */
  hourSource: HourSource[];
}

export type HourSource = 'beam-diffuse' | 'global' | 'cloud';

const HOUR_MS = 3_600_000;

// ───────────────────────────── validation ─────────────────────────────

function fail(name: string, what: string, got: unknown): never {
  throw new RangeError(`${name} ${what}, got ${typeof got === 'number' || typeof got === 'string' ? got : JSON.stringify(got)}`);
}

function checkNumber(name: string, x: unknown, lo = -Infinity, hi = Infinity): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) fail(name, 'must be a finite number', x);
  if (x < lo || x > hi) fail(name, `must be within [${lo}, ${hi}]`, x);
}

/** Validates a {@link Site}; throws RangeError naming the field. */
export function assertSite(site: Site): void {
  if (typeof site !== 'object' || site === null) fail('site', 'must be an object', site);
  checkNumber('site.latitudeDeg', site.latitudeDeg, -90, 90);
  checkNumber('site.longitudeDeg', site.longitudeDeg, -180, 180);
  checkNumber('site.altitudeM', site.altitudeM, -500, 9000);
  if (site.linkeTurbidity !== undefined) assertLinkeTurbidityMonthly(site.linkeTurbidity, 'site.linkeTurbidity');
}

/** Validates an {@link ApertureGeometry}; throws RangeError naming the field. */
export function assertGeometry(g: ApertureGeometry): void {
  if (typeof g !== 'object' || g === null) fail('geometry', 'must be an object', g);
  if (!(TRACKING_MODES as readonly string[]).includes(g.tracking)) {
    fail('geometry.tracking', `must be one of ${TRACKING_MODES.map((m) => `'${m}'`).join(', ')}`, String(g.tracking));
  }
  checkNumber('geometry.tiltDeg', g.tiltDeg, 0, 180);
  checkNumber('geometry.surfaceAzimuthDeg', g.surfaceAzimuthDeg, -360, 360);
  if (typeof g.beamOnly !== 'boolean') fail('geometry.beamOnly', 'must be a boolean', String(g.beamOnly));
  if (g.groundAlbedo !== undefined) checkNumber('geometry.groundAlbedo', g.groundAlbedo, 0, 1);
}

function assertOptions(opts: SolarOptions | undefined): { model: SolarPositionModel; deltaTS: number } {
  const model = opts?.solarModel ?? 'spa';
  if (!(SOLAR_POSITION_MODELS as readonly string[]).includes(model)) {
    fail('opts.solarModel', `must be one of ${SOLAR_POSITION_MODELS.map((m) => `'${m}'`).join(', ')}`, String(model));
  }
  const deltaTS = opts?.deltaTS ?? DEFAULT_DELTA_T_S;
  checkNumber('opts.deltaTS', deltaTS, -8000, 8000);
  return { model, deltaTS };
}

/** Validates hourly records and returns which input drives each hour; throws RangeError naming the field. */
function assertHourly(hourly: HourlyWeather[]): HourSource[] {
  if (!Array.isArray(hourly) || hourly.length === 0) fail('hourly', 'must be a non-empty array', Array.isArray(hourly) ? 0 : typeof hourly);
  const sources: HourSource[] = [];
  for (let i = 0; i < hourly.length; i++) {
    const h = hourly[i] as HourlyWeather;
    const p = `hourly[${i}]`;
    if (typeof h !== 'object' || h === null) fail(p, 'must be an object', h);
    checkNumber(`${p}.t`, h.t);
    if (i > 0) {
      const prev = (hourly[i - 1] as HourlyWeather).t;
      if (h.t <= prev) fail(`${p}.t`, `must be after hourly[${i - 1}].t (hours must be sorted)`, h.t);
      if (h.t - prev !== HOUR_MS) fail(`${p}.t`, `must be exactly 3600000 ms after hourly[${i - 1}].t (gap or overlap)`, h.t);
    }
    for (const k of ['ghiWm2', 'dniWm2', 'dhiWm2'] as const) {
      const v = h[k];
      if (v !== undefined) checkNumber(`${p}.${k}`, v, 0, 2000);
    }
    if (h.cloudOkta !== undefined) checkNumber(`${p}.cloudOkta`, h.cloudOkta, 0, 8);
    checkNumber(`${p}.tAirC`, h.tAirC, -90, 70);
    if (h.windMS !== undefined) checkNumber(`${p}.windMS`, h.windMS, 0, 100);
    if (h.dniWm2 !== undefined && h.dhiWm2 !== undefined) sources.push('beam-diffuse');
    else if (h.ghiWm2 !== undefined) sources.push('global');
    else if (h.cloudOkta !== undefined) sources.push('cloud');
    else fail(p, 'needs dniWm2 + dhiWm2, or ghiWm2, or cloudOkta', 'none of them');
  }
  return sources;
}

// ───────────────────────────── sun sampling ─────────────────────────────

interface SunSamples {
  zenithDeg: Float64Array;
  zenithNoRefractionDeg: Float64Array;
  azimuthDeg: Float64Array;
  earthSunDistanceAu: Float64Array;
  declinationDeg: Float64Array;
  hourAngleDeg: Float64Array;
}

function sampleSun(timesMs: Float64Array, site: Site, model: SolarPositionModel, deltaTS: number): SunSamples {
  if (model === 'spa') {
    return solarPositionsSpaFast(timesMs, { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM }, deltaTS);
  }
  const n = timesMs.length;
  const s: SunSamples = {
    zenithDeg: new Float64Array(n),
    zenithNoRefractionDeg: new Float64Array(n),
    azimuthDeg: new Float64Array(n),
    earthSunDistanceAu: new Float64Array(n),
    declinationDeg: new Float64Array(n),
    hourAngleDeg: new Float64Array(n),
  };
  for (let i = 0; i < n; i++) {
    const r = solarPositionNoaa({ timeMs: timesMs[i] as number, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg });
    s.zenithDeg[i] = r.zenithDeg;
    s.zenithNoRefractionDeg[i] = r.zenithNoRefractionDeg;
    s.azimuthDeg[i] = r.azimuthDeg;
    s.earthSunDistanceAu[i] = r.earthSunDistanceAu;
    s.declinationDeg[i] = r.declinationDeg;
    s.hourAngleDeg[i] = r.hourAngleDeg;
  }
  return s;
}

// ───────────────────────────── per-hour parameters ─────────────────────────────

/** Hour-level drivers: beam and diffuse transmittances, clearness index or cloud cover. */
interface HourParams {
  source: HourSource;
  /** beam-diffuse: beam clear-sky index DNI / hourly mean of the Ineichen–Perez clear-sky DNI [–] */
  kb: number;
  /** beam-diffuse: DHI / mean extraterrestrial horizontal [–] */
  kd: number;
  /** global: clearness index kt = GHI / mean extraterrestrial horizontal [–] */
  kt: number;
  /** cloud: okta */
  okta: number;
  /** Linke turbidity for the hour's month [–] */
  tl: number;
}

/** Cap of the hourly indices kt and kd: near sunrise/sunset a small I0h makes the ratio meaningless. */
const MAX_HOURLY_INDEX = 1;
/** Cap of the beam clear-sky index kb (it may exceed 1 when the Linke turbidity used is too high). */
const MAX_BEAM_INDEX = 2;
/** Sub-samples per hour for the hourly mean of the clear-sky DNI (5-minute midpoints). */
const BEAM_SAMPLES_PER_HOUR = 12;

/**
 * Hour drivers from the records and the sun at the n + 1 hour boundaries (hour angle and declination feed the
 * analytic hourly mean of cos z).
 */
function hourParams(
  hourly: HourlyWeather[],
  sources: HourSource[],
  site: Site,
  sun: SunSamples,
  beamSun: SunSamples | null,
): HourParams[] {
  const n = hourly.length;
  const params: HourParams[] = [];
  const k = BEAM_SAMPLES_PER_HOUR;
  for (let h = 0; h < n; h++) {
    const rec = hourly[h] as HourlyWeather;
    const source = sources[h] as HourSource;
    const w1 = sun.hourAngleDeg[h] as number;
    const w2 = w1 + limitDegrees((sun.hourAngleDeg[h + 1] as number) - w1);
    const decl = 0.5 * ((sun.declinationDeg[h] as number) + (sun.declinationDeg[h + 1] as number));
    const r = 0.5 * ((sun.earthSunDistanceAu[h] as number) + (sun.earthSunDistanceAu[h + 1] as number));
    const i0 = SOLAR_CONSTANT_WM2 / (r * r);
    const { meanCosZ } = meanCosZenithOverHourAngles(site.latitudeDeg, decl, w1, w2);
    const i0hMean = i0 * meanCosZ;
    const ratio = (num: number, den: number): number => (den > 1e-9 ? Math.min(MAX_HOURLY_INDEX, num / den) : 0);
    const month = new Date(rec.t + HOUR_MS / 2).getUTCMonth();
    const tl = linkeTurbidityForMonth(month, site.latitudeDeg, site.linkeTurbidity);
    let kb = 0;
    if (source === 'beam-diffuse' && beamSun) {
      // Hourly mean of the clear-sky DNI, so the hour's beam is spread within the hour like a clear-sky beam.
      let clearDni = 0;
      for (let j = 0; j < k; j++) {
        const z = beamSun.zenithDeg[h * k + j] as number;
        const rj = beamSun.earthSunDistanceAu[h * k + j] as number;
        if (z < 90) {
          clearDni += clearSkyIneichenPerez2002({ zenithDeg: z, altitudeM: site.altitudeM, linkeTurbidity: tl, i0Wm2: SOLAR_CONSTANT_WM2 / (rj * rj) }).dniWm2;
        }
      }
      clearDni /= k;
      kb = clearDni > 1e-6 ? Math.min(MAX_BEAM_INDEX, (rec.dniWm2 ?? 0) / clearDni) : 0;
    }
    params.push({
      source,
      kb,
      kd: source === 'beam-diffuse' ? ratio(rec.dhiWm2 ?? 0, i0hMean) : 0,
      kt: source === 'global' ? ratio(rec.ghiWm2 ?? 0, i0hMean) : 0,
      okta: source === 'cloud' ? (rec.cloudOkta ?? 0) : 0,
      tl,
    });
  }
  return params;
}

/**
 * Components at one step from one set of hour parameters; writes into out = [ghi, dni, dhi].
 * The hourly indices were formed against the geometric I0·cos z, so they multiply the geometric cos z here
 * (using the refracted zenith would add ~1–3 % at low sun in winter at high latitudes); the beam direction,
 * the clear-sky model and the Erbs split use the apparent zenith.
 */
function componentsAt(
  p: HourParams,
  kb: number,
  kd: number,
  kt: number,
  okta: number,
  zenithDeg: number,
  zenithTrueDeg: number,
  i0: number,
  altitudeM: number,
  out: [number, number, number],
): void {
  if (!(zenithDeg < 90)) {
    out[0] = 0;
    out[1] = 0;
    out[2] = 0;
    return;
  }
  const cosZ = Math.cos(zenithDeg * DEG_TO_RAD);
  const cosZTrue = zenithTrueDeg < 90 ? Math.cos(zenithTrueDeg * DEG_TO_RAD) : 0;
  if (p.source === 'beam-diffuse') {
    const clear = clearSkyIneichenPerez2002({ zenithDeg, altitudeM, linkeTurbidity: p.tl, i0Wm2: i0 }).dniWm2;
    const dni = Math.min(kb * clear, i0);
    const dhi = kd * i0 * cosZTrue;
    out[0] = dhi + dni * cosZ;
    out[1] = dni;
    out[2] = dhi;
    return;
  }
  let ghi: number;
  if (p.source === 'global') {
    ghi = kt * i0 * cosZTrue;
  } else {
    // Cloud only: Ineichen–Perez clear sky × Kasten–Czeplak, then Erbs for the split.
    ghi = clearSkyIneichenPerez2002({ zenithDeg, altitudeM, linkeTurbidity: p.tl, i0Wm2: i0 }).ghiWm2 * cloudFactorKastenCzeplak1980(okta);
  }
  const d = decomposeErbs1982(ghi, zenithDeg, i0);
  out[0] = ghi;
  out[1] = d.dniWm2;
  out[2] = d.dhiWm2;
}

// ───────────────────────────── resolve ─────────────────────────────

/**
 * Hourly weather → per-step irradiance on the aperture, air temperature and wind, with the detail behind it.
 * See {@link resolveWeatherToAperture} for the method; this variant also returns the per-step sun and components.
 * @param site place ([°], [m], optional monthly Linke turbidity)
 * @param geometry aperture (tracking, tilt [°], azimuth [°], beamOnly, albedo [–])
 * @param hourly consecutive hours (see {@link HourlyWeather})
 * @param stepS step length [s], 0 < stepS ≤ 3600
 * @param opts solar position model and ΔT [s]
 * @returns steps plus per-step arrays (see {@link ResolvedWeather})
 */
export function resolveWeatherDetailed(
  site: Site,
  geometry: ApertureGeometry,
  hourly: HourlyWeather[],
  stepS: number,
  opts?: SolarOptions,
): ResolvedWeather {
  assertSite(site);
  assertGeometry(geometry);
  checkNumber('stepS', stepS);
  if (!(stepS > 0 && stepS <= 3600)) fail('stepS', 'must be > 0 and ≤ 3600', stepS);
  const stepMs = stepS * 1000;
  const { model, deltaTS } = assertOptions(opts);
  const sources = assertHourly(hourly);

  const nHours = hourly.length;
  const t0 = (hourly[0] as HourlyWeather).t;
  const spanMs = nHours * HOUR_MS;
  // Steps cover the hours given; when stepS does not divide the span the last step runs past the end.
  const nSteps = Math.ceil(spanMs / stepMs - 1e-9);
  // One sun sampling for the step mid-times, then the nHours + 1 hour boundaries, then (only when some hour gives
  // DNI + DHI) 12 sub-samples per hour for the clear-sky beam shape, so the fast SPA's hourly geocentric nodes
  // are computed once.
  const needBeam = sources.includes('beam-diffuse');
  const kSub = BEAM_SAMPLES_PER_HOUR;
  const nBound = nHours + 1;
  const times = new Float64Array(nSteps + nBound + (needBeam ? nHours * kSub : 0));
  for (let i = 0; i < nSteps; i++) times[i] = t0 + i * stepMs + stepMs / 2;
  for (let h = 0; h <= nHours; h++) times[nSteps + h] = t0 + h * HOUR_MS;
  if (needBeam) {
    for (let h = 0; h < nHours; h++) {
      for (let j = 0; j < kSub; j++) times[nSteps + nBound + h * kSub + j] = t0 + h * HOUR_MS + ((j + 0.5) * HOUR_MS) / kSub;
    }
  }
  const all = sampleSun(times, site, model, deltaTS);
  const part = (from: number, to: number): SunSamples => ({
    zenithDeg: all.zenithDeg.subarray(from, to),
    zenithNoRefractionDeg: all.zenithNoRefractionDeg.subarray(from, to),
    azimuthDeg: all.azimuthDeg.subarray(from, to),
    earthSunDistanceAu: all.earthSunDistanceAu.subarray(from, to),
    declinationDeg: all.declinationDeg.subarray(from, to),
    hourAngleDeg: all.hourAngleDeg.subarray(from, to),
  });
  const midMs = times.slice(0, nSteps);
  const sun = part(0, nSteps);
  const boundarySun = part(nSteps, nSteps + nBound);
  const beamSun = needBeam ? part(nSteps + nBound, times.length) : null;
  const params = hourParams(hourly, sources, site, boundarySun, beamSun);

  const ghiA = new Float64Array(nSteps);
  const dniA = new Float64Array(nSteps);
  const dhiA = new Float64Array(nSteps);
  const i0A = new Float64Array(nSteps);
  const steps: WeatherStep[] = new Array<WeatherStep>(nSteps);
  const ca: [number, number, number] = [0, 0, 0];
  const cb: [number, number, number] = [0, 0, 0];
  const tracking = geometry.tracking;
  const albedo = geometry.groundAlbedo ?? DEFAULT_GROUND_ALBEDO;
  const firstCentre = t0 + HOUR_MS / 2;

  for (let i = 0; i < nSteps; i++) {
    const m = midMs[i] as number;
    // Linear interpolation between hour centres; held constant before the first and after the last centre.
    const pos = (m - firstCentre) / HOUR_MS;
    let a: number;
    let b: number;
    let w: number;
    if (pos <= 0) {
      a = 0;
      b = 0;
      w = 0;
    } else if (pos >= nHours - 1) {
      a = nHours - 1;
      b = a;
      w = 0;
    } else {
      a = Math.floor(pos);
      b = a + 1;
      w = pos - a;
    }
    const pa = params[a] as HourParams;
    const pb = params[b] as HourParams;
    const z = sun.zenithDeg[i] as number;
    const zTrue = sun.zenithNoRefractionDeg[i] as number;
    const r = sun.earthSunDistanceAu[i] as number;
    const i0 = SOLAR_CONSTANT_WM2 / (r * r);
    i0A[i] = i0;
    if (pa.source === pb.source) {
      // Same driver on both sides: interpolate the driver (clearness index, transmittances or okta).
      componentsAt(
        pa,
        pa.kb + w * (pb.kb - pa.kb),
        pa.kd + w * (pb.kd - pa.kd),
        pa.kt + w * (pb.kt - pa.kt),
        pa.okta + w * (pb.okta - pa.okta),
        z,
        zTrue,
        i0,
        site.altitudeM,
        ca,
      );
    } else {
      // Different drivers: evaluate each and blend the components linearly (keeps GHI = DHI + DNI·cos z).
      componentsAt(pa, pa.kb, pa.kd, pa.kt, pa.okta, z, zTrue, i0, site.altitudeM, ca);
      componentsAt(pb, pb.kb, pb.kd, pb.kt, pb.okta, z, zTrue, i0, site.altitudeM, cb);
      ca[0] += w * (cb[0] - ca[0]);
      ca[1] += w * (cb[1] - ca[1]);
      ca[2] += w * (cb[2] - ca[2]);
    }
    ghiA[i] = ca[0];
    dniA[i] = ca[1];
    dhiA[i] = ca[2];

    const g = apertureIrradianceWm2(
      ca[1],
      ca[2],
      ca[0],
      z,
      sun.azimuthDeg[i] as number,
      tracking,
      geometry.tiltDeg,
      geometry.surfaceAzimuthDeg,
      geometry.beamOnly,
      albedo,
    );

    const ha = hourly[a] as HourlyWeather;
    const hb = hourly[b] as HourlyWeather;
    const step: WeatherStep = {
      t: t0 + i * stepMs,
      gApertureWm2: g > 0 ? g : 0,
      tAirC: ha.tAirC + w * (hb.tAirC - ha.tAirC),
    };
    const wa = ha.windMS;
    const wb = hb.windMS;
    if (wa !== undefined && wb !== undefined) step.windMS = wa + w * (wb - wa);
    else if (wa !== undefined || wb !== undefined) step.windMS = (wa ?? wb) as number;
    steps[i] = step;
  }

  return {
    steps,
    midMs,
    zenithDeg: sun.zenithDeg.slice(),
    zenithNoRefractionDeg: sun.zenithNoRefractionDeg.slice(),
    azimuthDeg: sun.azimuthDeg.slice(),
    i0Wm2: i0A,
    ghiWm2: ghiA,
    dniWm2: dniA,
    dhiWm2: dhiA,
    hourSource: sources,
  };
}

/**
 * Hourly weather → the cooker model's per-step weather on the aperture.
 * Method:
 * 1. Sun at each step's mid-time by SPA (Reda & Andreas, NREL/TP-560-34302, 2004; geocentric part interpolated
 *    hourly, see solarPositionsSpaFast) or NOAA.
 * 2. Per hour, the driver: DNI + DHI given → beam clear-sky index kb = DNI / hourly mean of the Ineichen–Perez
 *    clear-sky DNI (so the beam keeps a clear-sky shape within the hour, capped at 2) and diffuse index
 *    kd = DHI/Ī0h; GHI only → clearness index kt = GHI/Ī0h; cloud only → okta. Ī0h is the exact hourly mean of
 *    the (geometric) extraterrestrial horizontal irradiance (Duffie & Beckman, "Solar Engineering of Thermal
 *    Processes", 2013, eq. 1.10.4); kt and kd are capped at 1.
 * 3. Drivers are interpolated linearly in time between hour centres and multiplied by the step's own
 *    extraterrestrial irradiance, so night stays exactly zero: GHI-only → GHI = kt·I0·cos z, split by Erbs et
 *    al. 1982 (Solar Energy 28(4):293–302); cloud-only → Ineichen & Perez 2002 clear sky (Solar Energy
 *    73(3):151–157) × Kasten & Czeplak 1980 cloud factor (Solar Energy 24:177–189), split by Erbs.
 * 4. Aperture irradiance by tracking mode, beam-only or beam + isotropic diffuse (Liu & Jordan 1963) + ground.
 * Air temperature and wind are interpolated linearly between hour centres.
 * @param site place: latitude/longitude [°], altitude [m], optional 12 monthly Linke turbidity [–]
 * @param geometry aperture: tracking mode, tilt [°], azimuth [°] (eastward from north), beamOnly, albedo [–]
 * @param hourly consecutive hourly records (sorted, exactly 1 h apart; irradiance [W/m²] ≥ 0, okta 0–8, [°C], [m/s])
 * @param stepS step [s], 0 < stepS ≤ 3600
 * @param opts solar position model ('spa' default, or 'noaa') and ΔT [s]
 * @returns contiguous, equally spaced steps from hourly[0].t covering all hours: t [epoch ms], gApertureWm2
 *   [W/m²], tAirC [°C], windMS [m/s] when given
 * @throws RangeError naming the argument for bad inputs
 */
export function resolveWeatherToAperture(
  site: Site,
  geometry: ApertureGeometry,
  hourly: HourlyWeather[],
  stepS: number,
  opts?: SolarOptions,
): WeatherStep[] {
  return resolveWeatherDetailed(site, geometry, hourly, stepS, opts).steps;
}

// ───────────────────────────── clear-sky fallback series ─────────────────────────────

/** Options of {@link clearSkyHourly}. */
export interface ClearSkyHourlyOptions extends SolarOptions {
  /**
   * Air temperature: a daily minimum and maximum [°C], or a daily mean [°C] (then ±6 K). Default 15–30 °C
   * (common practice, no source).
   */
  tAirC?: number | { minC: number; maxC: number };
  /** Scale of the clear-sky global irradiance, 0–1 [–]; default 1. Below 1 the split comes from Erbs et al. 1982. */
  clearness?: number;
  /** Constant wind speed [m/s]; omitted when not given. */
  windMS?: number;
}

/** Sub-samples per hour for the clear-sky hourly means (5-minute midpoints). */
const CLEAR_SKY_SAMPLES_PER_HOUR = 12;
/** Largest clear-sky series [h] (about 11 years). */
const MAX_CLEAR_SKY_HOURS = 100_000;

/**
 * Daily air-temperature cycle: minimum at 06:00 and maximum at 15:00 local mean solar time, half-cosine rise over
 * 9 h and half-cosine fall over 15 h. Method: common practice, no source (a simple asymmetric-cosine shape).
 * @param solarHour local mean solar time [h], any real
 * @param minC daily minimum [°C]
 * @param maxC daily maximum [°C]
 * @returns air temperature [°C]
 */
export function dailyAirTemperatureC(solarHour: number, minC: number, maxC: number): number {
  const s = ((solarHour % 24) + 24) % 24;
  if (s >= 6 && s < 15) return minC + ((maxC - minC) * (1 - Math.cos((Math.PI * (s - 6)) / 9))) / 2;
  const d = (s - 15 + 24) % 24; // hours since the maximum, 0–15
  return maxC - ((maxC - minC) * (1 - Math.cos((Math.PI * d) / 15))) / 2;
}

/**
 * A clear-sky hourly weather series: the fallback when no forecast exists.
 * Method: hourly means of 12 five-minute samples of the Ineichen & Perez 2002 clear sky (Solar Energy
 * 73(3):151–157) with the site's monthly Linke turbidity, sun by SPA (Reda & Andreas 2004) or NOAA; when
 * clearness < 1 the global irradiance is scaled and re-split by Erbs et al. 1982 (Solar Energy 28(4):293–302).
 * Air temperature follows {@link dailyAirTemperatureC} in local mean solar time (UTC + longitude/15).
 * @param site place ([°], [m], optional monthly Linke turbidity)
 * @param fromMs first instant [epoch ms UTC]; the series starts at the UTC hour containing it
 * @param toMs end [epoch ms UTC], exclusive; hours start before it
 * @param opts tAirC [°C], clearness [–], windMS [m/s], solar model, ΔT [s]
 * @returns consecutive hourly records with ghiWm2, dniWm2, dhiWm2 [W/m²], tAirC [°C] and windMS if given
 * @throws RangeError naming the argument for bad inputs
 */
export function clearSkyHourly(site: Site, fromMs: number, toMs: number, opts?: ClearSkyHourlyOptions): HourlyWeather[] {
  assertSite(site);
  checkNumber('fromMs', fromMs);
  checkNumber('toMs', toMs);
  if (!(toMs > fromMs)) fail('toMs', 'must be after fromMs', toMs);
  const { model, deltaTS } = assertOptions(opts);
  const clearness = opts?.clearness ?? 1;
  checkNumber('opts.clearness', clearness, 0, 1);
  let minC = 15;
  let maxC = 30;
  const tOpt = opts?.tAirC;
  if (typeof tOpt === 'number') {
    checkNumber('opts.tAirC', tOpt, -90, 70);
    minC = tOpt - 6;
    maxC = tOpt + 6;
  } else if (tOpt !== undefined) {
    checkNumber('opts.tAirC.minC', tOpt.minC, -90, 70);
    checkNumber('opts.tAirC.maxC', tOpt.maxC, -90, 70);
    if (tOpt.maxC < tOpt.minC) fail('opts.tAirC.maxC', 'must be ≥ opts.tAirC.minC', tOpt.maxC);
    minC = tOpt.minC;
    maxC = tOpt.maxC;
  }
  if (opts?.windMS !== undefined) checkNumber('opts.windMS', opts.windMS, 0, 100);

  const first = Math.floor(fromMs / HOUR_MS) * HOUR_MS;
  const nHours = Math.ceil((toMs - first) / HOUR_MS);
  if (nHours > MAX_CLEAR_SKY_HOURS) fail('toMs', `must be within ${MAX_CLEAR_SKY_HOURS} hours of fromMs`, toMs);

  const k = CLEAR_SKY_SAMPLES_PER_HOUR;
  const times = new Float64Array(nHours * k);
  for (let h = 0; h < nHours; h++) {
    for (let j = 0; j < k; j++) times[h * k + j] = first + h * HOUR_MS + ((j + 0.5) * HOUR_MS) / k;
  }
  const sun = sampleSun(times, site, model, deltaTS);
  const out: HourlyWeather[] = [];
  for (let h = 0; h < nHours; h++) {
    const t = first + h * HOUR_MS;
    const tl = linkeTurbidityForMonth(new Date(t + HOUR_MS / 2).getUTCMonth(), site.latitudeDeg, site.linkeTurbidity);
    let ghi = 0;
    let dni = 0;
    let dhi = 0;
    for (let j = 0; j < k; j++) {
      const idx = h * k + j;
      const z = sun.zenithDeg[idx] as number;
      if (!(z < 90)) continue;
      const r = sun.earthSunDistanceAu[idx] as number;
      const i0 = SOLAR_CONSTANT_WM2 / (r * r);
      const cs = clearSkyIneichenPerez2002({ zenithDeg: z, altitudeM: site.altitudeM, linkeTurbidity: tl, i0Wm2: i0 });
      if (clearness === 1) {
        ghi += cs.ghiWm2;
        dni += cs.dniWm2;
        dhi += cs.dhiWm2;
      } else {
        const g = cs.ghiWm2 * clearness;
        const d = decomposeErbs1982(g, z, i0);
        ghi += g;
        dni += d.dniWm2;
        dhi += d.dhiWm2;
      }
    }
    const solarHour = (t + HOUR_MS / 2) / HOUR_MS + site.longitudeDeg / 15;
    const rec: HourlyWeather = {
      t,
      ghiWm2: ghi / k,
      dniWm2: dni / k,
      dhiWm2: dhi / k,
      tAirC: dailyAirTemperatureC(solarHour, minC, maxC),
    };
    if (opts?.windMS !== undefined) rec.windMS = opts.windMS;
    out.push(rec);
  }
  return out;
}
