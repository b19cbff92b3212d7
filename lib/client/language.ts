/** Saves the interface language: in the browser's cookie (read before sign-in) and, when signed in, on the account. */
export async function saveLanguage(locale: string, signedIn: boolean): Promise<void> {
  document.cookie = `hc_locale=${locale}; path=/; max-age=31536000; samesite=lax`;
  if (signedIn) await fetch('/api/v1/me', { method: 'PATCH', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ locale }) }).catch(() => undefined);
}

/** The languages offered, each in its own language. */
export const LANGUAGE_NAMES = { en: 'English', fr: 'Français' } as const;
