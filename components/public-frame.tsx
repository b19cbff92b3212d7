import { LanguagePicker } from './language-picker';
import { IntlProvider } from './intl-provider';
import { Brand } from './brand';

/** Frame for pages seen before signing in. */
export async function PublicFrame({ title, tagline, children }: { title: string; tagline: string; children: React.ReactNode }) {
  return (
    <IntlProvider>
    <main id="main" className="mx-auto flex min-h-screen max-w-md flex-col justify-center gap-6 px-4 py-8">
      <div className="flex items-center justify-between">
        <p className="flex items-center gap-2 text-xl font-bold">
          <Brand large />
        </p>
        <LanguagePicker signedIn={false} />
      </div>
      <p className="text-clay-700">{tagline}</p>
      <section className="card" aria-labelledby="page-title">
        <h1 id="page-title" className="mb-4 text-2xl font-bold">{title}</h1>
        {children}
      </section>
    </main>
    </IntlProvider>
  );
}
