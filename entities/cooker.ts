import { EntitySchema } from '@mikro-orm/core';
import { baseProperties, type Base } from './base';
import type { Kitchen } from './kitchen';
import type { StorageMedium } from './storage-medium';

import { COOKER_KINDS, TRACKING_MODES } from './constants';
export { COOKER_KINDS, TRACKING_MODES };
export type CookerKind = (typeof COOKER_KINDS)[number];
export type TrackingMode = (typeof TRACKING_MODES)[number];

export interface CookerPot {
  id: string;
  name: string;
  volumeL: number;
  massKg: number;
  cpJPerKgK: number;
  coupling: { kind: 'constant'; uaWPerK: number } | { kind: 'natural-convection'; contactAreaM2: number };
  lidAreaM2: number;
  lidUWPerM2K: number;
}

/** A solar cooker with its heat store and pots: the register entry behind every prediction. */
export interface Cooker extends Base {
  kitchen: Kitchen;
  name: string;
  kind: CookerKind;
  /** Collector aperture [m²]. */
  apertureM2: number;
  tracking: TrackingMode;
  /** Fixed aperture slope [°] and azimuth eastward from north [°]. */
  tiltDeg: number;
  surfaceAzimuthDeg: number;
  collectorModel: 'iso9806' | 'lumped';
  /** Optical efficiency [–]. */
  eta0: number;
  /** ISO 9806 loss coefficients [W/(m²·K)], [W/(m²·K²)]. */
  a1: number;
  a2: number;
  /** Lumped collector loss [W/K]. */
  uLossWPerK: number;
  /** Built-in medium id (lib/materials) or "custom". */
  mediumId: string;
  customMedium: StorageMedium | null;
  storeMassKg: number;
  storeUaWPerK: number;
  storeNodes: number;
  maxSafeTempC: number;
  minUsefulTempC: number;
  pots: CookerPot[];
  archived: boolean;
}

export const CookerSchema = new EntitySchema<Cooker>({
  name: 'Cooker',
  tableName: 'cookers',
  properties: {
    ...baseProperties,
    kitchen: { kind: 'm:1', entity: 'Kitchen', deleteRule: 'cascade' },
    name: { type: 'string', length: 200 },
    kind: { type: 'string', length: 24 },
    apertureM2: { type: 'double' },
    tracking: { type: 'string', length: 16 },
    tiltDeg: { type: 'double' },
    surfaceAzimuthDeg: { type: 'double' },
    collectorModel: { type: 'string', length: 16 },
    eta0: { type: 'double' },
    a1: { type: 'double', default: 0 },
    a2: { type: 'double', default: 0 },
    uLossWPerK: { type: 'double', default: 0 },
    mediumId: { type: 'string', length: 64 },
    customMedium: { kind: 'm:1', entity: 'StorageMedium', nullable: true, deleteRule: 'set null' },
    storeMassKg: { type: 'double' },
    storeUaWPerK: { type: 'double' },
    storeNodes: { type: 'integer', default: 1 },
    maxSafeTempC: { type: 'double' },
    minUsefulTempC: { type: 'double' },
    pots: { type: 'json' },
    archived: { type: 'boolean', default: false },
  },
});
