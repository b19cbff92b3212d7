/**
 * Which alerts a day calls for (lib/alerts/choose.ts), read from the day's model: ready alerts for
 * slots still to cook (none for skipped or done ones, none long past), predicted smoke-point
 * crossings, and the lead's at-once alerts (store low, measured smoke, a skip that is news).
 */
import { describe, expect, it } from 'vitest';
import { chooseLeadAlertsNow, choosePredictedSmokeAlerts, chooseReadyAlerts, MISSED_AFTER_MS } from '@/lib/alerts/choose';
import { buildKitchenDay } from '@/lib/day/model';
import { at, dayInputs } from '../day/fixtures';

describe('alert choosers', () => {
  it('one ready alert per slot still to cook, at its ready time', () => {
    const d = buildKitchenDay(dayInputs());
    expect(chooseReadyAlerts(d).map((a) => [a.batchId, a.fireAtMs, a.dedupeKey])).toEqual([
      ['rice-1', at(8), 'ready:plan-1:rice-1'],
      ['rice-2', at(10), 'ready:plan-1:rice-2'],
    ]);
  });

  it('no ready alert for a skipped or finished batch, nor for one due more than the grace period ago', () => {
    const checkIns = [{ batchId: 'rice-2', kind: 'skipped' as const, atMs: at(7), recordedAtMs: at(7), userName: 'Juma' }];
    const d = buildKitchenDay(dayInputs({ nowMs: at(8) + MISSED_AFTER_MS + 1, checkIns }));
    expect(chooseReadyAlerts(d)).toEqual([]);
  });

  it('a skip is told to the lead once it is known, with who and the fuel; an old one is not news', () => {
    const checkIns = [{ batchId: 'rice-2', kind: 'skipped' as const, atMs: at(7), recordedAtMs: at(7), userName: 'Juma' }];
    const skippedFuel = [{ batchId: 'rice-2', stoveId: 'lpg', fuelId: 'lpg', amount: 0.94, unit: 'kg' as const, cost: null, co2Kg: 2.7, co2BiogenicKg: 0, usefulKWh: 4 }];
    const now = chooseLeadAlertsNow(buildKitchenDay(dayInputs({ nowMs: at(7), checkIns, skippedFuel })));
    expect(now).toEqual([expect.objectContaining({ kind: 'skipped', batchId: 'rice-2', fireAtMs: null, params: expect.objectContaining({ who: 'Juma', fuel: 'lpg:0.9:kg', cooker: 'Dish 1' }) })]);
    expect(chooseLeadAlertsNow(buildKitchenDay(dayInputs({ nowMs: at(9), checkIns, skippedFuel })))).toEqual([]);
  });

  it('the plan’s store crossing the smoke-point margin is one predicted alert at the first crossing', () => {
    const d = buildKitchenDay(dayInputs());
    // 225 °C smoke point − 30 K = 195 °C, first reached at 11:00.
    const series = [{ cookerId: 'c1', t: [at(9), at(10), at(11), at(12)], storeTempC: [150, 190, 196, 201] }];
    expect(choosePredictedSmokeAlerts(d, series)).toEqual([expect.objectContaining({ kind: 'smoke-point', fireAtMs: at(11), params: expect.objectContaining({ storeC: 201, smokeC: 225, measured: 0 }) })]);
    expect(choosePredictedSmokeAlerts(d, [{ cookerId: 'c1', t: [at(9)], storeTempC: [150] }])).toEqual([]);
  });
});
