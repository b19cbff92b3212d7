/**
 * Natural-convection correlations for the oil (or melt) side of the store–pot coupling and for mixing inside a
 * stratified store, evaluated with the medium's properties at the film temperature.
 *
 * - Layer heated from below (horizontal fluid layer, lower surface hotter): Globe & Dropkin 1959,
 *   Nu = 0.069·Ra^(1/3)·Pr^0.074 for 3×10⁵ < Ra < 7×10⁹ (J. Heat Transfer 81:24–28; Incropera & DeWitt Eq. 9.49;
 *   secondary). Because Nu ∝ Ra^(1/3) ∝ L, the coefficient h = Nu·k/L does not depend on the layer depth L.
 * - Vertical wall, whole laminar–turbulent range: Churchill & Chu 1975, IJHMT 18:1323,
 *   Nu = {0.825 + 0.387·Ra^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}² (secondary).
 * Known pitfall: a solid store (PCM below its solidus) does not convect — viscosity() is NaN there and the
 * coefficient falls back to conduction, h = k/L.
 * Phase-change store in its melting range (mushy): the coupling is weighted by the melt fraction f of the enthalpy
 * method between the solid-conduction limit (f = 0) and the melt-convection limit (f = 1) — see
 * createNaturalConvectionCoupling. Without it a half-molten store coupled like a solid one (about 2 W/K instead of
 * about 100 W/K for a 50 L pot on erythritol), because the film mean under a cold pot lies below the melting range.
 */
import { liquidFractionEnthalpyMethod } from '../materials/pcm';
import type { StorageMedium } from '../materials/types';

/** Standard gravity [m/s²] (CGPM 1901). */
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;

/** Fluid properties at a film temperature (units per field). */
export interface FilmProperties {
  /** Conductivity [W/(m·K)]. */
  kWPerMK: number;
  /** Density [kg/m³]. */
  densityKgPerM3: number;
  /** Specific heat [J/(kg·K)]. */
  cpJPerKgK: number;
  /** Dynamic viscosity [Pa·s]. */
  viscosityPaS: number;
  /** Volumetric expansion coefficient β = −(1/ρ)·dρ/dT [1/K]. */
  betaPerK: number;
  /** Kinematic viscosity ν = μ/ρ [m²/s]. */
  nuM2PerS: number;
  /** Thermal diffusivity α = k/(ρ·cp) [m²/s]. */
  alphaM2PerS: number;
  /** Prandtl number ν/α [–]. */
  pr: number;
}

/** A reusable, mutable FilmProperties (for allocation-free loops). */
export function createFilmProperties(): FilmProperties {
  return { kWPerMK: 0, densityKgPerM3: 0, cpJPerKgK: 0, viscosityPaS: 0, betaPerK: 0, nuM2PerS: 0, alphaM2PerS: 0, pr: 0 };
}

/**
 * Properties of the medium at the film temperature; β by a ±0.5 K central difference of ρ(T) (exact for the
 * linear densities of lib/materials).
 * @param tFilmC film temperature [°C]
 * @param out optional object to fill (no allocation)
 * @returns the properties, or null when the medium is solid there (viscosity NaN)
 */
export function filmProperties(medium: StorageMedium, tFilmC: number, out: FilmProperties = createFilmProperties()): FilmProperties | null {
  const mu = medium.viscosity(tFilmC);
  if (!(mu > 0)) return null;
  const rho = medium.density(tFilmC);
  const k = medium.conductivity(tFilmC);
  const cp = medium.specificHeat(tFilmC);
  out.kWPerMK = k;
  out.densityKgPerM3 = rho;
  out.cpJPerKgK = cp;
  out.viscosityPaS = mu;
  out.betaPerK = (medium.density(tFilmC - 0.5) - medium.density(tFilmC + 0.5)) / rho;
  out.nuM2PerS = mu / rho;
  out.alphaM2PerS = k / (rho * cp);
  out.pr = out.nuM2PerS / out.alphaM2PerS;
  return out;
}

/**
 * Rayleigh number Ra = g·β·ΔT·L³/(ν·α).
 * @param betaPerK [1/K]; @param deltaTK [K]; @param lengthM [m]; @param nuM2PerS [m²/s]; @param alphaM2PerS [m²/s]
 * @returns Ra [–]
 */
export function rayleighNumber(betaPerK: number, deltaTK: number, lengthM: number, nuM2PerS: number, alphaM2PerS: number): number {
  return (STANDARD_GRAVITY_M_PER_S2 * betaPerK * deltaTK * lengthM * lengthM * lengthM) / (nuM2PerS * alphaM2PerS);
}

/**
 * Globe & Dropkin 1959: layer heated from below, Nu = 0.069·Ra^(1/3)·Pr^0.074 (3×10⁵ < Ra < 7×10⁹).
 * @returns Nu [–]
 */
export function nusseltGlobeDropkin1959(ra: number, pr: number): number {
  return 0.069 * Math.cbrt(ra) * Math.pow(pr, 0.074);
}

/**
 * Churchill & Chu 1975: vertical wall, all Ra, Nu = {0.825 + 0.387·Ra^(1/6)/[1 + (0.492/Pr)^(9/16)]^(8/27)}².
 * @returns mean Nu over the wall height [–]
 */
export function nusseltChurchillChu1975(ra: number, pr: number): number {
  const f = Math.pow(1 + Math.pow(0.492 / pr, 9 / 16), 8 / 27);
  const s = 0.825 + (0.387 * Math.pow(ra, 1 / 6)) / f;
  return s * s;
}

/**
 * Heat-transfer coefficient of a fluid layer heated from below by Globe & Dropkin 1959, written so the depth cancels:
 * h = 0.069·k·(g·β·ΔT/(ν·α))^(1/3)·Pr^0.074.
 * @param deltaTK temperature difference across the layer [K], > 0 (unstable)
 * @returns h [W/(m²·K)]
 */
export function hLayerHeatedFromBelowGlobeDropkin1959(p: FilmProperties, deltaTK: number): number {
  if (!(deltaTK > 0)) return 0;
  return 0.069 * p.kWPerMK * Math.cbrt((STANDARD_GRAVITY_M_PER_S2 * p.betaPerK * deltaTK) / (p.nuM2PerS * p.alphaM2PerS)) * Math.pow(p.pr, 0.074);
}

/**
 * Mean heat-transfer coefficient of a vertical wall of height L by Churchill & Chu 1975.
 * @param deltaTK |wall − fluid| [K]; @param heightM wall height L [m]
 * @returns h [W/(m²·K)]
 */
export function hVerticalWallChurchillChu1975(p: FilmProperties, deltaTK: number, heightM: number): number {
  const ra = rayleighNumber(p.betaPerK, Math.abs(deltaTK), heightM, p.nuM2PerS, p.alphaM2PerS);
  return (nusseltChurchillChu1975(ra, p.pr) * p.kWPerMK) / heightM;
}

/** Pot geometry assumed from its volume: a cylinder with height = diameter (common practice, no source). */
export interface PotGeometry {
  diameterM: number;
  bottomAreaM2: number;
  /** Outer wall area up to the brim [m²]. */
  wallAreaM2: number;
}

/**
 * Cylinder of height = diameter holding volumeL: D = (4V/π)^(1/3).
 * @param volumeL usable volume [L]
 */
export function potGeometryFromVolume(volumeL: number): PotGeometry {
  const v = volumeL / 1000;
  const d = Math.cbrt((4 * v) / Math.PI);
  return { diameterM: d, bottomAreaM2: (Math.PI * d * d) / 4, wallAreaM2: Math.PI * d * d };
}

/**
 * Property groups of a medium that the coupling needs, tabulated every FILM_TABLE_STEP_K and interpolated linearly
 * (the properties are smooth; the interpolation error is far below the correlations' own ±10–20 %). Filled lazily
 * and cached per medium, so the hot loop calls no Math.pow. Entries where the medium is solid are NaN.
 */
interface FilmGroupTable {
  /** g·β/(ν·α) [1/(K·m³)] */
  gb: Float64Array;
  /** 0.069·k·Pr^0.074 (Globe & Dropkin prefactor) [W/(m·K)] */
  gd: Float64Array;
  /** 0.387 / [1 + (0.492/Pr)^(9/16)]^(8/27) (Churchill & Chu) [–] */
  cc: Float64Array;
  /** k [W/(m·K)] */
  k: Float64Array;
  filled: Uint8Array;
}
const FILM_TABLE_MIN_C = -50;
const FILM_TABLE_MAX_C = 700;
/** Spacing of the film-property table [K]. */
export const FILM_TABLE_STEP_K = 0.5;
const FILM_TABLE_SIZE = Math.round((FILM_TABLE_MAX_C - FILM_TABLE_MIN_C) / FILM_TABLE_STEP_K) + 1;
const FILM_TABLES = new WeakMap<StorageMedium, FilmGroupTable>();
const FILM_SCRATCH = createFilmProperties();

/** Evaluate the coupling's property groups at tC into out = [gb, gd, cc, k]; false when the medium is solid there. */
function filmGroupsExact(medium: StorageMedium, tC: number, out: Float64Array): boolean {
  out[3] = medium.conductivity(tC);
  const p = filmProperties(medium, tC, FILM_SCRATCH);
  if (p === null) return false;
  out[0] = (STANDARD_GRAVITY_M_PER_S2 * p.betaPerK) / (p.nuM2PerS * p.alphaM2PerS);
  out[1] = 0.069 * p.kWPerMK * Math.pow(p.pr, 0.074);
  out[2] = 0.387 / Math.pow(1 + Math.pow(0.492 / p.pr, 9 / 16), 8 / 27);
  return true;
}

const ROW = new Float64Array(4);
/** Fill table row i (temperature FILM_TABLE_MIN_C + i·FILM_TABLE_STEP_K) with the exact property groups. */
function fillRow(t: FilmGroupTable, medium: StorageMedium, i: number): void {
  const ok = filmGroupsExact(medium, FILM_TABLE_MIN_C + i * FILM_TABLE_STEP_K, ROW);
  t.gb[i] = ok ? ROW[0]! : Number.NaN;
  t.gd[i] = ok ? ROW[1]! : Number.NaN;
  t.cc[i] = ok ? ROW[2]! : Number.NaN;
  t.k[i] = ROW[3]!;
  t.filled[i] = 1;
}

/** The cached film-property table of a medium (created empty on first use). */
function filmGroupTable(medium: StorageMedium): FilmGroupTable {
  let t = FILM_TABLES.get(medium);
  if (t === undefined) {
    t = {
      gb: new Float64Array(FILM_TABLE_SIZE),
      gd: new Float64Array(FILM_TABLE_SIZE),
      cc: new Float64Array(FILM_TABLE_SIZE),
      k: new Float64Array(FILM_TABLE_SIZE),
      filled: new Uint8Array(FILM_TABLE_SIZE),
    };
    FILM_TABLES.set(medium, t);
  }
  return t;
}

/** Property groups at tC from a medium's table (see filmGroups). */
function filmGroupsFromTable(t: FilmGroupTable, medium: StorageMedium, tC: number, out: Float64Array): boolean {
  const x = (tC - FILM_TABLE_MIN_C) / FILM_TABLE_STEP_K;
  if (!(x >= 0 && x < FILM_TABLE_SIZE - 1)) return filmGroupsExact(medium, tC, out);
  const i = Math.floor(x);
  if (t.filled[i] === 0) fillRow(t, medium, i);
  if (t.filled[i + 1] === 0) fillRow(t, medium, i + 1);
  const f = x - i;
  const gb0 = t.gb[i]!;
  const gb1 = t.gb[i + 1]!;
  if (gb0 !== gb0 || gb1 !== gb1) return filmGroupsExact(medium, tC, out); // NaN: a solid node nearby
  out[0] = gb0 + f * (gb1 - gb0);
  out[1] = t.gd[i]! + f * (t.gd[i + 1]! - t.gd[i]!);
  out[2] = t.cc[i]! + f * (t.cc[i + 1]! - t.cc[i]!);
  out[3] = t.k[i]! + f * (t.k[i + 1]! - t.k[i]!);
  return true;
}

/**
 * Property groups at tC into out = [g·β/(ν·α) [1/(K·m³)], 0.069·k·Pr^0.074 [W/(m·K)], Churchill–Chu Prandtl factor
 * 0.387/[1 + (0.492/Pr)^(9/16)]^(8/27) [–], k [W/(m·K)]] (table + linear interpolation; exact evaluation outside
 * the table or next to a solid/liquid switch).
 * @returns false when the medium is solid at tC
 */
export function filmGroups(medium: StorageMedium, tC: number, out: Float64Array): boolean {
  return filmGroupsFromTable(filmGroupTable(medium), medium, tC, out);
}

/**
 * Store-to-pot coupling conductance by natural convection on the store side, UA = h_bottom·A_bottom + h_wall·A_wall.
 * The contact area fills the pot bottom first, the rest is immersed wall (wetted height A_wall/(π·D)).
 * - bottom: the oil under a cooler pot bottom is a layer heated from below → Globe & Dropkin 1959;
 * - wall: Churchill & Chu 1975 over the wetted height;
 * - floor: conduction h ≥ k/L with L = D/4 (area/perimeter of the bottom), also used when the store is solid or the
 *   pot is the hotter side of the bottom (stable layer).
 * Properties at the film temperature (T_store + T_pot)/2, from the table above.
 * Phase-change stores (medium.melting set):
 * - the melt convects with the liquid's properties, evaluated at max(film, liquidus + 1 K): under a cold pot the film
 *   mean falls below the melting range, but what convects is melt (erythritol in particular supercools tens of
 *   kelvin), and inside the range the blended density of the enthalpy model would give the melting contraction
 *   (≈ 0.07 1/K for erythritol) as a spurious expansion coefficient. A frozen crust on the pot is not modelled.
 * - in the melting range (mushy store) the conductance is weighted by the melt fraction f (liquidFractionEnthalpyMethod):
 *   UA = f·UA_melt + (1 − f)·UA_solid, UA_solid = k(T_film)·A/L (conduction). This is the lumped form of the
 *   enthalpy–porosity method (Voller & Prakash 1987, "A fixed grid numerical modelling methodology for
 *   convection–diffusion mushy region phase-change problems", Int. J. Heat Mass Transfer 30(8):1709–1719; Brent,
 *   Voller & Reid 1988, Numer. Heat Transfer 13:297–318, validated on the gallium melting experiment of Gau &
 *   Viskanta 1986): a mushy zone is a porous medium of porosity f, with convection fully damped at f = 0 and free at
 *   f = 1, and mixture properties weighted by f. Read as areas: the fraction f of the pot's contact area is wetted
 *   by convecting melt, the rest rests against solid. It is continuous at the solidus (conduction) and at the
 *   liquidus (melt convection).
 * The pot-side (food/water) film resistance and the pot wall are neglected: the oil side's h is an order of magnitude
 * below that of water in natural convection or boiling.
 * @returns a function ua(tStoreC, tPotC) → [W/K] that reuses its scratch space (no allocation per call)
 */
export function createNaturalConvectionCoupling(
  medium: StorageMedium,
  contactAreaM2: number,
  potVolumeL: number,
): (tStoreC: number, tPotC: number) => number {
  const g = potGeometryFromVolume(potVolumeL);
  const aBottom = Math.min(contactAreaM2, g.bottomAreaM2);
  const aWall = contactAreaM2 - aBottom;
  const wetHeight = aWall > 0 ? aWall / (Math.PI * g.diameterM) : 0;
  const floorLength = g.diameterM / 4;
  const grp = new Float64Array(4);
  const table = filmGroupTable(medium);
  const melting = medium.melting;

  /** UA of a convecting fluid with the property groups in grp (filled, liquid) and store − pot difference dT [W/K]. */
  const convectiveUa = (dT: number): number => {
    const k = grp[3]!;
    const hFloor = k / floorLength;
    const c = Math.cbrt(grp[0]! * (dT < 0 ? -dT : dT)); // (g·β·|ΔT|/(ν·α))^(1/3) [1/m]
    // Bottom: Globe & Dropkin 1959 with the depth cancelled, only when the oil below is the hotter side.
    const hb = dT > 0 ? grp[1]! * c : 0;
    let ua = (hb > hFloor ? hb : hFloor) * aBottom;
    if (wetHeight > 0) {
      // Wall: Churchill & Chu 1975, Ra^(1/3) = c·L, Nu = (0.825 + 0.387·Ra^(1/6)/f(Pr))², Ra^(1/6) = √(Ra^(1/3)).
      const s = 0.825 + grp[2]! * Math.sqrt(c * wetHeight);
      const hw = (s * s * k) / wetHeight;
      ua += (hw > hFloor ? hw : hFloor) * aWall;
    }
    return ua;
  };

  if (melting === undefined) {
    return (tStoreC: number, tPotC: number): number => {
      const liquid = filmGroupsFromTable(table, medium, 0.5 * (tStoreC + tPotC), grp);
      if (!liquid) return (grp[3]! / floorLength) * contactAreaM2;
      return convectiveUa(tStoreC - tPotC);
    };
  }

  const meltFilmMinC = melting.liquidusC + 1;
  return (tStoreC: number, tPotC: number): number => {
    const f = liquidFractionEnthalpyMethod(medium, tStoreC);
    const tFilm = 0.5 * (tStoreC + tPotC);
    // Solid-conduction limit with the (mixture) conductivity at the film temperature.
    const uaSolid = f < 1 ? (medium.conductivity(tFilm) / floorLength) * contactAreaM2 : 0;
    if (f <= 0) return uaSolid;
    // Melt-convection limit: the liquid's properties at max(film, liquidus + 1 K).
    if (!filmGroupsFromTable(table, medium, tFilm > meltFilmMinC ? tFilm : meltFilmMinC, grp)) return uaSolid;
    const uaMelt = convectiveUa(tStoreC - tPotC);
    return f * uaMelt + (1 - f) * uaSolid;
  };
}

/**
 * Store-to-pot coupling conductance [W/K] by natural convection (see createNaturalConvectionCoupling).
 * @param tStoreC store (top layer) temperature [°C]; @param tPotC pot temperature [°C]
 * @param contactAreaM2 wetted outer area of the pot [m²]; @param potVolumeL pot volume [L]
 */
export function potCouplingNaturalConvectionWPerK(
  medium: StorageMedium,
  tStoreC: number,
  tPotC: number,
  contactAreaM2: number,
  potVolumeL: number,
): number {
  return createNaturalConvectionCoupling(medium, contactAreaM2, potVolumeL)(tStoreC, tPotC);
}
