'use client';

import { useTranslations } from 'next-intl';
import { useState } from 'react';
import { createInvitationSchema } from '@/lib/validations/users';
import { Field, Status } from './field';
import type { KitchenSummary } from './kitchen-list';
import { useFormSubmit } from './use-form-submit';

/** Invite someone by e-mail with a role and a kitchen (one the inviter manages); the roles offered follow the inviter's own. */
export function InviteForm({ canInviteCoordinator, kitchens }: { canInviteCoordinator: boolean; kitchens: KitchenSummary[] }) {
  const t = useTranslations('people');
  const tc = useTranslations('common');
  const [email, setEmail] = useState('');
  const [role, setRole] = useState('cook');
  const [kitchenId, setKitchenId] = useState(kitchens[0]?.id ?? '');
  const { busy, fields, status, submit } = useFormSubmit();

  async function onSubmit(e: React.FormEvent) {
    e.preventDefault();
    const sent = email;
    await submit({
      schema: createInvitationSchema,
      body: { email, role, kitchenId: role === 'coordinator' ? null : kitchenId || null },
      path: '/api/v1/invitations',
      success: t('sent', { email: sent.trim() }),
      describe: ([k]) => (k === 'email' ? t('email') : k === 'role' ? t('role') : k === 'kitchenId' ? t('kitchen') : null),
      onOk: () => setEmail(''),
    });
  }

  return (
    <form onSubmit={onSubmit} noValidate className="card max-w-xl">
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
