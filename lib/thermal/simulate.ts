/**
 * simulateCooker: a stored-heat solar cooker (collector → store → pots) stepped through a day of weather.
 *
 * Model (BRIEF.md §Physics 2–6):
 * - Collector: ISO 9806 or lumped useful gain into the store's bottom node, linearised in that node's temperature at
 *   the step start, clipped at 0 (./collector.ts).
 * - Store: one well-mixed node by default (Rayleigh–Bénard convection mixes a store heated from below; ./store.ts),
 *   or N equal layers (bottom = 0 heated by the collector, top = N−1 feeding the pots, shell loss UA/N per layer).
 *   After the node steps: conduction k·A/Δz between stable layers (each pair exchanged exactly), then a buoyancy
 *   mixing step that mixes any layer hotter than the one above it to the pair's (or run's) mean enthalpy
 *   (see mixLayers for why full mixing within a step is physical). Consequence worth knowing: heated from below and
 *   drawn from the top, the N-layer store stays close to the one-node store; it departs from it only where a stable
 *   gradient exists (a warmer top). Geometry: a cylinder of height = diameter (assumption, no source).
 * - Pot: a node of capacity C_p = m_pot·c_pot + m_food·c_food + m_water·c_water coupled to the store node by
 *   UA_c (constant, or natural convection re-evaluated when either temperature moves by > 0.25 K, or the store by
 *   > 0.02 K inside a PCM's melting range, where the coupling follows the melt fraction), losing
 *   U_lid·A_lid·(T_p − T_a) (× LID_OFF_LOSS_FACTOR with the lid off). Once water reaches the boiling point (altitude,
 *   ./boiling.ts) the pot stays there and its net heat boils water off (2.257 MJ/kg) until the water is gone; with
 *   the lid off, the extra loss over the lid-on loss is steam too.
 * - Integration: per step the store node and one pot form a linear two-node system with properties frozen at the
 *   step start; its exact exponential solution gives the time integrals of both temperatures (./linear-ode.ts), from
 *   which the gain, loss and draw over the step follow exactly. With several pots on the node at once, the two-node
 *   solves are composed by Strang splitting (second order; each sub-solve energy-conserving). Bookkeeping is in
 *   ENTHALPY: the store's enthalpy changes by exactly gain − loss − draw − spill, and temperatures are read back with
 *   medium.temperatureAt(), so PCM latent heat and the temperature-dependent cp stay energy-consistent and the
 *   balance closes to rounding (≈ 1e-15 relative).
 * - Not modelled: supercooling of PCMs (no hysteresis), the latent heat of fusion of palm oil, the pot-side film
 *   resistance, weather-driven changes of the boiling point, heat stored in the collector itself.
 * - Defocus: when the gain would lift a layer's enthalpy above h(maxSafeTempC), the excess (up to that step's gain) is
 *   spilled and reported, after mixing.
 * - Weather is held constant over each step (zero-order hold). Batches start and end on step boundaries: a load is
 *   put on at the first boundary ≥ startMs and taken off at the first boundary where it has held ≥ minTempC for holdS
 *   (continuously — a dip below restarts the hold), or at the first boundary ≥ maxEndMs, or at the end of the horizon.
 */
import type { StorageMedium } from '../materials/types';
import { boilingPointAtAltitudeC, WATER_CP_J_PER_KG_K, WATER_LATENT_HEAT_J_PER_KG } from './boiling';
import { createNaturalConvectionCoupling } from './convection';
import { exchangeHeatJ, integrateOneNode, integrateTwoNode } from './linear-ode';
import { storeGeometry } from './store';
import type {
  CookerSpec,
  EnergyBalance,
  LoadOutcome,
  PotLoad,
  SimulateOptions,
  SimulationEvent,
  SimulationResult,
  SimulationSeries,
  WeatherStep,
} from './types';
import { validateSimulationInputs } from './validate';

/** Pot losses with the lid off are multiplied by this factor (assumed, no source: order of magnitude; tune per kitchen). */
export const LID_OFF_LOSS_FACTOR = 3;
/** Charge thresholds [0..1] that raise a 'charge-below' event on the way down. */
export const CHARGE_EVENT_THRESHOLDS: readonly number[] = [0.25, 0.1];
/** Hysteresis before a charge threshold can fire again [0..1] (avoids chatter under passing clouds). */
export const CHARGE_EVENT_REARM = 0.02;
/** Hysteresis before 'store-below-useful' can fire again [K]. */
export const BELOW_USEFUL_REARM_K = 1;
/** Natural-convection coupling is re-evaluated when the store or pot temperature has moved by more than this [K]. */
export const COUPLING_UPDATE_K = 0.25;
/**
 * Inside a phase-change store's melting range the coupling follows the melt fraction (./convection.ts), which changes
 * by 1 % per 0.02 K of a 2 K range: the store side is re-evaluated after a move of this much there [K].
 */
export const MUSHY_COUPLING_UPDATE_K = 0.02;
/** Inter-layer conductance re-evaluated when the store mean temperature has moved by more than this [K]. */
const MIXING_UPDATE_K = 1;

/** Result of simulateCookerSummary: everything but the time series, plus the final state for re-planning. */
export interface SimulationSummary {
  loads: LoadOutcome[];
  balance: EnergyBalance;
  events: SimulationEvent[];
  /** Final store temperature, mean of layers [°C]. */
  finalStoreTempC: number;
  /** Final temperature of each layer, bottom first [°C]. */
  finalLayerTempsC: number[];
  /** Final state of charge [0..1]. */
  finalCharge: number;
  /** Lowest state of charge at any step boundary [0..1]. */
  minCharge: number;
  /** Highest mean store temperature at any step boundary [°C]. */
  maxStoreTempC: number;
}

/**
 * Simulate a stored-heat solar cooker over the weather steps (method in the file comment).
 * @param spec the cooker (collector, store, pots)
 * @param weather contiguous, evenly spaced steps (irradiance on the aperture [W/m²], air temperature [°C], wind [m/s])
 * @param opts initial store temperature [°C], altitude [m], loads; stepS [s] defaults to the weather spacing
 * @returns series at step boundaries (n+1) and per step (n), load outcomes, energy balance [J], events
 * @throws RangeError naming the field for invalid inputs
 */
export function simulateCooker(spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions): SimulationResult {
  const sim = new CookerSimulation(spec, weather, opts, true);
  sim.run();
  return { series: sim.series!, loads: sim.loadOutcomes(), balance: sim.balance(), events: sim.events };
}

/**
 * The same simulation without the time series (no per-step arrays): the fast path for the planner, which only needs
 * outcomes, the balance, events and the final state.
 */
export function simulateCookerSummary(spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions): SimulationSummary {
  const sim = new CookerSimulation(spec, weather, opts, false);
  sim.run();
  const layers: number[] = [];
  for (let i = 0; i < sim.nNodes; i++) layers.push(sim.layerT[i]!);
  return {
    loads: sim.loadOutcomes(),
    balance: sim.balance(),
    events: sim.events,
    finalStoreTempC: sim.meanStoreTemp(),
    finalLayerTempsC: layers,
    finalCharge: sim.charge(),
    minCharge: sim.minCharge,
    maxStoreTempC: sim.maxStoreTemp,
  };
}

/** A preallocated number[] (once per run); the loop writes every index, so there is no growth and no fill pass. */
function preallocated(len: number): number[] {
  return new Array<number>(len);
}

/** One simulation run. A class so the hot loop works on fields and typed arrays, with no closures or allocation. */
class CookerSimulation {
  readonly events: SimulationEvent[] = [];
  readonly series: SimulationSeries | null;
  readonly nNodes: number;
  readonly layerT: Float64Array;
  minCharge = Infinity;
  maxStoreTemp = -Infinity;

  private readonly medium: StorageMedium;
  private readonly weather: WeatherStep[];
  private readonly n: number;
  private readonly h: number;
  private readonly dtMs: number;
  private readonly t0Ms: number;
  private readonly mLayer: number;
  private readonly uaLoss: number;
  private readonly uaWind: number;
  private readonly minUsefulC: number;
  private readonly hMin: number;
  private readonly hSpan: number;
  private readonly hMaxLayer: number;
  private readonly tBoil: number;
  private readonly hasMelt: boolean;
  private readonly solidusC: number;
  private readonly liquidusC: number;
  private readonly latentPerK: number;
  // collector
  private readonly isIso: boolean;
  private readonly colArea: number;
  private readonly colEta: number;
  private readonly colA1: number;
  private readonly colA2: number;
  private readonly colU: number;
  // layers
  private readonly layerH: Float64Array;
  private readonly hStart: number;
  private readonly crossM2: number;
  private readonly dzM: number;
  private condG = 0; // k·A/Δz [W/K]
  private condAtC = Number.NaN;
  private readonly blockStart: Int32Array;
  private readonly blockSum: Float64Array;
  // pots
  private readonly nPots: number;
  private readonly potIds: string[];
  private readonly potMetalC: Float64Array;
  private readonly potLidUA: Float64Array;
  private readonly potConstUA: Float64Array; // NaN → natural convection
  private readonly potNc: (((ts: number, tp: number) => number) | null)[];
  private readonly potT: Float64Array;
  private readonly potC: Float64Array;
  private readonly potWater: Float64Array;
  private readonly potLoss: Float64Array;
  private readonly potG: Float64Array;
  private readonly potGTs: Float64Array;
  private readonly potGTp: Float64Array;
  private readonly potGValid: Uint8Array;
  private readonly potLoad: Int32Array;
  private readonly potNext: Int32Array;
  private readonly potQueue: number[][];
  private readonly potSeries: number[][];
  // loads
  private readonly loads: PotLoad[];
  private readonly lStartIdx: Float64Array;
  private readonly lReached: Float64Array;
  private readonly lDone: Float64Array;
  private readonly lEnd: Float64Array;
  private readonly lDrawn: Float64Array;
  private readonly lEvap: Float64Array;
  private readonly lMaxT: Float64Array;
  private readonly lHold: Float64Array;
  private readonly lState: Uint8Array; // 0 pending, 1 active, 2 finished
  private readonly lOk: Uint8Array;
  // totals
  private gainJ = 0;
  private lossJ = 0;
  private drawJ = 0;
  private spillJ = 0;
  // per-step scratch
  private stepGain = 0;
  private stepLoss = 0;
  private stepDraw = 0;
  private readonly ode = new Float64Array(2);
  // events
  private readonly chargeArmed: Uint8Array;
  private belowUsefulArmed = true;
  private wasSpilling = false;

  constructor(spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions, record: boolean) {
    const { medium, stepS, nodes } = validateSimulationInputs(spec, weather, opts);
    this.medium = medium;
    this.weather = weather;
    const n = weather.length;
    this.n = n;
    this.h = stepS;
    this.dtMs = stepS * 1000;
    this.t0Ms = weather[0]!.t;
    const store = spec.store;
    this.nNodes = nodes;
    this.mLayer = store.massKg / nodes;
    this.uaLoss = store.uaLossWPerK;
    this.uaWind = store.uaWindWPerKPerMS ?? 0;
    this.minUsefulC = store.minUsefulTempC;
    this.hMin = medium.enthalpy(store.minUsefulTempC);
    const hMax = medium.enthalpy(store.maxSafeTempC);
    this.hSpan = hMax - this.hMin;
    this.hMaxLayer = this.mLayer * hMax;
    this.tBoil = boilingPointAtAltitudeC(opts.altitudeM);
    const melt = medium.melting;
    this.hasMelt = melt !== undefined;
    this.solidusC = melt?.solidusC ?? 0;
    this.liquidusC = melt?.liquidusC ?? 0;
    this.latentPerK = melt ? melt.latentJPerKg / (melt.liquidusC - melt.solidusC) : 0;

    const c = spec.collector;
    this.isIso = c.model === 'iso9806';
    this.colArea = c.apertureM2;
    this.colEta = c.eta0;
    this.colA1 = c.model === 'iso9806' ? c.a1 : 0;
    this.colA2 = c.model === 'iso9806' ? c.a2 : 0;
    this.colU = c.model === 'lumped' ? c.uLossWPerK : 0;

    this.layerT = new Float64Array(nodes).fill(opts.initialStoreTempC);
    this.layerH = new Float64Array(nodes).fill(this.mLayer * medium.enthalpy(opts.initialStoreTempC));
    this.hStart = this.sumH();
    this.blockStart = new Int32Array(nodes);
    this.blockSum = new Float64Array(nodes);
    if (nodes > 1) {
      const g = storeGeometry(medium, store.massKg, opts.initialStoreTempC);
      this.crossM2 = g.crossSectionM2;
      this.dzM = g.heightM / nodes;
    } else {
      this.crossM2 = 0;
      this.dzM = 0;
    }

    const pots = spec.pots;
    const P = pots.length;
    this.nPots = P;
    this.potIds = pots.map((p) => p.id);
    this.potMetalC = Float64Array.from(pots, (p) => p.massKg * p.cpJPerKgK);
    this.potLidUA = Float64Array.from(pots, (p) => p.lidUWPerM2K * p.lidAreaM2);
    this.potConstUA = Float64Array.from(pots, (p) => (p.coupling.kind === 'constant' ? p.coupling.uaWPerK : Number.NaN));
    this.potNc = pots.map((p) =>
      p.coupling.kind === 'natural-convection' ? createNaturalConvectionCoupling(medium, p.coupling.contactAreaM2, p.volumeL) : null,
    );
    this.potT = new Float64Array(P).fill(Number.NaN);
    this.potC = new Float64Array(P);
    this.potWater = new Float64Array(P);
    this.potLoss = new Float64Array(P);
    this.potG = new Float64Array(P);
    this.potGTs = new Float64Array(P);
    this.potGTp = new Float64Array(P);
    this.potGValid = new Uint8Array(P);
    this.potLoad = new Int32Array(P).fill(-1);
    this.potNext = new Int32Array(P);
    this.potQueue = pots.map(() => []);

    const loads = opts.loads ?? [];
    this.loads = loads;
    const L = loads.length;
    this.lStartIdx = new Float64Array(L);
    this.lReached = new Float64Array(L).fill(Number.NaN);
    this.lDone = new Float64Array(L).fill(Number.NaN);
    this.lEnd = new Float64Array(L).fill(Number.NaN);
    this.lDrawn = new Float64Array(L);
    this.lEvap = new Float64Array(L);
    this.lMaxT = new Float64Array(L).fill(Number.NaN);
    this.lHold = new Float64Array(L).fill(Number.NaN);
    this.lState = new Uint8Array(L);
    this.lOk = new Uint8Array(L);
    const potIndex = new Map(this.potIds.map((id, i) => [id, i]));
    for (let i = 0; i < L; i++) {
      const l = loads[i]!;
      this.lStartIdx[i] = l.startMs <= this.t0Ms ? 0 : Math.ceil((l.startMs - this.t0Ms) / this.dtMs - 1e-9);
      this.potQueue[potIndex.get(l.potId)!]!.push(i);
    }
    for (const q of this.potQueue) q.sort((a, b) => loads[a]!.startMs - loads[b]!.startMs);

    this.potSeries = pots.map(() => (record ? preallocated(n + 1) : []));
    if (record) {
      const potTempC: Record<string, number[]> = {};
      pots.forEach((p, i) => (potTempC[p.id] = this.potSeries[i]!));
      this.series = {
        t: preallocated(n + 1),
        storeTempC: preallocated(n + 1),
        storeTopTempC: preallocated(n + 1),
        potTempC,
        charge: preallocated(n + 1),
        gainW: preallocated(n),
        lossW: preallocated(n),
        drawW: preallocated(n),
        spillW: preallocated(n),
      };
    } else {
      this.series = null;
    }
    const ch0 = this.charge();
    this.chargeArmed = Uint8Array.from(CHARGE_EVENT_THRESHOLDS, (thr) => (ch0 >= thr ? 1 : 0));
    this.belowUsefulArmed = this.layerT[nodes - 1]! >= this.minUsefulC;
  }

  run(): void {
    const n = this.n;
    for (let k = 0; k <= n; k++) {
      const tMs = this.t0Ms + k * this.dtMs;
      this.boundary(k, tMs);
      if (k === n) break;
      this.step(k, tMs);
    }
    // Loads never put on (start after the horizon, or expired before their start was reached).
    for (let i = 0; i < this.loads.length; i++) {
      if (this.lState[i] === 0) {
        this.lState[i] = 2;
        this.lEnd[i] = this.loads[i]!.startMs;
      }
    }
  }

  // ---------------------------------------------------------------- boundaries: series, loads, events

  private boundary(k: number, tMs: number): void {
    const nN = this.nNodes;
    const meanT = this.meanStoreTemp();
    const topT = this.layerT[nN - 1]!;
    const ch = this.charge();
    if (ch < this.minCharge) this.minCharge = ch;
    if (meanT > this.maxStoreTemp) this.maxStoreTemp = meanT;
    const s = this.series;
    if (s !== null) {
      s.t[k] = tMs;
      s.storeTempC[k] = meanT;
      s.storeTopTempC[k] = topT;
      s.charge[k] = ch;
    }
    for (let j = 0; j < CHARGE_EVENT_THRESHOLDS.length; j++) {
      const thr = CHARGE_EVENT_THRESHOLDS[j]!;
      if (this.chargeArmed[j] === 1 && ch < thr) {
        this.chargeArmed[j] = 0;
        this.events.push({ kind: 'charge-below', tMs, detail: `charge fell below ${Math.round(thr * 100)} % (${(ch * 100).toFixed(1)} %)` });
      } else if (this.chargeArmed[j] === 0 && ch >= thr + CHARGE_EVENT_REARM) {
        this.chargeArmed[j] = 1;
      }
    }
    if (this.belowUsefulArmed && topT < this.minUsefulC) {
      this.belowUsefulArmed = false;
      this.events.push({
        kind: 'store-below-useful',
        tMs,
        detail: `store top ${topT.toFixed(1)} °C fell below the lowest useful ${this.minUsefulC} °C`,
      });
    } else if (!this.belowUsefulArmed && topT >= this.minUsefulC + BELOW_USEFUL_REARM_K) {
      this.belowUsefulArmed = true;
    }

    const atEnd = k === this.n;
    for (let p = 0; p < this.nPots; p++) {
      const li = this.potLoad[p]!;
      let value = Number.NaN;
      if (li >= 0) {
        value = this.potT[p]!;
        this.checkLoad(li, p, tMs, atEnd);
      }
      if (!atEnd && this.potLoad[p]! < 0) {
        const activated = this.activateNext(p, k, tMs);
        if (activated >= 0) {
          // A load put on where another just came off: the series keeps the old load's final value at this boundary.
          if (Number.isNaN(value)) value = this.potT[p]!;
          this.checkLoad(activated, p, tMs, false);
        }
      }
      if (s !== null) this.potSeries[p]![k] = value;
    }
  }

  /** Reached / hold / done / hard-stop checks for an active load at a boundary. */
  private checkLoad(li: number, p: number, tMs: number, atEnd: boolean): void {
    const l = this.loads[li]!;
    const tp = this.potT[p]!;
    if (!(tp <= this.lMaxT[li]!)) this.lMaxT[li] = tp; // also replaces the initial NaN
    if (tp >= l.minTempC) {
      if (Number.isNaN(this.lReached[li]!)) {
        this.lReached[li] = tMs;
        this.events.push({ kind: 'pot-reached', tMs, loadId: l.id, detail: `pot ${l.potId} reached ${l.minTempC} °C (${tp.toFixed(1)} °C)` });
      }
      if (Number.isNaN(this.lHold[li]!)) this.lHold[li] = tMs;
    } else {
      this.lHold[li] = Number.NaN; // a dip below minTempC restarts the hold
    }
    const hold = this.lHold[li]!;
    if (!Number.isNaN(hold) && tMs - hold >= l.holdS * 1000) {
      this.lDone[li] = hold + l.holdS * 1000;
      this.lOk[li] = 1;
      this.events.push({ kind: 'batch-done', tMs, loadId: l.id, detail: `batch ${l.id} held ≥ ${l.minTempC} °C for ${l.holdS} s on pot ${l.potId}` });
      this.release(li, p, tMs);
    } else if (tMs >= l.maxEndMs || atEnd) {
      this.release(li, p, tMs);
    }
  }

  private release(li: number, p: number, tMs: number): void {
    this.lEnd[li] = tMs;
    this.lState[li] = 2;
    this.potLoad[p] = -1;
    this.potT[p] = Number.NaN;
  }

  /** Put the next due load on pot p; returns its index or −1. */
  private activateNext(p: number, k: number, tMs: number): number {
    const q = this.potQueue[p]!;
    while (this.potNext[p]! < q.length) {
      const li = q[this.potNext[p]!]!;
      if (this.lStartIdx[li]! > k) return -1;
      this.potNext[p] = this.potNext[p]! + 1;
      const l = this.loads[li]!;
      if (l.maxEndMs <= tMs) continue; // expired before the horizon reached it; reported as never put on
      const w = this.weather[k]!;
      let t0 = l.initialTempC ?? w.tAirC;
      if (l.waterKg > 0 && t0 > this.tBoil) t0 = this.tBoil;
      this.potT[p] = t0;
      this.potC[p] = this.potMetalC[p]! + l.foodKg * l.foodCpJPerKgK + l.waterKg * WATER_CP_J_PER_KG_K;
      this.potWater[p] = l.waterKg;
      this.potLoss[p] = this.potLidUA[p]! * (l.lidOn ? 1 : LID_OFF_LOSS_FACTOR);
      this.potGValid[p] = 0;
      this.potLoad[p] = li;
      this.lState[li] = 1;
      return li;
    }
    return -1;
  }

  // ---------------------------------------------------------------- one step

  private step(k: number, tMs: number): void {
    const w = this.weather[k]!;
    const ta = w.tAirC;
    const g = w.gApertureWm2;
    const h = this.h;
    const nN = this.nNodes;
    const uaNode = (this.uaLoss + this.uaWind * (w.windMS ?? 0)) / nN;

    // Collector gain linearised in the bottom-node temperature: Q ≈ q0 + q1·(T − T0).
    const tBottom0 = this.layerT[0]!;
    let q0 = 0;
    let q1 = 0;
    if (g > 0 && this.colArea > 0) {
      const d = tBottom0 - ta;
      q0 = this.isIso
        ? this.colArea * (this.colEta * g - this.colA1 * d - this.colA2 * d * d)
        : this.colEta * this.colArea * g - this.colU * d;
      if (q0 > 0) q1 = this.isIso ? -this.colArea * (this.colA1 + 2 * this.colA2 * d) : -this.colU;
      else q0 = 0;
    }

    this.stepGain = 0;
    this.stepLoss = 0;
    this.stepDraw = 0;
    const top = nN - 1;
    let active = 0;
    let firstPot = -1;
    for (let p = 0; p < this.nPots; p++) {
      if (this.potLoad[p]! >= 0) {
        if (firstPot < 0) firstPot = p;
        active++;
      }
    }
    for (let i = 0; i < nN; i++) {
      const gainOn = i === 0;
      const qa = gainOn ? q0 : 0;
      const qb = gainOn ? q1 : 0;
      if (i !== top || active === 0) {
        this.stepNodeAlone(i, qa, qb, tBottom0, uaNode, ta, h);
      } else if (active === 1) {
        // One pot: the exact two-node solution with the node's own gain and loss.
        this.stepNodeWithPot(i, firstPot, qa, qb, tBottom0, uaNode, ta, h);
      } else {
        // Several pots: Strang splitting (Strang 1968, SIAM J. Numer. Anal. 5:506) of exact two-node solves —
        // pots 1…P over h/2, then P…1 over h/2; the first carries the node's gain and loss. Second-order accurate,
        // so the result hardly depends on the pot order; each sub-solve conserves energy exactly.
        const half = 0.5 * h;
        for (let p = 0; p < this.nPots; p++) {
          if (this.potLoad[p]! < 0) continue;
          if (p === firstPot) this.stepNodeWithPot(i, p, qa, qb, tBottom0, uaNode, ta, half);
          else this.stepNodeWithPot(i, p, 0, 0, tBottom0, 0, ta, half);
        }
        for (let p = this.nPots - 1; p >= 0; p--) {
          if (this.potLoad[p]! < 0) continue;
          if (p === firstPot) this.stepNodeWithPot(i, p, qa, qb, tBottom0, uaNode, ta, half);
          else this.stepNodeWithPot(i, p, 0, 0, tBottom0, 0, ta, half);
        }
      }
    }
    if (nN > 1) this.mixLayers();
    this.spill(k, tMs);

    this.gainJ += this.stepGain;
    this.lossJ += this.stepLoss;
    this.drawJ += this.stepDraw;
    const s = this.series;
    if (s !== null) {
      s.gainW[k] = this.stepGain / h;
      s.lossW[k] = this.stepLoss / h;
      s.drawW[k] = this.stepDraw / h;
    }
  }

  /** Capacity of layer i for the linear step [J/K] (apparent cp, enthalpy method). */
  private layerCapacity(i: number): number {
    const t = this.layerT[i]!;
    let cp = this.medium.specificHeat(t);
    if (this.hasMelt && t >= this.solidusC && t < this.liquidusC) cp += this.latentPerK;
    return this.mLayer * cp;
  }

  private applyLayer(i: number, dH: number): void {
    const hNew = this.layerH[i]! + dH;
    this.layerH[i] = hNew;
    this.layerT[i] = this.medium.temperatureAt(hNew / this.mLayer);
  }

  /** Layer i without a pot: one node C·dT/dt = a − b·T with gain q0 + q1·(T − T0) and loss ua·(T − Ta). */
  private stepNodeAlone(i: number, q0: number, q1: number, tRef: number, ua: number, ta: number, h: number): void {
    const t0 = this.layerT[i]!;
    const a = q0 - q1 * tRef + ua * ta;
    const b = ua - q1;
    const iT = integrateOneNode(this.layerCapacity(i), b, a, t0, h);
    const gain = q0 * h + q1 * (iT - tRef * h);
    const loss = ua * (iT - ta * h);
    this.stepGain += gain;
    this.stepLoss += loss;
    this.applyLayer(i, gain - loss);
  }

  /** Layer i with pot p: exact two-node step (or store with a fixed-temperature sink while the pot boils). */
  private stepNodeWithPot(i: number, p: number, q0: number, q1: number, tRef: number, ua: number, ta: number, h: number): void {
    const ts0 = this.layerT[i]!;
    const tp0 = this.potT[p]!;
    const cs = this.layerCapacity(i);
    const gc = this.coupling(p, ts0, tp0);
    const uaP = this.potLoss[p]!;
    const tb = this.tBoil;
    const a = q0 - q1 * tRef + ua * ta;
    const b = ua - q1;
    const boiling = this.potWater[p]! > 0 && tp0 >= tb;
    let iTs: number;
    let iTp: number;
    if (boiling) {
      iTs = integrateOneNode(cs, b + gc, a + gc * tb, ts0, h);
      iTp = tb * h;
    } else {
      integrateTwoNode(cs, b, a, ts0, this.potC[p]!, uaP, uaP * ta, tp0, gc, h, this.ode);
      iTs = this.ode[0]!;
      iTp = this.ode[1]!;
    }
    const gain = q0 * h + q1 * (iTs - tRef * h);
    const loss = ua * (iTs - ta * h);
    const draw = gc * (iTs - iTp);
    this.stepGain += gain;
    this.stepLoss += loss;
    this.stepDraw += draw;
    this.applyLayer(i, gain - loss - draw);
    const li = this.potLoad[p]!;
    this.lDrawn[li] = this.lDrawn[li]! + draw;

    // Pot enthalpy: draw − lid loss; above the boiling point the excess boils water off.
    const potLossJ = uaP * (iTp - ta * h);
    const dHp = draw - potLossJ;
    if (boiling) {
      // Lid off while boiling: the extra loss over the lid-on loss leaves as steam (its energy is already in potLossJ).
      const lidOffExtraJ = potLossJ - potLossJ * (this.potLidUA[p]! / uaP);
      if (lidOffExtraJ > 0) this.evaporateOnly(p, li, lidOffExtraJ / WATER_LATENT_HEAT_J_PER_KG);
      if (dHp >= 0) this.boilOff(p, li, dHp);
      else this.potT[p] = tb + dHp / this.potC[p]!;
    } else {
      const tp = tp0 + dHp / this.potC[p]!;
      if (this.potWater[p]! > 0 && tp > tb) {
        this.potT[p] = tb;
        this.boilOff(p, li, (tp - tb) * this.potC[p]!);
      } else {
        this.potT[p] = tp;
      }
    }
  }

  /** Remove m [kg] of water whose latent heat is already booked as a loss (open-pot steam). */
  private evaporateOnly(p: number, li: number, m: number): void {
    const water = this.potWater[p]!;
    const dm = m < water ? m : water;
    this.potWater[p] = water - dm;
    this.potC[p] = this.potC[p]! - dm * WATER_CP_J_PER_KG_K;
    this.lEvap[li] = this.lEvap[li]! + dm;
  }

  /** Evaporate water with energy e [J] at the boiling point; any energy left when the water is gone heats the pot. */
  private boilOff(p: number, li: number, e: number): void {
    const tb = this.tBoil;
    const water = this.potWater[p]!;
    const m = e / WATER_LATENT_HEAT_J_PER_KG;
    if (m <= water) {
      this.potWater[p] = water - m;
      this.potC[p] = this.potC[p]! - m * WATER_CP_J_PER_KG_K;
      this.lEvap[li] = this.lEvap[li]! + m;
      this.potT[p] = tb;
    } else {
      this.potWater[p] = 0;
      this.potC[p] = this.potC[p]! - water * WATER_CP_J_PER_KG_K;
      this.lEvap[li] = this.lEvap[li]! + water;
      this.potT[p] = tb + (e - water * WATER_LATENT_HEAT_J_PER_KG) / this.potC[p]!;
    }
  }

  /** Store-to-pot conductance [W/K]: constant, or natural convection re-evaluated after a > 0.25 K move (0.02 K for the store inside its melting range). */
  private coupling(p: number, ts: number, tp: number): number {
    const c = this.potConstUA[p]!;
    if (c === c) return c; // not NaN → constant
    const storeTol = this.hasMelt && ts >= this.solidusC && ts < this.liquidusC ? MUSHY_COUPLING_UPDATE_K : COUPLING_UPDATE_K;
    if (this.potGValid[p] === 1 && Math.abs(ts - this.potGTs[p]!) <= storeTol && Math.abs(tp - this.potGTp[p]!) <= COUPLING_UPDATE_K) {
      return this.potG[p]!;
    }
    const ua = this.potNc[p]!(ts, tp);
    this.potG[p] = ua;
    this.potGTs[p] = ts;
    this.potGTp[p] = tp;
    this.potGValid[p] = 1;
    return ua;
  }

  /** Defocus: cap every layer at h(maxSafeTempC), spilling in total at most this step's gain (bottom layer first). */
  private spill(k: number, tMs: number): void {
    let room = this.stepGain;
    let sp = 0;
    for (let i = 0; i < this.nNodes && room > 0; i++) {
      const excess = this.layerH[i]! - this.hMaxLayer;
      if (excess <= 0) continue;
      const s = excess < room ? excess : room;
      this.applyLayer(i, -s);
      room -= s;
      sp += s;
    }
    if (sp > 0) {
      this.spillJ += sp;
      if (!this.wasSpilling) {
        this.events.push({ kind: 'store-max-safe', tMs, detail: 'store reached its highest safe temperature; collector defocused, excess gain spilled' });
      }
    }
    this.wasSpilling = sp > 0;
    if (this.series !== null) this.series.spillW[k] = sp / this.h;
  }

  /**
   * Layer exchange after the node steps: (1) conduction k·A/Δz between adjacent layers, each pair exchanged exactly;
   * (2) buoyancy mixing: wherever a lower layer is hotter than the one above, the unstable layers are mixed to their
   * mean enthalpy (pool-adjacent-violators over equal-mass layers, so the result is stable everywhere and enthalpy is
   * conserved). Full mixing within a step is justified by the overturn time: the convective velocity
   * w* = (g·β·q·H/(ρ·c_p))^(1/3) (Deardorff 1970) is ≈ 2 cm/s for 1 kW into a 40 kg oil store, so it overturns in
   * ≈ 20 s, shorter than a 60 s step. The same inversion-elimination step is used in 1-D stratified-tank models
   * (e.g. Kleinbach, Beckman & Klein 1993, Solar Energy 50(2):155 — from memory).
   */
  private mixLayers(): void {
    const nN = this.nNodes;
    const meanT = this.meanStoreTemp();
    if (!(Math.abs(meanT - this.condAtC) <= MIXING_UPDATE_K)) {
      this.condG = (this.medium.conductivity(meanT) * this.crossM2) / this.dzM;
      this.condAtC = meanT;
    }
    const h = this.h;
    for (let i = 0; i < nN - 1; i++) {
      const dT = this.layerT[i]! - this.layerT[i + 1]!;
      if (dT >= 0) continue; // stable pair (upper hotter) conducts; unstable pairs are mixed below
      const q = exchangeHeatJ(this.layerCapacity(i), this.layerCapacity(i + 1), this.condG, dT, h);
      this.applyLayer(i, -q);
      this.applyLayer(i + 1, q);
    }
    // Pool adjacent violators on layer enthalpy (equal masses): blocks of mean enthalpy non-decreasing upward.
    const bStart = this.blockStart;
    const bSum = this.blockSum;
    let nb = 0;
    let mixed = false;
    for (let i = 0; i < nN; i++) {
      bStart[nb] = i;
      bSum[nb] = this.layerH[i]!;
      nb++;
      while (nb > 1 && bSum[nb - 2]! / (bStart[nb - 1]! - bStart[nb - 2]!) > bSum[nb - 1]! / (i + 1 - bStart[nb - 1]!)) {
        bSum[nb - 2] = bSum[nb - 2]! + bSum[nb - 1]!;
        nb--;
        mixed = true;
      }
    }
    if (!mixed) return;
    for (let b = 0; b < nb; b++) {
      const i0 = bStart[b]!;
      const i1 = b + 1 < nb ? bStart[b + 1]! : nN;
      if (i1 - i0 === 1) continue;
      const hEach = bSum[b]! / (i1 - i0);
      const t = this.medium.temperatureAt(hEach / this.mLayer);
      for (let i = i0; i < i1; i++) {
        this.layerH[i] = hEach;
        this.layerT[i] = t;
      }
    }
  }

  // ---------------------------------------------------------------- state read-outs

  private sumH(): number {
    let s = 0;
    for (let i = 0; i < this.nNodes; i++) s += this.layerH[i]!;
    return s;
  }

  meanStoreTemp(): number {
    let s = 0;
    for (let i = 0; i < this.nNodes; i++) s += this.layerT[i]!;
    return s / this.nNodes;
  }

  /** State of charge [0..1]: per-layer (h − h_min)/(h_max − h_min) clipped, averaged over equal-mass layers. */
  charge(): number {
    let s = 0;
    for (let i = 0; i < this.nNodes; i++) {
      const f = (this.layerH[i]! / this.mLayer - this.hMin) / this.hSpan;
      s += f < 0 ? 0 : f > 1 ? 1 : f;
    }
    return s / this.nNodes;
  }

  balance(): EnergyBalance {
    const stored = this.sumH() - this.hStart;
    const resid = this.gainJ - this.lossJ - this.drawJ - this.spillJ - stored;
    return {
      gainJ: this.gainJ,
      lossJ: this.lossJ,
      drawJ: this.drawJ,
      spillJ: this.spillJ,
      storedChangeJ: stored,
      relativeError: Math.abs(resid) / Math.max(this.gainJ, Math.abs(stored), 1),
    };
  }

  loadOutcomes(): LoadOutcome[] {
    return this.loads.map((l, i) => ({
      id: l.id,
      potId: l.potId,
      startMs: l.startMs,
      reachedMs: Number.isNaN(this.lReached[i]!) ? null : this.lReached[i]!,
      doneMs: Number.isNaN(this.lDone[i]!) ? null : this.lDone[i]!,
      endMs: this.lEnd[i]!,
      drawnJ: this.lDrawn[i]!,
      evaporatedKg: this.lEvap[i]!,
      maxPotTempC: this.lMaxT[i]!,
      ok: this.lOk[i] === 1,
    }));
  }
}
