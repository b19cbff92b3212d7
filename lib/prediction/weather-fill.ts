/**
 * Clear-sky series with a monthly clear-sky index, and the filling of missing hours of a forecast with it.
 * Pure (lib/solar only), so it runs the same in a route, the worker and a test.
 */
import { clearSkyHourly, type HourlyWeather, type Site } from '@/lib/solar';

const HOUR_MS = 3_600_000;

/** Air temperature of the clear-sky fallback: daily minimum and maximum [°C] (common practice, no source). */
export const FALLBACK_TAIR_C = { minC: 16, maxC: 31 } as const;

/** Monthly value (January … December) or one value for every month → the value for a UTC month index. */
function clearnessFor(clearness: number | readonly number[], monthIndex: number): number {
  if (typeof clearness === 'number') return clearness;
  const v = clearness[monthIndex];
  if (clearness.length !== 12 || v === undefined) throw new RangeError(`clearness must be one number or 12 monthly values, got ${clearness.length} values`);
  return v;
}

/**
 * Hourly clear sky (lib/solar clearSkyHourly: Ineichen & Perez 2002, Erbs et al. 1982 split below 1) scaled by the
 * clear-sky index of each hour's UTC month.
 * @param site place ([°], [m])
 * @param fromMs first instant [epoch ms]; the series starts on the UTC hour containing it
 * @param toMs end [epoch ms], exclusive
 * @param clearness one value or 12 monthly values, January … December [0–1]
 * @param tAirC daily minimum and maximum air temperature [°C]
 * @returns consecutive hours with ghiWm2, dniWm2, dhiWm2 [W/m²] and tAirC [°C]
 */
export function clearSkyWithClearness(
  site: Site,
  fromMs: number,
  toMs: number,
  clearness: number | readonly number[],
  tAirC: { minC: number; maxC: number } = FALLBACK_TAIR_C,
): HourlyWeather[] {
  const out: HourlyWeather[] = [];
  let from = Math.floor(fromMs / HOUR_MS) * HOUR_MS;
  while (from < toMs) {
    // One call per UTC month so each month gets its own clear-sky index.
    const d = new Date(from);
    const monthEnd = Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 1);
    const to = Math.min(toMs, monthEnd);
    out.push(...clearSkyHourly(site, from, to, { clearness: clearnessFor(clearness, d.getUTCMonth()), tAirC }));
    from = Math.ceil(to / HOUR_MS) * HOUR_MS;
  }
  return out;
}

/**
 * Completes an hourly series over [fromMs, toMs) on whole UTC hours: hours the series has are kept, the missing
 * ones (before, after or inside it) come from {@link clearSkyWithClearness}.
 * @param hourly given hours, each starting on a whole UTC hour (any order; later duplicates win)
 * @returns the consecutive series and the start [epoch ms] of every filled hour
 * @throws RangeError when a given hour does not start on a whole UTC hour
 */
export function fillWithClearSky(
  site: Site,
  fromMs: number,
  toMs: number,
  hourly: readonly HourlyWeather[],
  clearness: number | readonly number[],
  tAirC: { minC: number; maxC: number } = FALLBACK_TAIR_C,
): { hourly: HourlyWeather[]; filledMs: number[] } {
  const given = new Map<number, HourlyWeather>();
  for (const h of hourly) {
    if (h.t % HOUR_MS !== 0) throw new RangeError(`hourly: every hour must start on a whole UTC hour, got ${new Date(h.t).toISOString()}`);
    given.set(h.t, h);
  }
  const first = Math.floor(fromMs / HOUR_MS) * HOUR_MS;
  const last = Math.ceil(toMs / HOUR_MS) * HOUR_MS;
  let missing = 0;
  for (let t = first; t < last; t += HOUR_MS) if (!given.has(t)) missing++;
  if (missing === 0) return { hourly: [...given.values()].filter((h) => h.t >= first && h.t < last).sort((a, b) => a.t - b.t), filledMs: [] };
  const clear = clearSkyWithClearness(site, first, last, clearness, tAirC);
  const filledMs: number[] = [];
  const out = clear.map((c) => {
    const g = given.get(c.t);
    if (g) return g;
    filledMs.push(c.t);
    return c;
  });
  return { hourly: out, filledMs };
}
