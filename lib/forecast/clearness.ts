/**
 * Monthly clear-sky index of a kitchen, for the clear-sky fallback: the share of the clear-sky global
 * irradiance (Ineichen & Perez 2002, lib/solar) that a typical day of the month gets. (Not the clearness
 * index kt of lib/GLOSSARY.md, which divides by the extraterrestrial irradiance.)
 *
 * Defaults: 0.75 in the dry season and 0.6 in the wet season — common practice, no source. The wet season is
 * taken by latitude band: June–September north of 5° N (West African and South Asian monsoon), December–March
 * south of 5° S, and the two equatorial rainy seasons (April–May, October–November) in between. The
 * coordinator should replace them with the kitchen's own values where known.
 */

/** Dry-season default [–] (common practice, no source). */
export const DRY_SEASON_CLEARNESS = 0.75;
/** Wet-season default [–] (common practice, no source). */
export const WET_SEASON_CLEARNESS = 0.6;
/** Said wherever the defaults are shown. */
export const CLEARNESS_DEFAULT_SOURCE = 'common practice, no source';
/** Bounds accepted for a monthly value [–]. */
export const CLEARNESS_MIN = 0.05;
export const CLEARNESS_MAX = 1;

const WET_NORTH = [5, 6, 7, 8];
const WET_SOUTH = [11, 0, 1, 2];
const WET_EQUATORIAL = [3, 4, 9, 10];

/**
 * The default 12 monthly values for a latitude.
 * @param latitudeDeg [°], north positive
 * @returns January … December [–]
 */
export function defaultClearness(latitudeDeg: number): number[] {
  const wet = latitudeDeg >= 5 ? WET_NORTH : latitudeDeg <= -5 ? WET_SOUTH : WET_EQUATORIAL;
  return Array.from({ length: 12 }, (_, m) => (wet.includes(m) ? WET_SEASON_CLEARNESS : DRY_SEASON_CLEARNESS));
}

/** True when the array is 12 finite values within the accepted bounds. */
export function isClearnessTable(values: unknown): values is number[] {
  return (
    Array.isArray(values) &&
    values.length === 12 &&
    values.every((v) => typeof v === 'number' && Number.isFinite(v) && v >= CLEARNESS_MIN && v <= CLEARNESS_MAX)
  );
}

/** The kitchen's own values when set and valid, else the defaults for its latitude. */
export function kitchenClearness(kitchen: { latitude: number; clearness?: number[] | null }): { values: number[]; isDefault: boolean } {
  if (isClearnessTable(kitchen.clearness)) return { values: [...kitchen.clearness], isDefault: false };
  return { values: defaultClearness(kitchen.latitude), isDefault: true };
}
