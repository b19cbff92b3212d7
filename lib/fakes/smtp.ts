import { SMTPServer } from 'smtp-server';
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { randomUUID } from 'node:crypto';

export interface StoredMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  raw: string;
  subject: string;
}

/**
 * Local SMTP fake: accepts every message on loopback (no TLS, no auth) and keeps each as a JSON
 * file in `dir`, newest readable by the dev mailbox page and by tests.
 */
export async function startSmtpFake(opts: { port: number; dir: string }): Promise<{ close: () => Promise<void>; port: number }> {
  await mkdir(opts.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const subject = /^Subject: (.*)$/im.exec(raw)?.[1]?.trim() ?? '';
        const mail: StoredMail = {
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((r) => r.address),
          subject,
          raw,
        };
        const file = path.join(opts.dir, `${Date.now()}-${mail.id}.json`);
        writeFile(file, JSON.stringify(mail, null, 2)).then(() => callback(), callback);
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : opts.port;
  return { port, close: () => new Promise<void>((r) => server.close(() => r())) };
}
