'use client';

import Link from 'next/link';
import { useTranslations } from 'next-intl';
import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { z } from 'zod';
import { signInSchema } from '@/lib/validations/session';
import { acceptInvitationSchema, confirmResetSchema, requestResetSchema } from '@/lib/validations/users';
import { Field, Status } from './field';
import { useFormSubmit } from './use-form-submit';

/** The sign-in and account forms: each posts its body once the route's schema accepts it. */
function useSubmit() {
  const tv = useTranslations('validation');
  const form = useFormSubmit();
  const run = <T,>(path: string, schema: z.ZodType, body: unknown, onOk: (d: T) => void) =>
    form.submit<T>({ schema, body, path, onOk, formats: { token: tv('link') } });
  return { ...form, run };
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
        void run('/api/v1/session', signInSchema, { email, password }, () => {
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
        void run('/api/v1/password-resets', requestResetSchema, { email }, () => setStatus({ msg: t('sent'), tone: 'info' }));
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
        void run('/api/v1/password-resets/confirm', confirmResetSchema, { token, password }, () => setDone(true));
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
        void run('/api/v1/invitations/accept', acceptInvitationSchema, { token, name, password }, () => {
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
