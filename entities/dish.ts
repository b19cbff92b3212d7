import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Organisation } from './organisation';

import { COOK_METHODS } from './constants';
export { COOK_METHODS };
export type CookMethod = (typeof COOK_METHODS)[number];

/** A dish of the organisation's library, shared by its kitchens. */
export interface Dish extends Base {
  organisation: Organisation;
  name: string;
  method: CookMethod;
  /** Largest batch the recipe is written for [servings]. */
  servingsPerBatch: number;
  /** Food (non-water) and water mass per serving [kg]. */
  foodKgPerServing: number;
  waterKgPerServing: number;
  /** Specific heat of the food part [J/(kg·K)]. */
  foodCpJPerKgK: number;
  /** Pot volume per serving [L]: decides which pots the batch fits. */
  litresPerServing: number;
  /** The pot must hold at least this [°C] for holdMin [min]. */
  minPotTempC: number;
  holdMin: number;
  /** Safe core temperature of the food [°C] (food safety). */
  safeCoreTempC: number;
  lidOn: boolean;
  /** Preferred backup stove id (lib/fuel STOVES). */
  backupStove: string;
  notes: string | null;
  archived: boolean;
}

export const DishSchema = new EntitySchema<Dish>({
  name: 'Dish',
  tableName: 'dishes',
  properties: {
    ...baseProperties,
    organisation: { kind: 'm:1', entity: 'Organisation', deleteRule: 'cascade' },
    name: { type: 'string', length: 200 },
    method: { type: 'string', length: 16 },
    servingsPerBatch: { type: 'integer' },
    foodKgPerServing: { type: 'double' },
    waterKgPerServing: { type: 'double' },
    foodCpJPerKgK: { type: 'double' },
    litresPerServing: { type: 'double' },
    minPotTempC: { type: 'double' },
    holdMin: { type: 'double' },
    safeCoreTempC: { type: 'double' },
    lidOn: { type: 'boolean', default: true },
    backupStove: { type: 'string', length: 32 },
    notes: { type: 'string', length: 1000, nullable: true },
    archived: { type: 'boolean', default: false },
  },
  uniques: [{ properties: ['organisation', 'name'] }],
});
