import { json, route } from '@/lib/http/handler';
import { getEnv } from '@/lib/env';
import { notFound } from '@/lib/http/errors';
import { mailText, readMailbox } from '@/lib/mail/mailbox';

export const dynamic = 'force-dynamic';

/** Dev tools only: what the local SMTP fake received. Off in production (404). */
export const GET = route(async () => {
  const env = getEnv();
  if (!env.devTools) throw notFound('Page');
  const mails = await readMailbox(env.MAILBOX_DIR);
  return json({ messages: mails.map((m) => ({ id: m.id, receivedAt: m.receivedAt, to: m.to, subject: m.subject, text: mailText(m.raw) })) });
});
