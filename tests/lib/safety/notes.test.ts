import { describe, expect, it } from 'vitest';
import { HOT_HOLD_C, safetyNotesForSlot } from '@/lib/safety/notes';

const codes = (n: ReturnType<typeof safetyNotesForSlot>) => n.map((x) => x.code);

describe('safety notes for a slot', () => {
  it('every slot ends with the reminder to follow local codes and trained practice', () => {
    for (const method of ['boil', 'simmer', 'steam', 'bake', 'fry'] as const) {
      const n = safetyNotesForSlot({ method, mediumKind: 'pcm', safeCoreTempC: 74 });
      expect(n.at(-1)?.code).toBe('local-codes');
      expect(codes(n)).toContain('burn-first-aid');
    }
  });

  it('frying adds the hot-oil cautions, even on a phase-change store', () => {
    const n = codes(safetyNotesForSlot({ method: 'fry', mediumKind: 'pcm', safeCoreTempC: 74 }));
    expect(n).toEqual(expect.arrayContaining(['oil-fire', 'no-water-in-oil', 'lower-slowly', 'never-unattended']));
  });

  it('an oil store near its smoke point warns first, with the temperatures', () => {
    // Refined sunflower oil smoke point 227 °C (handbook tables, REFERENCES.md, secondary).
    const n = safetyNotesForSlot({ method: 'boil', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 205, safeCoreTempC: 74 });
    expect(n[0]).toEqual({ code: 'smoke-point', level: 'danger', params: { storeC: 205, smokeC: 227 } });
    const cool = safetyNotesForSlot({ method: 'boil', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 150, safeCoreTempC: 74 });
    expect(codes(cool)).not.toContain('smoke-point');
  });

  it('boiling on a PCM store carries steam and PCM cautions but no oil-fire note', () => {
    const n = codes(safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', safeCoreTempC: 74 }));
    expect(n).toEqual(expect.arrayContaining(['steam', 'pcm-store']));
    expect(n).not.toContain('oil-fire');
  });

  it("uses the dish's safe core temperature and the 63 °C hot-holding rule", () => {
    // Poultry 74 °C (USDA FSIS chart); hot holding ≥ 63 °C (Food Hygiene (Wales) Regs 2006 Sch. 4).
    const n = safetyNotesForSlot({ method: 'simmer', mediumKind: 'oil', safeCoreTempC: 74 });
    expect(n.find((x) => x.code === 'core-temp')?.params).toEqual({ coreC: 74 });
    expect(HOT_HOLD_C).toBe(63);
  });
});
