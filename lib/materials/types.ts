/**
 * Storage media: the contract every medium (oil, phase-change material, custom table) fulfils.
 * Units follow lib/GLOSSARY.md: temperatures in °C, energies in J, masses in kg.
 */
export type MediumKind = 'oil' | 'pcm' | 'custom';

export interface StorageMedium {
  /** Stable id, e.g. "sunflower-oil", "erythritol". */
  id: string;
  /** English display name. */
  name: string;
  kind: MediumKind;
  /** Density ρ(T) [kg/m³] at temperature T [°C]. */
  density(tC: number): number;
  /** Apparent specific heat of the sensible part c_p(T) [J/(kg·K)] (latent heat excluded). */
  specificHeat(tC: number): number;
  /** Thermal conductivity k(T) [W/(m·K)]. */
  conductivity(tC: number): number;
  /** Dynamic viscosity μ(T) [Pa·s] (liquid phase; NaN where the medium is solid). */
  viscosity(tC: number): number;
  /**
   * Specific enthalpy h(T) [J/kg] relative to 0 °C, sensible plus latent (enthalpy method).
   * Strictly increasing in T so it can be inverted.
   */
  enthalpy(tC: number): number;
  /** Inverse of enthalpy(): temperature [°C] at specific enthalpy h [J/kg]. */
  temperatureAt(hJPerKg: number): number;
  /** Range of temperatures [°C] over which the correlations are valid. */
  validRangeC: { min: number; max: number };
  /** Smoke point [°C] (oils), where it applies. */
  smokePointC?: number;
  /** Flash point [°C], where it applies. */
  flashPointC?: number;
  /** Phase change, for PCMs: melting range [°C] and latent heat [J/kg]. */
  melting?: { solidusC: number; liquidusC: number; latentJPerKg: number };
  /** Highest store temperature we recommend [°C] (below smoke point / degradation limit with a margin). */
  recommendedMaxC: number;
  /** Sources of the numbers above: author, title, year, table or equation. */
  sources: string[];
  /**
   * Added (optional): supercooling reported for the material [K] — how far below the melting range it may cool
   * before it solidifies. The enthalpy model ignores it (no hysteresis); the planner may warn with it.
   */
  supercoolingK?: number;
  /** Added (optional): caveats a user of the medium should see (degradation, supercooling, extrapolation). */
  notes?: string[];
}
