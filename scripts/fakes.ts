/** Local fakes of hosted services (mail; later forecasts and push), on loopback. Started by npm start and the tests. */
import { startSmtpFake } from '../lib/fakes/smtp';

const smtpPort = Number(process.env.SMTP_FAKE_PORT ?? 2525);
const mailbox = process.env.MAILBOX_DIR ?? '.var/mail';

const smtp = await startSmtpFake({ port: smtpPort, dir: mailbox });
console.log(`[fakes] SMTP on 127.0.0.1:${smtp.port}, messages in ${mailbox}`);

const stop = async () => {
  await smtp.close();
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
