'use client';

import { createContext, useContext } from 'react';
import { cToF } from '@/lib/units';

export interface Prefs {
  temperatureUnit: 'C' | 'F';
  locale: string;
}

const PrefsContext = createContext<Prefs>({ temperatureUnit: 'C', locale: 'en' });

export function PrefsProvider({ value, children }: { value: Prefs; children: React.ReactNode }) {
  return <PrefsContext.Provider value={value}>{children}</PrefsContext.Provider>;
}

/** The signed-in user's display preferences, and a temperature formatter in their unit. */
export function usePrefs() {
  const prefs = useContext(PrefsContext);
  const toUnit = (c: number) => (prefs.temperatureUnit === 'F' ? cToF(c) : c);
  const fmtTemp = (c: number | null | undefined, digits = 0) =>
    c == null || !Number.isFinite(c) ? '—' : `${new Intl.NumberFormat(prefs.locale, { maximumFractionDigits: digits, minimumFractionDigits: digits }).format(toUnit(c))} °${prefs.temperatureUnit}`;
  return { ...prefs, toUnit, fmtTemp, unitLabel: `°${prefs.temperatureUnit}` };
}
