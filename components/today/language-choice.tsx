'use client';

import { useId, useState } from 'react';
import { LANGUAGE_NAMES as NAMES, saveLanguage } from '@/lib/client/language';
import { useTranslations } from '../mini-intl';

/** The cook's language picker: saved on the account and in the browser, then the page reloads in it. */
export function LanguageChoice({ locale }: { locale: string }) {
  const t = useTranslations('today');
  const id = useId();
  const [busy, setBusy] = useState(false);
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm font-semibold">
        {t('language')}
      </label>
      <select
        id={id}
        className="min-h-12 rounded-md border border-clay-200 bg-white px-2 text-base"
        value={locale}
        disabled={busy}
        onChange={async (e) => {
          const next = e.target.value;
          setBusy(true);
          await saveLanguage(next, true);
          location.reload();
        }}
      >
        {Object.entries(NAMES).map(([code, name]) => (
          <option key={code} value={code} lang={code}>
            {name}
          </option>
        ))}
      </select>
    </div>
  );
}
