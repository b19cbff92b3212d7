/**
 * Backup fuels: heating values, CO₂ factors and default stove efficiencies.
 *
 * Every number carries its source and how sure we are ("secondary" = read in a handbook or a
 * faithful copy of the source; "from memory" = recalled, not yet confirmed in the source).
 * Units follow lib/GLOSSARY.md; fuel quantities are kg, electricity kWh.
 */

export type FuelId = 'lpg' | 'kerosene' | 'wood' | 'charcoal' | 'electricity';

export const FUEL_IDS: readonly FuelId[] = ['lpg', 'kerosene', 'wood', 'charcoal', 'electricity'];

export interface FuelSpec {
  id: FuelId;
  name: string;
  /** Unit in which the fuel is bought and reported. */
  unit: 'kg' | 'kWh';
  /** Net calorific value [J/kg]; null for electricity (bought as kWh). */
  ncvJPerKg: number | null;
  /** CO₂ emission factor per unit of fuel energy [kg/TJ]; null for electricity (see grid factor). */
  co2KgPerTJ: number | null;
  /** True when the CO₂ is biogenic and reported separately (IPCC 2006 Vol. 2 Ch. 2 §2.3.3.4). */
  biogenic: boolean;
  /** Where the numbers come from. */
  sources: string[];
}

/** 1 kWh [J]. */
export const J_PER_KWH = 3.6e6;
/** 1 TJ [J]. */
export const J_PER_TJ = 1e12;

const IPCC_NCV = 'IPCC 2006 Guidelines for National Greenhouse Gas Inventories, Vol. 2 Ch. 1, Table 1.2 (net calorific values, TJ/Gg = MJ/kg) — secondary';
const IPCC_CO2 = 'IPCC 2006 Guidelines, Vol. 2 Ch. 2, Table 2.5 (residential/commercial default CO₂ factors, kg/TJ; same values as Ch. 1 Table 1.4) — secondary';

/**
 * The fuels. NCV: IPCC 2006 Vol. 2 Ch. 1 Table 1.2 (LPG 47.3, kerosene ("other kerosene") 43.8,
 * wood/wood waste 15.6, charcoal 29.5 MJ/kg). CO₂: IPCC 2006 Vol. 2 Table 1.4 / 2.5
 * (LPG 63 100, other kerosene 71 900, wood 112 000, charcoal 112 000 kg/TJ — charcoal from memory).
 */
export const FUELS: Readonly<Record<FuelId, FuelSpec>> = {
  lpg: {
    id: 'lpg',
    name: 'LPG',
    unit: 'kg',
    ncvJPerKg: 47.3e6,
    co2KgPerTJ: 63_100,
    biogenic: false,
    sources: [IPCC_NCV, IPCC_CO2],
  },
  kerosene: {
    id: 'kerosene',
    name: 'Kerosene',
    unit: 'kg',
    ncvJPerKg: 43.8e6,
    co2KgPerTJ: 71_900,
    biogenic: false,
    sources: [IPCC_NCV, IPCC_CO2],
  },
  wood: {
    id: 'wood',
    name: 'Firewood',
    unit: 'kg',
    ncvJPerKg: 15.6e6,
    co2KgPerTJ: 112_000,
    biogenic: true,
    sources: [IPCC_NCV, `${IPCC_CO2}; biogenic, reported separately (IPCC 2006 Vol. 2 Ch. 2)`],
  },
  charcoal: {
    id: 'charcoal',
    name: 'Charcoal',
    unit: 'kg',
    ncvJPerKg: 29.5e6,
    co2KgPerTJ: 112_000,
    // IPCC treats CO₂ from charcoal made from sustainably harvested wood as biogenic too; we report
    // it as fossil-like (counted) because charcoal supply is rarely sustainable. This is a choice, not a source.
    biogenic: false,
    sources: [IPCC_NCV, 'IPCC 2006 Vol. 2 Table 2.5, charcoal 112 000 kg/TJ — from memory'],
  },
  electricity: {
    id: 'electricity',
    name: 'Electricity',
    unit: 'kWh',
    ncvJPerKg: null,
    co2KgPerTJ: null,
    biogenic: false,
    sources: ['Grid factor is a parameter; see DEFAULT_GRID_KG_CO2_PER_KWH'],
  },
};

/**
 * Default grid emission factor [kg CO₂/kWh]: world-average electricity ≈ 0.475 kg/kWh
 * (IEA, Global Energy & CO₂ Status Report 2019) — from memory. Replace with the national factor.
 */
export const DEFAULT_GRID_KG_CO2_PER_KWH = 0.475;
export const DEFAULT_GRID_SOURCE = 'IEA Global Energy & CO₂ Status Report 2019, world average 0.475 kg/kWh — from memory';

export type StoveId =
  | 'three-stone-wood'
  | 'improved-wood'
  | 'charcoal'
  | 'kerosene-pressure'
  | 'lpg'
  | 'electric-hotplate'
  | 'induction';

export interface StoveSpec {
  id: StoveId;
  name: string;
  fuelId: FuelId;
  /** Thermal efficiency at the pot (useful heat ÷ fuel energy) [–]. */
  efficiency: number;
  /** ISO/TR 19867-3:2018 thermal-efficiency tier that this efficiency falls in. */
  tier: number;
  source: string;
}

/**
 * ISO/TR 19867-3:2018 voluntary performance targets, thermal efficiency tiers:
 * Tier 5 ≥ 50 %, 4 ≥ 40 %, 3 ≥ 30 %, 2 ≥ 20 %, 1 ≥ 10 %, 0 < 10 % (secondary).
 * @param efficiency thermal efficiency [–] (0–1)
 * @returns tier 0–5
 */
export function efficiencyTierIso19867(efficiency: number): number {
  if (!Number.isFinite(efficiency) || efficiency < 0 || efficiency > 1) {
    throw new RangeError(`efficiency must be between 0 and 1, got ${efficiency}`);
  }
  const thresholds = [0.5, 0.4, 0.3, 0.2, 0.1];
  for (let i = 0; i < thresholds.length; i++) if (efficiency >= (thresholds[i] as number)) return 5 - i;
  return 0;
}

function stove(id: StoveId, name: string, fuelId: FuelId, efficiency: number, source: string): StoveSpec {
  return { id, name, fuelId, efficiency, tier: efficiencyTierIso19867(efficiency), source };
}

/**
 * Default stoves. Efficiencies are typical end-use values from field and laboratory reports
 * (three-stone fire 5–30 %, ≈ 15 typical; improved wood 25–40; charcoal 20–35; LPG 50–60;
 * electric hotplate ≈ 70; induction 80–85) — all from memory; the tier is computed from them.
 */
export const STOVES: Readonly<Record<StoveId, StoveSpec>> = {
  'three-stone-wood': stove('three-stone-wood', 'Three-stone wood fire', 'wood', 0.15, 'field reports, three-stone fire 5–30 %, ≈ 15 % typical — from memory'),
  'improved-wood': stove('improved-wood', 'Improved wood stove', 'wood', 0.3, 'field and lab reports, improved wood stoves 25–40 % — from memory'),
  charcoal: stove('charcoal', 'Charcoal stove', 'charcoal', 0.25, 'field and lab reports, charcoal stoves 20–35 % — from memory'),
  'kerosene-pressure': stove('kerosene-pressure', 'Pressure kerosene stove', 'kerosene', 0.45, 'lab reports, pressure kerosene stoves ≈ 40–50 % — from memory'),
  lpg: stove('lpg', 'LPG burner', 'lpg', 0.55, 'lab reports, LPG 50–60 % — from memory'),
  'electric-hotplate': stove('electric-hotplate', 'Electric hotplate', 'electricity', 0.7, 'lab reports, electric hotplate ≈ 70 % — from memory'),
  induction: stove('induction', 'Induction hob', 'electricity', 0.82, 'lab reports, induction 80–85 % — from memory'),
};

/** The stove used for the "everything on wood" comparison. */
export const WOOD_BASELINE_STOVE: StoveId = 'three-stone-wood';
