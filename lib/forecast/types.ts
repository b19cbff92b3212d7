/**
 * Our own forecast shapes. Vendor formats (Open-Meteo JSON, CSV, EPW) are turned into these at the edge
 * (lib/forecast/open-meteo.ts, csv.ts, epw.ts); nothing else sees them.
 *
 * Conventions (lib/GLOSSARY.md): instants in epoch ms UTC; hours as lib/solar HourlyWeather, i.e. t is the
 * start of the hour [t, t + 1 h) whose mean the irradiances give [W/m²]; temperatures [°C]; wind [m/s]; okta.
 */
import type { HourlyWeather } from '@/lib/solar';

/** A forecast from a weather service, as we use it. */
export interface Forecast {
  /** Which service answered, e.g. "open-meteo". */
  provider: string;
  /** The grid point the service used [°]. */
  latitudeDeg: number;
  longitudeDeg: number;
  /** When we received it [epoch ms]. */
  fetchedAtMs: number;
  /** Consecutive hours, each starting on a whole UTC hour. */
  hours: HourlyWeather[];
}

/** Where the hours used for a day come from (the same values as lib/prediction's WeatherSource). */
export type { WeatherSource } from '@/lib/prediction/predict-day';

/** Why a forecast could not be had. `retryable` failures are worth asking again for (HTTP 5xx, 429, timeout, network). */
export type ForecastFailureKind = 'http' | 'timeout' | 'network' | 'malformed' | 'gap';

export class ForecastError extends Error {
  constructor(
    readonly kind: ForecastFailureKind,
    message: string,
    readonly retryable: boolean,
    readonly status?: number,
  ) {
    super(message);
    this.name = 'ForecastError';
  }
}

export const HOUR_MS = 3_600_000;
