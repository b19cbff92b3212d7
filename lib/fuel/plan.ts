/**
 * Backup fuel for a planner result: the batches the sun cannot serve (PlannerResult.backup) turned
 * into fuel, cost and CO₂ per day, and the coordinator's comparison with cooking everything on wood.
 */
import type { BackupBatch, PlannerBatch } from '@/lib/planner/types';
import { compareWithAllOnWood, planBackupFuel, type BackupBatchInput, type BackupFuelReport, type FuelOptions, type WoodComparison } from './backup';
import type { StoveId, StoveSpec } from './factors';

/** The fuel estimate's view of a planner batch. */
export function toBackupBatchInput(b: PlannerBatch): BackupBatchInput {
  return {
    id: b.id,
    dishName: b.dishName,
    servings: b.servings,
    method: b.method,
    potVolumeNeededL: b.potVolumeNeededL,
    foodKg: b.foodKg,
    foodCpJPerKgK: b.foodCpJPerKgK,
    waterKg: b.waterKg,
    minTempC: b.minTempC,
    holdS: b.holdS,
    lidOn: b.lidOn,
    serveByMs: b.serveByMs,
  };
}

/** Fuel for the backup batches of a plan (per batch, per day, total). */
export function backupFuelForPlan(batches: readonly PlannerBatch[], backup: readonly BackupBatch[], opts: FuelOptions): BackupFuelReport {
  const ids = new Set(backup.map((x) => x.batchId));
  return planBackupFuel(batches.filter((b) => ids.has(b.id)).map(toBackupBatchInput), opts);
}

/** The whole menu on a wood fire versus the plan (sun + backup stove). */
export function comparePlanWithAllOnWood(
  batches: readonly PlannerBatch[],
  backup: readonly BackupBatch[],
  opts: FuelOptions & { woodStove?: StoveId | StoveSpec },
): WoodComparison {
  return compareWithAllOnWood(batches.map(toBackupBatchInput), backup.map((x) => x.batchId), opts);
}
