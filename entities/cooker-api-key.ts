import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { Cooker } from './cooker';
import type { User } from './user';

/** A key a sensor on one cooker sends readings with. Shown once; only its SHA-256 is stored. */
export interface CookerApiKey extends Base {
  kitchen: Kitchen;
  cooker: Cooker;
  label: string;
  keyHash: string;
  /** First characters of the key, to tell keys apart in the list. */
  prefix: string;
  createdBy: User | null;
  revokedAt: Date | null;
  lastUsedAt: Date | null;
}

export const CookerApiKeySchema = new EntitySchema<CookerApiKey>({
  name: 'CookerApiKey',
  tableName: 'cooker_api_keys',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    cooker: { kind: 'm:1', entity: 'Cooker', deleteRule: 'cascade' },
    label: { type: 'string', length: 100 },
    keyHash: { type: 'string', length: 64, unique: true, hidden: true },
    prefix: { type: 'string', length: 16 },
    createdBy: { kind: 'm:1', entity: 'User', nullable: true, deleteRule: 'set null' },
    revokedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
    lastUsedAt: { type: 'Date', columnType: 'timestamptz', nullable: true },
  },
});
