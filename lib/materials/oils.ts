/**
 * Vegetable-oil storage media: sunflower, palm, soybean, rapeseed, cottonseed.
 *
 * Correlations (units in lib/GLOSSARY.md):
 * - density ρ(T) = ρ_ref − 0.65·(T − T_ref) [kg/m³]: linear fall of ≈ 0.65 kg/m³ per K, Esteban, Riba, Baquero,
 *   Rius & Puig 2012, "Temperature dependence of density and viscosity of vegetable oils", Biomass & Bioenergy
 *   42:164–171 (slope from memory); ρ_ref per oil from Codex Stan 210-1999 relative densities (sunflower read in a
 *   secondary source, the others from memory).
 * - specific heat c_p(T) linear, ≈ 2.0 kJ/(kg·K) at 40 °C to ≈ 2.4 at 180 °C: Fasina & Colley 2008, "Viscosity and
 *   specific heat of vegetable oils as a function of temperature: 35 °C to 180 °C", Int. J. Food Prop. 11:738–746
 *   (the two end values from memory; the paper gives one linear fit per oil, we use the common line for all five).
 * - conductivity k(T) = 0.165 − 2.0e-4·(T − 25) [W/(m·K)]: 0.16–0.17 at 25 °C falling slowly, Turgut, Tavman &
 *   Tavman 2009, Int. J. Food Prop. 12(4) (from memory; the slope is an order-of-magnitude value, from memory).
 * - viscosity μ(T): Vogel–Fulcher–Tammann form ln μ = A + B/(T_K − T0), which is the modified-WLF form that
 *   Fasina & Colley 2008 found best. Shape (B, T0) fitted through ≈ 50 mPa·s at 25 °C and ≈ 7 at 100 °C (Fasina &
 *   Colley 2008 / Stanciu, Grasas y Aceites; mixed certainty) and 3.0 mPa·s at 180 °C (chosen inside the 2.6–192.6
 *   mPa·s span that Stanciu reports for 13 oils over 278–453 K); level A per oil set by its kinematic viscosity at
 *   38 °C (Demirbas 2003, Energy Convers. Manage. 44:2093, table of oil properties; from memory).
 * - smoke point: lower end of the handbook ranges in lib/REFERENCES.md (refined oils; secondary); flash points from memory.
 * - recommendedMaxC = smoke point − 30 K (common practice, no source: a margin for hot spots at the absorber and
 *   for the smoke point falling as the oil ages and its free fatty acids rise).
 */
import { createPiecewiseLinearEnthalpy } from './enthalpy';
import type { StorageMedium } from './types';

const KELVIN = 273.15;

/** Density slope of vegetable oils [kg/(m³·K)] — Esteban et al. 2012 (from memory). */
export const OIL_DENSITY_SLOPE_KG_PER_M3K = -0.65;
/** Specific heat line through (40 °C, 2000) and (180 °C, 2400) J/(kg·K) — Fasina & Colley 2008 (from memory). */
export const OIL_CP_AT_40C_J_PER_KGK = 2000;
export const OIL_CP_AT_180C_J_PER_KGK = 2400;
/** Conductivity at 25 °C [W/(m·K)] and slope [W/(m·K²)] — Turgut et al. 2009 (from memory). */
export const OIL_K_AT_25C_W_PER_MK = 0.165;
export const OIL_K_SLOPE_W_PER_MK2 = -2.0e-4;

/**
 * Fit ln μ = A + B/(T_K − T0) (Vogel–Fulcher–Tammann / modified WLF) exactly through three points.
 * Closed form: with y = ln μ, R = [(y1−y2)/(y2−y3)]·[(x3−x2)/(x2−x1)], T0 = (R·x1 − x3)/(R − 1).
 * @param points three [tC [°C], μ [Pa·s]] pairs with increasing T and decreasing μ
 * @returns A [ln(Pa·s)], B [K], T0 [K]
 */
export function fitVogelFulcherTammann(
  points: readonly [readonly [number, number], readonly [number, number], readonly [number, number]],
): { a: number; bK: number; t0K: number } {
  const [[t1, m1], [t2, m2], [t3, m3]] = points;
  const x1 = t1 + KELVIN;
  const x2 = t2 + KELVIN;
  const x3 = t3 + KELVIN;
  const y1 = Math.log(m1);
  const y2 = Math.log(m2);
  const y3 = Math.log(m3);
  const r = ((y1 - y2) / (y2 - y3)) * ((x3 - x2) / (x2 - x1));
  const t0K = (r * x1 - x3) / (r - 1);
  const bK = (y1 - y2) / (1 / (x1 - t0K) - 1 / (x2 - t0K));
  const a = y1 - bK / (x1 - t0K);
  return { a, bK, t0K };
}

/**
 * Viscosity shape shared by the oils: through 50 mPa·s at 25 °C, 7 mPa·s at 100 °C (Fasina & Colley 2008 /
 * Stanciu; lib/REFERENCES.md "mixed") and 3.0 mPa·s at 180 °C (inside Stanciu's 2.6–192.6 mPa·s span at 278–453 K).
 */
export const OIL_VISCOSITY_SHAPE = fitVogelFulcherTammann([
  [25, 0.05],
  [100, 0.007],
  [180, 0.003],
]);

/** Temperature range of the cp line before it is held constant (keeps h(T) monotonic; not a validity claim) [°C]. */
const CP_LINE_MIN_C = -40;
const CP_LINE_MAX_C = 300;

export interface OilParameters {
  id: string;
  name: string;
  /** Reference density [kg/m³] at refTempC [°C]. */
  densityRefKgPerM3: number;
  densityRefTempC: number;
  /** Kinematic viscosity at 38 °C [mm²/s] (sets the level of the viscosity curve). */
  kinematicViscosity38Mm2PerS: number;
  /** Below this temperature [°C] the oil is (partly) crystalline: viscosity() returns NaN. */
  solidBelowC?: number;
  smokePointC: number;
  flashPointC: number;
  validRangeC: { min: number; max: number };
  sources: string[];
  notes?: string[];
}

/** Linear specific heat of vegetable oil [J/(kg·K)] at T [°C] — Fasina & Colley 2008 line (from memory). */
export function oilSpecificHeatFasinaColley2008(tC: number): number {
  const slope = (OIL_CP_AT_180C_J_PER_KGK - OIL_CP_AT_40C_J_PER_KGK) / (180 - 40);
  const t = tC < CP_LINE_MIN_C ? CP_LINE_MIN_C : tC > CP_LINE_MAX_C ? CP_LINE_MAX_C : tC;
  return OIL_CP_AT_40C_J_PER_KGK + slope * (t - 40);
}

/** Conductivity of vegetable oil [W/(m·K)] at T [°C] — Turgut et al. 2009 (from memory), floored at 0.05. */
export function oilConductivityTurgut2009(tC: number): number {
  const k = OIL_K_AT_25C_W_PER_MK + OIL_K_SLOPE_W_PER_MK2 * (tC - 25);
  return k > 0.05 ? k : 0.05;
}

/**
 * Build a vegetable-oil medium from its parameters (correlations in the file comment).
 * Enthalpy is the integral of the linear cp from 0 °C (sensible only; see palm-oil note on fusion).
 */
export function createVegetableOil(p: OilParameters): StorageMedium {
  const cpSegment = {
    t0C: CP_LINE_MIN_C,
    t1C: CP_LINE_MAX_C,
    c0: oilSpecificHeatFasinaColley2008(CP_LINE_MIN_C),
    c1: oilSpecificHeatFasinaColley2008(CP_LINE_MAX_C),
  };
  const h = createPiecewiseLinearEnthalpy([cpSegment]);
  const density = (tC: number): number => p.densityRefKgPerM3 + OIL_DENSITY_SLOPE_KG_PER_M3K * (tC - p.densityRefTempC);
  const { bK, t0K } = OIL_VISCOSITY_SHAPE;
  // Level: μ(38 °C) = ν38 · ρ(38 °C).
  const mu38 = p.kinematicViscosity38Mm2PerS * 1e-6 * density(38);
  const a = Math.log(mu38) - bK / (38 + KELVIN - t0K);
  const solidBelow = p.solidBelowC ?? -Infinity;
  return {
    id: p.id,
    name: p.name,
    kind: 'oil',
    density,
    specificHeat: oilSpecificHeatFasinaColley2008,
    conductivity: oilConductivityTurgut2009,
    viscosity(tC: number): number {
      if (tC < solidBelow) return Number.NaN;
      return Math.exp(a + bK / (tC + KELVIN - t0K));
    },
    enthalpy: h.enthalpy,
    temperatureAt: h.temperatureAt,
    validRangeC: p.validRangeC,
    smokePointC: p.smokePointC,
    flashPointC: p.flashPointC,
    recommendedMaxC: p.smokePointC - 30,
    sources: p.sources,
    notes: p.notes,
  };
}

const COMMON_OIL_SOURCES = [
  'Esteban B., Riba J.-R., Baquero G., Rius A., Puig R. (2012) Temperature dependence of density and viscosity of vegetable oils. Biomass & Bioenergy 42:164–171 — density slope ≈ −0.65 kg/(m³·K) (from memory)',
  'Fasina O.O., Colley Z. (2008) Viscosity and specific heat of vegetable oils as a function of temperature: 35 °C to 180 °C. Int. J. Food Properties 11:738–746 — linear cp ≈ 2.0 kJ/(kg·K) at 40 °C to ≈ 2.4 at 180 °C (from memory); modified-WLF viscosity',
  'Turgut A., Tavman I., Tavman S. (2009) Measurement of thermal conductivity of edible oils using transient hot wire method. Int. J. Food Properties 12(4) — 0.16–0.17 W/(m·K) at 25 °C (from memory)',
  'Stanciu I., A new mathematical model for the viscosity of vegetable oils based on freely sliding molecules. Grasas y Aceites — 13 oils span 2.6–192.6 mPa·s over 278.15–453.15 K',
  'Demirbas A. (2003) Biodiesels from vegetable oils via catalytic and non-catalytic supercritical alcohol transesterifications. Energy Conversion and Management 44:2093–2109 — kinematic viscosity at 38 °C (from memory)',
  'Smoke points: handbook tables (secondary), lower end of the range; vary with refining and age',
];

const COMMON_OIL_NOTES = [
  'cp and viscosity fits were measured 35–180 °C; outside that range the code extrapolates.',
  'Smoke point falls as the oil ages (free fatty acids rise); replace dark or smoking oil and keep the store below recommendedMaxC.',
];

export const sunflowerOil: StorageMedium = createVegetableOil({
  id: 'sunflower-oil',
  name: 'Sunflower oil (refined)',
  // ≈ 920 kg/m³ at 20 °C (Esteban et al. 2012, from memory); Codex Stan 210-1999: relative density 0.918–0.923 at 20 °C.
  densityRefKgPerM3: 920,
  densityRefTempC: 20,
  kinematicViscosity38Mm2PerS: 33.9, // Demirbas 2003 (from memory)
  smokePointC: 227, // refined 227–254 °C (handbook tables, secondary); unrefined ≈ 107 °C
  flashPointC: 316, // ≈ 316 °C (lib/REFERENCES.md: memory)
  validRangeC: { min: 20, max: 180 },
  sources: [...COMMON_OIL_SOURCES, 'Codex Stan 210-1999: sunflower relative density 0.918–0.923 at 20 °C'],
  notes: [...COMMON_OIL_NOTES, 'Unrefined sunflower oil smokes at ≈ 107 °C: use refined oil in a store.'],
});

export const palmOil: StorageMedium = createVegetableOil({
  id: 'palm-oil',
  name: 'Palm oil (refined)',
  // Codex Stan 210-1999: relative density 0.891–0.899 at 50 °C (from memory): 0.895 × 998.2 ≈ 893 kg/m³.
  densityRefKgPerM3: 893,
  densityRefTempC: 50,
  kinematicViscosity38Mm2PerS: 39.6, // Demirbas 2003 (from memory)
  // Slip melting point 33–39 °C (Codex Stan 210-1999, from memory): partly crystalline below ≈ 36 °C.
  solidBelowC: 36,
  smokePointC: 235, // ≈ 235 °C (handbook tables, secondary)
  flashPointC: 267, // from memory
  validRangeC: { min: 40, max: 180 },
  sources: [...COMMON_OIL_SOURCES, 'Codex Stan 210-1999: palm oil relative density 0.891–0.899 at 50 °C, slip melting point 33–39 °C (from memory)'],
  notes: [
    ...COMMON_OIL_NOTES,
    'Palm oil is semi-solid below ≈ 36 °C: viscosity() is NaN there, and its heat of fusion is not in enthalpy() (sensible heat only), so warming a cold store from ambient needs somewhat more energy than modelled.',
  ],
});

export const soybeanOil: StorageMedium = createVegetableOil({
  id: 'soybean-oil',
  name: 'Soybean oil (refined)',
  // Codex Stan 210-1999: relative density 0.919–0.925 at 20 °C (from memory): 0.922 × 998.2 ≈ 920 kg/m³.
  densityRefKgPerM3: 920,
  densityRefTempC: 20,
  kinematicViscosity38Mm2PerS: 32.6, // Demirbas 2003 (from memory)
  smokePointC: 234, // ≈ 234 °C (handbook tables, secondary)
  flashPointC: 282, // from memory
  validRangeC: { min: 20, max: 180 },
  sources: [...COMMON_OIL_SOURCES, 'Codex Stan 210-1999: soybean relative density 0.919–0.925 at 20 °C (from memory)'],
  notes: COMMON_OIL_NOTES,
});

export const rapeseedOil: StorageMedium = createVegetableOil({
  id: 'rapeseed-oil',
  name: 'Rapeseed oil, low erucic (refined)',
  // Codex Stan 210-1999: relative density 0.914–0.920 at 20 °C (from memory): 0.917 × 998.2 ≈ 915 kg/m³.
  densityRefKgPerM3: 915,
  densityRefTempC: 20,
  kinematicViscosity38Mm2PerS: 37.0, // Demirbas 2003 (from memory)
  smokePointC: 204, // refined ≈ 204–230 °C (handbook tables, secondary): lower end
  flashPointC: 275, // from memory
  validRangeC: { min: 20, max: 180 },
  sources: [...COMMON_OIL_SOURCES, 'Codex Stan 210-1999: rapeseed (low erucic) relative density 0.914–0.920 at 20 °C (from memory)'],
  notes: COMMON_OIL_NOTES,
});

export const cottonseedOil: StorageMedium = createVegetableOil({
  id: 'cottonseed-oil',
  name: 'Cottonseed oil (refined)',
  // Codex Stan 210-1999: relative density 0.918–0.926 at 20 °C (from memory): 0.922 × 998.2 ≈ 920 kg/m³.
  densityRefKgPerM3: 920,
  densityRefTempC: 20,
  kinematicViscosity38Mm2PerS: 33.5, // Demirbas 2003 (from memory)
  smokePointC: 220, // 220–230 °C (handbook tables, secondary): lower end
  flashPointC: 252, // from memory
  validRangeC: { min: 20, max: 180 },
  sources: [...COMMON_OIL_SOURCES, 'Codex Stan 210-1999: cottonseed relative density 0.918–0.926 at 20 °C (from memory)'],
  notes: COMMON_OIL_NOTES,
});

export const OILS: readonly StorageMedium[] = [sunflowerOil, palmOil, soybeanOil, rapeseedOil, cottonseedOil];
