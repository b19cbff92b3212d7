'use client';

import { useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { Field, Status } from './field';
import type { KitchenSummary } from './kitchen-list';

/** Invite someone by e-mail with a role and a kitchen; the roles offered follow the inviter's own. */
export function InviteForm({ canInviteCoordinator }: { canInviteCoordinator: boolean }) {
  const t = useTranslations('people');
  const tc = useTranslations('common');
  const [kitchens, setKitchens] = useState<KitchenSummary[]>([]);
  const [email, setEmail] = useState('');
  const [role, setRole] = useState('cook');
  const [kitchenId, setKitchenId] = useState('');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    apiFetch<{ kitchens: KitchenSummary[] }>('/api/v1/kitchens').then((r) => {
      if (!r.ok) return;
      const manageable = r.data.kitchens.filter((k) => k.role === 'coordinator' || k.role === 'lead');
      setKitchens(manageable);
      if (manageable[0]) setKitchenId(manageable[0].id);
    });
  }, []);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setBusy(true);
    const r = await apiFetch('/api/v1/invitations', { method: 'POST', body: { email, role, kitchenId: role === 'coordinator' ? null : kitchenId || null } });
    setBusy(false);
    if (r.ok) {
      setFields({});
      setStatus({ msg: t('sent', { email }), tone: 'info' });
      setEmail('');
    } else {
      setFields(r.error.fields ?? {});
      setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
    }
  }

  return (
    <form onSubmit={submit} noValidate className="card max-w-xl">
      <h2 className="mb-3 text-lg font-bold">{t('invite')}</h2>
      <Field label={t('email')} type="email" autoComplete="off" value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} required />
      <div className="mb-4">
        <label htmlFor="invite-role" className="label">{t('role')}</label>
        <select id="invite-role" className="field" value={role} onChange={(e) => setRole(e.target.value)}>
          <option value="cook">{tc('roles.cook')}</option>
          <option value="lead">{tc('roles.lead')}</option>
          {canInviteCoordinator && <option value="coordinator">{tc('roles.coordinator')}</option>}
        </select>
      </div>
      {role !== 'coordinator' && (
        <div className="mb-4">
          <label htmlFor="invite-kitchen" className="label">{t('kitchen')}</label>
          <select id="invite-kitchen" className="field" value={kitchenId} onChange={(e) => setKitchenId(e.target.value)} aria-describedby={fields.kitchenId ? 'invite-kitchen-err' : undefined}>
            {kitchens.map((k) => (
              <option key={k.id} value={k.id}>{k.name}</option>
            ))}
          </select>
          {fields.kitchenId && <p id="invite-kitchen-err" className="field-error">{fields.kitchenId}</p>}
        </div>
      )}
      <button className="btn-primary" disabled={busy}>{busy ? tc('loading') : t('send')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
