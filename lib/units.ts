import type { TemperatureUnit } from '@/entities/base';

/** °C → °F (exact definition: °F = °C × 9/5 + 32). */
export const cToF = (c: number) => (c * 9) / 5 + 32;
export const fToC = (f: number) => ((f - 32) * 5) / 9;

/** A temperature for display in the user's unit, with the unit, formatted for the locale. */
export function formatTemperature(c: number, unit: TemperatureUnit, locale: string, digits = 0): string {
  const v = unit === 'F' ? cToF(c) : c;
  return `${new Intl.NumberFormat(locale, { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(v)} °${unit}`;
}
