import { describe, expect, it } from 'vitest';
import { simulateCooker, type CookerSpec, type PotLoad, type SimulateOptions, type WeatherStep } from '@/lib/thermal';
import { constantWeather, HOUR_MS, referenceCooker, T0_MS } from './fixtures';

const okOpts: SimulateOptions = { initialStoreTempC: 80, altitudeM: 0 };
const load = (over: Partial<PotLoad> = {}): PotLoad => ({
  id: 'a',
  potId: 'big',
  startMs: T0_MS,
  foodKg: 1,
  foodCpJPerKgK: 3000,
  waterKg: 2,
  lidOn: true,
  minTempC: 80,
  holdS: 600,
  maxEndMs: T0_MS + HOUR_MS,
  ...over,
});

function run(spec: CookerSpec = referenceCooker('sunflower-oil'), weather: WeatherStep[] = constantWeather(10, 500, 25), opts: SimulateOptions = okOpts) {
  return () => simulateCooker(spec, weather, opts);
}

describe('simulateCooker input validation (RangeError naming the field)', () => {
  it('negative aperture area', () => {
    const spec = referenceCooker('sunflower-oil');
    spec.collector = { ...spec.collector, apertureM2: -1 };
    expect(run(spec)).toThrow(RangeError);
    expect(run(spec)).toThrow(/collector\.apertureM2 must not be negative/);
  });

  it('negative pot contact area and lid area', () => {
    const spec = referenceCooker('sunflower-oil');
    spec.pots[0] = { ...spec.pots[0]!, coupling: { kind: 'natural-convection', contactAreaM2: -0.1 } };
    expect(run(spec)).toThrow(/pots\[0\]\.coupling\.contactAreaM2/);
    const spec2 = referenceCooker('sunflower-oil');
    spec2.pots[1] = { ...spec2.pots[1]!, lidAreaM2: -0.1 };
    expect(run(spec2)).toThrow(/pots\[1\]\.lidAreaM2/);
  });

  it('unknown medium: the message lists the known ids', () => {
    const spec = referenceCooker('olive-oil');
    expect(run(spec)).toThrow(RangeError);
    expect(run(spec)).toThrow(/store\.mediumId: unknown storage medium "olive-oil"; known ids: sunflower-oil, palm-oil, soybean-oil/);
  });

  it('custom medium without a table, and a bad custom table', () => {
    expect(run(referenceCooker('custom'))).toThrow(/store\.customTable is required/);
    const spec = referenceCooker('custom');
    spec.store.customTable = { name: 't', rows: [{ tC: 10, density: 900, cp: 2000, k: 0.1, viscosity: 0.01 }, { tC: 5, density: 900, cp: 2000, k: 0.1, viscosity: 0.01 }] };
    expect(run(spec)).toThrow(/store\.customTable\.rows\[1\]\.tC/);
  });

  it('store fields: mass, nodes, maxSafe ≤ minUseful', () => {
    const a = referenceCooker('sunflower-oil');
    a.store.massKg = 0;
    expect(run(a)).toThrow(/store\.massKg must be positive/);
    const b = referenceCooker('sunflower-oil');
    b.store.nodes = 0;
    expect(run(b)).toThrow(/store\.nodes/);
    const c = referenceCooker('sunflower-oil');
    c.store.maxSafeTempC = 90;
    expect(run(c)).toThrow(/store\.maxSafeTempC \(90\) must be above store\.minUsefulTempC/);
  });

  it('unsorted, gapped and uneven weather steps', () => {
    const w = constantWeather(5, 500, 25);
    const unsorted = [w[0]!, w[2]!, w[1]!, w[3]!];
    expect(run(undefined, unsorted)).toThrow(/weather\[2\]\.t must be later than weather\[1\]\.t/);
    const gapped = [w[0]!, w[1]!, w[3]!, w[4]!];
    expect(run(undefined, gapped)).toThrow(/weather\[2\]\.t: steps must be contiguous and evenly spaced/);
    const uneven = [w[0]!, w[1]!, { ...w[2]!, t: w[2]!.t + 1000 }];
    expect(run(undefined, uneven)).toThrow(/weather\[2\]\.t/);
    expect(run(undefined, [])).toThrow(/weather must contain at least one step/);
  });

  it('NaN anywhere is named', () => {
    const w = constantWeather(5, 500, 25);
    w[3] = { ...w[3]!, tAirC: Number.NaN };
    expect(run(undefined, w)).toThrow(/weather\[3\]\.tAirC must be a finite number/);
    const w2 = constantWeather(5, 500, 25);
    w2[1] = { ...w2[1]!, gApertureWm2: Number.NaN };
    expect(run(undefined, w2)).toThrow(/weather\[1\]\.gApertureWm2/);
    expect(run(undefined, undefined, { initialStoreTempC: Number.NaN, altitudeM: 0 })).toThrow(/opts\.initialStoreTempC/);
    expect(run(undefined, undefined, { ...okOpts, loads: [load({ minTempC: Number.NaN })] })).toThrow(/loads\[0\]\.minTempC/);
    const spec = referenceCooker('sunflower-oil');
    spec.store.uaLossWPerK = Number.NaN;
    expect(run(spec)).toThrow(/store\.uaLossWPerK/);
  });

  it('stepS that does not match the weather spacing, and an altitude outside the ISA formula', () => {
    expect(run(undefined, undefined, { ...okOpts, stepS: 30 })).toThrow(/opts\.stepS \(30 s\) must equal the weather step spacing \(60 s\)/);
    expect(run(undefined, undefined, { ...okOpts, altitudeM: 20000 })).toThrow(/opts\.altitudeM/);
  });

  it('loads on unknown pots, overlapping loads on one pot, duplicate ids, end before start', () => {
    expect(run(undefined, undefined, { ...okOpts, loads: [load({ potId: 'wok' })] })).toThrow(/loads\[0\]\.potId: unknown pot "wok"; pots: big, small/);
    expect(
      run(undefined, undefined, { ...okOpts, loads: [load(), load({ id: 'b', startMs: T0_MS + 30 * 60_000, maxEndMs: T0_MS + 2 * HOUR_MS })] }),
    ).toThrow(/loads\[1\]\.startMs: load "b" overlaps load "a" on pot "big"/);
    expect(run(undefined, undefined, { ...okOpts, loads: [load(), load({ potId: 'small' })] })).toThrow(/loads\[1\]\.id "a" is used by another load/);
    expect(run(undefined, undefined, { ...okOpts, loads: [load({ maxEndMs: T0_MS })] })).toThrow(/loads\[0\]\.maxEndMs must be after/);
    // Back-to-back loads on one pot are fine.
    expect(
      run(undefined, undefined, { ...okOpts, loads: [load(), load({ id: 'b', startMs: T0_MS + HOUR_MS, maxEndMs: T0_MS + 2 * HOUR_MS })] }),
    ).not.toThrow();
  });
});
