import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base, type Locale } from './base';
import type { Organisation } from './organisation';

export interface Kitchen extends Base {
  organisation: Organisation;
  name: string;
  /** [°] north positive */
  latitude: number;
  /** [°] east positive */
  longitude: number;
  /** [m] above sea level */
  altitudeM: number;
  /** IANA time zone, e.g. "Africa/Nairobi" */
  timeZone: string;
  locale: Locale;
  /**
   * Monthly clear-sky index, January … December [0–1]: the share of the clear-sky global irradiance a
   * typical day of the month gets, used by the clear-sky fallback when no forecast exists. Null = the
   * defaults of lib/forecast/clearness.ts. Set by the coordinator.
   */
  clearness?: number[] | null;
}

export const KitchenSchema = new EntitySchema<Kitchen>({
  name: 'Kitchen',
  tableName: 'kitchens',
  properties: {
    ...baseProperties,
    organisation: { kind: 'm:1', entity: 'Organisation', deleteRule: 'cascade' },
    name: { type: 'string', length: 200 },
    latitude: { type: 'double' },
    longitude: { type: 'double' },
    altitudeM: { type: 'double' },
    timeZone: { type: 'string', length: 64 },
    locale: { type: 'string', length: 8, default: 'en' },
    clearness: { type: 'json', nullable: true },
  },
});
