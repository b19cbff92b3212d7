import { inject } from 'vitest';
import { mailText, readMailbox } from '../../lib/mail/mailbox';

/** A message the SMTP fake received, with the body decoded. */
export interface ReceivedMail {
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

/** Every message the SMTP fake received for an address, newest first. */
export async function mailsTo(address: string): Promise<ReceivedMail[]> {
  const wanted = address.toLowerCase();
  const mails = await readMailbox(inject('mailboxDir'), 100_000);
  return mails
    .filter((m) => m.to.some((t) => t.toLowerCase() === wanted))
    .map((m) => ({ to: m.to, subject: m.subject, receivedAt: m.receivedAt, text: mailText(m.raw) }));
}

/**
 * Waits until at least `count` messages for the address are in the mailbox and returns the newest.
 * The API answers after the fake has stored the message, so this rarely polls more than once.
 */
export async function waitForMail(address: string, { count = 1, timeoutMs = 5_000 } = {}): Promise<ReceivedMail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const mails = await mailsTo(address);
    if (mails.length >= count) return mails[0]!;
    if (Date.now() > until) throw new Error(`no mail #${count} for ${address} within ${timeoutMs} ms (found ${mails.length})`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** The one-time token of the first /invite/… or /reset/… link in a mail. */
export function linkToken(text: string, kind: 'invite' | 'reset'): string {
  const m = new RegExp(`https?://[^\\s/]+/${kind}/([A-Za-z0-9_-]+)`).exec(text);
  if (!m?.[1]) throw new Error(`no /${kind}/ link in the mail:\n${text}`);
  return m[1];
}
