import type { Cooker, Kitchen, StorageMedium as CustomMediumRow } from '@/entities';
import { resolveWeatherToAperture, type HourlyWeather } from '@/lib/solar';
import type { WeatherStep } from '@/lib/thermal';
import { simulateCooker } from '@/lib/thermal';
import { unprocessable } from '@/lib/http/errors';
import { normalisePots, toApertureGeometry, toCookerSpec } from '@/lib/cookers/spec';
import type { SimulationInput } from '@/lib/validations/simulations';

/**
 * Runs the thermal model for POST /api/v1/simulations: a stored cooker (with its kitchen's place)
 * or an inline one, driven by aperture steps or by hourly weather resolved with lib/solar.
 * An inline cooker with mediumId "custom" needs its custom medium's row (looked up by the caller within the
 * viewer's organisations); without it the request is refused naming cooker.customMediumId.
 */
export function runSimulationRequest(
  input: SimulationInput,
  stored?: { cooker: Cooker; kitchen: Kitchen },
  inlineCustom?: Pick<CustomMediumRow, 'name' | 'rows' | 'smokePointC'> | null,
) {
  const def = stored?.cooker ?? { ...input.cooker!, pots: normalisePots(input.cooker!.pots) };
  const custom = stored ? (stored.cooker.customMedium ?? null) : (inlineCustom ?? null);
  if (def.mediumId === 'custom' && !custom) {
    throw unprocessable('Choose a custom medium of your organisation.', { [stored ? 'cookerId' : 'cooker.customMediumId']: 'Unknown custom medium.' });
  }
  const spec = toCookerSpec(def as Cooker, custom);
  const site = input.site
    ? { latitudeDeg: input.site.latitude, longitudeDeg: input.site.longitude, altitudeM: input.site.altitudeM }
    : stored
      ? { latitudeDeg: stored.kitchen.latitude, longitudeDeg: stored.kitchen.longitude, altitudeM: stored.kitchen.altitudeM }
      : null;
  const altitudeM = input.altitudeM ?? site?.altitudeM ?? 0;
  let steps: WeatherStep[];
  if (input.weather.kind === 'aperture') {
    steps = input.weather.steps.map((s) => ({ t: Date.parse(s.t), gApertureWm2: s.gApertureWm2, tAirC: s.tAirC, ...(s.windMS !== undefined ? { windMS: s.windMS } : {}) }));
  } else {
    const hourly: HourlyWeather[] = input.weather.hours.map(({ t, ...rest }) => ({ t: Date.parse(t), ...rest }));
    steps = resolveWeatherToAperture(site!, toApertureGeometry(def as Cooker), hourly, 60);
  }
  const potIds = new Set(spec.pots.map((p) => p.id));
  input.loads.forEach((l, i) => {
    if (!potIds.has(l.potId)) throw unprocessable(`Batch ${i + 1} names a pot the cooker does not have.`, { [`loads.${i}.potId`]: `Known pots: ${[...potIds].join(', ')}.` });
  });
  const loads = input.loads.map((l) => ({ ...l, startMs: Date.parse(l.start), maxEndMs: Date.parse(l.maxEnd) }));
  let sim;
  try {
    sim = simulateCooker(spec, steps, { initialStoreTempC: input.initialStoreTempC, altitudeM, loads: loads.map(({ start: _s, maxEnd: _m, ...l }) => l) });
  } catch (err) {
    if (err instanceof RangeError) throw unprocessable(`The model refused the input: ${err.message}`, { '(body)': err.message });
    throw err;
  }
  const stepS = steps.length > 1 ? (steps[1]!.t - steps[0]!.t) / 1000 : 60;
  const every = Math.max(1, Math.round((input.outputStepMin * 60) / stepS));
  const pick = <T,>(a: T[]) => a.filter((_, i) => i % every === 0);
  return {
    series: {
      t: pick(sim.series.t).map((ms) => new Date(ms).toISOString()),
      storeTempC: pick(sim.series.storeTempC),
      charge: pick(sim.series.charge),
      potTempC: Object.fromEntries(Object.entries(sim.series.potTempC).map(([k, v]) => [k, pick(v).map((x) => (Number.isFinite(x) ? x : null))])),
    },
    loads: sim.loads.map((l) => ({ ...l, startMs: undefined, start: new Date(l.startMs).toISOString(), reached: l.reachedMs ? new Date(l.reachedMs).toISOString() : null, done: l.doneMs ? new Date(l.doneMs).toISOString() : null, end: new Date(l.endMs).toISOString() })),
    events: sim.events.map((e) => ({ ...e, t: new Date(e.tMs).toISOString() })),
    balance: sim.balance,
  };
}
