/**
 * The one type the solar and thermal cores share: a step of weather at a cooker's aperture. lib/solar
 * makes these steps from hourly weather (sun position, decomposition, transposition); lib/thermal reads
 * them to drive the collector and the store. Both reach it downhill; neither imports the other for it.
 */

/** One step of driving weather, already resolved to the cooker's aperture. */
export interface WeatherStep {
  /** Start of the step [epoch ms]. Steps are contiguous and equally spaced. */
  t: number;
  /** Irradiance usable by the collector on its aperture [W/m²] (beam-only for concentrators). */
  gApertureWm2: number;
  /** Ambient air temperature [°C]. */
  tAirC: number;
  /** Wind speed [m/s]; optional. */
  windMS?: number;
}
