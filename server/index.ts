import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './access/demo-people';
import { createApp } from './app';
import { connectDatabase } from './db/client';
import { readEnv, type Env } from './env';
import type { PaymentConfig } from './features/payments/payment-config';
import { startJobs } from './jobs/jobs';
import { createHttpServer, lanBanner, loadLan } from './lan/lan-server';
import { createLogger } from './logger';
import type { DevSmtp } from './mail/dev-smtp';
import { createSmtpMailer } from './mail/mailer';
import type { PaymentFake } from './payment-fake/payment-fake';

let env: Env;
try {
  env = readEnv();
} catch (err) {
  // A configuration mistake is the operator's to fix: say what, with no stack trace.
  console.error((err as Error).message);
  process.exit(1);
}
const logger = createLogger(env);
const lan = loadLan(env);
const database = connectDatabase(env.DATABASE_URL, 20);

// The local SMTP fake (and the packages it needs) loads only when no SMTP_URL is given, which
// production never allows (server/env.ts).
let devSmtp: DevSmtp | undefined;
let smtpUrl = env.SMTP_URL;
if (!smtpUrl) {
  devSmtp = await (await import('./mail/dev-smtp')).startDevSmtp();
  smtpUrl = devSmtp.url;
}
const mailer = createSmtpMailer(smtpUrl, env.MAIL_FROM);
// Sales — payments: the service's keys when given; else, outside production, the local fake
// of the service (loaded only then) with keys of its own; production without keys: card off.
let paymentFake: PaymentFake | undefined;
let payments: PaymentConfig | undefined;
if (env.PAYMENT_SECRET_KEY && env.PAYMENT_WEBHOOK_SECRET) {
  payments = {
    secretKey: env.PAYMENT_SECRET_KEY,
    webhookSecret: env.PAYMENT_WEBHOOK_SECRET,
    apiUrl: env.PAYMENT_API_URL,
  };
} else if (env.NODE_ENV !== 'production') {
  paymentFake = await (await import('./payment-fake/payment-fake')).startPaymentFake();
  payments = {
    secretKey: paymentFake.secretKey,
    webhookSecret: paymentFake.webhookSecret,
    apiUrl: paymentFake.url,
  };
}
const { app, services, shutdown } = createApp({
  env,
  database,
  mailer,
  devMailbox: devSmtp?.mailbox,
  logger,
  lan,
  payments,
});
const jobs = await startJobs({
  databaseUrl: env.DATABASE_URL,
  rounds: services.rounds,
  coverReports: services.coverReports,
  helperReports: services.helperReports,
  dailyMail: services.dailyMail,
  sales: services.sales,
  logger,
});

const server = createHttpServer(app, env).listen(env.PORT, env.HOST, async () => {
  const shown = env.HOST === '0.0.0.0' ? 'localhost' : env.HOST;
  const scheme = env.HTTPS_CERT_FILE ? 'https' : 'http';
  const url = env.PUBLIC_URL ?? lan?.url ?? `${scheme}://${shown}:${env.PORT}`;
  const lines = [``, `  Rackside is running at ${url}`];
  const address = server.address();
  if (paymentFake && typeof address === 'object' && address)
    paymentFake.setWebhookTarget(
      `${scheme}://${['0.0.0.0', '::'].includes(env.HOST) ? '127.0.0.1' : env.HOST}:${address.port}/api/payments/webhook`,
    );
  if (lan) lines.push(await lanBanner(lan));
  if (env.DEMO_MODE) {
    lines.push(`  Demo sign-in: ${DEMO_ACCOUNTS[0]!.email} / ${DEMO_PASSWORD}`);
    lines.push(
      `  (also ${DEMO_ACCOUNTS.slice(1)
        .map((a) => a.email)
        .join(', ')})`,
    );
  }
  if (devSmtp) lines.push(`  E-mail goes to a local mailbox: ${url}/dev/mailbox`);
  if (paymentFake) lines.push(`  Card payments go to a local test checkout (${paymentFake.url})`);
  lines.push(`  Press Ctrl-C to stop.`, ``);
  console.log(lines.join('\n'));
});

let closing = false;
async function stop() {
  if (closing) return;
  closing = true;
  server.close();
  server.closeAllConnections();
  await jobs.stop();
  await shutdown();
  mailer.close();
  await devSmtp?.stop();
  await paymentFake?.stop();
  await database.close();
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
