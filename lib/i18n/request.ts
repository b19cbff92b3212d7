import { getRequestConfig } from 'next-intl/server';
import { getRequestLocale } from './config';

/** next-intl without locale routing: the locale comes from a cookie, messages from JSON files. */
export default getRequestConfig(async () => {
  const locale = await getRequestLocale();
  const messages = (await import(`./messages/${locale}.json`)).default;
  return { locale, messages, timeZone: 'UTC' };
});
