/**
 * Adapter for the Open-Meteo forecast API (documented JSON HTTP API, https://open-meteo.com/en/docs):
 *   GET {base}/v1/forecast?latitude=..&longitude=..&elevation=..&hourly=shortwave_radiation,direct_normal_irradiance,
 *       diffuse_radiation,temperature_2m,wind_speed_10m,cloud_cover&timezone=GMT&past_days=1&forecast_days=4
 *       &wind_speed_unit=ms[&apikey=..]
 * The local fake (lib/fakes/forecast.ts) answers the same request; this module cannot tell them apart.
 *
 * Conversions at the edge (into lib/solar HourlyWeather):
 * - Open-Meteo's radiation values (shortwave_radiation = GHI, direct_normal_irradiance = DNI, diffuse_radiation
 *   = DHI) are means over the PRECEDING hour: the value stamped T describes [T − 1 h, T). Ours describe the hour
 *   starting at t, so the value stamped T goes to the hour t = T − 1 h.
 * - temperature_2m, wind_speed_10m and cloud_cover are instantaneous at T; our hour [t, t + 1 h) takes the mean
 *   of the values at its two ends (its mid-hour value under linear change).
 * - cloud_cover [%] → okta = % / 12.5.
 * - past_days=1 (documented parameter, 0–92) adds yesterday, so the series covers the whole local day in
 *   zones east of UTC and the day before (the store's spin-up in lib/prediction); forecast_days=4 rather than 3
 *   keeps the kitchen's day after tomorrow whole in zones west of UTC and in GMT itself (the last hour of a GMT
 *   day is stamped 00:00 of the next).
 * A malformed response (not JSON, wrong shape, values out of physical range, wrong units, a missing hour or a
 * missing value) is rejected with a ForecastError and never reaches storage.
 */
import { z } from 'zod';
import type { HourlyWeather } from '@/lib/solar';
import { ForecastError, HOUR_MS, type Forecast } from './types';

export const OPEN_METEO_HOURLY = [
  'shortwave_radiation',
  'direct_normal_irradiance',
  'diffuse_radiation',
  'temperature_2m',
  'wind_speed_10m',
  'cloud_cover',
] as const;

/**
 * Days of forecast asked for: today and the next two in the kitchen's zone need four GMT days west of UTC
 * (the hours come in GMT, and the last one of a GMT day is stamped the next day's 00:00).
 */
export const FORECAST_DAYS = 4;
/** Past days asked for (yesterday, for the store's spin-up and zones east of UTC). */
export const PAST_DAYS = 1;

export interface OpenMeteoOptions {
  /** Base URL without the path, e.g. https://api.open-meteo.com or the local fake. */
  baseUrl: string;
  /** Sent as the `apikey` query parameter when set (commercial endpoint). */
  apiKey?: string;
  /** Per-try timeout [ms]; default 10 000. */
  timeoutMs?: number;
  /** Tries in all; default 3. */
  tries?: number;
  /** First back-off delay [ms], doubled after each failed try; default 1000. */
  backoffMs?: number;
  /** Injected for tests. */
  fetchImpl?: typeof fetch;
  now?: () => number;
  sleep?: (ms: number) => Promise<void>;
}

export interface ForecastSite {
  latitudeDeg: number;
  longitudeDeg: number;
  /** [m]; passed as `elevation` so the service's downscaling uses the kitchen's altitude. */
  altitudeM?: number;
}

/** Physical bounds of accepted values (wider than any real hour mean; narrower than garbage). */
const series = (min: number, max: number, what: string) =>
  z.array(
    z
      .number({ message: `${what} must be numbers` })
      .min(min, `${what} below ${min}`)
      .max(max, `${what} above ${max}`)
      .nullable(),
  );

const responseSchema = z
  .object({
    latitude: z.number().min(-90).max(90),
    longitude: z.number().min(-180).max(180),
    hourly_units: z.object({
      time: z.literal('iso8601', { message: 'time must be iso8601' }),
      shortwave_radiation: z.literal('W/m²', { message: 'shortwave_radiation must be in W/m²' }),
      direct_normal_irradiance: z.literal('W/m²', { message: 'direct_normal_irradiance must be in W/m²' }),
      diffuse_radiation: z.literal('W/m²', { message: 'diffuse_radiation must be in W/m²' }),
      temperature_2m: z.literal('°C', { message: 'temperature_2m must be in °C' }),
      wind_speed_10m: z.literal('m/s', { message: 'wind_speed_10m must be in m/s' }),
      cloud_cover: z.literal('%', { message: 'cloud_cover must be in %' }),
    }),
    hourly: z.object({
      time: z
        .array(z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, 'time must look like 2026-12-03T00:00 (GMT)'))
        .min(2, 'at least two hours')
        .max(24 * 20, 'too many hours'),
      shortwave_radiation: series(0, 1500, 'shortwave_radiation [W/m²]'),
      direct_normal_irradiance: series(0, 1450, 'direct_normal_irradiance [W/m²]'),
      diffuse_radiation: series(0, 1000, 'diffuse_radiation [W/m²]'),
      temperature_2m: series(-90, 70, 'temperature_2m [°C]'),
      wind_speed_10m: series(0, 100, 'wind_speed_10m [m/s]'),
      cloud_cover: series(0, 100, 'cloud_cover [%]'),
    }),
  })
  .superRefine((r, ctx) => {
    const n = r.hourly.time.length;
    for (const k of OPEN_METEO_HOURLY) {
      if (r.hourly[k].length !== n) ctx.addIssue({ code: 'custom', path: ['hourly', k], message: `${k} has ${r.hourly[k].length} values for ${n} times` });
    }
  });

export type OpenMeteoResponse = z.infer<typeof responseSchema>;

/** The request URL (exported for tests and logs; the API key is included only when given). */
export function openMeteoUrl(site: ForecastSite, opts: Pick<OpenMeteoOptions, 'baseUrl' | 'apiKey'>): string {
  const u = new URL('/v1/forecast', opts.baseUrl);
  u.searchParams.set('latitude', site.latitudeDeg.toFixed(4));
  u.searchParams.set('longitude', site.longitudeDeg.toFixed(4));
  if (site.altitudeM !== undefined) u.searchParams.set('elevation', String(Math.round(site.altitudeM)));
  u.searchParams.set('hourly', OPEN_METEO_HOURLY.join(','));
  u.searchParams.set('timezone', 'GMT');
  u.searchParams.set('past_days', String(PAST_DAYS));
  u.searchParams.set('forecast_days', String(FORECAST_DAYS));
  u.searchParams.set('wind_speed_unit', 'ms');
  if (opts.apiKey) u.searchParams.set('apikey', opts.apiKey);
  return u.toString();
}

/** Largest distance between the asked and the answered point [°]; Open-Meteo snaps to its grid (a few km). */
const MAX_GRID_OFFSET_DEG = 0.5;

/**
 * Turns a validated response into our hours (see the module comment for the conventions).
 * @throws ForecastError 'gap' for a missing or repeated hour or a missing GHI/temperature value
 */
export function convertOpenMeteo(r: OpenMeteoResponse, site: ForecastSite, fetchedAtMs: number): Forecast {
  if (Math.abs(r.latitude - site.latitudeDeg) > MAX_GRID_OFFSET_DEG || Math.abs(r.longitude - site.longitudeDeg) > MAX_GRID_OFFSET_DEG) {
    throw new ForecastError('malformed', `the service answered for ${r.latitude}, ${r.longitude}, not for ${site.latitudeDeg}, ${site.longitudeDeg}`, false);
  }
  const h = r.hourly;
  const times = h.time.map((s) => Date.parse(`${s}:00Z`));
  for (let i = 0; i < times.length; i++) {
    const t = times[i] as number;
    if (!Number.isFinite(t)) throw new ForecastError('malformed', `time ${h.time[i]} is not a date`, false);
    if (t % HOUR_MS !== 0) throw new ForecastError('malformed', `time ${h.time[i]} is not on a whole hour`, false);
    if (i > 0 && t - (times[i - 1] as number) !== HOUR_MS) {
      throw new ForecastError('gap', `the hours jump from ${h.time[i - 1]} to ${h.time[i]} (GMT): a gap or a repeat in the forecast`, false);
    }
  }
  const hours: HourlyWeather[] = [];
  const mean = (a: number | null | undefined, b: number | null | undefined) => (a == null || b == null ? undefined : (a + b) / 2);
  for (let i = 1; i < times.length; i++) {
    const ghi = h.shortwave_radiation[i];
    const tA = mean(h.temperature_2m[i - 1], h.temperature_2m[i]);
    if (ghi == null) throw new ForecastError('gap', `no shortwave_radiation for ${h.time[i]} (GMT)`, false);
    if (tA === undefined) throw new ForecastError('gap', `no temperature_2m for ${h.time[h.temperature_2m[i] == null ? i : i - 1]} (GMT)`, false);
    const rec: HourlyWeather = { t: (times[i] as number) - HOUR_MS, ghiWm2: ghi, tAirC: tA };
    const dni = h.direct_normal_irradiance[i];
    const dhi = h.diffuse_radiation[i];
    if (dni != null && dhi != null) {
      rec.dniWm2 = dni;
      rec.dhiWm2 = dhi;
    }
    const wind = mean(h.wind_speed_10m[i - 1], h.wind_speed_10m[i]);
    if (wind !== undefined) rec.windMS = wind;
    const cloud = mean(h.cloud_cover[i - 1], h.cloud_cover[i]);
    if (cloud !== undefined) rec.cloudOkta = cloud / 12.5;
    hours.push(rec);
  }
  return { provider: 'open-meteo', latitudeDeg: r.latitude, longitudeDeg: r.longitude, fetchedAtMs, hours };
}

/** Parses and validates a response body; malformed data becomes a ForecastError naming the first problems. */
export function parseOpenMeteoBody(text: string): OpenMeteoResponse {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new ForecastError('malformed', 'the forecast service sent a body that is not valid JSON', false);
  }
  const parsed = responseSchema.safeParse(data);
  if (!parsed.success) {
    const issues = parsed.error.issues.slice(0, 3).map((i) => `${i.path.join('.') || '(body)'}: ${i.message}`);
    throw new ForecastError('malformed', `the forecast service sent data we cannot use (${issues.join('; ')})`, false);
  }
  return parsed.data;
}

const defaultSleep = (ms: number) => new Promise<void>((r) => setTimeout(r, ms));

/** One try: HTTP, timeout, JSON and schema. */
async function tryOnce(url: string, site: ForecastSite, opts: Required<Pick<OpenMeteoOptions, 'timeoutMs'>> & OpenMeteoOptions): Promise<Forecast> {
  const doFetch = opts.fetchImpl ?? fetch;
  let text: string;
  let status: number;
  try {
    const res = await doFetch(url, { signal: AbortSignal.timeout(opts.timeoutMs), headers: { accept: 'application/json' } });
    status = res.status;
    text = await res.text();
  } catch (err) {
    const name = err instanceof Error ? err.name : '';
    if (name === 'TimeoutError' || name === 'AbortError') {
      throw new ForecastError('timeout', `the forecast service did not answer within ${Math.round(opts.timeoutMs / 100) / 10} s`, true);
    }
    throw new ForecastError('network', `the forecast service cannot be reached (${err instanceof Error ? (err.cause instanceof Error ? err.cause.message : err.message) : String(err)})`, true);
  }
  if (status !== 200) {
    // Open-Meteo explains errors as {"error": true, "reason": "..."}.
    let reason = '';
    try {
      const b = JSON.parse(text) as { reason?: unknown };
      if (typeof b.reason === 'string') reason = `: ${b.reason.slice(0, 200)}`;
    } catch {
      /* not JSON */
    }
    throw new ForecastError('http', `the forecast service answered HTTP ${status}${reason}`, status >= 500 || status === 429, status);
  }
  return convertOpenMeteo(parseOpenMeteoBody(text), site, (opts.now ?? Date.now)());
}

/**
 * Fetches today's and the next two days' hourly forecast (and yesterday's) for a place.
 * Tries up to `tries` times with exponential back-off (backoffMs, 2·backoffMs, …) when the failure is worth
 * retrying (HTTP 5xx or 429, timeout, network); a malformed answer or a 4xx is not retried.
 * @param site latitude, longitude [°], altitude [m]
 * @returns our Forecast (hours as lib/solar HourlyWeather)
 * @throws ForecastError with the last failure
 */
export async function fetchOpenMeteoForecast(site: ForecastSite, opts: OpenMeteoOptions): Promise<Forecast> {
  const tries = Math.max(1, opts.tries ?? 3);
  const backoffMs = opts.backoffMs ?? 1000;
  const timeoutMs = opts.timeoutMs ?? 10_000;
  const sleep = opts.sleep ?? defaultSleep;
  const url = openMeteoUrl(site, opts);
  let last: ForecastError | null = null;
  for (let attempt = 1; attempt <= tries; attempt++) {
    try {
      return await tryOnce(url, site, { ...opts, timeoutMs });
    } catch (err) {
      if (!(err instanceof ForecastError)) throw err;
      last = err;
      if (!err.retryable || attempt === tries) break;
      await sleep(backoffMs * 2 ** (attempt - 1));
    }
  }
  const e = last as ForecastError;
  throw new ForecastError(e.kind, e.retryable && tries > 1 ? `${e.message} (after ${tries} tries)` : e.message, e.retryable, e.status);
}
