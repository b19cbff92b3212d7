import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';

export const FORECAST_SOURCES = ['service', 'upload'] as const;
export type ForecastSourceKind = (typeof FORECAST_SOURCES)[number];
export const FORECAST_STATUSES = ['ok', 'failed'] as const;
export type ForecastStatus = (typeof FORECAST_STATUSES)[number];
import { UPLOAD_MODES } from './constants';
export { UPLOAD_MODES };
export type UploadMode = (typeof UPLOAD_MODES)[number];

/**
 * One forecast issue for a kitchen: fetched from the forecast service, or uploaded by the kitchen lead.
 * A failed fetch is kept too (status "failed", the error, no points), so the page can say what went wrong.
 * The hours are ForecastPoint rows.
 */
export interface Forecast extends Base {
  kitchen: Kitchen;
  source: ForecastSourceKind;
  /**
   * When the forecast was issued (service: the fetch time floored to the hour, see lib/forecast/refresh.ts;
   * upload: the upload time). Null for a failed fetch. Unique per kitchen and source, so one issue is stored once.
   */
  issuedAt: Date | null;
  fetchedAt: Date;
  status: ForecastStatus;
  /** Why the fetch failed (status "failed"). */
  error: string | null;
  /** First hour start and end of the last hour [instants]; null for a failed fetch. */
  coversFrom: Date | null;
  coversTo: Date | null;
  /** File name of an upload. */
  uploadName: string | null;
  /** How an upload is used: the file's own hours, or a typical day for the date of year. */
  uploadMode: UploadMode | null;
}

export const ForecastSchema = new EntitySchema<Forecast>({
  name: 'Forecast',
  tableName: 'forecasts',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    source: { type: 'string', length: 16 },
    issuedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
    fetchedAt: { type: 'Date', columnType: 'timestamptz' },
    status: { type: 'string', length: 8 },
    error: { type: 'string', length: 1000, nullable: true },
    coversFrom: { type: 'Date', columnType: 'timestamptz', nullable: true },
    coversTo: { type: 'Date', columnType: 'timestamptz', nullable: true },
    uploadName: { type: 'string', length: 255, nullable: true },
    uploadMode: { type: 'string', length: 16, nullable: true },
  },
  // A failed fetch has no issue time (NULLs are distinct in PostgreSQL), so only good issues are deduplicated.
  uniques: [{ properties: ['kitchen', 'source', 'issuedAt'] }],
  indexes: [{ properties: ['kitchen', 'fetchedAt'] }],
});
