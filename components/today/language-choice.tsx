'use client';

import { useId, useState } from 'react';
import { useTranslations } from '../mini-intl';

const NAMES = { en: 'English', fr: 'Français' } as const;

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
          document.cookie = `hc_locale=${next}; path=/; max-age=31536000; samesite=lax`;
          await fetch('/api/v1/me', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ locale: next }) }).catch(() => undefined);
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
