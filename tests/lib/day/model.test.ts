/**
 * The read model of a kitchen's day (lib/day/model.ts), pure: slot states follow the clock and the
 * cooks' marks, ready times follow a re-prediction when there is one, skipped batches join the backup
 * list with their fuel, the servings add up, and a ready time after serve-by is a warning.
 */
import { describe, expect, it } from 'vitest';
import { buildKitchenDay, marksFromCheckIns } from '@/lib/day/model';
import type { Reprediction } from '@/lib/day/repredict';
import { at, dayInputs, H } from './fixtures';

const slotsOf = (d: ReturnType<typeof buildKitchenDay>) => Object.fromEntries(d.cookers.flatMap((c) => c.slots).map((s) => [s.batchId, s]));

describe('buildKitchenDay', () => {
  it('no plan: an empty day that says so', () => {
    const d = buildKitchenDay(dayInputs({ plan: null }));
    expect(d.plan).toBeNull();
    expect(d.cookers).toEqual([]);
    expect(d.servings).toEqual({ total: 0, onSun: 0, backup: 0 });
  });

  it('before the shift every slot is planned; servings on the sun and on backup add up to the menu', () => {
    const d = buildKitchenDay(dayInputs());
    expect(Object.values(slotsOf(d)).map((s) => s.state)).toEqual(['planned', 'planned']);
    expect(d.servings).toEqual({ total: 300, onSun: 200, backup: 100 });
    expect(d.backup.map((b) => [b.batchId, b.reason, b.fuelId, b.amount])).toEqual([['beans-1', 'no-cooker-hot-enough', 'lpg', 1.2]]);
  });

  it('at 20:00 the morning’s unstarted slots are missed, not "planned" (the evening contradiction)', () => {
    const d = buildKitchenDay(dayInputs({ nowMs: at(20) }));
    expect(Object.values(slotsOf(d)).map((s) => s.state)).toEqual(['missed', 'missed']);
  });

  it('a started batch shifts its planned ready time by how late it went on; a skipped one goes to backup with who skipped it', () => {
    const checkIns = [
      { batchId: 'rice-1', kind: 'started' as const, atMs: at(7.5), recordedAtMs: at(7.5), userName: 'Amina' },
      { batchId: 'rice-2', kind: 'skipped' as const, atMs: at(8), recordedAtMs: at(8.2), userName: 'Juma' },
    ];
    const d = buildKitchenDay(dayInputs({ nowMs: at(8.25), checkIns, skippedFuel: [{ batchId: 'rice-2', stoveId: 'lpg', fuelId: 'lpg', amount: 0.9, unit: 'kg', cost: null, co2Kg: 2.7, co2BiogenicKg: 0, usefulKWh: 4 }] }));
    const s = slotsOf(d);
    expect(s['rice-1']!.readyMs).toBe(at(8.5));
    expect(s['rice-1']!.state).toBe('cooking');
    expect(s['rice-2']!.state).toBe('skipped');
    expect(d.backup.find((b) => b.batchId === 'rice-2')).toMatchObject({ reason: 'skipped', fuelId: 'lpg', amount: 0.9 });
    expect(d.skippedBy['rice-2']).toEqual({ userName: 'Juma', recordedAtMs: at(8.2) });
    expect(d.servings).toEqual({ total: 300, onSun: 100, backup: 200 });
  });

  it('a re-prediction moves the ready time; one after serve-by is a warning, and a store that cannot do it is "store-low"', () => {
    const r: Reprediction = {
      slots: {
        'rice-1': { batchId: 'rice-1', readyMs: at(12.5), doneMs: null, source: 'reading' },
        'rice-2': { batchId: 'rice-2', readyMs: null, doneMs: null, source: 'reading' },
      },
      fromMs: at(7),
      series: { t: [at(7), at(7) + 60_000], storeTempC: [110, 109] },
      maxStoreTempC: 110,
    };
    const d = buildKitchenDay(dayInputs({ nowMs: at(7), repredicted: new Map([['c1', r]]), checkIns: [{ batchId: 'rice-1', kind: 'started', atMs: at(7), recordedAtMs: at(7), userName: null }] }));
    const s = slotsOf(d);
    expect(s['rice-1']).toMatchObject({ readyMs: at(12.5), readySource: 'reading' });
    expect(d.warnings).toContainEqual({ kind: 'ready-after-serve-by', cookerId: 'c1', batchId: 'rice-1', dishName: 'Rice', readyMs: at(12.5), serveByMs: at(12) });
    expect(d.warnings.some((w) => w.kind === 'store-low' && w.batchId === 'rice-2')).toBe(true);
    expect(d.cookers[0]!.storeNowC).toBe(110);
  });

  it('a reading close to the oil’s smoke point warns as measured', () => {
    const readings = new Map([['c1', { id: 'r', cookerId: 'c1', atMs: at(11), storeC: 200, potC: null, potId: null, source: 'manual' as const }]]);
    const d = buildKitchenDay(dayInputs({ nowMs: at(11) + 0.1 * H, readings }));
    // Smoke point 225 °C less the 30 K margin (lib/safety/notes.ts) = 195 °C ≤ 200 °C.
    expect(d.warnings).toContainEqual({ kind: 'smoke-point', cookerId: 'c1', storeC: 200, smokeC: 225, measured: true, atMs: at(11) });
  });

  it('marks keep the first time of each kind', () => {
    const m = marksFromCheckIns([
      { batchId: 'a', kind: 'started', atMs: 5 },
      { batchId: 'a', kind: 'started', atMs: 3 },
      { batchId: 'a', kind: 'done', atMs: 9 },
    ]);
    expect(m.a).toEqual({ startedMs: 3, doneMs: 9 });
  });
});
