import { cookies, headers } from 'next/headers';
import { LOCALES, type Locale } from '@/entities/base';

export const LOCALE_COOKIE = 'hc_locale';
export const DEFAULT_LOCALE: Locale = 'en';

export const isLocale = (v: unknown): v is Locale => typeof v === 'string' && (LOCALES as readonly string[]).includes(v);

/** The language of this request: the cookie set by the picker, else the browser's preference, else English. */
export async function getRequestLocale(): Promise<Locale> {
  const c = (await cookies()).get(LOCALE_COOKIE)?.value;
  if (isLocale(c)) return c;
  const accept = (await headers()).get('accept-language') ?? '';
  const first = accept.split(',')[0]?.trim().slice(0, 2).toLowerCase();
  return isLocale(first) ? first : DEFAULT_LOCALE;
}
