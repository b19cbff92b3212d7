import { resolveWeatherToAperture, type ApertureGeometry, type HourlyWeather, type Site } from '@/lib/solar';
import { boilingPointAtAltitudeC, simulateCooker, simulateCookerSummary, type CookerSpec, type PotLoad, type SimulationResult, type WeatherStep } from '@/lib/thermal';
import { addDays, zonedDayBoundsMs, zonedTimeToUtcMs } from '@/lib/time';
import { fillWithClearSky } from './weather-fill';

export type WeatherSource = 'forecast' | 'stale-forecast' | 'upload' | 'clear-sky';

/** Where the weather of a prediction comes from and how old it is (passed through from lib/forecast). */
export interface WeatherMeta {
  source: WeatherSource;
  /** When the forecast was issued / fetched (ISO 8601); null for the clear-sky fallback. */
  issuedAt: string | null;
  fetchedAt: string | null;
  /** Age of the forecast when asked [s]; null for the clear-sky fallback. */
  ageS: number | null;
  /** A sentence on the fallback in use, if any. */
  note: string | null;
}

export interface DayPredictionInput {
  site: Site;
  timeZone: string;
  /** Local date YYYY-MM-DD. */
  date: string;
  spec: CookerSpec;
  geometry: ApertureGeometry;
  /**
   * Hourly weather for the day before and the day (for spin-up), each hour starting on a whole UTC hour;
   * missing hours (or all, when absent) are filled with clear sky × clearness.
   */
  hourly?: HourlyWeather[];
  /** Source and age of `hourly`; default 'forecast' with hours, 'clear-sky' without. */
  weather?: WeatherMeta;
  /** Store temperature at local midnight [°C]; when absent, the store is spun up over the previous day. */
  initialStoreTempC?: number;
  /** Batches; when absent, one reference batch of water in the first pot shows when a pot gets hot. */
  loads?: PotLoad[];
  /** Scale of clear-sky irradiance where no forecast exists: one value or 12 monthly values [0–1]; default 1. */
  clearness?: number | readonly number[];
  /** Output resolution of the series [min]; default 10. */
  outputStepMin?: number;
}

export interface DayPrediction {
  date: string;
  source: WeatherSource;
  /** Source and age of the weather, and how many hours were filled with clear sky (in the day, and in all). */
  weather: WeatherMeta & { filledHours: number; filledHoursInDay: number };
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
  /** Source and age of the weather, and how many hours were filled with clear sky. */
  weather: WeatherMeta & { filledHours: number; filledHoursInDay: number };
  /** 60-s aperture steps over the local day. */
  steps: WeatherStep[];
  /** Store temperature at local midnight [°C] (given, or from the one-day spin-up). */
  initialStoreTempC: number;
}

/**
 * The local day's aperture weather and the store's midnight temperature: the common first half of
 * a prediction and of a plan. Missing hours are filled with clear sky × clearness. Without a
 * starting temperature the store is simulated over the previous day from its lowest useful
 * temperature (a one-day spin-up), so the morning state follows from yesterday's sun.
 */
export function prepareDay(input: Pick<DayPredictionInput, 'site' | 'timeZone' | 'date' | 'spec' | 'geometry' | 'hourly' | 'weather' | 'initialStoreTempC' | 'clearness'>): PreparedDay {
  const [dayStart, dayEnd] = zonedDayBoundsMs(input.date, input.timeZone);
  const prevStart = zonedDayBoundsMs(addDays(input.date, -1), input.timeZone)[0];
  const given = input.hourly ?? [];
  const { hourly, filledMs } = fillWithClearSky(input.site, prevStart - 3_600_000, dayEnd + 3_600_000, given, input.clearness ?? 1);
  const filledHoursInDay = filledMs.filter((t) => t + 3_600_000 > dayStart && t < dayEnd).length;
  const hoursInDay = Math.ceil(dayEnd / 3_600_000) - Math.floor(dayStart / 3_600_000);
  let meta: WeatherMeta = input.weather ?? { source: given.length ? 'forecast' : 'clear-sky', issuedAt: null, fetchedAt: null, ageS: null, note: null };
  if (meta.source !== 'clear-sky' && filledHoursInDay >= hoursInDay) {
    // Nothing of the given weather falls in the day: say so rather than name a forecast that was not used.
    meta = { source: 'clear-sky', issuedAt: null, fetchedAt: null, ageS: null, note: 'The weather given does not cover this day; clear sky × clearness is used.' };
  }
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
  return { source: meta.source, weather: { ...meta, filledHours: filledMs.length, filledHoursInDay }, steps, initialStoreTempC };
}

/**
 * Predicts a cooker's day: weather → aperture irradiance (lib/solar) → store and pot simulation
 * (lib/thermal), minute by minute, returned at a coarser resolution for charts.
 */
export function predictDay(input: DayPredictionInput): DayPrediction {
  const { source, weather, steps: day, initialStoreTempC } = prepareDay(input);

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
    weather,
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
