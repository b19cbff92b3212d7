/** Default monthly clear-sky index by latitude band: 0.75 dry, 0.6 wet (common practice, no source). */
import { describe, expect, it } from 'vitest';
import { defaultClearness, isClearnessTable, kitchenClearness } from '@/lib/forecast/clearness';

describe('defaultClearness', () => {
  it('north of 5° N: wet June–September (West African and South Asian monsoon)', () => {
    expect(defaultClearness(12.37)).toEqual([0.75, 0.75, 0.75, 0.75, 0.75, 0.6, 0.6, 0.6, 0.6, 0.75, 0.75, 0.75]);
  });
  it('south of 5° S: wet December–March', () => {
    expect(defaultClearness(-6.16)).toEqual([0.6, 0.6, 0.6, 0.75, 0.75, 0.75, 0.75, 0.75, 0.75, 0.75, 0.75, 0.6]);
  });
  it('near the equator: the two rainy seasons', () => {
    expect(defaultClearness(0.3)).toEqual([0.75, 0.75, 0.75, 0.6, 0.6, 0.75, 0.75, 0.75, 0.75, 0.6, 0.6, 0.75]);
  });
});

describe('kitchenClearness', () => {
  it('uses the kitchen’s own 12 values, else the defaults', () => {
    const own = [0.9, 0.9, 0.85, 0.8, 0.7, 0.6, 0.5, 0.5, 0.6, 0.8, 0.9, 0.9];
    expect(kitchenClearness({ latitude: 12, clearness: own })).toEqual({ values: own, isDefault: false });
    expect(kitchenClearness({ latitude: 12, clearness: null })).toEqual({ values: defaultClearness(12), isDefault: true });
    // A damaged value (wrong length, out of range) falls back to the defaults rather than breaking planning.
    expect(kitchenClearness({ latitude: 12, clearness: [0.5] }).isDefault).toBe(true);
    expect(isClearnessTable([...own.slice(0, 11), 1.2])).toBe(false);
  });
});
