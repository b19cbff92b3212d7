import type { Cooker, CookerPot, StorageMedium as CustomMediumRow } from '@/entities';
import type { CookerInput } from '@/lib/validations/cookers';
import type { CookerSpec } from '@/lib/thermal';
import type { ApertureGeometry } from '@/lib/solar';

/** Concentrators use beam irradiance only; box and evacuated-tube cookers also take diffuse and ground-reflected light. */
export const BEAM_ONLY_KINDS = new Set(['dish', 'trough']);

/** The register entry as the thermal model's CookerSpec. */
export function toCookerSpec(c: Pick<Cooker, 'apertureM2' | 'collectorModel' | 'eta0' | 'a1' | 'a2' | 'uLossWPerK' | 'mediumId' | 'storeMassKg' | 'storeUaWPerK' | 'storeNodes' | 'maxSafeTempC' | 'minUsefulTempC' | 'pots'>, custom?: Pick<CustomMediumRow, 'name' | 'rows' | 'smokePointC'> | null): CookerSpec {
  return {
    collector:
      c.collectorModel === 'iso9806'
        ? { model: 'iso9806', apertureM2: c.apertureM2, eta0: c.eta0, a1: c.a1, a2: c.a2 }
        : { model: 'lumped', apertureM2: c.apertureM2, eta0: c.eta0, uLossWPerK: c.uLossWPerK },
    store: {
      mediumId: c.mediumId,
      ...(c.mediumId === 'custom' && custom ? { customTable: { name: custom.name, rows: custom.rows, ...(custom.smokePointC != null ? { smokePointC: custom.smokePointC } : {}) } } : {}),
      massKg: c.storeMassKg,
      uaLossWPerK: c.storeUaWPerK,
      nodes: c.storeNodes,
      maxSafeTempC: c.maxSafeTempC,
      minUsefulTempC: c.minUsefulTempC,
    },
    pots: c.pots.map((p) => ({ id: p.id, volumeL: p.volumeL, massKg: p.massKg, cpJPerKgK: p.cpJPerKgK, coupling: p.coupling, lidAreaM2: p.lidAreaM2, lidUWPerM2K: p.lidUWPerM2K })),
  };
}

export function toApertureGeometry(c: Pick<Cooker, 'kind' | 'tracking' | 'tiltDeg' | 'surfaceAzimuthDeg'>): ApertureGeometry {
  return { tracking: c.tracking, tiltDeg: c.tiltDeg, surfaceAzimuthDeg: c.surfaceAzimuthDeg, beamOnly: BEAM_ONLY_KINDS.has(c.kind) };
}

/** Pots as entered (id and specific heat optional) → as stored: ids pot-1, pot-2…, aluminium 900 J/(kg·K) by default. */
export function normalisePots(pots: CookerInput['pots']): CookerPot[] {
  return pots.map((p, i) => ({ ...p, id: p.id ?? `pot-${i + 1}`, cpJPerKgK: p.cpJPerKgK ?? 900 }));
}
