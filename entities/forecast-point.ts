import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Forecast } from './forecast';

/**
 * One hour of a forecast, in our convention (lib/solar HourlyWeather): values describe the hour [t, t + 1 h);
 * irradiances are hour means [W/m²]. Optional quantities are null when the source did not give them.
 */
export interface ForecastPoint extends Base {
  forecast: Forecast;
  /** Start of the hour. */
  t: Date;
  /** Global horizontal irradiance [W/m²]. */
  ghi: number;
  /** Direct normal irradiance [W/m²]. */
  dni: number | null;
  /** Diffuse horizontal irradiance [W/m²]. */
  dhi: number | null;
  /** Air temperature [°C]; null when an upload had none (a typical daily cycle is used then). */
  tAirC: number | null;
  /** Wind speed [m/s]. */
  windMS: number | null;
  /** Total cloud cover [okta], 0–8. */
  cloudOkta: number | null;
}

export const ForecastPointSchema = new EntitySchema<ForecastPoint>({
  name: 'ForecastPoint',
  tableName: 'forecast_points',
  properties: {
    ...baseProperties,
    forecast: { kind: 'm:1', entity: 'Forecast', deleteRule: 'cascade' },
    t: { type: 'Date', columnType: 'timestamptz' },
    ghi: { type: 'double' },
    dni: { type: 'double', nullable: true },
    dhi: { type: 'double', nullable: true },
    tAirC: { type: 'double', nullable: true },
    windMS: { type: 'double', nullable: true },
    cloudOkta: { type: 'double', nullable: true },
  },
  uniques: [{ properties: ['forecast', 't'] }],
});
