import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base, type Locale } from './base';
import type { Organisation } from './organisation';

export interface Kitchen extends Base<'planning'> {
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
  /** Cooks' shift, turnaround between batches and backup fuels on hand (see KitchenPlanning). */
  planning: KitchenPlanning;
  /**
   * Monthly clear-sky index, January … December [0–1]: the share of the clear-sky global irradiance a
   * typical day of the month gets, used by the clear-sky fallback when no forecast exists. Null = the
   * defaults of lib/forecast/clearness.ts. Set by the coordinator.
   */
  clearness?: number[] | null;
}

/** How a kitchen plans: shift hours (local HH:MM), turnaround, currency and backup stoves with local prices. */
export interface KitchenPlanning {
  shiftStart: string;
  shiftEnd: string;
  turnaroundMin: number;
  /** A same-day plan puts no pot on before the time of solving plus this [min]. Absent: DEFAULT_LEAD_TIME_MIN. */
  leadTimeMin?: number;
  currency: string;
  /** Backup stoves on hand: stove id (lib/fuel STOVES), measured efficiency [0–1] if known, price per kg or kWh. */
  fuels: { stoveId: string; efficiency?: number; price?: number }[];
}

/** Time cooks need between a same-day plan and the first pot going on [min] (common practice, no source). */
export const DEFAULT_LEAD_TIME_MIN = 30;

export const DEFAULT_PLANNING: KitchenPlanning = {
  shiftStart: '06:00',
  shiftEnd: '19:00',
  turnaroundMin: 15,
  leadTimeMin: DEFAULT_LEAD_TIME_MIN,
  currency: 'USD',
  fuels: [{ stoveId: 'lpg' }, { stoveId: 'three-stone-wood' }],
};

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
    planning: { type: 'json', onCreate: () => structuredClone(DEFAULT_PLANNING) },
    clearness: { type: 'json', nullable: true },
  },
});
