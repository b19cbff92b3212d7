import { z } from 'zod';
import { COOK_METHODS } from '@/entities/constants';
import { STOVES } from '@/lib/fuel';

const STOVE_IDS = Object.keys(STOVES) as [string, ...string[]];
const num = (what: string, min: number, max: number, unit: string) =>
  z.number({ message: `${what} is a number (${unit}).` }).min(min, `${what} is at least ${min} ${unit}.`).max(max, `${what} is at most ${max} ${unit}.`);

/** The fields as they are checked, without defaults (a PATCH must not fill in what it does not name). */
const dishFieldChecks = {
  name: z.string({ message: 'Name the dish.' }).trim().min(1, 'Name the dish.').max(200, 'At most 200 characters.'),
  method: z.enum(COOK_METHODS, { message: `Method is one of: ${COOK_METHODS.join(', ')}.` }),
  servingsPerBatch: z.number({ message: 'Servings per batch is a whole number.' }).int('Servings per batch is a whole number.').min(1, 'At least 1 serving.').max(5000, 'At most 5000 servings.'),
  foodKgPerServing: num('Food per serving', 0, 5, 'kg'),
  waterKgPerServing: num('Water per serving', 0, 5, 'kg'),
  foodCpJPerKgK: num('Food specific heat', 500, 4500, 'J/(kg·K)'),
  litresPerServing: num('Pot volume per serving', 0.05, 10, 'L'),
  minPotTempC: num('Minimum pot temperature', 40, 250, '°C'),
  holdMin: num('Hold time', 1, 600, 'min'),
  safeCoreTempC: num('Safe core temperature', 40, 100, '°C'),
  lidOn: z.boolean({ message: 'Lid on is true or false.' }),
  backupStove: z.enum(STOVE_IDS, { message: `Backup stove is one of: ${STOVE_IDS.join(', ')}.` }),
  notes: z.string().trim().max(1000, 'At most 1000 characters.').nullable().optional(),
};

/** The fields of a new dish: a few have defaults. */
export const dishFields = {
  ...dishFieldChecks,
  foodCpJPerKgK: dishFieldChecks.foodCpJPerKgK.default(3500),
  lidOn: dishFieldChecks.lidOn.default(true),
  backupStove: dishFieldChecks.backupStove.default('lpg'),
};

const refineDish = (v: { foodKgPerServing?: number; waterKgPerServing?: number; minPotTempC?: number; safeCoreTempC?: number }, ctx: z.RefinementCtx) => {
  if (v.foodKgPerServing === 0 && v.waterKgPerServing === 0) ctx.addIssue({ code: 'custom', path: ['foodKgPerServing'], message: 'A serving needs some food or water.', params: { i18n: 'foodOrWater' } });
  if (v.minPotTempC !== undefined && v.safeCoreTempC !== undefined && v.minPotTempC < v.safeCoreTempC)
    ctx.addIssue({ code: 'custom', path: ['minPotTempC'], message: 'The pot must reach at least the safe core temperature of the food.', params: { i18n: 'potAboveCore' } });
};

export const createDishSchema = z.strictObject(dishFields).superRefine(refineDish);
/**
 * A change names only the fields it changes. Built from the checks without defaults: zod 4 applies a
 * default inside .optional() to a missing key, so optional(default) would reset foodCpJPerKgK, lidOn
 * and backupStove on every PATCH that does not name them.
 */
export const updateDishSchema = z
  .strictObject(Object.fromEntries(Object.entries(dishFieldChecks).map(([k, v]) => [k, v.optional()])) as { [K in keyof typeof dishFieldChecks]: z.ZodOptional<(typeof dishFieldChecks)[K]> })
  .superRefine(refineDish)
  .refine((v) => Object.keys(v).length > 0, { message: 'Send at least one field to change.' })
  .meta({ minProperties: 1 });
export type DishInput = z.infer<typeof createDishSchema>;

/** CSV columns of the dish import/export, in order (our own header; documented in the UI). */
export const DISH_CSV_COLUMNS = [
  'name',
  'method',
  'servings_per_batch',
  'food_kg_per_serving',
  'water_kg_per_serving',
  'food_cp_j_per_kg_k',
  'litres_per_serving',
  'min_pot_temp_c',
  'hold_min',
  'safe_core_temp_c',
  'lid_on',
  'backup_stove',
  'notes',
] as const;
