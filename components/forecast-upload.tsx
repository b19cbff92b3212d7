'use client';

import { useTranslations } from 'next-intl';
import { useId, useRef, useState } from 'react';
import type { ApiResult } from '@/lib/client/api';
import { forecastUploadFieldsSchema } from '@/lib/validations/forecast';
import { useFormSubmit } from './use-form-submit';

type Uploaded = { hours: number; warnings: string[] };

/** Sends the form with XMLHttpRequest so the upload's progress can be shown (fetch cannot report it). */
function sendWithProgress(url: string, form: FormData, onProgress: (fraction: number) => void): Promise<ApiResult<Uploaded>> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', url);
    xhr.responseType = 'json';
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onload = () => {
      const body = xhr.response as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null;
      if (xhr.status >= 200 && xhr.status < 300) resolve({ ok: true, data: body as unknown as Uploaded });
      else resolve({ ok: false, error: { status: xhr.status, code: body?.error?.code ?? 'unknown', message: body?.error?.message ?? xhr.statusText, fields: body?.error?.fields ?? {} } });
    };
    xhr.onerror = () => resolve({ ok: false, error: { status: 0, code: 'offline', message: '' } });
    xhr.send(form);
  });
}

/** A kitchen lead's weather upload (CSV or EPW) for a day, with a progress bar and the file's problems listed by line. */
export function ForecastUpload({ kitchenId, defaultDate, onUploaded }: { kitchenId: string; defaultDate: string; onUploaded: () => void }) {
  const t = useTranslations('forecast.upload');
  const id = useId();
  const fileRef = useRef<HTMLInputElement>(null);
  const [date, setDate] = useState(defaultDate);
  const [mode, setMode] = useState<'as-is' | 'typical-day'>('as-is');
  const [progress, setProgress] = useState<number | null>(null);
  const [warnings, setWarnings] = useState<string[]>([]);
  const { busy, fields, setFields, status, setStatus, submit } = useFormSubmit();
  // The file's problems by line; the others join the message (the date's stays at its field).
  const lineFields = Object.entries(fields).filter(([k]) => k.startsWith('line '));
  const otherFields = Object.entries(fields).filter(([k]) => !k.startsWith('line ') && k !== 'date').map(([, v]) => v);
  const result = status && { ...status, msg: status.tone === 'error' ? [status.msg, ...otherFields].join(' ') : status.msg };

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    setWarnings([]);
    const file = fileRef.current?.files?.[0];
    const refuse = (msg: string) => {
      setFields({});
      setStatus({ msg, tone: 'error' });
    };
    if (!file) return refuse(t('chooseFile'));
    if (file.size > 5 * 1024 * 1024) return refuse(t('tooLarge'));
    const form = new FormData();
    form.set('file', file);
    form.set('date', date);
    form.set('mode', mode);
    await submit<Uploaded>({
      schema: forecastUploadFieldsSchema,
      body: { date, mode },
      describe: ([k]) => (k === 'date' ? t('date') : k === 'mode' ? t('mode') : null),
      send: async () => {
        setProgress(0);
        const r = await sendWithProgress(`/api/v1/kitchens/${kitchenId}/forecast/uploads`, form, setProgress);
        setProgress(null);
        return r;
      },
      onOk: (data) => {
        setStatus({ msg: t('done', { hours: data.hours }), tone: 'info' });
        setWarnings(data.warnings);
        if (fileRef.current) fileRef.current.value = '';
        onUploaded();
      },
    });
  }

  return (
    <section aria-labelledby={`${id}-title`} className="card flex flex-col gap-3">
      <h2 id={`${id}-title`} className="text-lg font-bold">{t('title')}</h2>
      <p className="text-sm text-clay-700">{t('intro')}</p>
      <form onSubmit={onSubmit} noValidate className="grid gap-3 sm:grid-cols-2">
        <div className="sm:col-span-2">
          <label htmlFor={`${id}-file`} className="label">{t('file')}</label>
          <input id={`${id}-file`} ref={fileRef} type="file" accept=".csv,.epw,text/csv" className="field" aria-describedby={`${id}-file-hint`} />
          <p id={`${id}-file-hint`} className="mt-1 text-sm text-clay-700">{t('fileHint')}</p>
        </div>
        <div>
          <label htmlFor={`${id}-date`} className="label">{t('date')}</label>
          <input id={`${id}-date`} type="date" className="field" value={date} onChange={(e) => setDate(e.target.value)} required aria-invalid={fields.date ? true : undefined} aria-describedby={fields.date ? `${id}-date-err` : undefined} />
          {fields.date && <p id={`${id}-date-err`} className="field-error">{fields.date}</p>}
        </div>
        <div>
          <label htmlFor={`${id}-mode`} className="label">{t('mode')}</label>
          <select id={`${id}-mode`} className="field" value={mode} onChange={(e) => setMode(e.target.value as 'as-is' | 'typical-day')}>
            <option value="as-is">{t('modes.as-is')}</option>
            <option value="typical-day">{t('modes.typical-day')}</option>
          </select>
        </div>
        <div className="flex flex-wrap items-center gap-3 sm:col-span-2">
          <button className="btn-primary" disabled={busy}>
            {busy ? t('sending') : t('send')}
          </button>
          {progress !== null && (
            <label className="flex items-center gap-2 text-sm">
              {t('progress')}
              <progress max={1} value={progress} className="h-3 w-48" aria-valuetext={`${Math.round(progress * 100)} %`} />
              <span aria-hidden="true">{Math.round(progress * 100)} %</span>
            </label>
          )}
        </div>
      </form>
      <div role={result?.tone === 'error' ? 'alert' : 'status'} aria-live="polite" className="text-sm">
        {result && <p className={result.tone === 'error' ? 'font-semibold text-ember-800' : 'text-tide-700'}>{result.msg}</p>}
        {result?.tone === 'error' && lineFields.length > 0 && (
          <ul className="mt-1 list-disc pl-5 text-ember-800">
            {lineFields.map(([k, v]) => (
              <li key={k}>
                <span className="font-semibold">{k.replace(/^line (\d+)\.(.*)$/, (_, line: string, field: string) => (field.startsWith('(') ? t('lineOnly', { line }) : t('lineField', { line, field })))}</span> {v}
              </li>
            ))}
          </ul>
        )}
        {warnings.map((w) => <p key={w} className="text-clay-700">{w}</p>)}
      </div>
      <details className="text-sm">
        <summary className="cursor-pointer font-semibold">{t('formatTitle')}</summary>
        <p className="mt-2">{t('csvFormat')}</p>
        <pre className="mt-2 overflow-x-auto rounded bg-clay-100 p-2 text-xs">{'time,ghi_w_m2,dni_w_m2,dhi_w_m2,temp_c,wind_m_s,cloud_okta\n2026-12-03T09:00+03:00,610,720,140,24.5,2.1,1\n2026-12-03T10:00+03:00,780,790,150,26.0,2.4,1'}</pre>
        <p className="mt-2">{t('epwFormat')}</p>
      </details>
    </section>
  );
}
