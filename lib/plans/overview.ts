import { KitchenSchema, PlanSchema } from '@/entities';
import type { Viewer } from '@/lib/auth/guard';
import type { PlannerResult } from '@/lib/planner';
import type { MenuBatch } from '@/lib/menus';
import type { PlanFuelView } from './index';

/**
 * The coordinator's day across the organisation: per kitchen, the published plan (or the draft if
 * none is published), servings on the sun and on backup fuel, fuel to buy by type, cost and CO₂,
 * and the same menu all on wood for comparison.
 */
export async function getOrganisationOverview(viewer: Viewer, organisationId: string, date: string) {
  const kitchens = await viewer.em.find(KitchenSchema, { organisation: organisationId }, { orderBy: { name: 'asc' } });
  const plans = await viewer.em.find(PlanSchema, { kitchen: { $in: kitchens.map((k) => k.id) }, date, status: { $in: ['draft', 'published'] } });
  const rows = kitchens.map((k) => {
    const mine = plans.filter((p) => p.kitchen.id === k.id);
    const plan = mine.find((p) => p.status === 'published') ?? mine.find((p) => p.status === 'draft') ?? null;
    if (!plan) return { kitchenId: k.id, kitchenName: k.name, plan: null };
    const result = plan.result as PlannerResult;
    const batches = plan.batches as MenuBatch[];
    const fuel = plan.fuel as PlanFuelView;
    const backupIds = new Set(result.backup.map((b) => b.batchId));
    const servingsTotal = batches.reduce((s, b) => s + b.servings, 0);
    const servingsBackup = batches.filter((b) => backupIds.has(b.id)).reduce((s, b) => s + b.servings, 0);
    return {
      kitchenId: k.id,
      kitchenName: k.name,
      plan: {
        id: plan.id,
        status: plan.status,
        version: plan.version,
        weatherSource: plan.weatherSource,
        servingsTotal,
        servingsOnSun: result.servingsOnSun,
        servingsBackup,
        backupDishes: result.backup.map((b) => ({ batchId: b.batchId, dishName: batches.find((x) => x.id === b.batchId)?.dishName ?? b.batchId, servings: batches.find((x) => x.id === b.batchId)?.servings ?? 0, reason: b.reason, detail: b.detail })),
        fuel,
      },
    };
  });
  const totals = { servingsTotal: 0, servingsOnSun: 0, servingsBackup: 0, byFuel: {} as Record<string, { amount: number; unit: string }>, costByCurrency: {} as Record<string, number>, co2Kg: 0, co2BiogenicKg: 0, woodAllKg: 0, woodAllCo2BiogenicKg: 0 };
  for (const r of rows) {
    if (!r.plan) continue;
    totals.servingsTotal += r.plan.servingsTotal;
    totals.servingsOnSun += r.plan.servingsOnSun;
    totals.servingsBackup += r.plan.servingsBackup;
    for (const [fuelId, f] of Object.entries(r.plan.fuel.byFuel)) {
      const t = (totals.byFuel[fuelId] ??= { amount: 0, unit: f.unit });
      t.amount += f.amount;
    }
    if (r.plan.fuel.total.cost !== null) totals.costByCurrency[r.plan.fuel.currency] = (totals.costByCurrency[r.plan.fuel.currency] ?? 0) + r.plan.fuel.total.cost;
    totals.co2Kg += r.plan.fuel.total.co2Kg;
    totals.co2BiogenicKg += r.plan.fuel.total.co2BiogenicKg;
    totals.woodAllKg += r.plan.fuel.allOnWood.woodKg;
    totals.woodAllCo2BiogenicKg += r.plan.fuel.allOnWood.co2BiogenicKg;
  }
  return { date, kitchens: rows, totals };
}
