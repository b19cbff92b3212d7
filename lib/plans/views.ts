/**
 * What a solved plan stores beside the planner's result: each cooker's store through the day under
 * the plan's loads (full simulation, for the chart and the safety notes), the backup fuel of the
 * batches the sun cannot serve, and batch numbers in cooking order. Pure: no database.
 */
import type { Cooker, Kitchen, PlanCookerView, PlanFuelView, StoredResult } from '@/entities';
import { cookerMedium } from '@/lib/cookers/medium';
import { compareWithAllOnWood, planBackupFuel, STOVES, type StoveId } from '@/lib/fuel';
import type { MenuBatch } from '@/lib/menus';
import type { PlannerCooker, Shift } from '@/lib/planner';
import { potLoadsForSlots } from '@/lib/planner/pot-loads';
import { simulateCooker } from '@/lib/thermal';

/** Each cooker's store through the day under the plan's loads (full simulation), every 10 min. */
export function cookerViews(
  problem: { cookers: PlannerCooker[]; shifts: Shift[]; turnaroundS: number; altitudeM: number },
  batches: readonly MenuBatch[],
  cookers: readonly Cooker[],
  result: Pick<StoredResult, 'slots'>,
): PlanCookerView[] {
  const byBatch = new Map(batches.map((b) => [b.id, b]));
  return problem.cookers.map((pc) => {
    const c = cookers.find((x) => x.id === pc.id)!;
    const t0 = pc.weather[0]?.t ?? 0;
    const weatherEndMs = (pc.weather[pc.weather.length - 1]?.t ?? t0) + 60_000;
    const mine = result.slots.filter((s) => s.cookerId === pc.id && s.startMs >= t0);
    const loads = potLoadsForSlots(mine, byBatch, { shifts: problem.shifts, turnaroundS: problem.turnaroundS, weatherEndMs });
    const sim = simulateCooker(pc.spec, pc.weather, { initialStoreTempC: pc.initialStoreTempC, altitudeM: problem.altitudeM, loads });
    const pick = <T,>(a: T[]) => a.filter((_, i) => i % 10 === 0);
    return {
      id: c.id,
      name: c.name,
      pots: c.pots.map((p) => ({ id: p.id, name: p.name, volumeL: p.volumeL })),
      minUsefulTempC: c.minUsefulTempC,
      maxSafeTempC: c.maxSafeTempC,
      medium: cookerMedium(c),
      series: { t: pick(sim.series.t), storeTempC: pick(sim.series.storeTempC).map((v) => Math.round(v * 10) / 10), charge: pick(sim.series.charge).map((v) => Math.round(v * 1000) / 1000) },
    };
  });
}

/** Backup fuel for the batches the sun cannot serve, each on its dish's stove if the kitchen has it, else the kitchen's first. */
export function fuelView(kitchen: Pick<Kitchen, 'planning' | 'altitudeM' | 'timeZone'>, menuBatches: readonly MenuBatch[], backupIds: readonly string[]): PlanFuelView {
  const fuels = kitchen.planning.fuels;
  const onHand = new Map(fuels.map((f) => [f.stoveId, f]));
  const stoveFor = (b: MenuBatch) => (onHand.has(b.backupStove) ? b.backupStove : (fuels[0]?.stoveId ?? 'lpg')) as StoveId;
  const opts = (stoveId: StoveId) => {
    const f = onHand.get(stoveId);
    const base = STOVES[stoveId];
    return {
      ambientC: 25,
      altitudeM: kitchen.altitudeM,
      timeZone: kitchen.timeZone,
      currency: kitchen.planning.currency,
      stove: { ...base, efficiency: f?.efficiency ?? base.efficiency },
      prices: f?.price !== undefined ? { [base.fuelId]: f.price } : {},
    };
  };
  const ids = new Set(backupIds);
  const groups = new Map<StoveId, MenuBatch[]>();
  for (const b of menuBatches.filter((x) => ids.has(x.id))) groups.set(stoveFor(b), [...(groups.get(stoveFor(b)) ?? []), b]);
  const view: PlanFuelView = { currency: kitchen.planning.currency, perBatch: [], byFuel: {}, total: { cost: 0, co2Kg: 0, co2BiogenicKg: 0, usefulKWh: 0 }, allOnWood: { woodKg: 0, co2BiogenicKg: 0, cost: null }, solarShareOfHeat: 0 };
  for (const [stoveId, list] of groups) {
    // A menu batch carries every field the fuel estimate reads.
    const r = planBackupFuel(list, opts(stoveId));
    for (const bf of r.perBatch) {
      view.perBatch.push({ batchId: bf.batchId, stoveId, fuelId: bf.fuelId, amount: bf.amount, unit: bf.unit, cost: bf.cost, co2Kg: bf.co2Kg, co2BiogenicKg: bf.co2BiogenicKg, usefulKWh: bf.heat.usefulJ / 3.6e6 });
      const f = (view.byFuel[bf.fuelId] ??= { amount: 0, unit: bf.unit, cost: 0, co2Kg: 0, co2BiogenicKg: 0 });
      f.amount += bf.amount;
      f.cost = f.cost === null || bf.cost === null ? null : f.cost + bf.cost;
      f.co2Kg += bf.co2Kg;
      f.co2BiogenicKg += bf.co2BiogenicKg;
      view.total.cost = view.total.cost === null || bf.cost === null ? null : view.total.cost + bf.cost;
      view.total.co2Kg += bf.co2Kg;
      view.total.co2BiogenicKg += bf.co2BiogenicKg;
      view.total.usefulKWh += bf.heat.usefulJ / 3.6e6;
    }
  }
  const first = menuBatches[0];
  if (first) {
    // "All on wood" burns on the kitchen's own wood stove (its measured efficiency) when it has one.
    const woodStove: StoveId = onHand.has('improved-wood') && !onHand.has('three-stone-wood') ? 'improved-wood' : 'three-stone-wood';
    const wood = onHand.get(woodStove);
    const cmp = compareWithAllOnWood([...menuBatches], ids, { ...opts(stoveFor(first)), woodStove: { ...STOVES[woodStove], efficiency: wood?.efficiency ?? STOVES[woodStove].efficiency }, prices: wood?.price !== undefined ? { wood: wood.price } : {} });
    view.allOnWood = { woodKg: cmp.allOnWood.amountByFuel.wood ?? 0, co2BiogenicKg: cmp.allOnWood.co2BiogenicKg, cost: cmp.allOnWood.cost };
    view.solarShareOfHeat = cmp.solarShareOfHeat;
  }
  return view;
}

/**
 * Batch numbers in the order the batches are cooked: "1/3" is the first to go on. Batches on backup
 * fuel come after those on the sun, in their menu order.
 */
export function numberInCookingOrder<B extends Pick<MenuBatch, 'id' | 'lineId' | 'index' | 'of'>>(batches: readonly B[], result: Pick<StoredResult, 'slots'>): B[] {
  const start = new Map(result.slots.map((s) => [s.batchId, s.startMs]));
  const byLine = new Map<string, B[]>();
  for (const b of batches) byLine.set(b.lineId, [...(byLine.get(b.lineId) ?? []), b]);
  const index = new Map<string, number>();
  for (const list of byLine.values()) {
    const ordered = [...list].sort((a, b) => (start.get(a.id) ?? Infinity) - (start.get(b.id) ?? Infinity) || a.index - b.index);
    ordered.forEach((b, i) => index.set(b.id, i + 1));
  }
  return batches.map((b) => ({ ...b, index: index.get(b.id) ?? b.index }));
}
