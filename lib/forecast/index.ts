/**
 * Forecasts: the Open-Meteo adapter, CSV and EPW uploads, storage, the scheduled refresh and the fallback chain
 * that decides which weather a kitchen's day is planned on.
 */
export * from './types';
export * from './clearness';
export { fetchOpenMeteoForecast, openMeteoUrl, convertOpenMeteo, parseOpenMeteoBody, FORECAST_DAYS, PAST_DAYS } from './open-meteo';
export type { OpenMeteoOptions, ForecastSite } from './open-meteo';
export { parseWeatherCsv, CSV_COLUMNS, type FileIssue, type ParsedHours } from './csv';
export { parseEpw, epwHoursAsIs, epwHoursTypical, type EpwLocation, type EpwRecord, type ParsedEpw } from './epw';
export { saveForecast, recordFailedFetch, pruneForecasts, getForecastHours } from './store';
export { refreshForecasts, refreshKitchenForecast, forecastOptionsFromEnv, issueTimeOf, type RefreshOptions, type RefreshOutcome, type RefreshSummary } from './refresh';
export { getWeatherForDay, weatherMeta, kitchenSite, STALE_AFTER_S, type WeatherForDay } from './weather-for-day';
export { createForecastUpload, prepareUpload, alignToUtcHours, UPLOAD_LIMIT_BYTES, UPLOAD_BODY_LIMIT_BYTES, fileTooLarge } from './upload';
export { getDayForecast, type DayForecast } from './view';
