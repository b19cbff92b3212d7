/**
 * Safety notes for a slot: burn, hot-oil and food-safety cautions chosen from the dish's method, the
 * store medium and the predicted temperatures. Returned as codes with parameters so every language
 * words them itself (lib/i18n/messages, namespace "safety"). Every slot ends with the reminder to
 * follow local codes and trained practice.
 *
 * Sources of the rules:
 * - Burn first aid: cool running water for 20 minutes; no ice, butter or creams (burns first-aid
 *   guidance of national burn associations; lib/REFERENCES.md, secondary).
 * - Oil fire: never water; turn off the heat if safe, do not move the pot, cover with a lid or fire
 *   blanket (fire-service guidance); extinguisher Class K (NFPA 10) / Class F (EN 2, ISO 3941).
 * - Safe core temperatures (USDA FSIS chart, FoodSafety.gov): poultry 74 °C, ground meat and eggs
 *   71 °C, whole cuts and fish 63 °C + 3 min rest — the dish carries its own value.
 * - Hot holding ≥ 63 °C (Food Hygiene (Wales) Regulations 2006 Sch. 4; the FDA Food Code §3-501.16
 *   asks ≥ 57 °C — we show the stricter 63 °C).
 * - Water into hot oil spatters violently; lower food in slowly; never leave frying unattended;
 *   gloves, closed shoes, children away: common practice, no source.
 * - Store temperatures: every note that speaks of the store names the store's own temperatures (its
 *   melting range from lib/materials, the cooker's highest safe temperature, the predicted peak during
 *   the slot when known). Temperature parameters end in "C" and are in °C; the UI formats them in the
 *   reader's unit (components/safety-list.tsx).
 */
import { listMedia } from '@/lib/materials';

export type SafetyLevel = 'danger' | 'warning' | 'info';

export interface SafetyNote {
  code:
    | 'smoke-point'
    | 'oil-fire'
    | 'no-water-in-oil'
    | 'lower-slowly'
    | 'never-unattended'
    | 'pcm-store'
    | 'pcm-store-molten'
    | 'store-max-safe'
    | 'store-peak'
    | 'steam'
    | 'gloves-shoes'
    | 'children-away'
    | 'burn-first-aid'
    | 'core-temp'
    | 'hold-hot'
    | 'local-codes';
  level: SafetyLevel;
  params?: Record<string, number | string>;
}

export interface SlotSafetyInput {
  method: 'boil' | 'simmer' | 'steam' | 'bake' | 'fry';
  /** 'oil' | 'pcm' | 'custom' (custom tables are treated like oil when they give a smoke point). */
  mediumKind: 'oil' | 'pcm' | 'custom';
  smokePointC?: number | null;
  /** Highest store temperature predicted during the slot [°C]. */
  predictedStoreMaxC?: number | null;
  /** Melting range of a phase-change store [°C] (lib/materials), when known. */
  melting?: { solidusC: number; liquidusC: number } | null;
  /** The cooker's highest safe store temperature [°C], when known. */
  maxSafeTempC?: number | null;
  safeCoreTempC: number;
}

/** Hot-holding temperature shown to cooks [°C] (see the module comment). */
export const HOT_HOLD_C = 63;
/** Warn when the store comes within this of the smoke point [K] (common practice, no source). */
export const SMOKE_POINT_WARNING_MARGIN_K = 30;

/**
 * Melting range [°C] of a built-in phase-change medium by its display name (plans store the medium's kind and name),
 * or null when the name is not a built-in PCM.
 */
export function meltingRangeForMediumName(name: string): { solidusC: number; liquidusC: number } | null {
  const m = listMedia().find((x) => x.name === name)?.melting;
  return m ? { solidusC: m.solidusC, liquidusC: m.liquidusC } : null;
}

/** A temperature parameter [°C], rounded to 1 K for display. */
const deg = (tC: number) => Math.round(tC);

export function safetyNotesForSlot(s: SlotSafetyInput): SafetyNote[] {
  const notes: SafetyNote[] = [];
  const oily = s.mediumKind === 'oil' || (s.mediumKind === 'custom' && s.smokePointC != null);
  if (oily && s.smokePointC != null && s.predictedStoreMaxC != null && s.predictedStoreMaxC >= s.smokePointC - SMOKE_POINT_WARNING_MARGIN_K) {
    notes.push({ code: 'smoke-point', level: 'danger', params: { storeC: Math.round(s.predictedStoreMaxC), smokeC: Math.round(s.smokePointC) } });
  }
  if (oily || s.method === 'fry') notes.push({ code: 'oil-fire', level: 'danger' }, { code: 'no-water-in-oil', level: 'danger' });
  if (s.method === 'fry') notes.push({ code: 'lower-slowly', level: 'warning' }, { code: 'never-unattended', level: 'warning' });
  if (s.mediumKind === 'pcm') {
    // The melting range rounded outward, so the note never claims the store is solid where it may be molten.
    notes.push(
      s.melting
        ? { code: 'pcm-store', level: 'warning', params: { meltLowC: Math.floor(s.melting.solidusC), meltHighC: Math.ceil(s.melting.liquidusC) } }
        : { code: 'pcm-store-molten', level: 'warning' },
    );
  }
  if (s.maxSafeTempC != null) {
    const maxSafeC = deg(s.maxSafeTempC);
    if (s.predictedStoreMaxC != null) {
      const peakC = deg(s.predictedStoreMaxC);
      notes.push({ code: 'store-peak', level: peakC >= maxSafeC ? 'warning' : 'info', params: { peakC, maxSafeC } });
    } else {
      notes.push({ code: 'store-max-safe', level: 'info', params: { maxSafeC } });
    }
  }
  if (s.method === 'boil' || s.method === 'simmer' || s.method === 'steam') notes.push({ code: 'steam', level: 'warning' });
  notes.push({ code: 'gloves-shoes', level: 'warning' }, { code: 'children-away', level: 'warning' }, { code: 'burn-first-aid', level: 'info' });
  notes.push({ code: 'core-temp', level: 'info', params: { coreC: s.safeCoreTempC } }, { code: 'hold-hot', level: 'info', params: { holdC: HOT_HOLD_C } });
  notes.push({ code: 'local-codes', level: 'info' });
  return notes;
}
