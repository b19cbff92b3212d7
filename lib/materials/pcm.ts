/**
 * Phase-change storage media by the enthalpy method: erythritol, MgCl₂·6H₂O, D-mannitol, acetanilide and the
 * NaNO₃–KNO₃ 60:40 "solar salt".
 *
 * Method: apparent specific heat (enthalpy method; Voller & Prakash 1987, see ./enthalpy.ts). Sensible cp is linear in
 * the solid and in the liquid; across the melting range [solidus, liquidus] the sensible cp is blended linearly from
 * the solid value at the solidus to the liquid value at the liquidus, and the latent heat L [J/kg] is spread uniformly
 * over the range (apparent cp + L/ΔT). A pure substance melts at one temperature; the ±1 K range is a modelling
 * choice (no source) that keeps h(T) strictly increasing so T(h) is a function.
 *
 * Known pitfall: supercooling. On cooling, sugar alcohols and salt hydrates can stay liquid tens of kelvin below the
 * melting point before they crystallise, so the stored latent heat comes back later and colder than this model
 * (no hysteresis) predicts. It is recorded in supercoolingK / notes for the planner to warn about.
 *
 * Viscosity is NaN below the solidus (solid); from the solidus up it is the liquid value — the melt along a heated
 * wall convects while the rest is still mushy.
 */
import { createPiecewiseLinearEnthalpy } from './enthalpy';
import type { StorageMedium } from './types';

/**
 * Liquid (melt) fraction f [0..1] of a medium at T [°C] by the enthalpy method (Voller & Prakash 1987, Int. J. Heat
 * Mass Transfer 30(8):1709; see ./enthalpy.ts): with the latent heat spread uniformly over [solidus, liquidus] (this
 * file's convention), the latent part of h(T) is L·f with f = (T − T_solidus)/(T_liquidus − T_solidus), clipped to
 * [0, 1]. A medium without a melting range is liquid wherever it has a viscosity (f = 1) and solid elsewhere (f = 0).
 * @param tC temperature [°C]
 * @returns f [–]
 */
export function liquidFractionEnthalpyMethod(medium: StorageMedium, tC: number): number {
  const m = medium.melting;
  if (m === undefined) return medium.viscosity(tC) > 0 ? 1 : 0;
  if (tC <= m.solidusC) return 0;
  if (tC >= m.liquidusC) return 1;
  return (tC - m.solidusC) / (m.liquidusC - m.solidusC);
}

/** A linear property p(T) = valueAtRef + slopePerK·(T − refC). */
interface LinearProperty {
  refC: number;
  value: number;
  slopePerK: number;
}
/** A linear property through value at refC [°C] with slopePerK [unit/K] (0 = constant). */
const lin = (refC: number, value: number, slopePerK = 0): LinearProperty => ({ refC, value, slopePerK });
/** Evaluate a linear property at T [°C]. */
const evalLin = (p: LinearProperty, tC: number): number => p.value + p.slopePerK * (tC - p.refC);

export interface PcmParameters {
  id: string;
  name: string;
  solidusC: number;
  liquidusC: number;
  latentJPerKg: number;
  /** Sensible specific heat [J/(kg·K)] of the solid and of the liquid (linear in T). */
  cpSolid: LinearProperty;
  cpLiquid: LinearProperty;
  /** Density [kg/m³] of solid and liquid. */
  densitySolid: LinearProperty;
  densityLiquid: LinearProperty;
  /** Conductivity [W/(m·K)] of solid and liquid. */
  kSolid: LinearProperty;
  kLiquid: LinearProperty;
  /** Liquid dynamic viscosity [Pa·s] at T [°C]. */
  viscosityLiquid: (tC: number) => number;
  recommendedMaxC: number;
  flashPointC?: number;
  supercoolingK?: number;
  validRangeC: { min: number; max: number };
  sources: string[];
  notes: string[];
}

/** Width of the solid and liquid cp segments before cp is held constant [K] (keeps h(T) monotonic). */
const SENSIBLE_SPAN_K = 250;

/**
 * Build a phase-change medium (enthalpy method with latent heat spread uniformly over the melting range).
 * @throws RangeError when the melting range is empty or the latent heat is not positive.
 */
export function createPhaseChangeMaterial(p: PcmParameters): StorageMedium {
  const ts = p.solidusC;
  const tl = p.liquidusC;
  if (!(tl > ts)) throw new RangeError(`${p.id}: liquidusC must exceed solidusC`);
  if (!(p.latentJPerKg > 0)) throw new RangeError(`${p.id}: latentJPerKg must be positive`);
  const latentPerK = p.latentJPerKg / (tl - ts);
  const csAt = (t: number): number => evalLin(p.cpSolid, t);
  const clAt = (t: number): number => evalLin(p.cpLiquid, t);
  const h = createPiecewiseLinearEnthalpy([
    { t0C: ts - SENSIBLE_SPAN_K, t1C: ts, c0: Math.max(csAt(ts - SENSIBLE_SPAN_K), 100), c1: csAt(ts) },
    { t0C: ts, t1C: tl, c0: csAt(ts) + latentPerK, c1: clAt(tl) + latentPerK },
    { t0C: tl, t1C: tl + SENSIBLE_SPAN_K, c0: clAt(tl), c1: Math.max(clAt(tl + SENSIBLE_SPAN_K), 100) },
  ]);
  const blend = (tC: number, solid: LinearProperty, liquid: LinearProperty): number => {
    if (tC < ts) return evalLin(solid, tC);
    if (tC >= tl) return evalLin(liquid, tC);
    const f = (tC - ts) / (tl - ts);
    return (1 - f) * evalLin(solid, ts) + f * evalLin(liquid, tl);
  };
  return {
    id: p.id,
    name: p.name,
    kind: 'pcm',
    density: (tC) => blend(tC, p.densitySolid, p.densityLiquid),
    // Sensible part only: the apparent cp of the enthalpy curve minus the latent spread inside [solidus, liquidus).
    specificHeat: (tC) => h.apparentCp(tC) - (tC >= ts && tC < tl ? latentPerK : 0),
    conductivity: (tC) => blend(tC, p.kSolid, p.kLiquid),
    viscosity: (tC) => (tC < ts ? Number.NaN : p.viscosityLiquid(tC)),
    enthalpy: h.enthalpy,
    temperatureAt: h.temperatureAt,
    validRangeC: p.validRangeC,
    flashPointC: p.flashPointC,
    melting: { solidusC: ts, liquidusC: tl, latentJPerKg: p.latentJPerKg },
    recommendedMaxC: p.recommendedMaxC,
    sources: p.sources,
    supercoolingK: p.supercoolingK,
    notes: p.notes,
  };
}

const MELT_RANGE_NOTE = 'Melting range ±1 K around the melting point is a modelling choice (no source).';

/** Molar mass of erythritol C₄H₁₀O₄ [kg/mol]: 4·12.011 + 10·1.008 + 4·15.999 g/mol (IUPAC standard atomic weights). */
export const ERYTHRITOL_MOLAR_MASS_KG_PER_MOL = (4 * 12.011 + 10 * 1.008 + 4 * 15.999) / 1000;
/** Erythritol melting point 390.254 K and enthalpy of fusion 37.92 kJ/mol (J. Therm. Anal. Calorim. 95(2):469; secondary). */
export const ERYTHRITOL_MELT_C = 390.254 - 273.15;
export const ERYTHRITOL_LATENT_J_PER_KG = 37920 / ERYTHRITOL_MOLAR_MASS_KG_PER_MOL; // ≈ 310.5 kJ/kg

export const erythritol: StorageMedium = createPhaseChangeMaterial({
  id: 'erythritol',
  name: 'Erythritol (sugar alcohol PCM)',
  solidusC: ERYTHRITOL_MELT_C - 1,
  liquidusC: ERYTHRITOL_MELT_C + 1,
  latentJPerKg: ERYTHRITOL_LATENT_J_PER_KG,
  // Agyenim, Hewitt, Eames & Smyth 2010, RSER 14:615, property table (from memory): cp 1.383 / 2.765 kJ/(kg·K),
  // ρ 1480 / 1300 kg/m³, k 0.733 / 0.326 W/(m·K), solid / liquid.
  cpSolid: lin(20, 1383),
  cpLiquid: lin(140, 2765),
  densitySolid: lin(20, 1480),
  // Liquid expansion −0.8 kg/(m³·K) (β ≈ 6e-4 1/K): assumed, typical of organic liquids, no source. Without it the melt
  // would have β = 0 and no natural convection at the pot.
  densityLiquid: lin(140, 1300, -0.8),
  kSolid: lin(20, 0.733),
  kLiquid: lin(140, 0.326),
  // ≈ 28.6 mPa·s at 140 °C (from memory, uncertain); held constant (no source for its temperature dependence).
  viscosityLiquid: () => 0.0286,
  // Degrades with long cycling above 180 °C (lib/REFERENCES.md, secondary); 20 K margin (common practice, no source).
  recommendedMaxC: 160,
  validRangeC: { min: 20, max: 180 },
  sources: [
    'Melting point 390.254 K and enthalpy of fusion 37.92 kJ/mol: J. Therm. Anal. Calorim. 95(2):469 (secondary)',
    'Agyenim F., Hewitt N., Eames P., Smyth M. (2010) A review of materials, heat transfer and phase change problem formulation for latent heat thermal energy storage systems. RSER 14:615–628 — cp, density, conductivity (from memory); reviews quote ≈ 340 kJ/kg latent',
    'Höhlein S., König-Haagen A., Brüggemann D. (2017) Thermophysical characterization of MgCl2·6H2O, xylitol and erythritol as PCM. Materials 10(4):444 — large supercooling of erythritol (abstract, secondary)',
  ],
  notes: [
    'Strong supercooling: liquid erythritol can cool tens of kelvin below 117 °C before it crystallises, releasing its latent heat late and cold; the enthalpy model ignores this.',
    'Degrades with long cycling above 180 °C.',
    MELT_RANGE_NOTE,
  ],
});

export const magnesiumChlorideHexahydrate: StorageMedium = createPhaseChangeMaterial({
  id: 'magnesium-chloride-hexahydrate',
  name: 'Magnesium chloride hexahydrate MgCl₂·6H₂O (salt-hydrate PCM)',
  // ≈ 117 °C, ≈ 169 kJ/kg (Sharma et al. 2009, RSER 13:318; from memory). Höhlein et al. 2017 measured
  // 115.1 ± 0.1 °C and 166.9 ± 1.2 J/g on technical grade (abstract, secondary).
  solidusC: 116,
  liquidusC: 118,
  latentJPerKg: 169e3,
  // Sharma et al. 2009 table (from memory): cp 2.25 / 2.61 kJ/(kg·K); ρ 1569 / 1450 kg/m³; k 0.694 / 0.570 W/(m·K).
  cpSolid: lin(20, 2250),
  cpLiquid: lin(120, 2610),
  densitySolid: lin(20, 1569),
  // Liquid expansion −0.6 kg/(m³·K): assumed for a salt-hydrate melt, no source (β = 0 would suppress convection).
  densityLiquid: lin(120, 1450, -0.6),
  kSolid: lin(90, 0.694),
  kLiquid: lin(120, 0.57),
  // Assumed, no source: order of magnitude of a concentrated salt-hydrate melt.
  viscosityLiquid: () => 0.02,
  // Assumed, no source: the hydrate loses water and hydrolyses when overheated; keep sealed and ≈ 20 K above melting.
  recommendedMaxC: 140,
  // ≈ 37 K for the pure salt over 50 cycles (Pilar, Svoboda, Honcová & Oravová 2012, Thermochim. Acta 546:81; abstract, secondary).
  supercoolingK: 37,
  validRangeC: { min: 20, max: 150 },
  sources: [
    'Sharma A., Tyagi V.V., Chen C.R., Buddhi D. (2009) Review on thermal energy storage with phase change materials and applications. RSER 13:318–345 — 117 °C, 169 kJ/kg, properties (from memory)',
    'Pilar R., Svoboda L., Honcová P., Oravová L. (2012) Study of magnesium chloride hexahydrate as heat storage material. Thermochim. Acta 546:81–86 — supercooling ≈ 37 K (abstract, secondary)',
    'Höhlein S., König-Haagen A., Brüggemann D. (2017) Materials 10(4):444 — 115.1 °C, 166.9 J/g, 2.8 K supercooling at 100 g samples (abstract, secondary)',
  ],
  notes: [
    'Supercools ≈ 37 K as a pure salt in small samples (less in 100 g samples or with SrCO₃ / Sr(OH)₂ nucleators).',
    'Corrosive to steel and aluminium when molten; keep in a sealed, compatible container.',
    'Viscosity of the melt is an assumed order of magnitude (no source).',
    MELT_RANGE_NOTE,
  ],
});

export const dMannitol: StorageMedium = createPhaseChangeMaterial({
  id: 'd-mannitol',
  name: 'D-mannitol (sugar alcohol PCM)',
  // 166–167 °C, ≈ 300 kJ/kg (Sharma et al. 2009; from memory).
  solidusC: 165.5,
  liquidusC: 167.5,
  latentJPerKg: 300e3,
  // From memory, uncertain: cp ≈ 1.6 (solid, averaged) / 2.4 kJ/(kg·K) (liquid); ρ ≈ 1490 / 1330 kg/m³; k ≈ 0.6 / 0.2 W/(m·K).
  cpSolid: lin(20, 1600),
  cpLiquid: lin(170, 2400),
  densitySolid: lin(20, 1490),
  // Liquid expansion −0.8 kg/(m³·K): assumed, typical of organic liquids, no source.
  densityLiquid: lin(170, 1330, -0.8),
  kSolid: lin(20, 0.6),
  kLiquid: lin(170, 0.2),
  // Assumed, no source: sugar-alcohol melts are viscous; order of magnitude.
  viscosityLiquid: () => 0.02,
  // Common practice, no source: sugar alcohols oxidise in air above their melting point; keep within ≈ 20 K of it.
  recommendedMaxC: 185,
  validRangeC: { min: 20, max: 200 },
  sources: [
    'Sharma A. et al. (2009) RSER 13:318–345 — D-mannitol 166–167 °C, ≈ 300 kJ/kg (from memory)',
    'Solid/liquid cp, density, conductivity: from memory, uncertain',
  ],
  notes: [
    'Supercools strongly and degrades (browning) with repeated cycling in air above its melting point.',
    'Liquid properties are uncertain (from memory / assumed).',
    MELT_RANGE_NOTE,
  ],
});

export const acetanilide: StorageMedium = createPhaseChangeMaterial({
  id: 'acetanilide',
  name: 'Acetanilide (organic PCM)',
  // 118.9 °C, 222 kJ/kg (Sharma et al. 2009; from memory).
  solidusC: 117.9,
  liquidusC: 119.9,
  latentJPerKg: 222e3,
  // From memory, uncertain: cp ≈ 1.32 (solid, 179 J/(mol·K) / 135.17 g/mol) / 2.0 kJ/(kg·K) (liquid);
  // ρ ≈ 1219 (solid) / 1050 (liquid) kg/m³; k ≈ 0.2 / 0.17 W/(m·K).
  cpSolid: lin(20, 1320),
  cpLiquid: lin(120, 2000),
  densitySolid: lin(20, 1219),
  // Liquid expansion −0.8 kg/(m³·K): assumed, typical of organic liquids, no source.
  densityLiquid: lin(120, 1050, -0.8),
  kSolid: lin(20, 0.2),
  kLiquid: lin(120, 0.17),
  viscosityLiquid: () => 0.0022, // ≈ 2.2 mPa·s near 120 °C (from memory, uncertain)
  flashPointC: 169, // from memory
  // Flash point 169 °C − 25 K margin (common practice, no source).
  recommendedMaxC: 145,
  validRangeC: { min: 20, max: 160 },
  sources: ['Sharma A. et al. (2009) RSER 13:318–345 — acetanilide 118.9 °C, 222 kJ/kg (from memory)', 'Other properties: from memory, uncertain'],
  notes: [
    'Acetanilide is harmful if swallowed and not food-safe: it must be fully sealed away from food and cooks.',
    'Flash point ≈ 169 °C (from memory): keep the store well below it.',
    MELT_RANGE_NOTE,
  ],
});

/**
 * Zavoico 2001, "Solar Power Tower Design Basis Document", SAND2001-2100, liquid solar-salt correlations
 * (from memory; valid ≈ 260–600 °C): ρ = 2090 − 0.636·T [kg/m³], cp = 1443 + 0.172·T [J/(kg·K)],
 * k = 0.443 + 1.9e-4·T [W/(m·K)], μ = 22.714 − 0.120·T + 2.281e-4·T² − 1.474e-7·T³ [mPa·s], T in °C.
 */
export function solarSaltViscosityZavoico2001PaS(tC: number): number {
  return (22.714 - 0.12 * tC + 2.281e-4 * tC * tC - 1.474e-7 * tC * tC * tC) * 1e-3;
}

export const solarSalt: StorageMedium = createPhaseChangeMaterial({
  id: 'solar-salt',
  name: 'Solar salt NaNO₃–KNO₃ 60:40',
  // Melts from ≈ 220 °C; 60:40 is off-eutectic so it melts over a range, liquidus ≈ 240 °C (from memory).
  solidusC: 220,
  liquidusC: 240,
  latentJPerKg: 110e3, // ≈ 110 kJ/kg (lib/REFERENCES.md: memory)
  cpSolid: lin(240, 1443 + 0.172 * 240), // assumed equal to the liquid value at the liquidus (no source)
  cpLiquid: lin(0, 1443, 0.172), // Zavoico 2001 (from memory)
  densitySolid: lin(20, 2190), // mass-weighted NaNO₃ 2260 / KNO₃ 2110 kg/m³ (from memory)
  densityLiquid: lin(0, 2090, -0.636), // Zavoico 2001 (from memory)
  kSolid: lin(220, 0.443 + 1.9e-4 * 220), // assumed equal to the liquid value (no source)
  kLiquid: lin(0, 0.443, 1.9e-4), // Zavoico 2001 (from memory)
  viscosityLiquid: solarSaltViscosityZavoico2001PaS,
  // Upper design limit ≈ 565 °C (nitrate decomposition above ≈ 600 °C), Zavoico 2001 (from memory).
  recommendedMaxC: 565,
  validRangeC: { min: 20, max: 600 },
  sources: [
    'Pilar et al. 2012 / Sharma et al. 2009 — NaNO₃–KNO₃ 60:40 ≈ 220 °C, ≈ 110 kJ/kg (from memory)',
    'Zavoico A.B. (2001) Solar Power Tower Design Basis Document, Sandia report SAND2001-2100 — liquid correlations (from memory)',
  ],
  notes: [
    'Melts at ≈ 220 °C, above the smoke point of cooking oils: it suits a high-temperature store with a heat exchanger, not direct frying.',
    'A strong oxidiser: keep it away from oil, wood and other fuels.',
  ],
});

export const PCMS: readonly StorageMedium[] = [erythritol, magnesiumChlorideHexahydrate, dMannitol, acetanilide, solarSalt];
