/**
 * Boiling point of water at the kitchen's altitude, and the water constants used by the pot model.
 *
 * Method: ISA troposphere pressure (ISO 2533:1975) p = 101325·(1 − 2.25577e-5·h)^5.25588 [Pa], then the Antoine
 * equation for water log10(p/mmHg) = A − B/(C + T/°C) with A = 8.07131, B = 1730.63, C = 233.426 (valid 1–100 °C;
 * widely tabulated, e.g. Lange's Handbook of Chemistry; read in a secondary table), solved for T in closed form.
 * Together they reproduce standard steam tables within ≈ 0.3 °C (lib/REFERENCES.md, secondary). Weather-driven
 * pressure changes (± ≈ 1 kPa, ± ≈ 0.3 K) are ignored.
 */

/** ISA sea-level pressure [Pa] (ISO 2533). */
export const ISA_SEA_LEVEL_PRESSURE_PA = 101325;
/** Pascal per millimetre of mercury (conventional 133.322387415 Pa). */
export const PA_PER_MMHG = 133.322387415;
/** Antoine constants for water, p in mmHg and T in °C, 1–100 °C. */
export const WATER_ANTOINE = { a: 8.07131, b: 1730.63, c: 233.426 } as const;
/** Latent heat of vaporisation of water at 100 °C [J/kg] (steam tables: 2256.4 kJ/kg; 2.257 MJ/kg as commonly rounded). */
export const WATER_LATENT_HEAT_J_PER_KG = 2.257e6;
/** Specific heat of liquid water [J/(kg·K)]: 4186, the value ASAE S580.1 uses (4.18–4.22 over 20–100 °C in steam tables). */
export const WATER_CP_J_PER_KG_K = 4186;

/**
 * ISA (ISO 2533) troposphere pressure at altitude.
 * @param altitudeM geopotential altitude [m], valid −500…11000
 * @returns pressure [Pa]
 */
export function pressureIsa1975Pa(altitudeM: number): number {
  return ISA_SEA_LEVEL_PRESSURE_PA * Math.pow(1 - 2.25577e-5 * altitudeM, 5.25588);
}

/**
 * Saturation vapour pressure of water by the Antoine equation (constants above).
 * @param tC temperature [°C] (1–100 °C fitted; mild extrapolation to ≈ 105 °C)
 * @returns pressure [Pa]
 */
export function waterVapourPressureAntoinePa(tC: number): number {
  return PA_PER_MMHG * Math.pow(10, WATER_ANTOINE.a - WATER_ANTOINE.b / (WATER_ANTOINE.c + tC));
}

/**
 * Boiling temperature of water at a pressure: the Antoine equation inverted, T = B/(A − log10 p_mmHg) − C.
 * @param pressurePa absolute pressure [Pa]
 * @returns boiling point [°C]
 */
export function waterBoilingPointAntoineC(pressurePa: number): number {
  return WATER_ANTOINE.b / (WATER_ANTOINE.a - Math.log10(pressurePa / PA_PER_MMHG)) - WATER_ANTOINE.c;
}

/**
 * Boiling point of water at a site altitude: ISA pressure then inverted Antoine equation (file comment).
 * @param altitudeM site elevation [m]
 * @returns boiling point [°C] (100 °C at 0 m, ≈ 95 at 1500 m, ≈ 90 at 3000 m)
 */
export function boilingPointAtAltitudeC(altitudeM: number): number {
  return waterBoilingPointAntoineC(pressureIsa1975Pa(altitudeM));
}

/**
 * Mass of water boiled off by an energy input at the boiling point.
 * @param energyJ heat into the boiling pot beyond its losses [J]
 * @returns evaporated mass [kg] (latent heat WATER_LATENT_HEAT_J_PER_KG; its rise to ≈ 2.28 MJ/kg at 90 °C is ignored)
 */
export function evaporatedMassKg(energyJ: number): number {
  return energyJ > 0 ? energyJ / WATER_LATENT_HEAT_J_PER_KG : 0;
}
