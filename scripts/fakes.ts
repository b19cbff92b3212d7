/** Local fakes of hosted services (mail, weather forecast; later push), on loopback. Started by npm start and the tests. */
import { startSmtpFake } from '../lib/fakes/smtp';
import { startForecastFake } from '../lib/fakes/forecast';

const smtpPort = Number(process.env.SMTP_FAKE_PORT ?? 2525);
const forecastPort = Number(process.env.FORECAST_FAKE_PORT ?? 4011);
const mailbox = process.env.MAILBOX_DIR ?? '.var/mail';

const smtp = await startSmtpFake({ port: smtpPort, dir: mailbox });
console.log(`[fakes] SMTP on 127.0.0.1:${smtp.port}, messages in ${mailbox}`);
const forecast = await startForecastFake({ port: forecastPort });
console.log(`[fakes] forecast (Open-Meteo API) on ${forecast.url}`);

const stop = async () => {
  await Promise.all([smtp.close(), forecast.close()]);
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
