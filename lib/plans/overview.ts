import { KitchenSchema, PlanSchema } from '@/entities';
import type { Viewer } from '@/lib/auth/guard';
import { loadKitchenDay } from './day';
import { fuelView } from './views';

/**
 * The coordinator's day across the organisation: per kitchen, the published plan (or the draft if
 * none is published), servings on the sun and on backup fuel, fuel to buy by type, cost and CO₂,
 * and the same menu all on wood for comparison. A published day is read through the day's model, so
 * a batch a cook moved to backup fuel counts on backup here too.
 */
export async function getOrganisationOverview(viewer: Viewer, organisationId: string, date: string, nowMs = Date.now()) {
  const kitchens = await viewer.em.find(KitchenSchema, { organisation: organisationId }, { orderBy: { name: 'asc' }, populate: ['organisation'] });
  const plans = await viewer.em.find(PlanSchema, { kitchen: { $in: kitchens.map((k) => k.id) }, date, status: { $in: ['draft', 'published'] } });
  const rows = await Promise.all(
    kitchens.map(async (k) => {
      const mine = plans.filter((p) => p.kitchen.id === k.id);
      const plan = mine.find((p) => p.status === 'published') ?? mine.find((p) => p.status === 'draft') ?? null;
      if (!plan) return { kitchenId: k.id, kitchenName: k.name, plan: null };
      const byId = new Map(plan.batches.map((b) => [b.id, b]));
      const backupDishes =
        plan.status === 'published'
          ? (await loadKitchenDay(viewer.em.fork(), k, nowMs, date)).backup.map((b) => ({ batchId: b.batchId, dishName: b.dishName, servings: b.servings, reason: b.reason, detail: b.detail }))
          : plan.result.backup.map((b) => ({ batchId: b.batchId, dishName: byId.get(b.batchId)?.dishName ?? '', servings: byId.get(b.batchId)?.servings ?? 0, reason: b.reason, detail: b.detail }));
      const backupIds = backupDishes.map((b) => b.batchId);
      const servingsTotal = plan.batches.reduce((s, b) => s + b.servings, 0);
      const servingsBackup = backupDishes.reduce((s, b) => s + b.servings, 0);
      return {
        kitchenId: k.id,
        kitchenName: k.name,
        plan: {
          id: plan.id,
          status: plan.status,
          version: plan.version,
          weatherSource: plan.weatherSource,
          servingsTotal,
          servingsOnSun: servingsTotal - servingsBackup,
          servingsBackup,
          backupDishes,
          // Fuel for everything on backup as the day stands (skipped batches included).
          fuel: backupIds.length === plan.result.backup.length ? plan.fuel : fuelView(k, plan.batches, backupIds),
        },
      };
    }),
  );
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
