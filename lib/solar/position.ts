/**
 * Solar position.
 *
 * - {@link solarPositionSpa}: the NREL Solar Position Algorithm, in full.
 *   I. Reda and A. Andreas, "Solar Position Algorithm for Solar Radiation Applications",
 *   NREL/TP-560-34302, 2003 (revised 2008); Solar Energy 76(5):577–589, 2004. Stated
 *   uncertainty ±0.0003° for the years −2000…6000. Equation numbers below refer to section 3 of
 *   the report; sunrise/transit/sunset follow its appendix A.2.
 * - {@link solarPositionNoaa}: the NOAA Global Monitoring Laboratory solar calculator spreadsheet
 *   equations (after J. Meeus, "Astronomical Algorithms", 1991): cheap, geocentric, ≈0.01° class.
 * - {@link solarPositionsSpaFast}: SPA for many instants at one place; the slow geocentric part is
 *   evaluated on an hourly grid and interpolated, the fast local part per instant.
 *
 * Conventions (lib/GLOSSARY.md): times are epoch milliseconds UTC; angles in degrees; azimuth is
 * measured eastward from north; longitude is positive east of Greenwich.
 */
import {
  DEG_TO_RAD,
  RAD_TO_DEG,
  acosd,
  asind,
  atan2d,
  atand,
  clamp,
  cosd,
  limitDegrees,
  limitDegrees180pm,
  limitZeroToOne,
  sind,
  tand,
} from './angles';
import { B_TERMS, L_TERMS, NUTATION_TERMS, R_TERMS, type EarthTerm } from './spa-tables';

/** Default ΔT = TT − UT1 [s]; ≈ 69 s for the 2020s (IERS Bulletin A values hover at 69.1–69.4 s). */
export const DEFAULT_DELTA_T_S = 69;
/** SPA default atmospheric refraction at sunrise/sunset [°] (Reda & Andreas 2004, section 3.14 and A.2). */
export const DEFAULT_ATMOS_REFRACTION_DEG = 0.5667;
/** Apparent solar radius [°] used by SPA to decide when to apply the refraction correction. */
export const SUN_RADIUS_DEG = 0.26667;
/** Default annual mean local air temperature for refraction [°C] (common practice, no source). */
export const DEFAULT_REFRACTION_T_AIR_C = 15;

const MS_PER_DAY = 86_400_000;
const HOUR_MS = 3_600_000;
/** Julian day of the Unix epoch 1970-01-01T00:00:00Z. */
const JD_UNIX_EPOCH = 2440587.5;
/** Julian day of J2000.0. */
const JD_J2000 = 2451545;

// ───────────────────────────── input checks ─────────────────────────────

function requireFinite(name: string, x: number): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new RangeError(`${name} must be a finite number, got ${String(x)}`);
}

function requireRange(name: string, x: number, lo: number, hi: number): void {
  requireFinite(name, x);
  if (x < lo || x > hi) throw new RangeError(`${name} must be within [${lo}, ${hi}], got ${x}`);
}

/** Validates a geographic position; throws RangeError naming the field. */
export function assertLatLon(latitudeDeg: number, longitudeDeg: number, prefix = ''): void {
  requireRange(`${prefix}latitudeDeg`, latitudeDeg, -90, 90);
  requireRange(`${prefix}longitudeDeg`, longitudeDeg, -180, 180);
}

/**
 * ISA standard-atmosphere pressure at an altitude.
 * Method: ICAO/ISO 2533 standard atmosphere, p = 101325·(1 − 2.25577e-5·h)^5.25588.
 * @param altitudeM site elevation above sea level [m]
 * @returns pressure [hPa] (= mbar)
 */
export function standardPressureHPa(altitudeM: number): number {
  return (101325 * Math.pow(1 - 2.25577e-5 * altitudeM, 5.25588)) / 100;
}

// ───────────────────────────── time ─────────────────────────────

/**
 * Julian day from a calendar date and time.
 * Method: Reda & Andreas 2004, eq. 4 (Meeus 1998, eq. 7.1), Gregorian correction B = 2 − A + INT(A/4)
 * for dates after 1582-10-15 (JD > 2299160).
 * @param year calendar year (astronomical numbering)
 * @param month 1–12
 * @param day day of month
 * @param hour hour of day, local [h]
 * @param minute [min]
 * @param second [s] (may be fractional)
 * @param timezoneH local time zone, hours east of UTC [h] (−7 for MST)
 * @param deltaUt1S UT1 − UTC [s], default 0
 * @returns Julian day (UT1) [d]
 */
export function julianDaySpa(
  year: number,
  month: number,
  day: number,
  hour = 0,
  minute = 0,
  second = 0,
  timezoneH = 0,
  deltaUt1S = 0,
): number {
  const dayDecimal = day + (hour - timezoneH + (minute + (second + deltaUt1S) / 60) / 60) / 24;
  let y = year;
  let m = month;
  if (m < 3) {
    m += 12;
    y -= 1;
  }
  let jd = Math.floor(365.25 * (y + 4716)) + Math.floor(30.6001 * (m + 1)) + dayDecimal - 1524.5;
  if (jd > 2299160) {
    const a = Math.floor(y / 100);
    jd += 2 - a + Math.floor(a / 4);
  }
  return jd;
}

/**
 * Julian day from an instant.
 * Method: JD = t/86 400 000 + 2 440 587.5 (the Unix epoch is JD 2440587.5; proleptic Gregorian, same as
 * Reda & Andreas 2004 eq. 4 for dates after 1582).
 * @param timeMs instant [epoch ms UTC]
 * @param deltaUt1S UT1 − UTC [s], default 0
 * @returns Julian day (UT1) [d]
 */
export function julianDayFromMs(timeMs: number, deltaUt1S = 0): number {
  return (timeMs + deltaUt1S * 1000) / MS_PER_DAY + JD_UNIX_EPOCH;
}

// ───────────────────────────── geocentric part ─────────────────────────────

/** A periodic-term series flattened to [A, B, C, A, B, C, …] per power of JME, for a fast inner loop. */
type FlatSeries = readonly Float64Array[];

function flatten(series: readonly (readonly EarthTerm[])[]): FlatSeries {
  return series.map((terms) => Float64Array.from(terms.flat()));
}

const L_FLAT = flatten(L_TERMS);
const B_FLAT = flatten(B_TERMS);
const R_FLAT = flatten(R_TERMS);
const NUT_ROWS = NUTATION_TERMS.length;
const NUT_FLAT = Float64Array.from(NUTATION_TERMS.flat());

/** Σ_i (Σ_j A·cos(B + C·JME))·JME^i / 1e8 — Reda & Andreas 2004, eqs. 9–11. */
function earthValue(series: FlatSeries, jme: number): number {
  let s = 0;
  let p = 1;
  for (const terms of series) {
    let sum = 0;
    for (let j = 0; j < terms.length; j += 3) {
      sum += (terms[j] as number) * Math.cos((terms[j + 1] as number) + (terms[j + 2] as number) * jme);
    }
    s += sum * p;
    p *= jme;
  }
  return s / 1e8;
}

/**
 * Earth heliocentric longitude, latitude and radius vector.
 * Method: Reda & Andreas 2004, section 3.2, eqs. 9–14, with the periodic terms of Table A4.2.
 * @param jme Julian ephemeris millennium from J2000.0 [millennia]
 * @returns lDeg heliocentric longitude [°, 0–360), bDeg heliocentric latitude [°], rAu Earth–Sun distance [AU]
 */
export function earthHeliocentricSpa(jme: number): { lDeg: number; bDeg: number; rAu: number } {
  return {
    lDeg: limitDegrees(earthValue(L_FLAT, jme) * RAD_TO_DEG),
    bDeg: earthValue(B_FLAT, jme) * RAD_TO_DEG,
    rAu: earthValue(R_FLAT, jme),
  };
}

/**
 * Nutation in longitude and obliquity.
 * Method: Reda & Andreas 2004, section 3.4, eqs. 15–23, with the periodic terms of Table A4.3.
 * @param jce Julian ephemeris century from J2000.0 [centuries]
 * @returns deltaPsiDeg nutation in longitude [°], deltaEpsilonDeg nutation in obliquity [°]
 */
export function nutationSpa(jce: number): { deltaPsiDeg: number; deltaEpsilonDeg: number } {
  const jce2 = jce * jce;
  const jce3 = jce2 * jce;
  // Eqs. 15–19: mean elongation of the Moon from the Sun, mean anomaly of the Sun, mean anomaly of the
  // Moon, Moon's argument of latitude, longitude of the ascending node of the Moon's mean orbit [°].
  const x0 = 297.85036 + 445267.11148 * jce - 0.0019142 * jce2 + jce3 / 189474;
  const x1 = 357.52772 + 35999.05034 * jce - 0.0001603 * jce2 - jce3 / 300000;
  const x2 = 134.96298 + 477198.867398 * jce + 0.0086972 * jce2 + jce3 / 56250;
  const x3 = 93.27191 + 483202.017538 * jce - 0.0036825 * jce2 + jce3 / 327270;
  const x4 = 125.04452 - 1934.136261 * jce + 0.0020708 * jce2 + jce3 / 450000;
  let psi = 0;
  let eps = 0;
  const t = NUT_FLAT;
  for (let r = 0; r < NUT_ROWS; r++) {
    const o = r * 9;
    const arg =
      (x0 * (t[o] as number) + x1 * (t[o + 1] as number) + x2 * (t[o + 2] as number) + x3 * (t[o + 3] as number) + x4 * (t[o + 4] as number)) *
      DEG_TO_RAD;
    psi += ((t[o + 5] as number) + (t[o + 6] as number) * jce) * Math.sin(arg);
    eps += ((t[o + 7] as number) + (t[o + 8] as number) * jce) * Math.cos(arg);
  }
  // Eqs. 22–23: table units are 0.0001″.
  return { deltaPsiDeg: psi / 36_000_000, deltaEpsilonDeg: eps / 36_000_000 };
}

/**
 * Mean obliquity of the ecliptic.
 * Method: Reda & Andreas 2004, eq. 24 (Laskar 1986 polynomial), U = JME/10.
 * @param jme Julian ephemeris millennium [millennia]
 * @returns mean obliquity ε0 [arcsec]
 */
export function meanObliquityArcsecSpa(jme: number): number {
  const u = jme / 10;
  return (
    84381.448 +
    u *
      (-4680.93 +
        u *
          (-1.55 +
            u * (1999.25 + u * (-51.38 + u * (-249.67 + u * (-39.05 + u * (7.12 + u * (27.87 + u * (5.79 + u * 2.45)))))))))
  );
}

/** Geocentric (Earth-centre) apparent position of the Sun and the quantities leading to it. */
export interface SpaGeocentric {
  /** Julian day (UT1) [d]. */
  julianDay: number;
  /** Julian ephemeris day (TT) [d]. */
  julianEphemerisDay: number;
  /** Julian century (UT1) from J2000.0 [centuries]. */
  julianCentury: number;
  /** Julian ephemeris century [centuries]. */
  julianEphemerisCentury: number;
  /** Julian ephemeris millennium [millennia]. */
  julianEphemerisMillennium: number;
  /** Earth heliocentric longitude L [°]. */
  heliocentricLongitudeDeg: number;
  /** Earth heliocentric latitude B [°]. */
  heliocentricLatitudeDeg: number;
  /** Earth–Sun distance R [AU]. */
  earthSunDistanceAu: number;
  /** Geocentric longitude Θ [°]. */
  geocentricLongitudeDeg: number;
  /** Geocentric latitude β [°]. */
  geocentricLatitudeDeg: number;
  /** Nutation in longitude Δψ [°]. */
  nutationLongitudeDeg: number;
  /** Nutation in obliquity Δε [°]. */
  nutationObliquityDeg: number;
  /** True obliquity of the ecliptic ε [°]. */
  trueObliquityDeg: number;
  /** Aberration correction Δτ [°]. */
  aberrationDeg: number;
  /** Apparent Sun longitude λ [°]. */
  apparentLongitudeDeg: number;
  /** Apparent sidereal time at Greenwich ν [°]. */
  apparentSiderealTimeDeg: number;
  /** Geocentric right ascension α [°, 0–360). */
  rightAscensionDeg: number;
  /** Geocentric declination δ [°]. */
  declinationDeg: number;
  /** Equation of time E [min], within ±20. */
  equationOfTimeMin: number;
}

/**
 * Geocentric apparent Sun position.
 * Method: Reda & Andreas 2004, sections 3.1–3.9 (eqs. 4–34) and the equation of time of A.1 (eqs. A.1–A.2).
 * @param jd Julian day (UT1) [d]
 * @param deltaTS ΔT = TT − UT1 [s]
 * @returns the intermediate and final geocentric quantities (see {@link SpaGeocentric})
 */
export function geocentricSunSpa(jd: number, deltaTS: number): SpaGeocentric {
  const jc = (jd - JD_J2000) / 36525; // eq. 5
  const jde = jd + deltaTS / 86400; // eq. 5
  const jce = (jde - JD_J2000) / 36525; // eq. 6
  const jme = jce / 10; // eq. 7

  const { lDeg, bDeg, rAu } = earthHeliocentricSpa(jme);
  const theta = limitDegrees(lDeg + 180); // eq. 13
  const beta = -bDeg; // eq. 14
  const { deltaPsiDeg, deltaEpsilonDeg } = nutationSpa(jce);
  const epsilon = meanObliquityArcsecSpa(jme) / 3600 + deltaEpsilonDeg; // eq. 25
  const deltaTau = -20.4898 / (3600 * rAu); // eq. 26
  const lambda = theta + deltaPsiDeg + deltaTau; // eq. 27

  // Eqs. 28–29: mean then apparent sidereal time at Greenwich.
  const nu0 = limitDegrees(280.46061837 + 360.98564736629 * (jd - JD_J2000) + jc * jc * (0.000387933 - jc / 38710000));
  const nu = nu0 + deltaPsiDeg * cosd(epsilon);

  // Eqs. 30–31: geocentric right ascension and declination.
  const sinL = sind(lambda);
  const cosE = cosd(epsilon);
  const sinE = sind(epsilon);
  const alpha = limitDegrees(atan2d(sinL * cosE - tand(beta) * sinE, cosd(lambda)));
  const delta = asind(sind(beta) * cosE + cosd(beta) * sinE * sinL);

  // A.1: equation of time from the Sun's mean longitude M.
  const m =
    280.4664567 +
    jme * (360007.6982779 + jme * (0.03032028 + jme * (1 / 49931 + jme * (-1 / 15300 + jme * (-1 / 2000000)))));
  let e = 4 * (limitDegrees(m) - 0.0057183 - alpha + deltaPsiDeg * cosE);
  // M and α are each reduced to 0–360°, so 4·(M − α) may be off by a whole day (1440 min): eq. A.2 note.
  if (e < -20) e += 1440;
  else if (e > 20) e -= 1440;

  return {
    julianDay: jd,
    julianEphemerisDay: jde,
    julianCentury: jc,
    julianEphemerisCentury: jce,
    julianEphemerisMillennium: jme,
    heliocentricLongitudeDeg: lDeg,
    heliocentricLatitudeDeg: bDeg,
    earthSunDistanceAu: rAu,
    geocentricLongitudeDeg: theta,
    geocentricLatitudeDeg: beta,
    nutationLongitudeDeg: deltaPsiDeg,
    nutationObliquityDeg: deltaEpsilonDeg,
    trueObliquityDeg: epsilon,
    aberrationDeg: deltaTau,
    apparentLongitudeDeg: lambda,
    apparentSiderealTimeDeg: limitDegrees(nu),
    rightAscensionDeg: alpha,
    declinationDeg: delta,
    equationOfTimeMin: e,
  };
}

// ───────────────────────────── local (topocentric) part ─────────────────────────────

/** Observer-side inputs of the SPA local part. */
export interface SpaObserver {
  /** Geodetic latitude [°], positive north. */
  latitudeDeg: number;
  /** Longitude [°], positive east. */
  longitudeDeg: number;
  /** Elevation above sea level [m]; default 0. */
  altitudeM?: number;
  /** Annual mean local pressure [hPa] (= mbar); default: ISA pressure at altitudeM. */
  pressureHPa?: number;
  /** Annual mean local air temperature [°C]; default 15. */
  tAirC?: number;
  /** Atmospheric refraction at sunrise/sunset [°]; default 0.5667. Only decides when refraction applies. */
  atmosRefractionDeg?: number;
  /** Surface slope from horizontal [°], for the incidence angle; default 0. */
  slopeDeg?: number;
  /**
   * Surface azimuth eastward from north [°] (glossary convention), for the incidence angle; default 180 (facing south).
   * SPA's own "azimuth rotation" γ is measured from south, positive toward west: γ = surfaceAzimuthDeg − 180.
   */
  surfaceAzimuthDeg?: number;
}

/** Topocentric result of the SPA local part. */
export interface SpaTopocentric {
  /** Observer local hour angle H [°, 0–360). */
  hourAngleDeg: number;
  /** Equatorial horizontal parallax of the Sun ξ [°]. */
  parallaxDeg: number;
  /** Parallax in right ascension Δα [°]. */
  parallaxRightAscensionDeg: number;
  /** Topocentric right ascension α′ [°]. */
  topocentricRightAscensionDeg: number;
  /** Topocentric declination δ′ [°]. */
  topocentricDeclinationDeg: number;
  /** Topocentric local hour angle H′ [°]. */
  topocentricHourAngleDeg: number;
  /** Topocentric elevation without refraction e0 [°]. */
  elevationNoRefractionDeg: number;
  /** Atmospheric refraction correction Δe [°] (0 when the Sun is below the horizon). */
  refractionDeg: number;
  /** Topocentric elevation e = e0 + Δe [°]. */
  elevationDeg: number;
  /** Topocentric zenith θ = 90 − e [°], refraction-corrected. */
  zenithDeg: number;
  /** Topocentric zenith without refraction 90 − e0 [°]. */
  zenithNoRefractionDeg: number;
  /** Topocentric astronomers' azimuth Γ, westward from south [°, 0–360). */
  azimuthAstronomicalDeg: number;
  /** Topocentric azimuth Φ, eastward from north [°, 0–360). */
  azimuthDeg: number;
  /** Incidence angle on the surface I [°]. */
  incidenceDeg: number;
}

/**
 * Atmospheric refraction correction of the elevation.
 * Method: Reda & Andreas 2004, eq. 42 (Sæmundsson's refraction for a true altitude, Meeus 1998 eq. 16.4,
 * with the pressure/temperature factor), applied only when e0 ≥ −(sun radius + sunrise refraction), as in the
 * 2007 revision of the SPA code.
 * @param e0Deg topocentric elevation without refraction [°]
 * @param pressureHPa local pressure [hPa]
 * @param tAirC local air temperature [°C]
 * @param atmosRefractionDeg refraction at the horizon [°]
 * @returns refraction correction Δe [°]
 */
export function refractionCorrectionSpa(
  e0Deg: number,
  pressureHPa: number,
  tAirC: number,
  atmosRefractionDeg = DEFAULT_ATMOS_REFRACTION_DEG,
): number {
  if (e0Deg < -(SUN_RADIUS_DEG + atmosRefractionDeg)) return 0;
  return ((pressureHPa / 1010) * (283 / (273 + tAirC)) * 1.02) / (60 * tand(e0Deg + 10.3 / (e0Deg + 5.11)));
}

/**
 * Incidence angle of the Sun's rays on a tilted surface.
 * Method: Reda & Andreas 2004, eq. 47, with γ = surfaceAzimuthDeg − 180 (SPA's azimuth rotation,
 * westward from south) and Γ the astronomers' azimuth; this equals the usual form
 * cos I = cos θ·cos ω + sin ω·sin θ·cos(Φ − surfaceAzimuth) with Φ eastward from north.
 * @param zenithDeg solar zenith θ [°]
 * @param azimuthDeg solar azimuth, eastward from north [°]
 * @param slopeDeg surface slope from horizontal ω [°]
 * @param surfaceAzimuthDeg surface azimuth, eastward from north [°]
 * @returns incidence angle I [°], 0–180
 */
export function incidenceAngleDeg(zenithDeg: number, azimuthDeg: number, slopeDeg: number, surfaceAzimuthDeg: number): number {
  return acosd(cosd(zenithDeg) * cosd(slopeDeg) + sind(slopeDeg) * sind(zenithDeg) * cosd(azimuthDeg - surfaceAzimuthDeg));
}

/**
 * SPA local part: observer hour angle, parallax, topocentric coordinates, refraction, zenith, azimuth and
 * incidence.
 * Method: Reda & Andreas 2004, sections 3.10–3.16, eqs. 35–47.
 * @param geo geocentric Sun from {@link geocentricSunSpa} (uses α, δ, ν, R)
 * @param obs observer (see {@link SpaObserver}; angles [°], altitude [m], pressure [hPa], temperature [°C])
 * @returns topocentric quantities (see {@link SpaTopocentric})
 */
export function topocentricSunSpa(
  geo: Pick<SpaGeocentric, 'rightAscensionDeg' | 'declinationDeg' | 'apparentSiderealTimeDeg' | 'earthSunDistanceAu'>,
  obs: SpaObserver,
): SpaTopocentric {
  const lat = obs.latitudeDeg;
  const altitudeM = obs.altitudeM ?? 0;
  const h = limitDegrees(geo.apparentSiderealTimeDeg + obs.longitudeDeg - geo.rightAscensionDeg); // eq. 32

  const xi = 8.794 / (3600 * geo.earthSunDistanceAu); // eq. 33
  const u = atand(0.99664719 * tand(lat)); // eq. 34
  const x = Math.cos(u * DEG_TO_RAD) + (altitudeM / 6378140) * cosd(lat); // eq. 35
  const y = 0.99664719 * Math.sin(u * DEG_TO_RAD) + (altitudeM / 6378140) * sind(lat); // eq. 36

  const sinXi = sind(xi);
  const cosDelta = cosd(geo.declinationDeg);
  const cosH = cosd(h);
  const den = cosDelta - x * sinXi * cosH;
  const deltaAlpha = atan2d(-x * sinXi * sind(h), den); // eq. 37
  const alphaP = geo.rightAscensionDeg + deltaAlpha; // eq. 38
  const deltaP = atan2d((sind(geo.declinationDeg) - y * sinXi) * cosd(deltaAlpha), den); // eq. 39
  const hP = h - deltaAlpha; // eq. 40

  const sinLat = sind(lat);
  const cosLat = cosd(lat);
  const sinDp = sind(deltaP);
  const cosDp = cosd(deltaP);
  const cosHp = cosd(hP);
  const sinHp = sind(hP);
  const e0 = asind(sinLat * sinDp + cosLat * cosDp * cosHp); // eq. 41
  const pressureHPa = obs.pressureHPa ?? standardPressureHPa(altitudeM);
  const tAirC = obs.tAirC ?? DEFAULT_REFRACTION_T_AIR_C;
  const de = refractionCorrectionSpa(e0, pressureHPa, tAirC, obs.atmosRefractionDeg ?? DEFAULT_ATMOS_REFRACTION_DEG); // eq. 42
  const e = e0 + de; // eq. 43
  const zenith = 90 - e; // eq. 44

  const gamma = limitDegrees(atan2d(sinHp, cosHp * sinLat - (sinDp / cosDp) * cosLat)); // eq. 45
  const phi = limitDegrees(gamma + 180); // eq. 46

  const slope = obs.slopeDeg ?? 0;
  const surfAz = obs.surfaceAzimuthDeg ?? 180;
  const incidence = incidenceAngleDeg(zenith, phi, slope, surfAz); // eq. 47

  return {
    hourAngleDeg: h,
    parallaxDeg: xi,
    parallaxRightAscensionDeg: deltaAlpha,
    topocentricRightAscensionDeg: alphaP,
    topocentricDeclinationDeg: deltaP,
    topocentricHourAngleDeg: hP,
    elevationNoRefractionDeg: e0,
    refractionDeg: de,
    elevationDeg: e,
    zenithDeg: zenith,
    zenithNoRefractionDeg: 90 - e0,
    azimuthAstronomicalDeg: gamma,
    azimuthDeg: phi,
    incidenceDeg: incidence,
  };
}

// ───────────────────────────── public SPA entry points ─────────────────────────────

/** Inputs of {@link solarPositionSpa}. */
export interface SpaInput extends SpaObserver {
  /** Instant [epoch ms UTC]. */
  timeMs: number;
  /** ΔT = TT − UT1 [s]; default {@link DEFAULT_DELTA_T_S}. */
  deltaTS?: number;
  /** UT1 − UTC [s]; default 0. */
  deltaUt1S?: number;
}

/** Full SPA result: geocentric and topocentric parts. */
export type SpaResult = SpaGeocentric & SpaTopocentric;

function validateObserver(obs: SpaObserver): void {
  assertLatLon(obs.latitudeDeg, obs.longitudeDeg);
  if (obs.altitudeM !== undefined) requireRange('altitudeM', obs.altitudeM, -6_500_000, 100_000);
  if (obs.pressureHPa !== undefined) requireRange('pressureHPa', obs.pressureHPa, 0, 5000);
  if (obs.tAirC !== undefined) requireRange('tAirC', obs.tAirC, -272.99, 6000);
  if (obs.atmosRefractionDeg !== undefined) requireRange('atmosRefractionDeg', obs.atmosRefractionDeg, -5, 5);
  if (obs.slopeDeg !== undefined) requireRange('slopeDeg', obs.slopeDeg, -360, 360);
  if (obs.surfaceAzimuthDeg !== undefined) requireRange('surfaceAzimuthDeg', obs.surfaceAzimuthDeg, -360, 360);
}

/**
 * Solar position by the NREL Solar Position Algorithm.
 * Method: I. Reda and A. Andreas, "Solar Position Algorithm for Solar Radiation Applications",
 * NREL/TP-560-34302, 2003 (rev. 2008), section 3, eqs. 4–47, equation of time A.1.
 * @param input instant [epoch ms UTC], place ([°], [m]), pressure [hPa], temperature [°C], ΔT [s], UT1−UTC [s],
 *   surface slope and azimuth [°]
 * @returns geocentric and topocentric quantities; zenithDeg [°] refraction-corrected, azimuthDeg [°] eastward
 *   from north, incidenceDeg [°], equationOfTimeMin [min]
 * @throws RangeError naming the field for a non-finite or out-of-range input
 */
export function solarPositionSpa(input: SpaInput): SpaResult {
  requireFinite('timeMs', input.timeMs);
  validateObserver(input);
  const deltaTS = input.deltaTS ?? DEFAULT_DELTA_T_S;
  requireRange('deltaTS', deltaTS, -8000, 8000);
  const deltaUt1S = input.deltaUt1S ?? 0;
  requireRange('deltaUt1S', deltaUt1S, -1, 1);
  const g = geocentricSunSpa(julianDayFromMs(input.timeMs, deltaUt1S), deltaTS);
  const t = topocentricSunSpa(g, input);
  // An explicit literal: object spread of these two ~15-field objects was ~10× slower than the whole SPA in V8.
  return {
    julianDay: g.julianDay,
    julianEphemerisDay: g.julianEphemerisDay,
    julianCentury: g.julianCentury,
    julianEphemerisCentury: g.julianEphemerisCentury,
    julianEphemerisMillennium: g.julianEphemerisMillennium,
    heliocentricLongitudeDeg: g.heliocentricLongitudeDeg,
    heliocentricLatitudeDeg: g.heliocentricLatitudeDeg,
    earthSunDistanceAu: g.earthSunDistanceAu,
    geocentricLongitudeDeg: g.geocentricLongitudeDeg,
    geocentricLatitudeDeg: g.geocentricLatitudeDeg,
    nutationLongitudeDeg: g.nutationLongitudeDeg,
    nutationObliquityDeg: g.nutationObliquityDeg,
    trueObliquityDeg: g.trueObliquityDeg,
    aberrationDeg: g.aberrationDeg,
    apparentLongitudeDeg: g.apparentLongitudeDeg,
    apparentSiderealTimeDeg: g.apparentSiderealTimeDeg,
    rightAscensionDeg: g.rightAscensionDeg,
    declinationDeg: g.declinationDeg,
    equationOfTimeMin: g.equationOfTimeMin,
    hourAngleDeg: t.hourAngleDeg,
    parallaxDeg: t.parallaxDeg,
    parallaxRightAscensionDeg: t.parallaxRightAscensionDeg,
    topocentricRightAscensionDeg: t.topocentricRightAscensionDeg,
    topocentricDeclinationDeg: t.topocentricDeclinationDeg,
    topocentricHourAngleDeg: t.topocentricHourAngleDeg,
    elevationNoRefractionDeg: t.elevationNoRefractionDeg,
    refractionDeg: t.refractionDeg,
    elevationDeg: t.elevationDeg,
    zenithDeg: t.zenithDeg,
    zenithNoRefractionDeg: t.zenithNoRefractionDeg,
    azimuthAstronomicalDeg: t.azimuthAstronomicalDeg,
    azimuthDeg: t.azimuthDeg,
    incidenceDeg: t.incidenceDeg,
  };
}

/** Inputs of {@link sunriseTransitSunsetSpa}. */
export interface SpaRtsInput {
  /** Local calendar date. */
  year: number;
  month: number;
  day: number;
  /** Local time zone, hours east of UTC [h] (e.g. −7). */
  timezoneH: number;
  latitudeDeg: number;
  longitudeDeg: number;
  /** ΔT [s]; default {@link DEFAULT_DELTA_T_S}. */
  deltaTS?: number;
  /** Refraction at sunrise/sunset [°]; default 0.5667 (h0′ = −0.26667 − 0.5667 = −0.8333°). */
  atmosRefractionDeg?: number;
}

/** Result of {@link sunriseTransitSunsetSpa}. null fields: polar day or night (no rise/set that day). */
export interface SpaRtsResult {
  /** Local sun transit (solar noon) [h after local midnight]. */
  transitLocalH: number;
  /** Local sunrise [h], or null. */
  sunriseLocalH: number | null;
  /** Local sunset [h], or null. */
  sunsetLocalH: number | null;
  /**
   * The events of the given local date as instants [epoch ms UTC], refined by Newton iteration on the geocentric
   * elevation (so they can differ by a minute or two from the local hours above, see the function comment).
   */
  transitMs: number;
  sunriseMs: number | null;
  sunsetMs: number | null;
  /** Sun transit altitude [°]. */
  transitElevationDeg: number;
  /** Local hour angles at sunrise and sunset [°] (local hour angle H′ of appendix A.2), or null. */
  sunriseHourAngleDeg: number | null;
  sunsetHourAngleDeg: number | null;
}

/**
 * Sunrise, sun transit and sunset.
 * Method: Reda & Andreas 2004, appendix A.2, after Meeus 1998 ch. 15: geocentric
 * α, δ at 0 TT of the previous, given and next day (ΔT = 0), apparent sidereal time at 0 UT, three-point
 * interpolation and the altitude correction of the rise/set times. One deliberate deviation: where the
 * report limits an interpolation difference |a| or |b| > 2 to the fraction 0–1 (it is meant to absorb the
 * 360°→0° wrap of right ascension), we wrap it to (−180°, 180°], which is the exact difference; this only
 * matters around the March equinox, where the literal rule shifts transit by up to ~1 min.
 * @param input local date, time zone [h], place [°], ΔT [s], horizon refraction [°]
 * @returns local event times [h], instants [epoch ms UTC], transit elevation [°], hour angles [°]
 */
export function sunriseTransitSunsetSpa(input: SpaRtsInput): SpaRtsResult {
  assertLatLon(input.latitudeDeg, input.longitudeDeg);
  requireRange('timezoneH', input.timezoneH, -18, 18);
  requireRange('year', input.year, -2000, 6000);
  requireRange('month', input.month, 1, 12);
  requireRange('day', input.day, 1, 31);
  const deltaTS = input.deltaTS ?? DEFAULT_DELTA_T_S;
  requireRange('deltaTS', deltaTS, -8000, 8000);
  const refr = input.atmosRefractionDeg ?? DEFAULT_ATMOS_REFRACTION_DEG;
  requireRange('atmosRefractionDeg', refr, -5, 5);
  const lat = input.latitudeDeg;
  const lon = input.longitudeDeg;

  // A.2: 0 UT of the date, sidereal time ν there (ΔT = 0), and α, δ for days −1, 0, +1.
  const jd0 = julianDaySpa(input.year, input.month, input.day, 0, 0, 0, 0);
  const nu = geocentricSunSpa(jd0, 0).apparentSiderealTimeDeg;
  const alpha: number[] = [];
  const delta: number[] = [];
  for (let i = -1; i <= 1; i++) {
    const g = geocentricSunSpa(jd0 + i, 0);
    alpha.push(g.rightAscensionDeg);
    delta.push(g.declinationDeg);
  }
  const [aM, a0, aP] = alpha as [number, number, number];
  const [dM, d0, dP] = delta as [number, number, number];

  const h0Prime = -(SUN_RADIUS_DEG + refr); // sunrise/sunset altitude h0′ = −0.8333°
  const m0 = (a0 - lon - nu) / 360; // approximate transit time (fraction of day)
  const cosH0 = (sind(h0Prime) - sind(lat) * sind(d0)) / (cosd(lat) * cosd(d0)); // local hour angle at rise/set H0
  const hasRiseSet = Math.abs(cosH0) <= 1;
  const bigH0 = hasRiseSet ? acosd(cosH0) : 0; // limited to 0–180 by acos

  const m = [limitZeroToOne(m0), limitZeroToOne(m0 - bigH0 / 360), limitZeroToOne(m0 + bigH0 / 360)] as const; // transit, rise, set

  // Interpolation differences (right ascension differences wrapped, see above).
  const a = limitDegrees180pm(a0 - aM);
  const b = limitDegrees180pm(aP - a0);
  const aD = d0 - dM;
  const bD = dP - d0;
  const c = b - a;
  const cD = bD - aD;

  const hp: number[] = [];
  const hh: number[] = [];
  const dp: number[] = [];
  for (const mi of m) {
    const nui = nu + 360.985647 * mi; // sidereal time at each event
    const n = mi + deltaTS / 86400; // in TT
    const alphaI = a0 + (n * (a + b + c * n)) / 2; // interpolated α′
    const deltaI = d0 + (n * (aD + bD + cD * n)) / 2; // interpolated δ′
    const hPrime = limitDegrees180pm(nui + lon - alphaI); // local hour angle H′
    const hI = asind(sind(lat) * sind(deltaI) + cosd(lat) * cosd(deltaI) * cosd(hPrime)); // Sun altitude h
    hp.push(hPrime);
    hh.push(hI);
    dp.push(deltaI);
  }
  const [hp0, hp1, hp2] = hp as [number, number, number];
  const [hh0, hh1, hh2] = hh as [number, number, number];
  const [, dp1, dp2] = dp as [number, number, number];
  const [m0l, m1l, m2l] = m;

  const transitFrac = m0l - hp0 / 360; // transit
  const riseFrac = m1l + (hh1 - h0Prime) / (360 * cosd(dp1) * cosd(lat) * sind(hp1)); // sunrise
  const setFrac = m2l + (hh2 - h0Prime) / (360 * cosd(dp2) * cosd(lat) * sind(hp2)); // sunset

  const toLocalH = (frac: number): number => 24 * limitZeroToOne(frac + input.timezoneH / 24); // local hours
  const dateMs = Date.UTC(input.year, input.month - 1, input.day);
  const toMs = (localH: number): number => dateMs + (localH - input.timezoneH) * 3_600_000;

  const transitLocalH = toLocalH(transitFrac);
  const sunriseLocalH = hasRiseSet ? toLocalH(riseFrac) : null;
  const sunsetLocalH = hasRiseSet ? toLocalH(setFrac) : null;
  // A.2 works on fractions of the UT day, so an event can belong to the neighbouring local day (e.g. a
  // Denver sunset at 00:20 UT): its local clock time is then the previous evening's, ~1–2 min off. The
  // instants are therefore refined on the requested local date by Newton iteration on the geocentric
  // elevation (transit: hour angle = 0; rise/set: elevation = h0′), using the full geocentric SPA.
  const sunriseMs = sunriseLocalH === null ? null : refineEventMs(toMs(sunriseLocalH), lat, lon, deltaTS, h0Prime);
  const sunsetMs = sunsetLocalH === null ? null : refineEventMs(toMs(sunsetLocalH), lat, lon, deltaTS, h0Prime);
  return {
    transitLocalH,
    sunriseLocalH,
    sunsetLocalH,
    transitMs: refineEventMs(toMs(transitLocalH), lat, lon, deltaTS, null),
    sunriseMs,
    sunsetMs,
    transitElevationDeg: hh0,
    sunriseHourAngleDeg: hasRiseSet ? hp1 : null,
    sunsetHourAngleDeg: hasRiseSet ? hp2 : null,
  };
}

/** Geocentric elevation [°] and local hour angle [°, −180…180) at an instant (Reda & Andreas 2004, eqs. 32, 41 without parallax). */
function geocentricElevationAndHourAngle(timeMs: number, lat: number, lon: number, deltaTS: number): { e: number; h: number } {
  const g = geocentricSunSpa(julianDayFromMs(timeMs), deltaTS);
  const h = limitDegrees180pm(g.apparentSiderealTimeDeg + lon - g.rightAscensionDeg);
  const e = asind(sind(lat) * sind(g.declinationDeg) + cosd(lat) * cosd(g.declinationDeg) * cosd(h));
  return { e, h };
}

/**
 * Newton refinement of a rise/set (targetDeg = h0′) or transit (targetDeg = null: hour angle 0) instant.
 * @returns refined instant [epoch ms UTC]; the start value if the iteration does not settle
 */
function refineEventMs(startMs: number, lat: number, lon: number, deltaTS: number, targetDeg: number | null): number {
  let t = startMs;
  for (let iter = 0; iter < 5; iter++) {
    const { e, h } = geocentricElevationAndHourAngle(t, lat, lon, deltaTS);
    let stepMs: number;
    if (targetDeg === null) {
      stepMs = (-h / 360) * MS_PER_DAY; // hour angle advances ≈ 360° per solar day
    } else {
      const e2 = geocentricElevationAndHourAngle(t + 60_000, lat, lon, deltaTS).e;
      const rate = (e2 - e) / 60_000; // [°/ms]
      if (Math.abs(rate) < 1e-12) return startMs;
      stepMs = (targetDeg - e) / rate;
    }
    if (!Number.isFinite(stepMs) || Math.abs(stepMs) > 3 * HOUR_MS) return startMs;
    t += stepMs;
    if (Math.abs(stepMs) < 10) break;
  }
  return t;
}

// ───────────────────────────── fast SPA for a time series ─────────────────────────────

/** Zenith/azimuth arrays for many instants at one place. */
export interface SolarPositionSeries {
  /** Topocentric zenith, refraction-corrected [°]. */
  zenithDeg: Float64Array;
  /** Topocentric zenith without refraction [°]. */
  zenithNoRefractionDeg: Float64Array;
  /** Azimuth eastward from north [°]. */
  azimuthDeg: Float64Array;
  /** Earth–Sun distance [AU]. */
  earthSunDistanceAu: Float64Array;
  /** Geocentric declination [°]. */
  declinationDeg: Float64Array;
  /** Geocentric local hour angle [°, −180…180). */
  hourAngleDeg: Float64Array;
}

/**
 * SPA for many instants at one observer, fast.
 * Method: Reda & Andreas 2004 (as {@link solarPositionSpa}); the geocentric right ascension, declination,
 * distance and nutation correction of sidereal time are evaluated exactly at whole UTC hours spanning the
 * instants and interpolated linearly in between (their second derivatives make the error < 1e-5°, checked in
 * the tests), while mean sidereal time and the local part (eqs. 32–46) are evaluated per instant.
 * @param timesMs instants [epoch ms UTC], any order
 * @param obs observer ([°], [m], [hPa], [°C]); slope/azimuth are ignored here
 * @param deltaTS ΔT [s]
 * @returns arrays aligned with timesMs (see {@link SolarPositionSeries})
 */
export function solarPositionsSpaFast(
  timesMs: ArrayLike<number>,
  obs: SpaObserver,
  deltaTS = DEFAULT_DELTA_T_S,
): SolarPositionSeries {
  validateObserver(obs);
  requireRange('deltaTS', deltaTS, -8000, 8000);
  const n = timesMs.length;
  const out: SolarPositionSeries = {
    zenithDeg: new Float64Array(n),
    zenithNoRefractionDeg: new Float64Array(n),
    azimuthDeg: new Float64Array(n),
    earthSunDistanceAu: new Float64Array(n),
    declinationDeg: new Float64Array(n),
    hourAngleDeg: new Float64Array(n),
  };
  if (n === 0) return out;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < n; i++) {
    const t = timesMs[i] as number;
    requireFinite(`timesMs[${i}]`, t);
    if (t < lo) lo = t;
    if (t > hi) hi = t;
  }
  const h0 = Math.floor(lo / HOUR_MS);
  const nNodes = Math.floor(hi / HOUR_MS) - h0 + 2;
  const nodeAlpha = new Float64Array(nNodes);
  const nodeDelta = new Float64Array(nNodes);
  const nodeR = new Float64Array(nNodes);
  const nodeNut = new Float64Array(nNodes);
  for (let k = 0; k < nNodes; k++) {
    const g = geocentricSunSpa(julianDayFromMs((h0 + k) * HOUR_MS), deltaTS);
    let alpha = g.rightAscensionDeg;
    // Unwrap right ascension so linear interpolation never crosses 360°→0°.
    if (k > 0) {
      const prev = nodeAlpha[k - 1] as number;
      alpha += 360 * Math.round((prev - alpha) / 360);
    }
    nodeAlpha[k] = alpha;
    nodeDelta[k] = g.declinationDeg;
    nodeR[k] = g.earthSunDistanceAu;
    nodeNut[k] = g.nutationLongitudeDeg * cosd(g.trueObliquityDeg);
  }

  const lat = obs.latitudeDeg;
  const lon = obs.longitudeDeg;
  const altitudeM = obs.altitudeM ?? 0;
  const pressureHPa = obs.pressureHPa ?? standardPressureHPa(altitudeM);
  const tAirC = obs.tAirC ?? DEFAULT_REFRACTION_T_AIR_C;
  const refr = obs.atmosRefractionDeg ?? DEFAULT_ATMOS_REFRACTION_DEG;
  const refrLimit = -(SUN_RADIUS_DEG + refr);
  const refrFactor = ((pressureHPa / 1010) * (283 / (273 + tAirC)) * 1.02) / 60;
  const latR = lat * DEG_TO_RAD;
  const sinLat = Math.sin(latR);
  const cosLat = Math.cos(latR);
  const u = Math.atan(0.99664719 * Math.tan(latR));
  const x = Math.cos(u) + (altitudeM / 6378140) * cosLat;
  const y = 0.99664719 * Math.sin(u) + (altitudeM / 6378140) * sinLat;

  for (let i = 0; i < n; i++) {
    const t = timesMs[i] as number;
    const fk = t / HOUR_MS - h0;
    const k = Math.min(Math.floor(fk), nNodes - 2);
    const w = fk - k;
    const alpha = (nodeAlpha[k] as number) + w * ((nodeAlpha[k + 1] as number) - (nodeAlpha[k] as number));
    const delta = (nodeDelta[k] as number) + w * ((nodeDelta[k + 1] as number) - (nodeDelta[k] as number));
    const r = (nodeR[k] as number) + w * ((nodeR[k + 1] as number) - (nodeR[k] as number));
    const nut = (nodeNut[k] as number) + w * ((nodeNut[k + 1] as number) - (nodeNut[k] as number));

    const jd = julianDayFromMs(t);
    const jdd = jd - JD_J2000;
    const jc = jdd / 36525;
    // Eq. 28 with the whole turns of 360.98564736629·d removed first to keep precision.
    const nu0 = 280.46061837 + 360 * (jdd - Math.floor(jdd)) + 0.98564736629 * jdd + jc * jc * (0.000387933 - jc / 38710000);
    const hDeg = nu0 + nut + lon - alpha;
    const hR = (hDeg % 360) * DEG_TO_RAD;

    const sinXi = Math.sin((8.794 / (3600 * r)) * DEG_TO_RAD);
    const deltaR = delta * DEG_TO_RAD;
    const cosDelta = Math.cos(deltaR);
    const cosH = Math.cos(hR);
    const sinH = Math.sin(hR);
    const den = cosDelta - x * sinXi * cosH;
    const dAlpha = Math.atan2(-x * sinXi * sinH, den);
    const deltaP = Math.atan2((Math.sin(deltaR) - y * sinXi) * Math.cos(dAlpha), den);
    const hP = hR - dAlpha;
    const sinDp = Math.sin(deltaP);
    const cosDp = Math.cos(deltaP);
    const cosHp = Math.cos(hP);
    const e0 = Math.asin(clamp(sinLat * sinDp + cosLat * cosDp * cosHp, -1, 1)) * RAD_TO_DEG;
    const de = e0 < refrLimit ? 0 : refrFactor / Math.tan((e0 + 10.3 / (e0 + 5.11)) * DEG_TO_RAD);
    const gamma = Math.atan2(Math.sin(hP), cosHp * sinLat - (sinDp / cosDp) * cosLat) * RAD_TO_DEG;

    out.zenithDeg[i] = 90 - e0 - de;
    out.zenithNoRefractionDeg[i] = 90 - e0;
    out.azimuthDeg[i] = limitDegrees(gamma + 180);
    out.earthSunDistanceAu[i] = r;
    out.declinationDeg[i] = delta;
    out.hourAngleDeg[i] = limitDegrees180pm(hDeg);
  }
  return out;
}

// ───────────────────────────── NOAA ─────────────────────────────

/** Inputs of {@link solarPositionNoaa}. */
export interface NoaaInput {
  /** Instant [epoch ms UTC]. */
  timeMs: number;
  latitudeDeg: number;
  longitudeDeg: number;
}

/** Result of {@link solarPositionNoaa}. */
export interface NoaaResult {
  /** Julian day [d]. */
  julianDay: number;
  /** Apparent (geocentric) declination [°]. */
  declinationDeg: number;
  /** Equation of time [min]. */
  equationOfTimeMin: number;
  /** Hour angle [°], negative before solar noon. */
  hourAngleDeg: number;
  /** Zenith without refraction [°]. */
  zenithNoRefractionDeg: number;
  /** Refraction correction of the elevation [°]. */
  refractionDeg: number;
  /** Zenith, refraction-corrected [°]. */
  zenithDeg: number;
  /** Azimuth, eastward from north [°]. */
  azimuthDeg: number;
  /** Earth–Sun distance [AU]. */
  earthSunDistanceAu: number;
}

/**
 * Solar position by the NOAA solar calculator equations.
 * Method: NOAA Global Monitoring Laboratory, "Solar Calculation Details" and the NOAA_Solar_Calculations
 * spreadsheet (C. Cornwall, A. Horiuchi, C. Lehman), based on J. Meeus, "Astronomical Algorithms" (1991),
 * low-accuracy solar coordinates, with the spreadsheet's piecewise refraction approximation.
 * Geocentric (no parallax), UT used for TT; typically within ≈0.01–0.02° of SPA for 1950–2050.
 * The azimuth uses atan2 instead of the spreadsheet's arccos with quadrant tests (same value, no NaN at the poles).
 * @param input instant [epoch ms UTC], latitude and longitude [°]
 * @returns zenith [°] (refracted and not), azimuth [°] eastward from north, declination [°],
 *   equation of time [min], hour angle [°], Earth–Sun distance [AU]
 */
export function solarPositionNoaa(input: NoaaInput): NoaaResult {
  requireFinite('timeMs', input.timeMs);
  assertLatLon(input.latitudeDeg, input.longitudeDeg);
  const jd = julianDayFromMs(input.timeMs);
  const jc = (jd - JD_J2000) / 36525;
  const l0 = limitDegrees(280.46646 + jc * (36000.76983 + jc * 0.0003032)); // geometric mean longitude
  const m = 357.52911 + jc * (35999.05029 - 0.0001537 * jc); // geometric mean anomaly
  const ecc = 0.016708634 - jc * (0.000042037 + 0.0000001267 * jc);
  const c =
    sind(m) * (1.914602 - jc * (0.004817 + 0.000014 * jc)) + sind(2 * m) * (0.019993 - 0.000101 * jc) + sind(3 * m) * 0.000289;
  const trueLong = l0 + c;
  const trueAnom = m + c;
  const rAu = (1.000001018 * (1 - ecc * ecc)) / (1 + ecc * cosd(trueAnom));
  const omega = 125.04 - 1934.136 * jc;
  const appLong = trueLong - 0.00569 - 0.00478 * sind(omega);
  const meanObliq = 23 + (26 + (21.448 - jc * (46.815 + jc * (0.00059 - jc * 0.001813))) / 60) / 60;
  const obliq = meanObliq + 0.00256 * cosd(omega);
  const decl = asind(sind(obliq) * sind(appLong));
  const yv = tand(obliq / 2) ** 2;
  const l0r = l0 * DEG_TO_RAD;
  const mr = m * DEG_TO_RAD;
  const eot =
    4 *
    RAD_TO_DEG *
    (yv * Math.sin(2 * l0r) -
      2 * ecc * Math.sin(mr) +
      4 * ecc * yv * Math.sin(mr) * Math.cos(2 * l0r) -
      0.5 * yv * yv * Math.sin(4 * l0r) -
      1.25 * ecc * ecc * Math.sin(2 * mr));
  const minutesUtc = (((input.timeMs % MS_PER_DAY) + MS_PER_DAY) % MS_PER_DAY) / 60000;
  const tst = (((minutesUtc + eot + 4 * input.longitudeDeg) % 1440) + 1440) % 1440; // true solar time [min]
  const ha = tst / 4 - 180; // tst ∈ [0, 1440) so the spreadsheet's tst/4 < 0 branch never applies
  const lat = input.latitudeDeg;
  const cosZ = sind(lat) * sind(decl) + cosd(lat) * cosd(decl) * cosd(ha);
  const zen = acosd(cosZ);
  const elev = 90 - zen;
  let refrArcsec: number;
  if (elev > 85) refrArcsec = 0;
  else if (elev > 5) {
    const te = tand(elev);
    refrArcsec = 58.1 / te - 0.07 / te ** 3 + 0.000086 / te ** 5;
  } else if (elev > -0.575) refrArcsec = 1735 + elev * (-518.2 + elev * (103.4 + elev * (-12.79 + elev * 0.711)));
  else refrArcsec = -20.772 / tand(elev);
  const refr = refrArcsec / 3600;
  const az = limitDegrees(atan2d(sind(ha), cosd(ha) * sind(lat) - tand(decl) * cosd(lat)) + 180);
  return {
    julianDay: jd,
    declinationDeg: decl,
    equationOfTimeMin: eot,
    hourAngleDeg: ha,
    zenithNoRefractionDeg: zen,
    refractionDeg: refr,
    zenithDeg: zen - refr,
    azimuthDeg: az,
    earthSunDistanceAu: rAu,
  };
}

// ───────────────────────────── dispatcher ─────────────────────────────

/** Solar position models offered by {@link getSolarPosition}. */
export const SOLAR_POSITION_MODELS = ['spa', 'noaa'] as const;
export type SolarPositionModel = (typeof SOLAR_POSITION_MODELS)[number];

/** Common result of {@link getSolarPosition}. */
export interface SolarPosition {
  model: SolarPositionModel;
  /** Zenith, refraction-corrected [°]. */
  zenithDeg: number;
  /** Zenith without refraction [°]. */
  zenithNoRefractionDeg: number;
  /** Azimuth, eastward from north [°]. */
  azimuthDeg: number;
  /** Geocentric declination [°]. */
  declinationDeg: number;
  /** Equation of time [min]. */
  equationOfTimeMin: number;
  /** Earth–Sun distance [AU]. */
  earthSunDistanceAu: number;
}

/**
 * Solar position by the chosen model; fills SPA defaults (ΔT 69 s, ISA pressure, 15 °C).
 * Methods: 'spa' → {@link solarPositionSpa} (Reda & Andreas 2004); 'noaa' → {@link solarPositionNoaa}.
 * @param args model name, instant [epoch ms UTC], latitude/longitude [°], optional altitude [m] and SPA options
 * @returns zenith [°], azimuth [°] eastward from north, declination [°], equation of time [min], distance [AU]
 * @throws RangeError for an unknown model (message lists the choices) or bad inputs
 */
export function getSolarPosition(args: SpaInput & { model?: SolarPositionModel }): SolarPosition {
  const model = args.model ?? 'spa';
  if (model === 'spa') {
    const r = solarPositionSpa(args);
    return {
      model,
      zenithDeg: r.zenithDeg,
      zenithNoRefractionDeg: r.zenithNoRefractionDeg,
      azimuthDeg: r.azimuthDeg,
      declinationDeg: r.declinationDeg,
      equationOfTimeMin: r.equationOfTimeMin,
      earthSunDistanceAu: r.earthSunDistanceAu,
    };
  }
  if (model === 'noaa') {
    const r = solarPositionNoaa(args);
    return {
      model,
      zenithDeg: r.zenithDeg,
      zenithNoRefractionDeg: r.zenithNoRefractionDeg,
      azimuthDeg: r.azimuthDeg,
      declinationDeg: r.declinationDeg,
      equationOfTimeMin: r.equationOfTimeMin,
      earthSunDistanceAu: r.earthSunDistanceAu,
    };
  }
  throw new RangeError(`model must be one of ${SOLAR_POSITION_MODELS.map((m) => `'${m}'`).join(', ')}; got '${String(model)}'`);
}
