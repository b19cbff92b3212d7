import { describe, expect, it } from 'vitest';
import { HOT_HOLD_C, meltingRangeForMediumName, safetyNotesForSlot } from '@/lib/safety/notes';
import { getMedium } from '@/lib/materials';
import en from '@/lib/i18n/messages/en.json';
import fr from '@/lib/i18n/messages/fr.json';

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
    // Refined sunflower oil smoke point 227 °C (handbook tables, lib/REFERENCES.md, secondary).
    const n = safetyNotesForSlot({ method: 'boil', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 205, safeCoreTempC: 74 });
    expect(n[0]).toEqual({ code: 'smoke-point', level: 'danger', params: { storeC: 205, smokeC: 227 } });
    const cool = safetyNotesForSlot({ method: 'boil', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 150, safeCoreTempC: 74 });
    expect(codes(cool)).not.toContain('smoke-point');
  });

  it('boiling on a PCM store carries steam and PCM cautions but no oil-fire note', () => {
    // With the store's melting range, as the plans pass it (erythritol's model range, lib/materials/pcm.ts).
    const n = codes(safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', melting: { solidusC: 116.1, liquidusC: 118.1 }, safeCoreTempC: 74 }));
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

describe("safety notes state the store's own temperatures", () => {
  const pcmNote = (id: string) => {
    const m = getMedium(id).melting!;
    return safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', melting: m, maxSafeTempC: 150, safeCoreTempC: 74 }).find((x) => x.code === 'pcm-store');
  };

  it.each([
    // Published melting points: erythritol 390.254 K = 117.1 °C (J. Therm. Anal. Calorim. 95(2):469, secondary);
    // D-mannitol 166–167 °C and NaNO₃–KNO₃ 60:40 from ≈ 220 °C (Sharma et al. 2009, RSER 13:318; from memory).
    ['erythritol', 117.1, 117.1],
    ['d-mannitol', 166, 167],
    ['solar-salt', 220, 220],
  ])('%s: the PCM note gives a melting range that brackets the published melting point (%f–%f °C)', (id, lo, hi) => {
    const n = pcmNote(id);
    expect(n?.level).toBe('warning');
    const { meltLowC, meltHighC } = n!.params as { meltLowC: number; meltHighC: number };
    expect(meltLowC).toBeLessThanOrEqual(lo);
    expect(meltHighC).toBeGreaterThanOrEqual(hi);
    expect(meltHighC - meltLowC).toBeLessThanOrEqual(25); // a range, not a blanket statement
    expect(meltLowC).not.toBe(100);
  });

  it('without a known melting range the PCM note names no temperature (never a made-up one)', () => {
    const n = safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', safeCoreTempC: 74 });
    expect(n.find((x) => x.code === 'pcm-store-molten')).toEqual({ code: 'pcm-store-molten', level: 'warning' });
    expect(codes(n)).not.toContain('pcm-store');
  });

  it('built-in PCMs are found by their display name (plans store the name); oils and unknown names are not', () => {
    expect(meltingRangeForMediumName(getMedium('d-mannitol').name)).toEqual({ solidusC: 165.5, liquidusC: 167.5 });
    expect(meltingRangeForMediumName(getMedium('sunflower-oil').name)).toBeNull();
    expect(meltingRangeForMediumName('Local blend')).toBeNull();
  });

  it('the highest safe temperature, and the predicted peak when known, are in a note for every store', () => {
    const peak = safetyNotesForSlot({ method: 'boil', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 151.6, maxSafeTempC: 195, safeCoreTempC: 74 });
    expect(peak.find((x) => x.code === 'store-peak')).toEqual({ code: 'store-peak', level: 'info', params: { peakC: 152, maxSafeC: 195 } });
    const atCap = safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', melting: { solidusC: 116.1, liquidusC: 118.1 }, predictedStoreMaxC: 155, maxSafeTempC: 155, safeCoreTempC: 74 });
    expect(atCap.find((x) => x.code === 'store-peak')?.level).toBe('warning');
    const noPeak = safetyNotesForSlot({ method: 'bake', mediumKind: 'custom', maxSafeTempC: 180, safeCoreTempC: 74 });
    expect(noPeak.find((x) => x.code === 'store-max-safe')).toEqual({ code: 'store-max-safe', level: 'info', params: { maxSafeC: 180 } });
    expect(codes(noPeak)).not.toContain('store-peak');
  });

  it('every note has a message in both languages whose placeholders are exactly its parameters, temperatures only as …C placeholders', () => {
    const samples = [
      safetyNotesForSlot({ method: 'fry', mediumKind: 'oil', smokePointC: 227, predictedStoreMaxC: 210, maxSafeTempC: 215, safeCoreTempC: 74 }),
      safetyNotesForSlot({ method: 'boil', mediumKind: 'pcm', melting: { solidusC: 219.5, liquidusC: 240 }, maxSafeTempC: 300, safeCoreTempC: 71 }),
      safetyNotesForSlot({ method: 'steam', mediumKind: 'pcm', safeCoreTempC: 63 }),
    ].flat();
    for (const messages of [en, fr]) {
      const safety = messages.safety as Record<string, string>;
      for (const note of samples) {
        const text = safety[note.code];
        expect(text, note.code).toBeTypeOf('string');
        const placeholders = [...text!.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort();
        expect(placeholders, note.code).toEqual(Object.keys(note.params ?? {}).sort());
      }
      // No literal temperature in any safety message (e.g. "100 °C"): the UI formats °C/°F from the parameters.
      for (const [key, text] of Object.entries(safety)) expect(text, key).not.toMatch(/\d\s*°|°\s*[CF]\b/);
    }
  });
});
