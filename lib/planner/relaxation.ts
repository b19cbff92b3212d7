/**
 * Single-batch relaxations of the planning problem:
 *
 * - possible[b][c][p]: batch b could run on pot p of cooker c if it were alone — the pot fits, some
 *   grid start lies in a shift, and the pot screen (screen.ts, 'upper' mode) against the store
 *   trajectory without any batch reaches and holds the dish minimum before serve-by. A draw only
 *   lowers a store, so this is a necessary condition;
 * - dminMs[b][c][p]: a lower bound of the time the batch occupies the pot: the pot screen with the
 *   store held at its highest safe temperature and the contents starting at the day's warmest air
 *   (no real start is quicker: the store can never be hotter);
 * - energy: a lower bound of the heat each batch draws (sensible heat of contents and pot from the
 *   warmest air to the dish minimum, water capped at boiling) and, per cooker, the store enthalpy
 *   H(T) = m·h(T) of its medium and the loss-free collector gain η0·A·∫G dt.
 *
 * A batch with water whose minimum is above the boiling point at the kitchen's altitude
 * (lib/thermal boilingPointAtAltitudeC) is possible nowhere ('above-boiling-point').
 *
 * These feed the candidate filter of the search, the backup reasons and the upper bound (bound.ts).
 */
import { boilingPointAtAltitudeC as boilingPointAtAltitude, WATER_CP_J_PER_KG_K } from '@/lib/thermal/boiling';
import type { WeatherStep } from '@/lib/thermal/types';
import type { PotScreen } from './screen';
import { gridStartsInShifts, type CookerEvaluator, type PBatch, type PCooker, type PModel } from './model';
import { STEP_MS } from './validate';

/** Sparse table for O(1) range maxima over a store trajectory. */
export class RangeMax {
  private readonly levels: Float64Array[];
  constructor(values: ArrayLike<number>) {
    const n = values.length;
    const l0 = Float64Array.from(values as ArrayLike<number>);
    this.levels = [l0];
    for (let k = 1; 1 << k <= n; k++) {
      const prev = this.levels[k - 1] as Float64Array;
      const half = 1 << (k - 1);
      const cur = new Float64Array(n - (1 << k) + 1);
      for (let i = 0; i < cur.length; i++) cur[i] = Math.max(prev[i] as number, prev[i + half] as number);
      this.levels.push(cur);
    }
  }
  /** max over [i, j] inclusive (clamped). */
  max(i: number, j: number): number {
    const n = (this.levels[0] as Float64Array).length;
    const a = Math.max(0, i);
    const z = Math.min(n - 1, j);
    if (z < a) return -Infinity;
    const k = 31 - Math.clz32(z - a + 1);
    const lv = this.levels[k] as Float64Array;
    return Math.max(lv[a] as number, lv[z - (1 << k) + 1] as number);
  }
}

export type ImpossibleReason = 'pot-too-small' | 'outside-shift' | 'no-cooker-hot-enough' | 'above-boiling-point';

export interface Relaxation {
  possible: boolean[][][];
  dminMs: number[][][];
  /** Lower bound of heat drawn [J] per batch, cooker, pot. */
  energyLowJ: number[][][];
  /** Per cooker: no-load store trajectory range maxima. */
  noLoadMax: RangeMax[];
  /** Per cooker: cumulative loss-free collector gain η0·A·∫G dt at each step boundary [J]. */
  gainCumJ: Float64Array[];
  /** Per cooker: store enthalpy above its value at maxSafe, as a function of temperature [J]. */
  enthalpyJ: ((tC: number) => number)[];
  /** Why a batch can run nowhere, with a sentence for the cook; null when possible somewhere. */
  impossible: ({ reason: ImpossibleReason; detail: string } | null)[];
}

export function buildRelaxation(m: PModel, evals: CookerEvaluator[], screens: PotScreen[]): Relaxation {
  const clock = m.clock;
  const B = m.batches.length;
  const noLoadMax = evals.map((e) => {
    const ev = e.noLoad();
    e.storeAt(ev, e.c.n);
    return new RangeMax(ev.store);
  });

  // Loss-free collector gain, cumulative [J].
  const gainCumJ = m.cookers.map((c) => {
    const col = c.raw.spec.collector;
    const g = new Float64Array(c.n + 1);
    for (let i = 0; i < c.n; i++) g[i + 1] = (g[i] as number) + col.eta0 * col.apertureM2 * (c.raw.weather[i] as WeatherStep).gApertureWm2 * 60;
    return g;
  });

  // Store enthalpy from the medium: H(T) = m·h(T) (enthalpy method, latent heat included).
  const enthalpyJ = screens.map((sc) => (tC: number) => sc.enthalpyJ(tC));

  // Quickest occupation of each pot by each batch (store pinned at max safe), deduplicated.
  const tBoil = boilingPointAtAltitude(m.problem.altitudeM);
  const dminCache = new Map<string, number>();
  const dmin = (b: PBatch, c: PCooker, p: number): number => {
    const spec = c.raw.spec;
    const r = b.raw;
    const windowMs = Math.min(b.serveBy - b.earliest, b.holdMs + 8 * 3600_000);
    const key = JSON.stringify([spec.store.mediumId, spec.store.customTable ?? null, spec.store.maxSafeTempC, spec.pots[p], r.foodKg, r.foodCpJPerKgK, r.waterKg, r.minTempC, r.holdS, r.lidOn, b.fixed?.initialTempC ?? null, c.tAirMaxC, windowMs]);
    const hit = dminCache.get(key);
    if (hit !== undefined) return hit;
    const hot = spec.store.maxSafeTempC;
    const res = (screens[c.idx] as PotScreen).run(b, p, c.t0, c.t0 + windowMs, hot, 'upper', c.tAirMaxC);
    const d = res.ok && res.doneMs !== null ? Math.max(b.holdMs, res.doneMs - c.t0 - STEP_MS) : Infinity;
    dminCache.set(key, d);
    return d;
  };

  const possible: boolean[][][] = [];
  const dminMs: number[][][] = [];
  const energyLowJ: number[][][] = [];
  const impossible: Relaxation['impossible'] = [];
  for (let bi = 0; bi < B; bi++) {
    const b = m.batches[bi] as PBatch;
    const r = b.raw;
    const pb: boolean[][] = [];
    const db: number[][] = [];
    const eb: number[][] = [];
    let anyFit = false;
    let anyShift = false;
    let hottest = -Infinity;
    let hottestCooker = '';
    for (const c of m.cookers) {
      const pc: boolean[] = [];
      const dc: number[] = [];
      const ec: number[] = [];
      for (const pot of c.pots) {
        const fixedHere = b.fixed && b.fixed.c === c.idx && b.fixed.p === pot.idx;
        const eLow =
          (r.foodKg * r.foodCpJPerKgK + pot.massKg * pot.cpJPerKgK) * Math.max(0, r.minTempC - Math.max(c.tAirMaxC, b.fixed?.initialTempC ?? -Infinity)) +
          r.waterKg * WATER_CP_J_PER_KG_K * Math.max(0, Math.min(r.minTempC, tBoil) - Math.max(c.tAirMaxC, b.fixed?.initialTempC ?? -Infinity));
        ec.push(eLow);
        if (b.fixed) {
          pc.push(!!fixedHere && !b.fixed.done);
          dc.push(fixedHere ? b.holdMs : Infinity);
          if (fixedHere) anyFit = anyShift = true;
          continue;
        }
        if (!m.fits[bi]?.[c.idx]?.[pot.idx]) {
          pc.push(false);
          dc.push(Infinity);
          continue;
        }
        anyFit = true;
        // Any grid start inside a shift with room for the hold?
        let shiftOk = false;
        let ok = false;
        let d = -1;
        const rm = noLoadMax[c.idx] as RangeMax;
        for (const { s, maxEnd } of gridStartsInShifts(m, c, b)) {
          if (maxEnd - s >= b.holdMs) {
            shiftOk = true;
            const i0 = Math.round((s - c.t0) / STEP_MS);
            const i1 = Math.floor((maxEnd - b.holdMs - c.t0) / STEP_MS);
            const mx = rm.max(i0, i1);
            if (mx > hottest) {
              hottest = mx;
              hottestCooker = c.name;
            }
            if (mx >= r.minTempC) {
              if (d < 0) d = dmin(b, c, pot.idx);
              if (s + d <= maxEnd) {
                const ev = (evals[c.idx] as CookerEvaluator).noLoad();
                const e = evals[c.idx] as CookerEvaluator;
                if ((screens[c.idx] as PotScreen).run(b, pot.idx, s, maxEnd, e.storeUpTo(ev, c.n), 'upper').ok) {
                  ok = true;
                  break;
                }
              }
            }
          }
        }
        if (shiftOk) anyShift = true;
        pc.push(ok);
        dc.push(ok ? d : Infinity);
      }
      pb.push(pc);
      db.push(dc);
      eb.push(ec);
    }
    // A pot with water stays at the boiling point until the water is gone: a dish minimum above it
    // is reached only by boiling the pot dry, so no pot is possible.
    const aboveBoiling = r.waterKg > 0 && r.minTempC > tBoil && !b.fixed;
    if (aboveBoiling) {
      for (const pc of pb) pc.fill(false);
      for (const dc of db) dc.fill(Infinity);
    }
    possible.push(pb);
    dminMs.push(db);
    energyLowJ.push(eb);
    const some = pb.some((pc) => pc.some((x) => x));
    if (aboveBoiling) {
      impossible.push({
        reason: 'above-boiling-point',
        detail: `this dish needs ${Math.round(r.minTempC)} °C, but water boils at ${tBoil.toFixed(1)} °C at this kitchen's altitude (${Math.round(m.problem.altitudeM)} m): a pot with water cannot reach the dish's minimum here`,
      });
    } else if (some || (b.fixed && b.fixed.done)) impossible.push(null);
    else if (!anyFit) {
      const largest = Math.max(0, ...m.cookers.flatMap((c) => c.pots.map((p) => p.volumeL)));
      impossible.push({
        reason: 'pot-too-small',
        detail: largest > 0 ? `this batch needs a ${r.potVolumeNeededL} L pot; the largest pot is ${largest} L` : 'there is no cooker with a pot in this plan',
      });
    } else if (!anyShift) {
      impossible.push({
        reason: 'outside-shift',
        detail: `no shift leaves ${Math.round(r.holdS / 60)} min to cook between ${clock(b.earliest)} and ${clock(b.serveBy)}`,
      });
    } else if (hottest < r.minTempC) {
      impossible.push({
        reason: 'no-cooker-hot-enough',
        detail: `the hottest store before ${clock(b.serveBy)} is ${Math.round(hottest)} °C (${hottestCooker}); this dish needs ${Math.round(r.minTempC)} °C`,
      });
    } else {
      impossible.push({
        reason: 'no-cooker-hot-enough',
        detail: `no store stays hot enough long enough to bring the pot to ${Math.round(r.minTempC)} °C and hold it ${Math.round(r.holdS / 60)} min before ${clock(b.serveBy)}`,
      });
    }
  }
  return { possible, dminMs, energyLowJ, noLoadMax, gainCumJ, enthalpyJ, impossible };
}
