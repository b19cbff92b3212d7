/**
 * Store helpers: heat capacity for the linear step, shell losses, state of charge, geometry.
 *
 * Why one well-mixed node by default: a store heated from below is a fluid layer heated from below; above the
 * Rayleigh–Bénard onset (Ra ≈ 1708; Hollands et al. 1976) it overturns, and for an oil store Ra ~ 10⁸–10¹⁰, so
 * convection keeps the bulk within a few kelvin of uniform (BRIEF.md §Physics 3). An optional N-layer store models
 * what is left of stratification (simulate.ts).
 */
import type { StorageMedium } from '../materials/types';

/**
 * Apparent specific heat dh/dT [J/(kg·K)] (enthalpy method): the sensible cp plus, inside [solidus, liquidus), the
 * latent heat spread uniformly over the melting range — the convention of lib/materials/pcm.ts.
 * @param tC temperature [°C]
 */
export function apparentSpecificHeat(medium: StorageMedium, tC: number): number {
  const cp = medium.specificHeat(tC);
  const m = medium.melting;
  if (m !== undefined && tC >= m.solidusC && tC < m.liquidusC) return cp + m.latentJPerKg / (m.liquidusC - m.solidusC);
  return cp;
}

/**
 * Store shell loss conductance UA = UA0 + UA_wind·v [W/K].
 * @param uaLossWPerK UA0 [W/K]; @param uaWindWPerKPerMS [W/(K·m/s)]; @param windMS v [m/s]
 */
export function storeLossConductanceWPerK(uaLossWPerK: number, uaWindWPerKPerMS: number, windMS: number): number {
  return uaLossWPerK + uaWindWPerKPerMS * windMS;
}

/**
 * Store shell loss Q = UA·(T − Ta) [W].
 * @param uaWPerK [W/K]; @param tStoreC [°C]; @param tAirC [°C]
 */
export function storeLossW(uaWPerK: number, tStoreC: number, tAirC: number): number {
  return uaWPerK * (tStoreC - tAirC);
}

/**
 * State of charge from specific enthalpy: (h − h(T_min)) / (h(T_max) − h(T_min)), clipped to [0, 1]
 * (BRIEF.md §Physics 5; enthalpy so that latent heat counts).
 * @param tC store temperature [°C]; @param minUsefulTempC 0 % [°C]; @param maxSafeTempC 100 % [°C]
 * @returns charge [0..1]
 */
export function stateOfCharge(medium: StorageMedium, tC: number, minUsefulTempC: number, maxSafeTempC: number): number {
  const h0 = medium.enthalpy(minUsefulTempC);
  const h1 = medium.enthalpy(maxSafeTempC);
  const f = (medium.enthalpy(tC) - h0) / (h1 - h0);
  return f < 0 ? 0 : f > 1 ? 1 : f;
}

/**
 * Usable energy [J] between minUsefulTempC and maxSafeTempC for a store of mass m: m·(h(T_max) − h(T_min)).
 */
export function usableEnergyJ(medium: StorageMedium, massKg: number, minUsefulTempC: number, maxSafeTempC: number): number {
  return massKg * (medium.enthalpy(maxSafeTempC) - medium.enthalpy(minUsefulTempC));
}

/** Store geometry assumed for the stratified model: a cylinder with height = diameter (common practice, no source). */
export interface StoreGeometry {
  volumeM3: number;
  heightM: number;
  crossSectionM2: number;
}

/**
 * Cylinder of height = diameter holding the store's mass at the given temperature: D = (4V/π)^(1/3).
 * @param massKg [kg]; @param tC temperature for the density [°C]
 */
export function storeGeometry(medium: StorageMedium, massKg: number, tC: number): StoreGeometry {
  const v = massKg / medium.density(tC);
  const d = Math.cbrt((4 * v) / Math.PI);
  return { volumeM3: v, heightM: d, crossSectionM2: (Math.PI * d * d) / 4 };
}
