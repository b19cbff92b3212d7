import { json, route } from '@/lib/http/handler';
import { getEnv } from '@/lib/env';
import { requireCoordinatorOrg, requireViewer } from '@/lib/auth/guard';
import { notFound } from '@/lib/http/errors';
import { mailText, readMailbox } from '@/lib/mail/mailbox';

export const dynamic = 'force-dynamic';

/** Dev tools only: what the local SMTP fake received. Off in production (404); coordinators only. */
export const GET = route(async () => {
  const env = getEnv();
  if (!env.devTools) throw notFound('Page');
  // The fake's messages carry one-time links of every account: coordinators only, even in a demo.
  requireCoordinatorOrg(await requireViewer());
  const mails = await readMailbox(env.MAILBOX_DIR);
  return json({ messages: mails.map((m) => ({ id: m.id, receivedAt: m.receivedAt, to: m.to, subject: m.subject, text: mailText(m.raw) })) });
});
