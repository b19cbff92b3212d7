/**
 * A small stand-in for simulateCooker (lib/thermal) that honours the same contract, for tests of the
 * planner's plumbing (dependency injection, call counting). Well-mixed store with a constant
 * specific heat, explicit Euler at the weather step, pots coupled by a constant conductance,
 * boiling capped at 100 °C. Not a physical model to trust: the planner's real tests use the real simulator.
 */
import type { CookerSpec, LoadOutcome, PotLoad, SimulateOptions, SimulationResult, WeatherStep } from '@/lib/thermal/types';

export function stubSimulate(spec: CookerSpec, weather: WeatherStep[], opts: SimulateOptions): SimulationResult {
  const n = weather.length;
  const stepS = opts.stepS ?? 60;
  const dtMs = stepS * 1000;
  const cStore = spec.store.massKg * 2200;
  const t: number[] = [];
  const storeTempC: number[] = [];
  const potTempC: Record<string, number[]> = {};
  for (const p of spec.pots) potTempC[p.id] = [];
  const gainW: number[] = [];
  const lossW: number[] = [];
  const drawW: number[] = [];
  const spillW: number[] = [];
  const loads = [...(opts.loads ?? [])];
  interface Active {
    load: PotLoad;
    tempC: number;
    heldS: number;
    reachedMs: number | null;
    doneMs: number | null;
    drawnJ: number;
    maxC: number;
    c: number;
    ua: number;
    lidUa: number;
    ended: boolean;
    endMs: number;
  }
  const states = new Map<string, Active>();
  let ts = opts.initialStoreTempC;
  const t0 = weather[0]?.t ?? 0;
  let gainJ = 0;
  let lossJ = 0;
  let drawJ = 0;
  let spillJ = 0;
  for (let i = 0; i <= n; i++) {
    const now = t0 + i * dtMs;
    t.push(now);
    storeTempC.push(ts);
    for (const p of spec.pots) {
      const a = [...states.values()].find((s) => s.load.potId === p.id && !s.ended);
      potTempC[p.id]?.push(a ? a.tempC : Number.NaN);
    }
    if (i === n) break;
    const w = weather[i] as WeatherStep;
    // start loads
    for (const l of loads) {
      if (!states.has(l.id) && l.startMs <= now && l.startMs > now - dtMs) {
        const pot = spec.pots.find((p) => p.id === l.potId);
        if (!pot) throw new Error(`unknown pot ${l.potId}`);
        const ua = pot.coupling.kind === 'constant' ? pot.coupling.uaWPerK : 150 * pot.coupling.contactAreaM2;
        states.set(l.id, {
          load: l,
          tempC: l.initialTempC ?? w.tAirC,
          heldS: 0,
          reachedMs: null,
          doneMs: null,
          drawnJ: 0,
          maxC: l.initialTempC ?? w.tAirC,
          c: l.foodKg * l.foodCpJPerKgK + l.waterKg * 4186 + pot.massKg * pot.cpJPerKgK,
          ua,
          lidUa: pot.lidAreaM2 * pot.lidUWPerM2K * (l.lidOn ? 1 : 3),
          ended: false,
          endMs: l.maxEndMs,
        });
      }
    }
    const col = spec.collector;
    const gain =
      col.model === 'lumped'
        ? col.eta0 * col.apertureM2 * w.gApertureWm2 - col.uLossWPerK * (ts - w.tAirC)
        : col.apertureM2 * (col.eta0 * w.gApertureWm2 - col.a1 * (ts - w.tAirC) - col.a2 * (ts - w.tAirC) ** 2);
    const g = Math.max(0, gain);
    const loss = spec.store.uaLossWPerK * (ts - w.tAirC);
    let draw = 0;
    for (const s of states.values()) {
      if (s.ended) continue;
      const q = s.ua * (ts - s.tempC);
      draw += q;
      s.drawnJ += q * stepS;
      const qLoss = s.lidUa * (s.tempC - w.tAirC);
      s.tempC = Math.min(100, s.tempC + ((q - qLoss) * stepS) / s.c);
      s.maxC = Math.max(s.maxC, s.tempC);
      const end = now + dtMs;
      if (s.tempC >= s.load.minTempC - 1e-9) {
        if (s.reachedMs === null) s.reachedMs = end;
        s.heldS += stepS;
        if (s.heldS >= s.load.holdS && s.doneMs === null) {
          s.doneMs = end;
          s.ended = true;
          s.endMs = end;
        }
      }
      if (!s.ended && end >= s.load.maxEndMs) {
        s.ended = true;
        s.endMs = end;
      }
    }
    let next = ts + ((g - loss - draw) * stepS) / cStore;
    let spill = 0;
    if (next > spec.store.maxSafeTempC) {
      spill = ((next - spec.store.maxSafeTempC) * cStore) / stepS;
      next = spec.store.maxSafeTempC;
    }
    gainW.push(g);
    lossW.push(loss);
    drawW.push(draw);
    spillW.push(spill);
    gainJ += g * stepS;
    lossJ += loss * stepS;
    drawJ += draw * stepS;
    spillJ += spill * stepS;
    ts = next;
  }
  const outcomes: LoadOutcome[] = loads.map((l) => {
    const s = states.get(l.id);
    if (!s) return { id: l.id, potId: l.potId, startMs: l.startMs, reachedMs: null, doneMs: null, endMs: l.startMs, drawnJ: 0, evaporatedKg: 0, maxPotTempC: Number.NaN, ok: false };
    return {
      id: l.id,
      potId: l.potId,
      startMs: l.startMs,
      reachedMs: s.reachedMs,
      doneMs: s.doneMs,
      endMs: s.endMs,
      drawnJ: s.drawnJ,
      evaporatedKg: 0,
      maxPotTempC: s.maxC,
      ok: s.doneMs !== null && s.doneMs <= l.maxEndMs,
    };
  });
  const stored = (ts - opts.initialStoreTempC) * cStore;
  return {
    series: { t, storeTempC, storeTopTempC: storeTempC, potTempC, charge: storeTempC.map(() => 0), gainW, lossW, drawW, spillW },
    loads: outcomes,
    balance: { gainJ, lossJ, drawJ, spillJ, storedChangeJ: stored, relativeError: 0 },
    events: [],
  };
}
