import type { Metadata, Viewport } from 'next';
import { getLocale } from 'next-intl/server';
import '@fontsource/lexend/400.css';
import '@fontsource/lexend/600.css';
import '@fontsource/lexend/700.css';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Hearthcast', template: '%s · Hearthcast' },
  description: 'Plan community-kitchen cooking on stored-heat solar cookers.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#b4441e' };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  const locale = await getLocale();
  return (
    <html lang={locale}>
      <body className="min-h-screen antialiased">
        {children}
      </body>
    </html>
  );
}
