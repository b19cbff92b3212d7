'use client';

import { useFormatter, useTranslations } from 'next-intl';
import { useEffect, useState } from 'react';
import { apiFetch } from '@/lib/client/api';

interface Mail { id: string; receivedAt: string; to: string[]; subject: string; text: string }

/** Dev tools: lists what the local SMTP fake caught, newest first. */
export function Mailbox() {
  const t = useTranslations('mailbox');
  const tc = useTranslations('common');
  const format = useFormatter();
  const [mails, setMails] = useState<Mail[] | null>(null);
  useEffect(() => {
    apiFetch<{ messages: Mail[] }>('/api/v1/dev/mailbox').then((r) => setMails(r.ok ? r.data.messages : []));
  }, []);
  if (!mails) return <p aria-busy="true">{tc('loading')}</p>;
  if (!mails.length) return <p className="card">{t('empty')}</p>;
  return (
    <ul className="flex flex-col gap-4">
      {mails.map((m) => (
        <li key={m.id} className="card">
          <h2 className="font-bold">{m.subject}</h2>
          <p className="text-sm text-clay-700">
            {t('to')}: {m.to.join(', ')} · {format.dateTime(new Date(m.receivedAt), { dateStyle: 'medium', timeStyle: 'short' })}
          </p>
          <pre className="mt-2 whitespace-pre-wrap break-words text-sm">{m.text}</pre>
        </li>
      ))}
    </ul>
  );
}
