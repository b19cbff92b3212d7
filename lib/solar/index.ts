/**
 * Public API of the solar core: sun position (NREL SPA, NOAA), irradiance and decomposition, clear-sky models,
 * and the bridge from hourly weather to the cooker's per-step aperture irradiance.
 */
export * from './angles';
export {
  DEFAULT_ATMOS_REFRACTION_DEG,
  DEFAULT_DELTA_T_S,
  SOLAR_POSITION_MODELS,
  SUN_RADIUS_DEG,
  earthHeliocentricSpa,
  geocentricSunSpa,
  getSolarPosition,
  incidenceAngleDeg,
  julianDayFromMs,
  julianDaySpa,
  meanObliquityArcsecSpa,
  nutationSpa,
  refractionCorrectionSpa,
  solarPositionNoaa,
  solarPositionSpa,
  solarPositionsSpaFast,
  standardPressureHPa,
  sunriseTransitSunsetSpa,
  topocentricSunSpa,
} from './position';
export type {
  NoaaInput,
  NoaaResult,
  SolarPosition,
  SolarPositionModel,
  SolarPositionSeries,
  SpaGeocentric,
  SpaInput,
  SpaObserver,
  SpaResult,
  SpaRtsInput,
  SpaRtsResult,
  SpaTopocentric,
} from './position';
export * from './irradiance';
export * from './clearsky';
export {
  assertGeometry,
  assertSite,
  clearSkyHourly,
  dailyAirTemperatureC,
  resolveWeatherDetailed,
  resolveWeatherToAperture,
} from './weather';
export type {
  ApertureGeometry,
  ClearSkyHourlyOptions,
  HourSource,
  HourlyWeather,
  ResolvedWeather,
  Site,
  SolarOptions,
} from './weather';
