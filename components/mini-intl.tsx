'use client';

/**
 * A very small client-side stand-in for next-intl's useTranslations/useFormatter, for the cook's Today
 * page only: cooks are on cheap phones and weak links, and next-intl's client runtime is 12 kB gzip of
 * the page's budget. Messages still come from lib/i18n/messages (picked on the server with next-intl);
 * this formats {name} arguments and {n, plural, one {…} other {…}} with Intl.PluralRules, which is all
 * those namespaces use.
 */
import { createContext, useContext, useMemo } from 'react';

type Messages = { [key: string]: string | Messages };
type Params = Record<string, string | number | Date>;

const Ctx = createContext<{ locale: string; messages: Messages }>({ locale: 'en', messages: {} });

export function MiniIntlProvider({ locale, messages, children }: { locale: string; messages: Messages; children: React.ReactNode }) {
  const value = useMemo(() => ({ locale, messages }), [locale, messages]);
  return <Ctx.Provider value={value}>{children}</Ctx.Provider>;
}

function lookup(messages: Messages, path: string): string | undefined {
  let node: string | Messages | undefined = messages;
  for (const part of path.split('.')) node = typeof node === 'object' ? node[part] : undefined;
  return typeof node === 'string' ? node : undefined;
}

/** Formats an ICU-style message: {arg} and {arg, plural, =0 {…} one {…} other {…}} with # for the number. */
export function formatMessage(template: string, params: Params, locale: string): string {
  let out = '';
  let i = 0;
  while (i < template.length) {
    const open = template.indexOf('{', i);
    if (open < 0) break;
    out += template.slice(i, open);
    // Find the matching brace.
    let depth = 0;
    let j = open;
    for (; j < template.length; j++) {
      if (template[j] === '{') depth++;
      else if (template[j] === '}' && --depth === 0) break;
    }
    const body = template.slice(open + 1, j);
    const [name = '', kind, ...rest] = body.split(',');
    const value = params[name.trim()];
    if (kind?.trim() === 'plural' && typeof value === 'number') {
      const options = rest.join(',');
      const cases = new Map<string, string>();
      const re = /\s*(=?\w+)\s*\{/g;
      let m: RegExpExecArray | null;
      while ((m = re.exec(options))) {
        let d = 1;
        let k = re.lastIndex;
        for (; k < options.length && d > 0; k++) d += options[k] === '{' ? 1 : options[k] === '}' ? -1 : 0;
        cases.set(m[1]!, options.slice(re.lastIndex, k - 1));
        re.lastIndex = k;
      }
      const chosen = cases.get(`=${value}`) ?? cases.get(new Intl.PluralRules(locale).select(value)) ?? cases.get('other') ?? '';
      out += formatMessage(chosen.replace(/#/g, new Intl.NumberFormat(locale).format(value)), params, locale);
    } else {
      out += value instanceof Date ? value.toLocaleString(locale) : value === undefined ? `{${body}}` : String(value);
    }
    i = j + 1;
  }
  return out + template.slice(i);
}

export function useTranslations(namespace?: string) {
  const { locale, messages } = useContext(Ctx);
  return useMemo(() => {
    const t = (key: string, params: Params = {}) => {
      const path = namespace ? `${namespace}.${key}` : key;
      const template = lookup(messages, path);
      return template === undefined ? path : formatMessage(template, params, locale);
    };
    return t;
  }, [locale, messages, namespace]);
}

export function useFormatter() {
  const { locale } = useContext(Ctx);
  return useMemo(
    () => ({
      number: (v: number, opts?: Intl.NumberFormatOptions) => new Intl.NumberFormat(locale, opts).format(v),
      dateTime: (d: Date, opts?: Intl.DateTimeFormatOptions) => new Intl.DateTimeFormat(locale, opts).format(d),
    }),
    [locale],
  );
}
