/**
 * A cheap pot model to screen candidate starts before the full simulation.
 *
 * The pot is the same node as in lib/thermal (capacity of pot metal, food and water; store-to-pot
 * conductance UA, constant or natural convection from lib/thermal/convection; lid losses; water
 * capped at its boiling point), stepped with the exact exponential solution for a store temperature
 * held over each 60-s step. The store is the trajectory the cooker would follow WITHOUT this batch
 * (from the last simulation), in two modes:
 *
 * - 'upper': store as predicted, no lid loss. Drawing heat only lowers a store, and the pot can only
 *   be cooler than this, so a start that fails here fails in the full simulation too (a necessary
 *   test; a tolerance of 0.3 K and two steps covers the discretisation differences);
 * - 'estimate': the store lowered by the batch's own draw, linearised around the predicted trajectory
 *   (dΔ/dt = (q − k·Δ)/C_store, k the collector and shell loss slopes, C_store = m·dh/dT), with lid
 *   losses — a forecast of the outcome used only to try likely starts first.
 */
import {
  boilingPointAtAltitudeC,
  createNaturalConvectionCoupling,
  LID_OFF_LOSS_FACTOR,
  resolveStoreMedium,
  WATER_CP_J_PER_KG_K,
  WATER_LATENT_HEAT_J_PER_KG as WATER_LATENT_J_PER_KG,
} from '@/lib/thermal';
import type { StorageMedium } from '@/lib/materials/types';
import type { PBatch, PCooker, PModel } from './model';
import { STEP_MS } from './validate';

export interface ScreenResult {
  ok: boolean;
  reachedMs: number | null;
  doneMs: number | null;
  /** Stopped at the caller's cutoff, outcome unknown (not done before it). */
  cutoff?: boolean;
}

export class PotScreen {
  readonly medium: StorageMedium;
  private readonly ua: ((ts: number, tp: number) => number)[];
  /** Constant store-to-pot conductance per pot [W/K], −1 for natural convection. */
  private readonly uaConst: number[];
  readonly tBoil: number;
  private readonly kLoss: number;
  constructor(
    readonly m: PModel,
    readonly c: PCooker,
  ) {
    const spec = c.raw.spec;
    this.medium = resolveStoreMedium(spec.store);
    this.tBoil = boilingPointAtAltitudeC(m.problem.altitudeM);
    this.ua = spec.pots.map((p) => {
      if (p.coupling.kind === 'constant') {
        const u = p.coupling.uaWPerK;
        return () => u;
      }
      return createNaturalConvectionCoupling(this.medium, p.coupling.contactAreaM2, p.volumeL);
    });
    this.uaConst = spec.pots.map((p) => (p.coupling.kind === 'constant' ? p.coupling.uaWPerK : -1));
    const col = spec.collector;
    this.kLoss = (col.model === 'lumped' ? col.uLossWPerK : col.apertureM2 * col.a1) + spec.store.uaLossWPerK;
  }

  /** Store enthalpy [J] at temperature tC (mass × specific enthalpy of the medium). */
  enthalpyJ(tC: number): number {
    return this.c.raw.spec.store.massKg * this.medium.enthalpy(tC);
  }

  /**
   * Steps the pot from `s` to `maxEnd` against store temperatures `store[i]` (boundary index i; or a
   * constant), less the Δ of `minus` (another batch's forecast draw) when given.
   * Modes: 'upper' (necessary test), 'estimate' (forecast with the batch's own draw lowering the
   * store), 'existing' (a batch already in the simulated trajectory: its draw is in `storeAt`, lid
   * losses on). With `trace`, the store lowering Δ of 'estimate' is recorded per boundary.
   * @param s start [ms]; @param maxEnd hard stop [ms]
   */
  run(
    b: PBatch,
    p: number,
    s: number,
    maxEnd: number,
    store: Float64Array | number,
    mode: 'upper' | 'estimate' | 'existing',
    tAirOverrideC?: number,
    trace?: DeltaTrace,
    minus?: DeltaTrace,
    cutoffMs = Infinity,
  ): ScreenResult {
    return this.compute(b, p, s, maxEnd, store, mode, tAirOverrideC, trace, minus, cutoffMs);
  }

  private readonly suffix = new WeakMap<Float64Array, Float64Array>();

  /** max(store[i..n]) for each i, cached per trajectory (filled in place, so computed once it is complete). */
  private suffixMax(store: Float64Array): Float64Array {
    let sm = this.suffix.get(store);
    if (!sm) {
      sm = new Float64Array(store.length);
      let mx = -Infinity;
      for (let i = store.length - 1; i >= 0; i--) {
        const v = store[i] as number;
        if (v > mx) mx = v;
        sm[i] = mx;
      }
      this.suffix.set(store, sm);
    }
    return sm;
  }

  private compute(
    b: PBatch,
    p: number,
    s: number,
    maxEnd: number,
    store: Float64Array | number,
    mode: 'upper' | 'estimate' | 'existing',
    tAirOverrideC?: number,
    trace?: DeltaTrace,
    minus?: DeltaTrace,
    cutoffMs = Infinity,
  ): ScreenResult {
    const c = this.c;
    const spec = c.raw.spec;
    const pot = spec.pots[p];
    if (!pot) return { ok: false, reachedMs: null, doneMs: null };
    const r = b.raw;
    const upper = mode === 'upper';
    const selfDraw = mode === 'estimate';
    const cDry = pot.massKg * pot.cpJPerKgK + r.foodKg * r.foodCpJPerKgK;
    let water = r.waterKg;
    let cPot = cDry + water * WATER_CP_J_PER_KG_K;
    const lid = upper ? 0 : pot.lidAreaM2 * pot.lidUWPerM2K * (r.lidOn ? 1 : LID_OFF_LOSS_FACTOR);
    const uaConst = this.uaConst[p] as number;
    const ua = this.ua[p] as (ts: number, tp: number) => number;
    const minT = upper ? r.minTempC - 0.3 : r.minTempC;
    const holdMs = upper ? Math.max(0, b.holdMs - 2 * STEP_MS) : b.holdMs;
    const i0 = Math.ceil((s - c.t0) / STEP_MS - 1e-9);
    const iEnd = Math.min(c.n, Math.ceil((maxEnd - c.t0) / STEP_MS - 1e-9));
    const weather = c.raw.weather;
    const w0 = weather[Math.min(i0, c.n - 1)];
    let tp = b.fixed?.initialTempC ?? tAirOverrideC ?? w0?.tAirC ?? 20;
    if (water > 0 && tp > this.tBoil) tp = this.tBoil;
    let delta = 0;
    let reached: number | null = null;
    let hold = Number.NaN;
    const dt = STEP_MS / 1000;
    let cS = 1;
    let decay = 1;
    // exp(−g·dt/C) cached while g and C do not change (constant coupling).
    let lastG = -1;
    let lastC = -1;
    let ex = 1;
    const constStore = typeof store === 'number';
    const sufMax = constStore ? null : this.suffixMax(store);
    let md = 0;
    let mk = 0;
    if (minus) {
      mk = i0 - minus.i0;
    }
    if (trace) {
      trace.i0 = i0;
      trace.d.length = 0;
      trace.d.push(0);
    }
    for (let i = i0; ; i++) {
      const tMs = c.t0 + i * STEP_MS;
      if (tp >= minT) {
        if (reached === null) reached = tMs;
        if (hold !== hold) hold = tMs;
      } else hold = Number.NaN;
      if (hold === hold && tMs - hold >= holdMs) {
        if (trace) trace.decay = decay;
        return { ok: true, reachedMs: reached, doneMs: hold + b.holdMs };
      }
      // Early exits (exact for the screen): no time left to complete the hold, or the pot is below
      // the minimum and no store temperature ahead reaches it.
      // Past the cutoff the caller only needs to know the batch is not done earlier.
      if (tMs > cutoffMs) return { ok: true, reachedMs: reached, doneMs: null, cutoff: true };
      let early = false;
      if (hold !== hold && (iEnd - i) * STEP_MS < holdMs) early = true;
      else if (tp < minT && sufMax !== null && (sufMax[i] as number) < minT) early = true;
      if (early || i >= iEnd || i >= c.n) {
        if (trace) trace.decay = decay;
        return { ok: false, reachedMs: reached, doneMs: null };
      }
      if (minus) {
        const k = mk + (i - i0);
        md = k < 0 || minus.d.length === 0 ? 0 : k < minus.d.length ? (minus.d[k] as number) : (minus.d[minus.d.length - 1] as number) * Math.pow(minus.decay, k - minus.d.length + 1);
      }
      const ts = (constStore ? store : (store[i] as number)) - delta - md;
      const tAir = tAirOverrideC ?? (weather[i] as { tAirC: number }).tAirC;
      let u = uaConst >= 0 ? uaConst : ua(ts, tp);
      if (u < 0) u = 0;
      const g = u + lid;
      if (g !== lastG || cPot !== lastC) {
        lastG = g;
        lastC = cPot;
        ex = Math.exp((-g * dt) / cPot);
      }
      const tInf = g > 0 ? (u * ts + lid * tAir) / g : tp;
      const tpNew = tInf + (tp - tInf) * ex;
      if (selfDraw) {
        if ((i - i0) % 20 === 0) {
          cS = Math.max(1, this.enthalpyJ(ts + 0.5) - this.enthalpyJ(ts - 0.5));
          decay = Math.exp((-this.kLoss * dt) / cS);
        }
        const q = u * (ts - 0.5 * (tp + tpNew));
        delta = delta * decay + (q * dt) / cS;
        if (delta < 0) delta = 0;
        if (trace) trace.d.push(delta);
      }
      if (water > 0 && tpNew > this.tBoil) {
        // Boiling: the heat above the boiling point evaporates water (as lib/thermal does).
        water = Math.max(0, water - (cPot * (tpNew - this.tBoil)) / WATER_LATENT_J_PER_KG);
        cPot = cDry + water * WATER_CP_J_PER_KG_K;
        tp = this.tBoil;
      } else tp = tpNew;
    }
  }
}

/** Store lowering Δ [K] by a batch per boundary from i0, then decaying by `decay` per step. */
export interface DeltaTrace {
  i0: number;
  d: number[];
  decay: number;
}

export function newTrace(): DeltaTrace {
  return { i0: 0, d: [], decay: 1 };
}

/** Δ [K] at boundary i. */
export function deltaAt(t: DeltaTrace, i: number): number {
  const k = i - t.i0;
  if (k < 0 || t.d.length === 0) return 0;
  if (k < t.d.length) return t.d[k] as number;
  return (t.d[t.d.length - 1] as number) * Math.pow(t.decay, k - t.d.length + 1);
}
