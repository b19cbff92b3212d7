import { z } from 'zod';
import type { Operation } from './registry';
import { forecastQuerySchema, forecastUploadFormSchema } from '@/lib/validations/forecast';

const ALL = ['coordinator', 'lead', 'cook'];
const source = z.enum(['forecast', 'stale-forecast', 'upload', 'clear-sky']);

const dayForecast = z.object({
  date: z.string().describe('local date YYYY-MM-DD'),
  timeZone: z.string(),
  source: source.describe('forecast (fetched ≤ 6 h ago), stale-forecast (older), upload, or clear-sky (the fallback)'),
  issuedAt: z.string().nullable(),
  fetchedAt: z.string().nullable(),
  ageS: z.number().nullable().describe('age of the forecast [s]'),
  note: z.string().nullable().describe('what fallback is in use and why'),
  uploadName: z.string().nullable(),
  uploadMode: z.enum(['as-is', 'typical-day']).nullable(),
  clearness: z.object({ values: z.array(z.number()).describe('monthly clear-sky index, January … December [0–1]'), isDefault: z.boolean(), source: z.string().optional() }),
  lastFailure: z.object({ at: z.string(), error: z.string() }).nullable().describe('the newest fetch from the forecast service, when it failed'),
  hours: z.array(
    z.object({
      t: z.string().describe('start of the hour (UTC)'),
      ghiWm2: z.number().describe('global horizontal irradiance, hour mean [W/m²]'),
      dniWm2: z.number().nullable().describe('[W/m²]'),
      dhiWm2: z.number().nullable().describe('[W/m²]'),
      tAirC: z.number().describe('[°C]'),
      windMS: z.number().nullable().describe('[m/s]'),
      cloudOkta: z.number().nullable().describe('[okta]'),
      filled: z.boolean().describe('true where clear sky fills an hour the source lacks'),
    }),
  ),
});

const upload = z.object({
  id: z.uuid(),
  source: z.literal('upload'),
  kind: z.enum(['csv', 'epw']),
  uploadName: z.string(),
  mode: z.enum(['as-is', 'typical-day']),
  date: z.string(),
  hours: z.number().int(),
  coversFrom: z.string(),
  coversTo: z.string(),
  warnings: z.array(z.string()),
});

/** Forecast routes. */
export const forecastOperations: Operation[] = [
  { method: 'get', path: '/api/v1/kitchens/{kitchenId}/forecast', summary: "The hourly weather in use for a local day (today by default), with its source and age", tag: 'forecast', roles: ALL, query: forecastQuerySchema, response: dayForecast },
  {
    method: 'post',
    path: '/api/v1/kitchens/{kitchenId}/forecast/uploads',
    summary: 'Upload a CSV or EPW weather file for a day (5 MB at most; 422 lists the first 20 problems as "line N.field"; nothing is saved then)',
    tag: 'forecast',
    roles: ['lead'],
    body: forecastUploadFormSchema,
    bodyType: 'multipart/form-data',
    response: upload,
    successStatus: 201,
  },
];
