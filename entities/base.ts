import { randomUUID } from 'node:crypto';
import type { EntitySchemaMetadata, OptionalProps } from '@mikro-orm/core';

/** Fields every entity carries. */
export interface Base<Optional extends string = never> {
  /** Filled on create (or defaulted); optional in em.create(). */
  [OptionalProps]?: 'id' | 'createdAt' | 'updatedAt' | Optional;
  id: string;
  createdAt: Date;
  updatedAt: Date;
}

/** Shared property definitions for the base fields (spread into each schema). */
export const baseProperties = {
  // onCreate runs at flush; pass id: randomUUID() to em.create when the id is needed before that (e.g. for the audit log).
  id: { type: 'uuid', primary: true, onCreate: () => randomUUID() },
  createdAt: { type: 'Date', columnType: 'timestamptz', onCreate: () => new Date() },
  updatedAt: { type: 'Date', columnType: 'timestamptz', onCreate: () => new Date(), onUpdate: () => new Date() },
} satisfies EntitySchemaMetadata<Base>['properties'];

import { LOCALES, ROLES, TEMPERATURE_UNITS } from './constants';
export { LOCALES, ROLES, TEMPERATURE_UNITS };
export type Role = (typeof ROLES)[number];
export type Locale = (typeof LOCALES)[number];
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];
