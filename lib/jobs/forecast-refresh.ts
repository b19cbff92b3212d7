import type PgBoss from 'pg-boss';
import type { EntityManager } from '@mikro-orm/postgresql';
import { getEnv } from '@/lib/env';
import { forecastOptionsFromEnv, refreshForecasts, type RefreshOptions, type RefreshSummary } from '@/lib/forecast/refresh';

export interface ForecastRefreshData {
  /** Refresh one kitchen only; every kitchen when absent. */
  kitchenId?: string;
}

/** Cron of the refresh: every 3 hours and at the afternoon hour (UTC). */
export function forecastRefreshCron(afternoonHourUtc = getEnv().FORECAST_AFTERNOON_HOUR_UTC): string {
  return `0 0-23/3,${afternoonHourUtc} * * *`;
}

/**
 * The forecast-refresh job: fetches and stores every kitchen's forecast (idempotent within the hour: an issue
 * already stored is not fetched again), prunes forecasts past the retention, and throws when a kitchen failed
 * for a reason worth retrying so pg-boss retries the job with back-off (kitchens already refreshed this hour
 * are skipped on the retry).
 */
export async function handleForecastRefresh(
  em: EntityManager,
  data: ForecastRefreshData | undefined,
  opts: RefreshOptions & { retentionDays?: number } = forecastOptionsFromEnv(),
): Promise<RefreshSummary> {
  const summary = await refreshForecasts(em, {
    ...opts,
    retentionDays: opts.retentionDays ?? getEnv().FORECAST_RETENTION_DAYS,
    ...(data?.kitchenId ? { kitchenId: data.kitchenId } : {}),
  });
  const failed = summary.outcomes.filter((o) => o.status === 'failed');
  const retry = failed.filter((o) => o.status === 'failed' && o.retryable);
  if (retry.length) {
    throw new Error(`forecast refresh failed for ${retry.length} of ${summary.outcomes.length} kitchens: ${retry.map((o) => (o.status === 'failed' ? o.error : '')).join('; ')}`);
  }
  return summary;
}

export type ForecastRefreshJob = PgBoss.Job<ForecastRefreshData>;
