'use client';

import { useTranslations } from './mini-intl';
import type { SafetyNote } from '@/lib/safety/notes';
import { usePrefs } from './prefs';
import { LevelIcon } from './today/icons';

/** Safety notes (of a slot, a cooker or a dish), most serious first, each with a text label (not colour alone). */
export function SafetyList({ notes, compact = false }: { notes: SafetyNote[]; compact?: boolean }) {
  const t = useTranslations('safety');
  const { fmtTemp } = usePrefs();
  // Temperatures (params named …C, in °C) are shown in the reader's unit, like the rest of the page.
  const words = (n: SafetyNote) => Object.fromEntries(Object.entries(n.params ?? {}).map(([k, v]) => [k, typeof v === 'number' && k.endsWith('C') ? fmtTemp(v) : v]));
  // Compact (the lead's plan): the dangers and warnings, and the reminder; cooks see every note.
  const shown = compact ? notes.filter((n) => n.level !== 'info' || n.code === 'local-codes') : notes;
  if (!shown.length) return null;
  return (
    <ul aria-label={t('title')} className={`mt-2 flex flex-col gap-1 ${compact ? 'text-xs' : 'text-sm'}`}>
      {shown.map((n) => (
        <li
          key={n.code}
          className={`flex gap-2 rounded px-2 py-1 ${n.level === 'danger' ? 'bg-ember-50 font-semibold text-ember-800' : n.level === 'warning' ? 'bg-amber-50 text-clay-900' : 'text-clay-700'}`}
        >
          <LevelIcon level={n.level} className="mt-0.5 h-4 w-4 shrink-0" />
          <span>{t(n.code, words(n))}</span>
        </li>
      ))}
    </ul>
  );
}
