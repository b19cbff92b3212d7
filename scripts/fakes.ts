/** Local fakes of hosted services (mail, weather forecast, Web Push), on loopback. Started by npm start and the tests. */
import { startSmtpFake } from '../lib/fakes/smtp';
import { startForecastFake } from '../lib/fakes/forecast';
import { startPushFake } from '../lib/fakes/push';

const smtpPort = Number(process.env.SMTP_FAKE_PORT ?? 2525);
const forecastPort = Number(process.env.FORECAST_FAKE_PORT ?? 4011);
const mailbox = process.env.MAILBOX_DIR ?? '.var/mail';
const pushPort = Number(process.env.PUSH_FAKE_PORT ?? 4443);
const pushDir = process.env.PUSH_FAKE_DIR ?? '.var/push';
// The certificate goes where PUSH_FAKE_CA says (start.sh points the web server and worker there).
const pushCertDir = process.env.PUSH_FAKE_CA ? (await import('node:path')).dirname(process.env.PUSH_FAKE_CA) : '.var/push-tls';

const smtp = await startSmtpFake({ port: smtpPort, dir: mailbox });
console.log(`[fakes] SMTP on 127.0.0.1:${smtp.port}, messages in ${mailbox}`);
const forecast = await startForecastFake({ port: forecastPort });
console.log(`[fakes] forecast (Open-Meteo API) on ${forecast.url}`);
const push = await startPushFake({ port: pushPort, dir: pushDir, certDir: pushCertDir });
console.log(`[fakes] Web Push on ${push.origin} (endpoints ${push.endpointFor('<id>')}), deliveries in ${pushDir}, certificate ${push.caPath}`);

const stop = async () => {
  await Promise.all([smtp.close(), forecast.close(), push.close()]);
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
