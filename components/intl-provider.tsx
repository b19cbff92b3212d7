import { NextIntlClientProvider } from 'next-intl';
import { getLocale, getMessages } from 'next-intl/server';
import { MiniIntlProvider } from './mini-intl';

/**
 * The message providers for client components: next-intl's (most pages) and the small one the safety
 * notes and the cook's Today page use (components/mini-intl.tsx). Pages outside this provider (the
 * Today page) ship without next-intl's client runtime.
 */
export async function IntlProvider({ children }: { children: React.ReactNode }) {
  const [locale, messages] = await Promise.all([getLocale(), getMessages()]);
  return (
    <NextIntlClientProvider locale={locale} messages={messages}>
      <MiniIntlProvider locale={locale} messages={{ safety: messages.safety as never }}>
        {children}
      </MiniIntlProvider>
    </NextIntlClientProvider>
  );
}
