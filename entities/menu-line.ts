import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { Dish } from './dish';

/** One line of a kitchen's menu for a day: a dish, how many servings, served by when. */
export interface MenuLine extends Base {
  kitchen: Kitchen;
  /** Local date YYYY-MM-DD. */
  date: string;
  dish: Dish;
  servings: number;
  /** Local clock times HH:MM. */
  serveBy: string;
  earliestStart: string | null;
  position: number;
}

export const MenuLineSchema = new EntitySchema<MenuLine>({
  name: 'MenuLine',
  tableName: 'menu_lines',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    date: { type: 'string', length: 10 },
    dish: { kind: 'm:1', entity: 'Dish', deleteRule: 'cascade' },
    servings: { type: 'integer' },
    serveBy: { type: 'string', length: 5 },
    earliestStart: { type: 'string', length: 5, nullable: true },
    position: { type: 'integer', default: 0 },
  },
  indexes: [{ properties: ['kitchen', 'date'] }],
});
