/**
 * Test oracles written independently of the planner's internals, on the same rules:
 * starts on the slot grid (multiples of slotMinutes since the epoch) inside a shift and not before
 * the batch's earliest start; each batch must hold its minimum before min(serve-by, end of its shift,
 * next start on the same pot − turnaround, end of the weather); every batch on a cooker simulated
 * together with the real simulator from the cooker's initial state.
 */
import { simulateCooker } from '@/lib/thermal';
import type { PotLoad } from '@/lib/thermal/types';
import type { PlannerBatch, PlannerCooker, PlannerProblem, PlannerResult } from '@/lib/planner/types';

export interface OracleLoad {
  batch: PlannerBatch;
  potId: string;
  startMs: number;
}

function shiftEnd(p: PlannerProblem, t: number): number {
  let end = -1;
  // Merge overlapping shifts the simple way: follow the chain of shifts covering t.
  let cur = t;
  for (let guard = 0; guard < 50; guard++) {
    const s = p.shifts.find((x) => x.startMs <= cur && x.endMs > cur && x.endMs > end);
    if (!s) break;
    end = s.endMs;
    cur = s.endMs;
    if (!p.shifts.some((x) => x.startMs <= cur && x.endMs > cur)) break;
  }
  return end;
}

/** Simulates one cooker with these loads; returns per-batch outcomes or null when any fails. */
export function simulateCookerLoads(p: PlannerProblem, c: PlannerCooker, loads: OracleLoad[]) {
  const turn = p.turnaroundS * 1000;
  const tEnd = (c.weather[0]?.t ?? 0) + c.weather.length * 60_000;
  const potLoads: PotLoad[] = loads.map((l) => {
    let maxEnd = Math.min(l.batch.serveByMs, tEnd);
    if (!l.batch.fixed) maxEnd = Math.min(maxEnd, shiftEnd(p, l.startMs));
    for (const o of loads) if (o !== l && o.potId === l.potId && o.startMs > l.startMs) maxEnd = Math.min(maxEnd, o.startMs - turn);
    return {
      id: l.batch.id,
      potId: l.potId,
      startMs: l.startMs,
      foodKg: l.batch.foodKg,
      foodCpJPerKgK: l.batch.foodCpJPerKgK,
      waterKg: l.batch.waterKg,
      ...(l.batch.fixed?.contentsTempC !== undefined && l.startMs < (c.weather[0]?.t ?? 0) ? { initialTempC: l.batch.fixed.contentsTempC } : {}),
      lidOn: l.batch.lidOn,
      minTempC: l.batch.minTempC,
      holdS: l.batch.holdS,
      maxEndMs: maxEnd,
    };
  });
  for (const pl of potLoads) if (pl.maxEndMs - pl.startMs < pl.holdS * 1000) return null;
  const r = simulateCooker(c.spec, c.weather, { stepS: 60, initialStoreTempC: c.initialStoreTempC, altitudeM: p.altitudeM, loads: potLoads });
  if (!r.loads.every((o) => o.ok)) return null;
  return r;
}

/** Candidate (pot, start) options of a batch on a cooker under the grid and shift rules. */
export function options(p: PlannerProblem, c: PlannerCooker, b: PlannerBatch): { potId: string; startMs: number }[] {
  const slot = (p.slotMinutes ?? 15) * 60_000;
  const t0 = c.weather[0]?.t ?? 0;
  const tEnd = t0 + c.weather.length * 60_000;
  const out: { potId: string; startMs: number }[] = [];
  for (const pot of c.spec.pots) {
    if (pot.volumeL < b.potVolumeNeededL) continue;
    for (let s = Math.ceil(Math.max(b.earliestStartMs, t0) / slot) * slot; s + b.holdS * 1000 <= Math.min(b.serveByMs, tEnd); s += slot) {
      const se = shiftEnd(p, s);
      if (se < 0 || s + b.holdS * 1000 > se) continue;
      out.push({ potId: pot.id, startMs: s });
    }
  }
  return out;
}

/**
 * Exhaustive search: for every subset of batches on every cooker, is there an assignment of pots and
 * grid starts that works? Depth-first over the subset's batches, pruning partial assignments that
 * already fail (adding a batch only draws more heat and shortens deadlines on its pot, so a failing
 * partial assignment cannot be completed). Returns the best total servings over disjoint subsets
 * (two cookers) and the number of simulations.
 */
export function exhaustiveBestServings(p: PlannerProblem): { best: number; sims: number; feasibleSets: string[][] } {
  if (p.cookers.length !== 2) throw new Error('oracle handles two cookers');
  let sims = 0;
  const batches = p.batches;
  const nB = batches.length;
  const feasible: Set<number>[] = [];
  const feasibleSets: string[][] = [];
  for (const c of p.cookers) {
    const opts = batches.map((b) => options(p, c, b));
    const ok = new Set<number>([0]);
    // Subsets in increasing size; a subset is tried only if all its one-smaller subsets work.
    const masks = Array.from({ length: 1 << nB }, (_, i) => i).sort((a, z) => popcount(a) - popcount(z) || a - z);
    for (const mask of masks) {
      if (mask === 0) continue;
      let subsOk = true;
      for (let i = 0; i < nB; i++) if (mask & (1 << i) && !ok.has(mask & ~(1 << i))) subsOk = false;
      if (!subsOk) continue;
      const members = [...Array(nB).keys()].filter((i) => mask & (1 << i));
      const chosen: OracleLoad[] = [];
      const dfs = (k: number): boolean => {
        if (k === members.length) return true;
        const bi = members[k] as number;
        for (const o of opts[bi] ?? []) {
          if (chosen.some((x) => x.potId === o.potId && x.startMs === o.startMs)) continue;
          chosen.push({ batch: batches[bi] as PlannerBatch, potId: o.potId, startMs: o.startMs });
          sims++;
          const r = simulateCookerLoads(p, c, chosen);
          if (r && dfs(k + 1)) return true;
          chosen.pop();
        }
        return false;
      };
      if (dfs(0)) ok.add(mask);
    }
    feasible.push(ok);
    feasibleSets.push([...ok].map((mk) => batches.filter((_, i) => mk & (1 << i)).map((b) => b.id).join('+')));
  }
  let best = 0;
  const serv = (mask: number) => batches.reduce((s, b, i) => s + (mask & (1 << i) ? b.servings : 0), 0);
  for (const a of feasible[0] ?? []) for (const z of feasible[1] ?? []) if ((a & z) === 0) best = Math.max(best, serv(a) + serv(z));
  return { best, sims, feasibleSets };
}

function popcount(x: number): number {
  let n = 0;
  for (let v = x; v; v &= v - 1) n++;
  return n;
}

/**
 * Checks a plan against the rules with the real simulator; returns a list of violations (empty = valid).
 */
export function planViolations(p: PlannerProblem, r: PlannerResult): string[] {
  const out: string[] = [];
  const slot = (p.slotMinutes ?? 15) * 60_000;
  const turn = p.turnaroundS * 1000;
  const seen = new Set<string>();
  for (const s of r.slots) {
    if (seen.has(s.batchId)) out.push(`${s.batchId} planned twice`);
    seen.add(s.batchId);
  }
  for (const b of r.backup) if (seen.has(b.batchId)) out.push(`${b.batchId} both planned and in backup`);
  for (const b of p.batches) if (!seen.has(b.id) && !r.backup.some((x) => x.batchId === b.id)) out.push(`${b.id} neither planned nor in backup`);
  for (const c of p.cookers) {
    const mine = r.slots.filter((s) => s.cookerId === c.id && !(p.batches.find((b) => b.id === s.batchId)?.fixed?.doneMs !== undefined));
    const loads: OracleLoad[] = mine.map((s) => ({ batch: p.batches.find((b) => b.id === s.batchId) as PlannerBatch, potId: s.potId, startMs: s.startMs }));
    for (const l of loads) {
      if (l.batch.fixed) continue;
      if (l.startMs % slot !== 0) out.push(`${l.batch.id} starts off the grid`);
      if (l.startMs < l.batch.earliestStartMs) out.push(`${l.batch.id} starts before its earliest start`);
      if (shiftEnd(p, l.startMs) < 0) out.push(`${l.batch.id} starts outside shifts`);
      const pot = c.spec.pots.find((x) => x.id === l.potId);
      if (!pot || pot.volumeL < l.batch.potVolumeNeededL) out.push(`${l.batch.id} pot too small`);
    }
    const sim = simulateCookerLoads(p, c, loads);
    if (!sim) {
      out.push(`cooker ${c.id}: a batch fails in the full simulation`);
      continue;
    }
    for (const s of mine) {
      const o = sim.loads.find((x) => x.id === s.batchId);
      if (!o || o.doneMs !== s.doneMs || o.reachedMs !== s.readyMs) out.push(`${s.batchId}: reported times differ from the simulation`);
      const b = p.batches.find((x) => x.id === s.batchId) as PlannerBatch;
      if (s.doneMs > b.serveByMs) out.push(`${s.batchId} done after serve-by`);
      for (const t of mine) if (t !== s && t.potId === s.potId && t.startMs > s.startMs && t.startMs < s.doneMs + turn) out.push(`${s.batchId} and ${t.batchId} overlap on ${s.potId}`);
    }
  }
  return out;
}
