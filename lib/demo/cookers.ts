import type { CookerInput } from '@/lib/validations/cookers';

/**
 * Demo cookers (invented; plausible sizes and coefficients, "common practice, no source"): several
 * kinds, oil and phase-change stores, so a newcomer sees predictions at once.
 */
const pot = (id: string, name: string, volumeL: number, contactAreaM2: number) => ({
  id,
  name,
  volumeL,
  massKg: Math.round((0.09 * volumeL + 1) * 10) / 10,
  cpJPerKgK: 900, // aluminium ≈ 900 J/(kg·K) (from memory)
  coupling: { kind: 'natural-convection' as const, contactAreaM2 },
  lidAreaM2: Math.round(contactAreaM2 * 90) / 100,
  lidUWPerM2K: 6,
});

export const DEMO_COOKERS: Record<string, CookerInput[]> = {
  baobab: [
    {
      name: 'Dish 1 (sunflower store)',
      kind: 'dish', apertureM2: 5, tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 0,
      collectorModel: 'iso9806', eta0: 0.6, a1: 0.6, a2: 0.002, uLossWPerK: 0,
      mediumId: 'sunflower-oil', storeMassKg: 180, storeUaWPerK: 1.6, storeNodes: 1,
      maxSafeTempC: 195, minUsefulTempC: 110,
      pots: [pot('p1', 'Pot 1 (40 L)', 40, 0.28), pot('p2', 'Pot 2 (40 L)', 40, 0.28)],
    },
    {
      name: 'Box cooker A (rapeseed store)',
      kind: 'box', apertureM2: 1.4, tracking: 'fixed', tiltDeg: 20, surfaceAzimuthDeg: 0,
      collectorModel: 'lumped', eta0: 0.55, a1: 0, a2: 0, uLossWPerK: 3.5,
      mediumId: 'rapeseed-oil', storeMassKg: 35, storeUaWPerK: 0.8, storeNodes: 1,
      maxSafeTempC: 150, minUsefulTempC: 85,
      pots: [pot('p1', 'Pot (15 L)', 15, 0.12)],
    },
  ],
  tamarind: [
    {
      name: 'Trough (erythritol store)',
      kind: 'trough', apertureM2: 10, tracking: 'one-axis', tiltDeg: 0, surfaceAzimuthDeg: 180,
      collectorModel: 'iso9806', eta0: 0.65, a1: 0.45, a2: 0.003, uLossWPerK: 0,
      mediumId: 'erythritol', storeMassKg: 260, storeUaWPerK: 2.0, storeNodes: 1,
      maxSafeTempC: 155, minUsefulTempC: 100,
      pots: [pot('p1', 'Pot 1 (50 L)', 50, 0.32), pot('p2', 'Pot 2 (50 L)', 50, 0.32)],
    },
    {
      name: 'Dish 2 (palm-oil store)',
      kind: 'dish', apertureM2: 6, tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 180,
      collectorModel: 'iso9806', eta0: 0.58, a1: 0.7, a2: 0.002, uLossWPerK: 0,
      mediumId: 'palm-oil', storeMassKg: 140, storeUaWPerK: 1.5, storeNodes: 4,
      maxSafeTempC: 200, minUsefulTempC: 110,
      pots: [pot('p1', 'Pot (30 L)', 30, 0.22)],
    },
  ],
  saltbush: [
    {
      name: 'Tube cooker (soybean store)',
      kind: 'evacuated-tube', apertureM2: 3, tracking: 'fixed', tiltDeg: 30, surfaceAzimuthDeg: 180,
      collectorModel: 'iso9806', eta0: 0.6, a1: 1.4, a2: 0.006, uLossWPerK: 0,
      mediumId: 'soybean-oil', storeMassKg: 70, storeUaWPerK: 1.0, storeNodes: 1,
      maxSafeTempC: 180, minUsefulTempC: 95,
      pots: [pot('p1', 'Pot (25 L)', 25, 0.18)],
    },
    {
      name: 'Dish 3 (cottonseed store)',
      kind: 'dish', apertureM2: 10, tracking: 'two-axis', tiltDeg: 0, surfaceAzimuthDeg: 180,
      collectorModel: 'iso9806', eta0: 0.6, a1: 0.6, a2: 0.002, uLossWPerK: 0,
      mediumId: 'cottonseed-oil', storeMassKg: 220, storeUaWPerK: 1.8, storeNodes: 1,
      maxSafeTempC: 185, minUsefulTempC: 110,
      pots: [pot('p1', 'Pot 1 (60 L)', 60, 0.36), pot('p2', 'Pot 2 (60 L)', 60, 0.36)],
    },
  ],
};
