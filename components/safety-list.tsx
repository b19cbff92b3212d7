'use client';

import { useTranslations } from 'next-intl';
import type { SafetyNote } from '@/lib/safety/notes';

const ICON = { danger: '⛔', warning: '⚠', info: 'ℹ' } as const;

/** Safety notes of a slot, most serious first, each with a text label (not colour alone). */
export function SafetyList({ notes, compact = false }: { notes: SafetyNote[]; compact?: boolean }) {
  const t = useTranslations('safety');
  if (!notes.length) return null;
  return (
    <ul aria-label={t('title')} className={`mt-2 flex flex-col gap-1 ${compact ? 'text-xs' : 'text-sm'}`}>
      {notes.map((n) => (
        <li
          key={n.code}
          className={`flex gap-2 rounded px-2 py-1 ${n.level === 'danger' ? 'bg-ember-50 font-semibold text-ember-800' : n.level === 'warning' ? 'bg-amber-50 text-clay-900' : 'text-clay-700'}`}
        >
          <span aria-hidden="true">{ICON[n.level]}</span>
          <span>{t(n.code, n.params ?? {})}</span>
        </li>
      ))}
    </ul>
  );
}
