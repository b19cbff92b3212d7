'use client';

import { useLocale, useTranslations } from 'next-intl';
import { useRouter } from 'next/navigation';
import { useId, useTransition } from 'react';
import { LANGUAGE_NAMES as NAMES, saveLanguage } from '@/lib/client/language';

/** Switches the interface language; saved in a cookie and, when signed in, on the account. */
export function LanguagePicker({ signedIn }: { signedIn: boolean }) {
  const t = useTranslations('common');
  const locale = useLocale();
  const router = useRouter();
  const id = useId();
  const [pending, start] = useTransition();
  return (
    <div className="flex items-center gap-2">
      <label htmlFor={id} className="text-sm">
        {t('language')}
      </label>
      <select
        id={id}
        className="rounded-md border border-clay-200 bg-white px-2 py-1 text-sm text-clay-900"
        value={locale}
        disabled={pending}
        onChange={(e) => {
          const next = e.target.value;
          start(async () => {
            await saveLanguage(next, signedIn);
            router.refresh();
          });
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
