import { clearSkyHourly, resolveWeatherToAperture, type ApertureGeometry, type HourlyWeather, type Site } from '@/lib/solar';
import { boilingPointAtAltitudeC, simulateCooker, type CookerSpec, type PotLoad, type SimulationResult } from '@/lib/thermal';
import { addDays, zonedDayBoundsMs, zonedTimeToUtcMs } from '@/lib/time';

export type WeatherSource = 'forecast' | 'stale-forecast' | 'upload' | 'clear-sky';

export interface DayPredictionInput {
  site: Site;
  timeZone: string;
  /** Local date YYYY-MM-DD. */
  date: string;
  spec: CookerSpec;
  geometry: ApertureGeometry;
  /** Hourly weather covering the day before and the day (for spin-up); clear sky when absent. */
  hourly?: HourlyWeather[];
  /** Store temperature at local midnight [°C]; when absent, the store is spun up over the previous day. */
  initialStoreTempC?: number;
  /** Batches; when absent, one reference batch of water in the first pot shows when a pot gets hot. */
  loads?: PotLoad[];
  /** Scale of clear-sky irradiance when no forecast exists (monthly clearness) [0–1]. */
  clearness?: number;
  /** Output resolution of the series [min]; default 10. */
  outputStepMin?: number;
}

export interface DayPrediction {
  date: string;
  source: WeatherSource;
  /** Output series at outputStepMin resolution. */
  series: { t: number[]; storeTempC: number[]; potTempC: Record<string, (number | null)[]>; charge: number[]; gApertureWm2: number[]; tAirC: number[] };
  loads: SimulationResult['loads'];
  events: SimulationResult['events'];
  balance: SimulationResult['balance'];
  initialStoreTempC: number;
  referenceLoad: PotLoad | null;
  boilingPointC: number;
}

const STEP_S = 60;

/**
 * Predicts a cooker's day: weather → aperture irradiance (lib/solar) → store and pot simulation
 * (lib/thermal), minute by minute, returned at a coarser resolution for charts.
 * Without a starting temperature the store is first simulated over the previous day from its lowest
 * useful temperature (a one-day spin-up), so the morning state follows from yesterday's sun.
 */
export function predictDay(input: DayPredictionInput): DayPrediction {
  const [dayStart, dayEnd] = zonedDayBoundsMs(input.date, input.timeZone);
  const prevStart = zonedDayBoundsMs(addDays(input.date, -1), input.timeZone)[0];
  const source: WeatherSource = input.hourly ? 'forecast' : 'clear-sky';
  const hourly =
    input.hourly ??
    clearSkyHourly(input.site, prevStart - 3_600_000, dayEnd + 3_600_000, { clearness: input.clearness ?? 1, tAirC: { minC: 16, maxC: 31 } });
  const steps = resolveWeatherToAperture(input.site, input.geometry, hourly, STEP_S);
  const firstT = steps[0]?.t ?? dayStart;
  const from = (ms: number) => Math.max(0, Math.round((ms - firstT) / (STEP_S * 1000)));
  const day = steps.slice(from(dayStart), from(dayEnd));
  if (day.length < 60) throw new RangeError('hourly: the weather does not cover the requested day');

  let initialStoreTempC = input.initialStoreTempC;
  if (initialStoreTempC === undefined) {
    const prev = steps.slice(from(prevStart), from(dayStart));
    if (prev.length >= 60) {
      const spin = simulateCooker(input.spec, prev, { stepS: STEP_S, initialStoreTempC: input.spec.store.minUsefulTempC, altitudeM: input.site.altitudeM });
      initialStoreTempC = spin.series.storeTempC[spin.series.storeTempC.length - 1] ?? input.spec.store.minUsefulTempC;
    } else {
      initialStoreTempC = input.spec.store.minUsefulTempC;
    }
  }

  const boilingPointC = boilingPointAtAltitudeC(input.site.altitudeM);
  let referenceLoad: PotLoad | null = null;
  let loads = input.loads;
  const pot = input.spec.pots[0];
  if (!loads && pot) {
    // Reference batch (common practice, no source): a pot 70 % full of water from 10:00, held near the boil for 30 min.
    referenceLoad = {
      id: 'reference',
      potId: pot.id,
      startMs: zonedTimeToUtcMs(input.date, input.timeZone, 10, 0),
      foodKg: 0,
      foodCpJPerKgK: 3500,
      waterKg: 0.7 * pot.volumeL,
      lidOn: true,
      minTempC: Math.min(90, boilingPointC - 3),
      holdS: 30 * 60,
      maxEndMs: zonedTimeToUtcMs(input.date, input.timeZone, 17, 0),
    };
    loads = [referenceLoad];
  }

  const sim = simulateCooker(input.spec, day, { stepS: STEP_S, initialStoreTempC, altitudeM: input.site.altitudeM, loads: loads ?? [] });
  const every = Math.max(1, Math.round(((input.outputStepMin ?? 10) * 60) / STEP_S));
  const pick = <T,>(a: T[]) => a.filter((_, i) => i % every === 0);
  const potTempC: Record<string, (number | null)[]> = {};
  for (const [id, arr] of Object.entries(sim.series.potTempC)) potTempC[id] = pick(arr).map((v) => (Number.isFinite(v) ? v : null));
  return {
    date: input.date,
    source,
    series: {
      t: pick(sim.series.t),
      storeTempC: pick(sim.series.storeTempC),
      potTempC,
      charge: pick(sim.series.charge),
      gApertureWm2: pick(day.map((s) => s.gApertureWm2)),
      tAirC: pick(day.map((s) => s.tAirC)),
    },
    loads: sim.loads,
    events: sim.events,
    balance: sim.balance,
    initialStoreTempC,
    referenceLoad,
    boilingPointC,
  };
}
