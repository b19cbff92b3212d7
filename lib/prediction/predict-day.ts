import { clearSkyHourly, resolveWeatherToAperture, type ApertureGeometry, type HourlyWeather, type Site } from '@/lib/solar';
import { boilingPointAtAltitudeC, simulateCooker, simulateCookerSummary, type CookerSpec, type PotLoad, type SimulationResult, type WeatherStep } from '@/lib/thermal';
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
  /** Where `hourly` came from; default 'forecast'. */
  hourlySource?: WeatherSource;
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

export interface PreparedDay {
  source: WeatherSource;
  /** 60-s aperture steps over the local day. */
  steps: WeatherStep[];
  /** Store temperature at local midnight [°C] (given, or from the one-day spin-up). */
  initialStoreTempC: number;
}

/**
 * The local day's aperture weather and the store's midnight temperature: the common first half of
 * a prediction and of a plan. Without a starting temperature the store is simulated over the
 * previous day from its lowest useful temperature (a one-day spin-up).
 */
export function prepareDay(input: Pick<DayPredictionInput, 'site' | 'timeZone' | 'date' | 'spec' | 'geometry' | 'hourly' | 'hourlySource' | 'initialStoreTempC' | 'clearness'>): PreparedDay {
  const [dayStart, dayEnd] = zonedDayBoundsMs(input.date, input.timeZone);
  const prevStart = zonedDayBoundsMs(addDays(input.date, -1), input.timeZone)[0];
  const source: WeatherSource = input.hourly ? (input.hourlySource ?? 'forecast') : 'clear-sky';
  const hourly = input.hourly ?? clearSkyForDay(input.site, input.timeZone, input.date, input.clearness ?? 1);
  const all = resolveWeatherToAperture(input.site, input.geometry, hourly, STEP_S);
  const firstT = all[0]?.t ?? dayStart;
  const from = (ms: number) => Math.max(0, Math.round((ms - firstT) / (STEP_S * 1000)));
  const steps = all.slice(from(dayStart), from(dayEnd));
  if (steps.length < 60) throw new RangeError('hourly: the weather does not cover the requested day');

  let initialStoreTempC = input.initialStoreTempC;
  if (initialStoreTempC === undefined) {
    const prev = all.slice(from(prevStart), from(dayStart));
    if (prev.length >= 60) {
      const spin = simulateCookerSummary(input.spec, prev, { stepS: STEP_S, initialStoreTempC: input.spec.store.minUsefulTempC, altitudeM: input.site.altitudeM });
      initialStoreTempC = spin.finalStoreTempC;
    } else {
      initialStoreTempC = input.spec.store.minUsefulTempC;
    }
  }
  return { source, steps, initialStoreTempC };
}

/**
 * Predicts a cooker's day: weather → aperture irradiance (lib/solar) → store and pot simulation
 * (lib/thermal), minute by minute, returned at a coarser resolution for charts.
 */
/** Clear-sky hourly weather for a local day and the day before (the spin-up), the fallback of every prediction. */
export function clearSkyForDay(site: Site, timeZone: string, date: string, clearness = 1): HourlyWeather[] {
  const [, dayEnd] = zonedDayBoundsMs(date, timeZone);
  const prevStart = zonedDayBoundsMs(addDays(date, -1), timeZone)[0];
  return clearSkyHourly(site, prevStart - 3_600_000, dayEnd + 3_600_000, { clearness, tAirC: { minC: 16, maxC: 31 } });
}

export function predictDay(input: DayPredictionInput): DayPrediction {
  const { source, steps: day, initialStoreTempC } = prepareDay(input);
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
