/**
 * The stored shape of a plan's JSON columns (batches, result, fuel, cookers): one zod schema each,
 * parsed once where a row leaves the database (entities/plan-record-type.ts), so the rest of the app works
 * with typed records and a row that does not match is a clear error at load, not a crash three calls
 * later. lib/plans checks at compile time that what the planner and the fuel estimate return fits
 * these shapes (lib/plans/records.ts).
 */
import { z } from 'zod';

const COOK_METHODS = ['boil', 'simmer', 'steam', 'bake', 'fry'] as const;
/** The planner's reasons, and 'too-late': solved the same day after the batch could still be cooked in time. */
const BACKUP_REASONS = ['no-cooker-hot-enough', 'no-free-pot', 'outside-shift', 'pot-too-small', 'failed-recheck', 'above-boiling-point', 'not-placed', 'too-late'] as const;
const MEDIUM_KINDS = ['oil', 'pcm', 'custom'] as const;

/** One batch of a menu line as planned: what the dish needs, when, and which batch of its line it is. */
export const storedBatchSchema = z.object({
  id: z.string(),
  lineId: z.string(),
  dishId: z.string(),
  dishName: z.string(),
  method: z.enum(COOK_METHODS),
  servings: z.number(),
  /** [L] */
  potVolumeNeededL: z.number(),
  /** [kg], [J/(kg·K)], [kg] */
  foodKg: z.number(),
  foodCpJPerKgK: z.number(),
  waterKg: z.number(),
  /** The pot must hold at least minTempC [°C] for holdS [s]. */
  minTempC: z.number(),
  holdS: z.number(),
  /** Core temperature the food must reach to be safe [°C]. */
  safeCoreTempC: z.number(),
  lidOn: z.boolean(),
  backupStove: z.string(),
  /** [epoch ms] */
  earliestStartMs: z.number(),
  serveByMs: z.number(),
  /** Batch number within its line (1-based, in the order the batches are cooked) and how many the line makes. */
  index: z.number().int(),
  of: z.number().int(),
});
export type StoredBatch = z.infer<typeof storedBatchSchema>;

export const storedSlotSchema = z.object({
  batchId: z.string(),
  cookerId: z.string(),
  potId: z.string(),
  /** Pot onto the store, pot at the dish's minimum, hold complete [epoch ms]. */
  startMs: z.number(),
  readyMs: z.number(),
  doneMs: z.number(),
  /** [°C] */
  predictedStoreTempAtStartC: z.number().nullable(),
  predictedPotMaxC: z.number().nullable(),
  fixed: z.boolean().optional(),
});
export type StoredSlot = z.infer<typeof storedSlotSchema>;

export const storedBackupSchema = z.object({
  batchId: z.string(),
  reason: z.enum(BACKUP_REASONS),
  detail: z.string(),
});

export const storedResultSchema = z.object({
  status: z.enum(['optimal', 'time-limit', 'converged', 'iteration-limit', 'greedy-only', 'empty']),
  slots: z.array(storedSlotSchema),
  backup: z.array(storedBackupSchema),
  servingsOnSun: z.number(),
  objective: z.number(),
  upperBound: z.number(),
  boundMethod: z.string(),
  gap: z.number(),
  solveTimeMs: z.number(),
  greedyServings: z.number(),
  iterations: z.number(),
  log: z.array(z.string()),
});
export type StoredResult = z.infer<typeof storedResultSchema>;

const fuelUnit = z.enum(['kg', 'kWh']);
export const planFuelSchema = z.object({
  currency: z.string(),
  perBatch: z.array(
    z.object({
      batchId: z.string(),
      stoveId: z.string(),
      fuelId: z.string(),
      amount: z.number(),
      unit: fuelUnit,
      cost: z.number().nullable(),
      co2Kg: z.number(),
      co2BiogenicKg: z.number(),
      usefulKWh: z.number(),
    }),
  ),
  byFuel: z.record(z.string(), z.object({ amount: z.number(), unit: fuelUnit, cost: z.number().nullable(), co2Kg: z.number(), co2BiogenicKg: z.number() })),
  total: z.object({ cost: z.number().nullable(), co2Kg: z.number(), co2BiogenicKg: z.number(), usefulKWh: z.number() }),
  allOnWood: z.object({ woodKg: z.number(), co2BiogenicKg: z.number(), cost: z.number().nullable() }),
  solarShareOfHeat: z.number(),
});
export type PlanFuelView = z.infer<typeof planFuelSchema>;

export const planCookerSchema = z.object({
  id: z.string(),
  name: z.string(),
  pots: z.array(z.object({ id: z.string(), name: z.string(), volumeL: z.number() })),
  minUsefulTempC: z.number(),
  maxSafeTempC: z.number(),
  /** Plans stored before the medium was recorded have none (read as oil: the stricter cautions). */
  medium: z
    .object({ kind: z.enum(MEDIUM_KINDS), name: z.string(), smokePointC: z.number().nullable() })
    .default({ kind: 'oil', name: '', smokePointC: null }),
  /** The store through the day under the plan's loads, every 10 min: [epoch ms], [°C], [0–1]. */
  series: z.object({ t: z.array(z.number()), storeTempC: z.array(z.number()), charge: z.array(z.number()) }),
});
export type PlanCookerView = z.infer<typeof planCookerSchema>;

/** A stored plan record that does not match its schema: names the column and the first wrong field. */
export class PlanRecordError extends Error {
  constructor(column: string, issues: z.core.$ZodIssue[]) {
    const first = issues[0];
    super(`The stored plan's ${column} does not match its schema${first ? ` (${first.path.join('.') || 'top level'}: ${first.message})` : ''}.`);
    this.name = 'PlanRecordError';
  }
}

