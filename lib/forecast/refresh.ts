/**
 * Refreshing the kitchens' forecasts from the forecast service (run by the `forecast-refresh` job).
 *
 * Issue time: Open-Meteo's /v1/forecast does not report the model run behind an answer (its best-match blend
 * mixes models that update at different times), so the issue is identified by the fetch time floored to the
 * whole UTC hour. Refreshes run every 3 hours and once in the afternoon; a repeat within the same hour (a
 * retry, a second worker, the job sent at worker start) is the same issue and is stored once — the unique
 * (kitchen, source, issued_at) of the forecasts table holds this even between concurrent workers.
 */
import type { EntityManager } from '@mikro-orm/postgresql';
import { ForecastSchema, KitchenSchema, type Kitchen } from '@/entities';
import { getEnv } from '@/lib/env';
import { fetchOpenMeteoForecast, type OpenMeteoOptions } from './open-meteo';
import { pruneForecasts, recordFailedFetch, saveForecast } from './store';
import { ForecastError, HOUR_MS } from './types';

export interface RefreshOptions extends Omit<OpenMeteoOptions, 'now'> {
  /** The clock [epoch ms]; injected in tests. */
  now?: () => number;
}

/** Adapter options from the environment (FORECAST_URL, FORECAST_API_KEY, FORECAST_TIMEOUT_MS). */
export function forecastOptionsFromEnv(): RefreshOptions {
  const env = getEnv();
  return { baseUrl: env.FORECAST_URL, ...(env.FORECAST_API_KEY ? { apiKey: env.FORECAST_API_KEY } : {}), timeoutMs: env.FORECAST_TIMEOUT_MS };
}

/** The issue time of a fetch started at an instant: the whole UTC hour [epoch ms]. */
export function issueTimeOf(fetchStartMs: number): number {
  return Math.floor(fetchStartMs / HOUR_MS) * HOUR_MS;
}

export type RefreshOutcome =
  | { kitchenId: string; status: 'stored'; forecastId: string; hours: number }
  | { kitchenId: string; status: 'unchanged'; forecastId: string }
  | { kitchenId: string; status: 'failed'; error: string; retryable: boolean };

/**
 * Fetches and stores one kitchen's forecast, unless this hour's issue is already stored (then nothing is
 * fetched). A failure is recorded as a failed Forecast row with the error, and returned (not thrown).
 */
export async function refreshKitchenForecast(em: EntityManager, kitchen: Kitchen, opts: RefreshOptions): Promise<RefreshOutcome> {
  const now = opts.now ?? Date.now;
  const startMs = now();
  const issuedAtMs = issueTimeOf(startMs);
  const have = await em.findOne(ForecastSchema, { kitchen: kitchen.id, source: 'service', issuedAt: new Date(issuedAtMs), status: 'ok' }, { fields: ['id'] });
  if (have) return { kitchenId: kitchen.id, status: 'unchanged', forecastId: have.id };
  try {
    const f = await fetchOpenMeteoForecast({ latitudeDeg: kitchen.latitude, longitudeDeg: kitchen.longitude, altitudeM: kitchen.altitudeM }, { ...opts, now });
    const r = await saveForecast(em, kitchen, { source: 'service', issuedAtMs, fetchedAtMs: f.fetchedAtMs, hours: f.hours });
    return r.stored ? { kitchenId: kitchen.id, status: 'stored', forecastId: r.id, hours: f.hours.length } : { kitchenId: kitchen.id, status: 'unchanged', forecastId: r.id };
  } catch (err) {
    if (!(err instanceof ForecastError)) throw err;
    await recordFailedFetch(em, kitchen, err.message, now());
    return { kitchenId: kitchen.id, status: 'failed', error: err.message, retryable: err.retryable };
  }
}

/** Consecutive retryable failures after which the other kitchens are not tried in this run. */
const BREAKER_FAILURES = 3;

export interface RefreshSummary {
  outcomes: RefreshOutcome[];
  pruned: number;
}

/**
 * Refreshes every kitchen (or one), one after the other, then prunes forecasts older than the retention.
 * @param retentionDays FORECAST_RETENTION_DAYS [days]
 */
export async function refreshForecasts(
  em: EntityManager,
  opts: RefreshOptions & { kitchenId?: string; retentionDays: number },
): Promise<RefreshSummary> {
  const kitchens = await em.find(KitchenSchema, opts.kitchenId ? { id: opts.kitchenId } : {}, { orderBy: { createdAt: 'asc' } });
  const outcomes: RefreshOutcome[] = [];
  let down = 0;
  for (const k of kitchens) {
    if (down >= BREAKER_FAILURES) {
      // The service is down: do not spend the job's time on timeouts for every remaining kitchen.
      const error = `not tried: the forecast service failed for the previous ${BREAKER_FAILURES} kitchens`;
      await recordFailedFetch(em.fork(), k, error, (opts.now ?? Date.now)());
      outcomes.push({ kitchenId: k.id, status: 'failed', error, retryable: true });
      continue;
    }
    const o = await refreshKitchenForecast(em.fork(), k, opts);
    down = o.status === 'failed' && o.retryable ? down + 1 : 0;
    outcomes.push(o);
  }
  const pruned = await pruneForecasts(em, opts.retentionDays, (opts.now ?? Date.now)());
  return { outcomes, pruned };
}
