import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { Cooker } from './cooker';
import type { User } from './user';

export const READING_SOURCES = ['manual', 'sensor'] as const;
export type ReadingSource = (typeof READING_SOURCES)[number];

/** A measured store and/or pot temperature [°C] of a cooker at an instant, typed by a cook or sent by a sensor. */
export interface Reading extends Base {
  kitchen: Kitchen;
  cooker: Cooker;
  /** When it was measured. */
  at: Date;
  storeC: number | null;
  potC: number | null;
  /** The pot the pot temperature belongs to (cooker pot id), when known. */
  potId: string | null;
  source: ReadingSource;
  user: User | null;
  /** The cooker API key that sent it (sensor readings). */
  apiKeyId: string | null;
}

export const ReadingSchema = new EntitySchema<Reading>({
  name: 'Reading',
  tableName: 'readings',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    cooker: { kind: 'm:1', entity: 'Cooker', deleteRule: 'cascade' },
    at: { type: 'Date', columnType: 'timestamptz' },
    storeC: { type: 'double', nullable: true },
    potC: { type: 'double', nullable: true },
    potId: { type: 'string', length: 40, nullable: true },
    source: { type: 'string', length: 8 },
    user: { kind: 'm:1', entity: 'User', nullable: true, deleteRule: 'set null' },
    apiKeyId: { type: 'uuid', nullable: true },
  },
  indexes: [{ properties: ['cooker', 'at'] }],
});
