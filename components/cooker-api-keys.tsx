'use client';

import { useFormatter, useTranslations } from 'next-intl';
import { useCallback, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { apiKeySchema } from '@/lib/validations/cooks';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

/** A sensor key as GET …/cookers/{cookerId}/api-keys lists it (never the key itself). */
export interface ApiKey { id: string; label: string; prefix: string; createdAt: string; lastUsedAt: string | null; revokedAt: string | null }

/** Leads make and revoke the keys a cooker's sensor sends readings with; a new key is shown once. */
export function CookerApiKeys({ kitchenId, cookerId, initialKeys }: { kitchenId: string; cookerId: string; initialKeys: ApiKey[] }) {
  const t = useTranslations('cookers.apiKeys');
  const tc = useTranslations('common');
  const format = useFormatter();
  const base = `/api/v1/kitchens/${kitchenId}/cookers/${cookerId}/api-keys`;
  const [keys, setKeys] = useState<ApiKey[]>(initialKeys);
  const [label, setLabel] = useState('');
  const [fresh, setFresh] = useState<string | null>(null);
  const { busy, fields, status, setStatus, submit } = useFormSubmit();

  /** Reads the list again after a change (the page rendered the first one). */
  const load = useCallback(async () => {
    const r = await apiFetch<{ keys: ApiKey[] }>(base);
    if (r.ok) setKeys(r.data.keys);
    else setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
  }, [base, tc, setStatus]);

  async function create(e: React.FormEvent) {
    e.preventDefault();
    await submit<ApiKey & { key: string }>({
      schema: apiKeySchema,
      body: { label },
      path: base,
      onOk: async (data) => {
        setLabel('');
        setFresh(data.key);
        await load();
      },
    });
  }

  async function revoke(id: string) {
    if (!window.confirm(t('confirmRevoke'))) return;
    await submit({ path: `${base}/${id}`, method: 'DELETE' });
    await load();
  }

  const date = (iso: string) => format.dateTime(new Date(iso), { dateStyle: 'medium', timeStyle: 'short', timeZone: Intl.DateTimeFormat().resolvedOptions().timeZone });
  return (
    <section aria-labelledby="api-keys-title" className="card flex flex-col gap-3">
      <h2 id="api-keys-title" className="text-lg font-bold">{t('title')}</h2>
      <p className="text-sm text-clay-700">{t('intro')}</p>
      {fresh && (
        <div role="status" className="rounded-lg bg-tide-50 p-3">
          <p className="font-semibold">{t('shownOnce')}</p>
          <code className="block break-all rounded bg-white p-2 text-sm" data-testid="new-api-key">{fresh}</code>
          <button type="button" className="btn-quiet mt-2" onClick={() => navigator.clipboard?.writeText(fresh).then(() => setStatus({ msg: t('copied'), tone: 'info' }))}>
            {t('copy')}
          </button>
        </div>
      )}
      {keys.length === 0 && <p>{t('none')}</p>}
      {keys.length > 0 && (
        <ul className="flex flex-col gap-2">
          {keys.map((k) => (
            <li key={k.id} className="flex flex-wrap items-center justify-between gap-2 rounded-lg bg-clay-100 px-3 py-2 text-sm">
              <span>
                <span className="font-semibold">{k.label}</span> <code>{k.prefix}…</code>
                <span className="block text-clay-700">{k.revokedAt ? t('revoked', { date: date(k.revokedAt) }) : k.lastUsedAt ? t('lastUsed', { date: date(k.lastUsedAt) }) : t('neverUsed')}</span>
              </span>
              {!k.revokedAt && (
                <button type="button" className="btn-quiet" onClick={() => revoke(k.id)}>
                  {t('revoke')}
                </button>
              )}
            </li>
          ))}
        </ul>
      )}
      <form onSubmit={create} noValidate className="flex flex-col gap-1 sm:flex-row sm:items-end sm:gap-3">
        <div className="flex-1">
          <Field label={t('label')} hint={t('labelHint')} value={label} onChange={(e) => setLabel(e.target.value)} error={fields.label} maxLength={100} />
        </div>
        <button type="submit" className="btn-primary mb-4" disabled={busy}>{t('create')}</button>
      </form>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </section>
  );
}
