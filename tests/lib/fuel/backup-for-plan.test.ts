import { describe, expect, it } from 'vitest';
/** Backup fuel of a plan's batches (lib/fuel/backup.ts), given planner batches as they are. */
import { compareWithAllOnWood, planBackupFuel } from '@/lib/fuel';
import type { PlannerBatch } from '@/lib/planner/types';

// A bake batch that stays below boiling: useful heat (5·3500 + 0.12·20·900)·(75 − 25) + 2·4186·(75 − 25) J
// (default stove pot 0.12 kg per litre of volume, aluminium 900 J/(kg·K); see lib/fuel/energy.ts).
const mk = (id: string, serveByMs: number): PlannerBatch => ({
  id,
  dishId: 'bake',
  dishName: 'Bean bake',
  servings: 50,
  method: 'bake',
  potVolumeNeededL: 20,
  foodKg: 5,
  foodCpJPerKgK: 3500,
  waterKg: 2,
  minTempC: 75,
  holdS: 0,
  lidOn: true,
  earliestStartMs: serveByMs - 3 * 3600_000,
  serveByMs,
});
const HEAT_J = (5 * 3500 + 0.12 * 20 * 900) * 50 + 2 * 4186 * 50;

describe('backup fuel for a plan', () => {
  const batches = [mk('a', Date.UTC(2024, 2, 20, 12)), mk('b', Date.UTC(2024, 2, 20, 18)), mk('c', Date.UTC(2024, 2, 21, 12))];
  const backup = [
    { batchId: 'b', reason: 'no-cooker-hot-enough' as const, detail: '' },
    { batchId: 'c', reason: 'no-free-pot' as const, detail: '' },
  ];
  it('counts only the backup batches, per day, LPG at 55 % and 47.3 MJ/kg (IPCC 2006 Vol. 2 Table 1.2)', () => {
    const ids = new Set(backup.map((x) => x.batchId));
    const r = planBackupFuel(batches.filter((b) => ids.has(b.id)), { ambientC: 25, altitudeM: 0, stove: 'lpg' });
    expect(r.perBatch.map((x) => x.batchId)).toEqual(['b', 'c']);
    expect(r.perDay.map((d) => [d.day, d.batches])).toEqual([
      ['2024-03-20', 1],
      ['2024-03-21', 1],
    ]);
    expect(r.total.amountByFuel.lpg).toBeCloseTo((2 * HEAT_J) / 0.55 / 47.3e6, 9);
  });
  it('all on wood: three batches on a 15 % fire, the sun avoids the wood of one', () => {
    const c = compareWithAllOnWood(batches, backup.map((x) => x.batchId), { ambientC: 25, altitudeM: 0, stove: 'lpg' });
    expect(c.allOnWood.amountByFuel.wood).toBeCloseTo((3 * HEAT_J) / 0.15 / 15.6e6, 9);
    expect(c.woodAvoidedKg).toBeCloseTo(HEAT_J / 0.15 / 15.6e6, 9);
    expect(c.solarShareOfHeat).toBeCloseTo(1 / 3, 12);
  });
});
