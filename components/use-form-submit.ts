'use client';

import { useLocale, useTranslations } from 'next-intl';
import { useCallback, useState } from 'react';
import type { z } from 'zod';
import { apiFetch, type ApiResult } from '@/lib/client/api';
import { formIssues, type IssueOptions, type Translate } from '@/lib/client/form-issues';

export type FormStatus = { msg: string; tone: 'info' | 'error' } | null;

export interface SubmitOptions<T> extends Omit<IssueOptions, 'input'> {
  /** The route handler's schema: the body is checked with it first and not sent when it fails. */
  schema?: z.ZodType;
  /** The JSON body (checked with `schema`, sent as it is: the server validates again). */
  body?: unknown;
  /** Where to send it; or `send` for another transport (e.g. a multipart upload). */
  path?: string;
  method?: 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  send?: () => Promise<ApiResult<T>>;
  /** Shown in the live region on success. */
  success?: string;
  onOk?: (data: T) => void | Promise<void>;
}

/**
 * The one form-submit pattern: busy flag, the route's zod schema checked in the browser (issues at their
 * fields, in the user's language), the request, the API's `{ error: { code, message, fields } }` at the
 * fields, and the result in a live region (`<Status>`). Returns the data, or undefined when it failed.
 */
export function useFormSubmit() {
  const tc = useTranslations('common');
  const tv = useTranslations('validation');
  const locale = useLocale();
  const [busy, setBusy] = useState(false);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<FormStatus>(null);

  const submit = useCallback(
    async <T = unknown>(o: SubmitOptions<T>): Promise<T | undefined> => {
      if (o.schema) {
        const parsed = o.schema.safeParse(o.body);
        if (!parsed.success) {
          const issues = formIssues(parsed.error, tv as unknown as Translate, { describe: o.describe, formats: o.formats, input: o.body, schemaLanguage: locale === 'en' });
          setFields(issues.fields);
          setStatus({ msg: issues.summary, tone: 'error' });
          return undefined;
        }
      }
      setBusy(true);
      setStatus(null);
      const r = o.send ? await o.send() : await apiFetch<T>(o.path ?? '', { method: o.method ?? 'POST', body: o.body });
      setBusy(false);
      if (!r.ok) {
        setFields(r.error.fields ?? {});
        setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message || tc('error'), tone: 'error' });
        return undefined;
      }
      setFields({});
      setStatus(o.success ? { msg: o.success, tone: 'info' } : null);
      await o.onOk?.(r.data);
      return r.data;
    },
    [tc, tv, locale],
  );

  return { busy, fields, setFields, status, setStatus, submit };
}
