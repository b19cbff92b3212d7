import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Organisation } from './organisation';

/**
 * A custom storage medium defined by a kitchen lead from a table of measured values. Built-in media
 * (oils, phase-change materials) live in lib/materials and are not stored.
 */
export interface StorageMedium extends Base {
  organisation: Organisation;
  name: string;
  /** Rows sorted by temperature: tC [°C], density [kg/m³], cp [J/(kg·K)], k [W/(m·K)], viscosity [Pa·s]. */
  rows: { tC: number; density: number; cp: number; k: number; viscosity: number }[];
  smokePointC: number | null;
  source: string | null;
}

export const StorageMediumSchema = new EntitySchema<StorageMedium>({
  name: 'StorageMedium',
  tableName: 'storage_media',
  properties: {
    ...baseProperties,
    organisation: { kind: 'm:1', entity: 'Organisation', deleteRule: 'cascade' },
    name: { type: 'string', length: 200 },
    rows: { type: 'json' },
    smokePointC: { type: 'double', nullable: true },
    source: { type: 'string', length: 500, nullable: true },
  },
});
