/**
 * Useful heat a batch needs when it is cooked on a backup stove instead of the sun.
 *
 * A simple, documented estimate (not a simulation): the stove's thermal efficiency — measured
 * with water-boiling tests that include the pot's own losses while heating — converts this useful
 * heat into fuel energy, so the heat-up phase is counted as the sensible heat of the contents and
 * the pot only. Three terms:
 *   1. heating: (m_food·cp_food + m_water·c_water + m_pot·cp_pot)·(T_target − T_ambient)
 *   2. holding: UA_pot·(T_target − T_ambient)·hold time, UA_pot from a cylinder (height = diameter)
 *      and a surface coefficient (≈ 10 W/(m²·K) lid on, doubled lid off; common practice, no source)
 *   3. evaporation where the dish boils or steams: boil-off rate × hold time × latent heat.
 * Units follow lib/GLOSSARY.md.
 */

// Water properties and the boiling point come from the thermal model (one implementation for the
// planner, the predictions and the backup-fuel estimate): ISO 2533 pressure + Antoine (lib/thermal/boiling.ts).
export { WATER_CP_J_PER_KG_K } from '@/lib/thermal/boiling';
export {
  WATER_LATENT_HEAT_J_PER_KG as WATER_LATENT_J_PER_KG,
  pressureIsa1975Pa as pressureIsa,
  waterBoilingPointAntoineC as boilingPointAntoine,
  boilingPointAtAltitudeC as boilingPointAtAltitude,
} from '@/lib/thermal/boiling';

import { boilingPointAtAltitudeC as boilingPointAtAltitude, WATER_CP_J_PER_KG_K, WATER_LATENT_HEAT_J_PER_KG as WATER_LATENT_J_PER_KG } from '@/lib/thermal/boiling';

export type CookMethod = 'boil' | 'simmer' | 'steam' | 'bake' | 'fry';
export const COOK_METHODS: readonly CookMethod[] = ['boil', 'simmer', 'steam', 'bake', 'fry'];

/** What the estimate needs to know about a batch. */
export interface BatchHeatInput {
  id: string;
  method: CookMethod;
  /** Pot volume the batch needs [L] (sizes the default pot's surface). */
  potVolumeNeededL: number;
  foodKg: number;
  foodCpJPerKgK: number;
  waterKg: number;
  /** Minimum temperature the food must hold [°C]. */
  minTempC: number;
  /** Hold time at or above minTempC [s]. */
  holdS: number;
  lidOn: boolean;
}

export interface HeatEstimateOptions {
  /** Temperature of the contents before cooking and of the surrounding air [°C]. */
  ambientC: number;
  /** Site elevation [m] for the boiling point. */
  altitudeM: number;
  /** Empty stove pot: mass [kg] and specific heat [J/(kg·K)]. Default: 0.12 kg/L of volume, aluminium 900. */
  potMassKg?: number;
  potCpJPerKgK?: number;
  /** Surface coefficient of the pot wall and lid to air [W/(m²·K)]; default 10 with lid (common practice, no source). */
  potSurfaceUWPerM2K?: number;
  /** Factor on the surface losses with the lid off; default 2 (common practice, no source). */
  lidOffLossFactor?: number;
  /**
   * Boil-off while boiling or steaming, as a fraction of the water per hour:
   * default 0.03/h with the lid on and 0.15/h with it off (common practice for a gentle boil, no source).
   */
  boilOffPerHourLidOn?: number;
  boilOffPerHourLidOff?: number;
}

export interface HeatEstimate {
  /** Temperature the contents are brought to [°C]: the boiling point for boil/steam, else minTempC. */
  targetTempC: number;
  /** Sensible heat of contents and pot [J]. */
  heatingJ: number;
  /** Surface losses while holding [J]. */
  holdingJ: number;
  /** Water boiled off [kg] and its latent heat [J]. */
  evaporatedKg: number;
  evaporationJ: number;
  /** Sum: the useful heat at the pot [J]. */
  usefulJ: number;
  /** Pot surface conductance to air used for holding [W/K]. */
  potUaWPerK: number;
}

function requireFinite(name: string, v: number, min = -Infinity): void {
  if (!Number.isFinite(v) || v < min) throw new RangeError(`${name} must be a finite number ≥ ${min}, got ${v}`);
}

/**
 * Useful heat a batch needs on a stove (see the module comment for the three terms).
 * Water above its boiling point cannot exist in an open pot, so for bake/fry at a target above
 * the boiling point the water term is taken to the boiling point and its full evaporation counted.
 * @returns energies [J], mass [kg]
 */
export function estimateBatchHeat(batch: BatchHeatInput, opts: HeatEstimateOptions): HeatEstimate {
  const f = `batch ${batch.id}`;
  requireFinite(`${f}: foodKg`, batch.foodKg, 0);
  requireFinite(`${f}: foodCpJPerKgK`, batch.foodCpJPerKgK, 0);
  requireFinite(`${f}: waterKg`, batch.waterKg, 0);
  requireFinite(`${f}: holdS`, batch.holdS, 0);
  requireFinite(`${f}: minTempC`, batch.minTempC);
  requireFinite(`${f}: potVolumeNeededL`, batch.potVolumeNeededL, 0);
  requireFinite('ambientC', opts.ambientC);
  requireFinite('altitudeM', opts.altitudeM, -500);
  if (!(['boil', 'simmer', 'steam', 'bake', 'fry'] as const).includes(batch.method)) {
    throw new RangeError(`${f}: method must be one of boil, simmer, steam, bake, fry, got ${String(batch.method)}`);
  }
  const tBoil = boilingPointAtAltitude(opts.altitudeM);
  const boils = batch.method === 'boil' || batch.method === 'steam';
  const targetTempC = boils ? tBoil : batch.minTempC;
  const dT = Math.max(0, targetTempC - opts.ambientC);

  const potMassKg = opts.potMassKg ?? 0.12 * batch.potVolumeNeededL;
  const potCp = opts.potCpJPerKgK ?? 900;
  // Water cannot be heated above boiling in an open pot: cap its sensible heat at the boiling point.
  const waterDT = Math.max(0, Math.min(targetTempC, tBoil) - opts.ambientC);
  const heatingJ = (batch.foodKg * batch.foodCpJPerKgK + potMassKg * potCp) * dT + batch.waterKg * WATER_CP_J_PER_KG_K * waterDT;

  // Cylinder with height = diameter holding the needed volume: wall + lid area.
  const vM3 = batch.potVolumeNeededL / 1000;
  const d = Math.cbrt((4 * vM3) / Math.PI);
  const areaM2 = Math.PI * d * d + (Math.PI * d * d) / 4;
  const u = (opts.potSurfaceUWPerM2K ?? 10) * (batch.lidOn ? 1 : (opts.lidOffLossFactor ?? 2));
  const potUaWPerK = u * areaM2;
  const holdingJ = potUaWPerK * dT * batch.holdS;

  let evaporatedKg = 0;
  if (boils) {
    const perHour = batch.lidOn ? (opts.boilOffPerHourLidOn ?? 0.03) : (opts.boilOffPerHourLidOff ?? 0.15);
    evaporatedKg = Math.min(batch.waterKg, batch.waterKg * perHour * (batch.holdS / 3600));
  } else if (targetTempC > tBoil) {
    evaporatedKg = batch.waterKg; // frying/baking above boiling drives the water off
  }
  const evaporationJ = evaporatedKg * WATER_LATENT_J_PER_KG;
  return {
    targetTempC,
    heatingJ,
    holdingJ,
    evaporatedKg,
    evaporationJ,
    usefulJ: heatingJ + holdingJ + evaporationJ,
    potUaWPerK,
  };
}
