import { describe, expect, it } from 'vitest';
import { erythritol, getMedium, sunflowerOil } from '@/lib/materials';
import { boilingPointAtAltitudeC, simulateCooker, simulateCookerSummary, type CookerSpec, type PotLoad, type SimulationResult } from '@/lib/thermal';
import { constantWeather, dailyLoads, HOUR_MS, MIN_MS, referenceCooker, T0_MS, variedWeather } from './fixtures';

/** Constant-property custom medium (cp 2000 J/(kg·K)) for analytic checks. */
const constantCpStore = {
  mediumId: 'custom',
  customTable: {
    name: 'constant cp',
    rows: [
      { tC: 0, density: 900, cp: 2000, k: 0.15, viscosity: 0.01 },
      { tC: 400, density: 900, cp: 2000, k: 0.15, viscosity: 0.01 },
    ],
  },
};

function independentStoredChangeJ(mediumId: string, massKg: number, layersC: number[], t0C: number): number {
  const m = getMedium(mediumId);
  const mL = massKg / layersC.length;
  return layersC.reduce((s, t) => s + mL * (m.enthalpy(t) - m.enthalpy(t0C)), 0);
}

describe('simulateCooker — analytic case', () => {
  it('constant gain and ambient, lumped U = 0, store UA, no pots, constant cp: T(t) = Ta + (Q/UA)(1 − e^(−t·UA/C)) within 0.01 K over 12 h', () => {
    // Q = η0·A·G = 0.5·1·1000 = 500 W; UA = 2 W/K; C = 50 kg · 2000 = 1e5 J/K; Ta = T0 = 25 °C.
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 1, eta0: 0.5, uLossWPerK: 0 },
      store: { ...constantCpStore, massKg: 50, uaLossWPerK: 2, maxSafeTempC: 390, minUsefulTempC: 60 },
      pots: [],
    };
    const n = 12 * 60;
    const r = simulateCooker(spec, constantWeather(n, 1000, 25), { initialStoreTempC: 25, altitudeM: 0 });
    let worst = 0;
    for (let k = 0; k <= n; k++) {
      const t = k * 60;
      const exact = 25 + (500 / 2) * (1 - Math.exp((-t * 2) / 1e5));
      worst = Math.max(worst, Math.abs(r.series.storeTempC[k]! - exact));
    }
    expect(worst).toBeLessThan(0.01);
    expect(worst).toBeLessThan(1e-9); // exact exponential solution: only rounding is left
    expect(r.balance.spillJ).toBe(0);
  });
});

describe('simulateCooker — energy balance over a week of varied weather (seeded PRNG) with loads', () => {
  const weather = variedWeather(7, 20260301);
  const loads = dailyLoads(7);
  const cases: [string, CookerSpec, number][] = [
    ['well-mixed sunflower-oil store', referenceCooker('sunflower-oil'), 60],
    ['10-node sunflower-oil store', referenceCooker('sunflower-oil', 10), 60],
    ['erythritol store', { ...referenceCooker('erythritol'), store: { ...referenceCooker('erythritol').store, maxSafeTempC: 150, minUsefulTempC: 100 } }, 90],
  ];
  it.each(cases)('%s: gain − loss − draw − spill = stored change within 0.1 % (and 1e-9 by construction)', (_name, spec, t0C) => {
    const opts = { initialStoreTempC: t0C, altitudeM: 1200, loads };
    const r = simulateCooker(spec, weather, opts);
    const b = r.balance;
    expect(b.gainJ).toBeGreaterThan(1e7);
    expect(b.drawJ).toBeGreaterThan(1e6);
    expect(b.relativeError).toBeLessThan(1e-3);
    expect(b.relativeError).toBeLessThan(1e-9);
    // Independent check of the stored change from the final layer temperatures: Σ m_i·(h(T_i) − h(T0)).
    const s = simulateCookerSummary(spec, weather, opts);
    const indep = independentStoredChangeJ(spec.store.mediumId, spec.store.massKg, s.finalLayerTempsC, t0C);
    expect(Math.abs(indep - b.storedChangeJ) / b.gainJ).toBeLessThan(1e-9);
    // The per-step series integrate to the totals.
    const sum = (xs: number[]) => xs.reduce((a, x) => a + x * 60, 0);
    expect(Math.abs(sum(r.series.gainW) - b.gainJ) / b.gainJ).toBeLessThan(1e-9);
    expect(Math.abs(sum(r.series.drawW) - b.drawJ) / b.drawJ).toBeLessThan(1e-9);
    // Every load drew heat; the draws add up to the store's draw.
    const drawn = r.loads.reduce((a, l) => a + l.drawnJ, 0);
    expect(Math.abs(drawn - b.drawJ) / b.drawJ).toBeLessThan(1e-9);
  });
});

describe('simulateCooker — phase-change plateau', () => {
  it('an erythritol store stays within its melting range for ≈ m·L/Q (within 3 %) while the latent heat is absorbed', () => {
    // Q = 0.5·2·1000 = 1000 W, no losses, 20 kg: m·L/Q = 20·310 514/1000 = 6210 s (latent heat from
    // 37.92 kJ/mol, J. Therm. Anal. Calorim. 95(2):469). The sensible heat over the 2 K range adds ≈ 1.3 %.
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 2, eta0: 0.5, uLossWPerK: 0 },
      store: { mediumId: 'erythritol', massKg: 20, uaLossWPerK: 0, maxSafeTempC: 170, minUsefulTempC: 100 },
      pots: [],
    };
    const r = simulateCooker(spec, constantWeather(5 * 60, 1000, 25), { initialStoreTempC: 100, altitudeM: 0 });
    const { solidusC, liquidusC, latentJPerKg } = erythritol.melting!;
    const T = r.series.storeTempC;
    const cross = (level: number): number => {
      const k = T.findIndex((x) => x >= level);
      return (k - 1 + (level - T[k - 1]!) / (T[k]! - T[k - 1]!)) * 60; // linear interpolation between boundaries
    };
    const plateauS = cross(liquidusC) - cross(solidusC);
    const mLOverQ = (20 * latentJPerKg) / 1000;
    expect(Math.abs(plateauS / mLOverQ - 1)).toBeLessThan(0.03);
    // Hand value with the sensible part: 20·(310 514 + 2·(1383 + 2765)/2)/1000 = 6293 s; within one step.
    expect(Math.abs(plateauS - 6293)).toBeLessThan(60);
    // During the plateau the temperature stays in the melting range.
    const k0 = Math.ceil(cross(solidusC) / 60);
    const k1 = Math.floor(cross(liquidusC) / 60);
    for (let k = k0; k <= k1; k++) {
      expect(T[k]!).toBeGreaterThanOrEqual(solidusC - 1e-9);
      expect(T[k]!).toBeLessThanOrEqual(liquidusC + 1e-9);
    }
  });
});

describe('simulateCooker — plausibility (a fact of the trade reported for oil-store cookers)', () => {
  it('a steady gain brings a sunflower-oil store to ≈ 137 °C (410 K): a non-boiling pot settles a few kelvin below it, and the store nears equilibrium within ≈ 4 h', () => {
    // Collector 1.5 m², η0 0.6, 800 W/m² → 720 W; loss paths: collector 4.5 W/K, store shell 1.6 W/K, pot lid 0.35 W/K
    // through a 10 W/K coupling. Equilibrium ≈ 25 + 720/6.44 ≈ 137 °C; store–pot drop ≈ 0.35·108/10 ≈ 3.8 K.
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 1.5, eta0: 0.6, uLossWPerK: 4.5 },
      store: { mediumId: 'sunflower-oil', massKg: 12, uaLossWPerK: 1.6, maxSafeTempC: 197, minUsefulTempC: 90 },
      pots: [{ id: 'fryer', volumeL: 8, massKg: 1.5, cpJPerKgK: 900, coupling: { kind: 'constant', uaWPerK: 10 }, lidAreaM2: 0.07, lidUWPerM2K: 5 }],
    };
    // Oil-fried food: no water, so the pot is not capped at the boiling point and the drop is meaningful.
    const load: PotLoad = { id: 'fry', potId: 'fryer', startMs: T0_MS, foodKg: 2, foodCpJPerKgK: 2000, waterKg: 0, lidOn: true, minTempC: 500, holdS: 0, maxEndMs: T0_MS + 48 * HOUR_MS };
    const n = 24 * 60;
    const r = simulateCooker(spec, constantWeather(n, 800, 25), { initialStoreTempC: 25, altitudeM: 0, loads: [load] });
    const ts = r.series.storeTempC;
    const tp = r.series.potTempC.fryer!;
    const tEq = ts[n]!;
    expect(tEq + 273.15).toBeGreaterThan(405); // ≈ 410 K
    expect(tEq + 273.15).toBeLessThan(415);
    const drop = ts[n]! - tp[n]!;
    expect(drop).toBeGreaterThan(2);
    expect(drop).toBeLessThan(6);
    // Near equilibrium after 4 h: less than 8 % of the rise left.
    expect((tEq - ts[4 * 60]!) / (tEq - 25)).toBeLessThan(0.08);
    // A 10 W/K coupling and 0.35 W/K lid: the pot never passes the store once warm.
    for (let k = 60; k <= n; k++) expect(tp[k]!).toBeLessThan(ts[k]!);
  });
});

describe('simulateCooker — defocus, charge, batches, boiling, events', () => {
  it('spills when the gain is huge, and the store never exceeds maxSafeTempC (well-mixed and 10-node)', () => {
    for (const nodes of [1, 10]) {
      const spec: CookerSpec = {
        collector: { model: 'lumped', apertureM2: 10, eta0: 0.8, uLossWPerK: 2 },
        store: { mediumId: 'sunflower-oil', massKg: 20, uaLossWPerK: 1, nodes, maxSafeTempC: 180, minUsefulTempC: 90 },
        pots: [],
      };
      const weather = constantWeather(6 * 60, 1000, 30);
      const r = simulateCooker(spec, weather, { initialStoreTempC: 40, altitudeM: 0 });
      expect(r.balance.spillJ).toBeGreaterThan(1e6);
      expect(Math.max(...r.series.storeTempC)).toBeLessThanOrEqual(180 + 1e-9);
      expect(Math.max(...r.series.storeTopTempC)).toBeLessThanOrEqual(180 + 1e-9);
      const s = simulateCookerSummary(spec, weather, { initialStoreTempC: 40, altitudeM: 0 });
      for (const t of s.finalLayerTempsC) expect(t).toBeLessThanOrEqual(180 + 1e-9);
      expect(r.events.filter((e) => e.kind === 'store-max-safe')).toHaveLength(1);
      expect(r.series.charge[r.series.charge.length - 1]).toBeCloseTo(1, 9);
      expect(r.balance.relativeError).toBeLessThan(1e-9);
    }
  });

  it('charge is 0 at minUsefulTempC and 1 at maxSafeTempC', () => {
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 0, eta0: 0.6, uLossWPerK: 0 },
      store: { mediumId: 'sunflower-oil', massKg: 20, uaLossWPerK: 0, maxSafeTempC: 190, minUsefulTempC: 90 },
      pots: [],
    };
    expect(simulateCooker(spec, constantWeather(2, 0, 25), { initialStoreTempC: 90, altitudeM: 0 }).series.charge[0]).toBeCloseTo(0, 12);
    expect(simulateCooker(spec, constantWeather(2, 0, 25), { initialStoreTempC: 190, altitudeM: 0 }).series.charge[0]).toBeCloseTo(1, 12);
  });

  function potRun(lidOn: boolean, altitudeM = 1500): SimulationResult {
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 2, eta0: 0.6, uLossWPerK: 3 },
      store: { mediumId: 'sunflower-oil', massKg: 40, uaLossWPerK: 1.5, maxSafeTempC: 197, minUsefulTempC: 95 },
      pots: [{ id: 'p', volumeL: 20, massKg: 3, cpJPerKgK: 900, coupling: { kind: 'natural-convection', contactAreaM2: 0.2 }, lidAreaM2: 0.07, lidUWPerM2K: 8 }],
    };
    const load: PotLoad = { id: 'stew', potId: 'p', startMs: T0_MS + 30 * MIN_MS + 20_000, foodKg: 4, foodCpJPerKgK: 3000, waterKg: 6, lidOn, minTempC: 85, holdS: 1800, maxEndMs: T0_MS + 5 * HOUR_MS };
    return simulateCooker(spec, constantWeather(6 * 60, 700, 25), { initialStoreTempC: 170, altitudeM, loads: [load] });
  }

  it("a batch's reachedMs / doneMs / endMs are consistent with the pot series; the pot is NaN while empty", () => {
    const r = potRun(true);
    const o = r.loads[0]!;
    const { t, potTempC } = r.series;
    const tp = potTempC.p!;
    const kStart = t.findIndex((x) => x >= o.startMs); // put on at the first boundary ≥ startMs
    expect(t[kStart]).toBe(T0_MS + 31 * MIN_MS);
    for (let k = 0; k < kStart; k++) expect(Number.isNaN(tp[k]!)).toBe(true);
    expect(tp[kStart]).toBe(25); // initial temperature defaults to the air temperature
    expect(o.reachedMs).not.toBeNull();
    const kReach = t.indexOf(o.reachedMs!);
    expect(tp[kReach]!).toBeGreaterThanOrEqual(85);
    for (let k = kStart; k < kReach; k++) expect(tp[k]!).toBeLessThan(85);
    expect(o.doneMs).toBe(o.reachedMs! + 1800 * 1000);
    expect(o.endMs).toBe(o.doneMs);
    const kEnd = t.indexOf(o.endMs);
    for (let k = kReach; k <= kEnd; k++) expect(tp[k]!).toBeGreaterThanOrEqual(85);
    expect(Number.isNaN(tp[kEnd + 1]!)).toBe(true);
    expect(o.ok).toBe(true);
    expect(o.maxPotTempC).toBeCloseTo(Math.max(...tp.slice(kStart, kEnd + 1)), 12);
    expect(r.events.map((e) => e.kind)).toEqual(expect.arrayContaining(['pot-reached', 'batch-done']));
  });

  it('a pot with water never exceeds the boiling point at the altitude and boils water off; lid off heats more slowly', () => {
    const tb = boilingPointAtAltitudeC(1500);
    const on = potRun(true);
    const off = potRun(false);
    for (const r of [on, off]) {
      for (const x of r.series.potTempC.p!) if (!Number.isNaN(x)) expect(x).toBeLessThanOrEqual(tb + 1e-9);
    }
    // Lid off multiplies the pot's losses (LID_OFF_LOSS_FACTOR): it is cooler during the heat-up, reaches 85 °C no earlier.
    const k10 = on.series.t.indexOf(T0_MS + 41 * MIN_MS);
    expect(off.series.potTempC.p![k10]!).toBeLessThan(on.series.potTempC.p![k10]!);
    expect(off.loads[0]!.reachedMs!).toBeGreaterThanOrEqual(on.loads[0]!.reachedMs!);
    // A long boil: minTempC above the boiling point is never reached, so the pot stays until maxEndMs.
    const specB: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 2, eta0: 0.6, uLossWPerK: 3 },
      store: { mediumId: 'sunflower-oil', massKg: 40, uaLossWPerK: 1.5, maxSafeTempC: 197, minUsefulTempC: 95 },
      pots: [{ id: 'p', volumeL: 20, massKg: 3, cpJPerKgK: 900, coupling: { kind: 'natural-convection', contactAreaM2: 0.2 }, lidAreaM2: 0.07, lidUWPerM2K: 8 }],
    };
    const load: PotLoad = { id: 'boil', potId: 'p', startMs: T0_MS, foodKg: 0, foodCpJPerKgK: 4186, waterKg: 6, lidOn: true, minTempC: 101, holdS: 0, maxEndMs: T0_MS + 4 * HOUR_MS };
    const b = simulateCooker(specB, constantWeather(6 * 60, 700, 25), { initialStoreTempC: 170, altitudeM: 1500, loads: [load] });
    const o = b.loads[0]!;
    expect(o.reachedMs).toBeNull();
    expect(o.ok).toBe(false);
    expect(o.endMs).toBe(T0_MS + 4 * HOUR_MS);
    expect(o.maxPotTempC).toBeCloseTo(tb, 9);
    expect(o.evaporatedKg).toBeGreaterThan(0.5);
    expect(o.evaporatedKg).toBeLessThanOrEqual(6);
    // Pot energy: the heat to warm 6 kg of water + 3 kg of aluminium from 25 °C to tb, plus latent heat, is at most
    // what was drawn (the rest went out through the lid). 4186 J/(kg·K) (ASAE S580.1), 900 for aluminium (PotSpec doc).
    const sensible = (6 * 4186 + 3 * 900) * (tb - 25);
    expect(sensible + o.evaporatedKg * 2.257e6).toBeLessThan(o.drawnJ);
    expect(sensible + o.evaporatedKg * 2.257e6).toBeGreaterThan(0.8 * o.drawnJ);
  });

  it('raises charge-below at 25 % then 10 %, and store-below-useful, while a night-time pot draws the store down', () => {
    const spec: CookerSpec = {
      collector: { model: 'lumped', apertureM2: 2, eta0: 0.6, uLossWPerK: 3 },
      store: { mediumId: 'sunflower-oil', massKg: 30, uaLossWPerK: 2, maxSafeTempC: 190, minUsefulTempC: 90 },
      pots: [{ id: 'p', volumeL: 20, massKg: 3, cpJPerKgK: 900, coupling: { kind: 'constant', uaWPerK: 15 }, lidAreaM2: 0.07, lidUWPerM2K: 8 }],
    };
    const load: PotLoad = { id: 'keep-warm', potId: 'p', startMs: T0_MS, foodKg: 2, foodCpJPerKgK: 3000, waterKg: 8, lidOn: false, minTempC: 200, holdS: 0, maxEndMs: T0_MS + 12 * HOUR_MS };
    const r = simulateCooker(spec, constantWeather(12 * 60, 0, 20), { initialStoreTempC: 180, altitudeM: 0, loads: [load] });
    const kinds = r.events.map((e) => `${e.kind}:${e.detail.match(/below (\d+) %/)?.[1] ?? ''}`);
    const i25 = kinds.indexOf('charge-below:25');
    const i10 = kinds.indexOf('charge-below:10');
    const iUseful = kinds.indexOf('store-below-useful:');
    expect(i25).toBeGreaterThanOrEqual(0);
    expect(i10).toBeGreaterThan(i25);
    expect(iUseful).toBeGreaterThan(i10);
    const e25 = r.events[i25]!;
    const k25 = r.series.t.indexOf(e25.tMs);
    expect(r.series.charge[k25]!).toBeLessThan(0.25);
    expect(r.series.charge[k25 - 1]!).toBeGreaterThanOrEqual(0.25);
    expect(r.events.filter((e) => e.kind === 'charge-below')).toHaveLength(2); // no chatter
  });

  it('two pots on one store at once: the Strang splitting barely depends on the pot order (< 0.02 K, < 0.05 % draw)', () => {
    const loads: PotLoad[] = [
      { id: 'a', potId: 'big', startMs: T0_MS + 60 * MIN_MS, foodKg: 4, foodCpJPerKgK: 3000, waterKg: 8, lidOn: true, minTempC: 200, holdS: 0, maxEndMs: T0_MS + 4 * HOUR_MS },
      { id: 'b', potId: 'small', startMs: T0_MS + 60 * MIN_MS, foodKg: 3, foodCpJPerKgK: 2100, waterKg: 0, lidOn: true, minTempC: 200, holdS: 0, maxEndMs: T0_MS + 4 * HOUR_MS },
    ];
    const spec = referenceCooker('sunflower-oil');
    const swapped: CookerSpec = { ...spec, pots: [spec.pots[1]!, spec.pots[0]!] };
    const w = constantWeather(5 * 60, 800, 28);
    const opts = { initialStoreTempC: 150, altitudeM: 0, loads };
    const r1 = simulateCooker(spec, w, opts);
    const r2 = simulateCooker(swapped, w, opts);
    for (let k = 0; k < r1.series.t.length; k++) expect(Math.abs(r1.series.storeTempC[k]! - r2.series.storeTempC[k]!)).toBeLessThan(0.02);
    for (let i = 0; i < 2; i++) expect(Math.abs(r1.loads[i]!.drawnJ / r2.loads[i]!.drawnJ - 1)).toBeLessThan(5e-4);
    expect(r1.balance.relativeError).toBeLessThan(1e-9);
  });

  it('a 10-node store heated from below and drawn from the top stays close to the well-mixed store and ends stably stratified', () => {
    const weather = variedWeather(1, 99);
    const opts = { initialStoreTempC: 70, altitudeM: 800, loads: dailyLoads(1) };
    const one = simulateCooker(referenceCooker('sunflower-oil'), weather, opts);
    const ten = simulateCookerSummary(referenceCooker('sunflower-oil', 10), weather, opts);
    // Rayleigh–Bénard mixing (BRIEF.md §Physics 3): the mean temperatures differ by well under 2 K.
    expect(Math.abs(ten.finalStoreTempC - one.series.storeTempC[one.series.storeTempC.length - 1]!)).toBeLessThan(2);
    for (let i = 1; i < ten.finalLayerTempsC.length; i++) {
      expect(ten.finalLayerTempsC[i]!).toBeGreaterThanOrEqual(ten.finalLayerTempsC[i - 1]! - 1e-9); // no inversion left
    }
  });

  it('simulateCookerSummary gives the same outcomes, balance and events as simulateCooker', () => {
    const weather = variedWeather(2, 7);
    const opts = { initialStoreTempC: 80, altitudeM: 500, loads: dailyLoads(2) };
    const full = simulateCooker(referenceCooker('soybean-oil'), weather, opts);
    const sum = simulateCookerSummary(referenceCooker('soybean-oil'), weather, opts);
    expect(sum.loads).toEqual(full.loads);
    expect(sum.balance).toEqual(full.balance);
    expect(sum.events).toEqual(full.events);
    expect(sum.finalStoreTempC).toBe(full.series.storeTempC[full.series.storeTempC.length - 1]);
    expect(sum.minCharge).toBe(Math.min(...full.series.charge));
  });

  it('a load starting after the horizon is reported as not done, with nothing drawn', () => {
    const r = simulateCooker(referenceCooker('sunflower-oil'), constantWeather(60, 500, 25), {
      initialStoreTempC: 120,
      altitudeM: 0,
      loads: [{ id: 'late', potId: 'big', startMs: T0_MS + 5 * HOUR_MS, foodKg: 1, foodCpJPerKgK: 3000, waterKg: 1, lidOn: true, minTempC: 80, holdS: 60, maxEndMs: T0_MS + 6 * HOUR_MS }],
    });
    expect(r.loads[0]).toMatchObject({ reachedMs: null, doneMs: null, ok: false, drawnJ: 0, evaporatedKg: 0 });
    expect(r.series.potTempC.big!.every((x) => Number.isNaN(x))).toBe(true);
  });

  it('uses the oil properties: sunflower store heats up more slowly per joule when hot (cp rises with T)', () => {
    // Enthalpy bookkeeping with the temperature-dependent cp: ΔT per MJ at 150 °C < at 50 °C by the cp ratio.
    expect(sunflowerOil.specificHeat(150) / sunflowerOil.specificHeat(50)).toBeGreaterThan(1.1);
  });
});
