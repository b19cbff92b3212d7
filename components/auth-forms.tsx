'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import { apiFetch } from '@/lib/client/api';
import { Field, Status } from './field';

function useSubmit() {
  const tc = useTranslations('common');
  const [fields, setFields] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ msg: string; tone: 'info' | 'error' } | null>(null);
  const [busy, setBusy] = useState(false);
  async function run<T>(path: string, body: unknown, onOk: (d: T) => void) {
    setBusy(true);
    setStatus(null);
    const r = await apiFetch<T>(path, { method: 'POST', body });
    setBusy(false);
    if (r.ok) {
      setFields({});
      onOk(r.data);
    } else {
      setFields(r.error.fields ?? {});
      setStatus({ msg: r.error.status === 0 ? tc('offline') : r.error.message, tone: 'error' });
    }
  }
  return { fields, status, setStatus, busy, run };
}

export function SignInForm() {
  const t = useTranslations('signIn');
  const router = useRouter();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const { fields, status, busy, run } = useSubmit();
  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void run('/api/v1/session', { email, password }, () => {
          router.push('/');
          router.refresh();
        });
      }}
    >
      <Field label={t('email')} type="email" name="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} required />
      <Field label={t('password')} type="password" name="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} error={fields.password} required />
      <button className="btn-primary w-full" disabled={busy}>{busy ? t('submitting') : t('submit')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
      <Link href="/reset" className="text-sm text-tide-700 underline">{t('forgot')}</Link>
    </form>
  );
}

export function ResetRequestForm() {
  const t = useTranslations('reset');
  const ts = useTranslations('signIn');
  const [email, setEmail] = useState('');
  const { fields, status, setStatus, busy, run } = useSubmit();
  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void run('/api/v1/password-resets', { email }, () => setStatus({ msg: t('sent'), tone: 'info' }));
      }}
    >
      <p className="mb-4 text-sm">{t('intro')}</p>
      <Field label={ts('email')} type="email" autoComplete="username" value={email} onChange={(e) => setEmail(e.target.value)} error={fields.email} required />
      <button className="btn-primary w-full" disabled={busy}>{t('send')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
      <Link href="/sign-in" className="text-sm text-tide-700 underline">{t('backToSignIn')}</Link>
    </form>
  );
}

export function ResetConfirmForm({ token }: { token: string }) {
  const t = useTranslations('reset');
  const [password, setPassword] = useState('');
  const [done, setDone] = useState(false);
  const { fields, status, busy, run } = useSubmit();
  if (done)
    return (
      <p role="status">
        {t('changed')} <Link href="/sign-in" className="text-tide-700 underline">{t('backToSignIn')}</Link>
      </p>
    );
  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void run('/api/v1/password-resets/confirm', { token, password }, () => setDone(true));
      }}
    >
      <Field label={t('newPassword')} type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} error={fields.password ?? fields.token} required minLength={10} />
      <button className="btn-primary w-full" disabled={busy}>{t('change')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}

export function AcceptInviteForm({ token }: { token: string }) {
  const t = useTranslations('invite');
  const router = useRouter();
  const [name, setName] = useState('');
  const [password, setPassword] = useState('');
  const { fields, status, busy, run } = useSubmit();
  return (
    <form
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void run('/api/v1/invitations/accept', { token, name, password }, () => {
          router.push('/');
          router.refresh();
        });
      }}
    >
      <p className="mb-4 text-sm">{t('intro')}</p>
      <Field label={t('name')} autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={fields.name} required />
      <Field label={t('password')} type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} error={fields.password ?? fields.token} required minLength={10} />
      <button className="btn-primary w-full" disabled={busy}>{t('accept')}</button>
      <Status message={status?.msg ?? null} tone={status?.tone} />
    </form>
  );
}
