// Starts Bumperline: the database (a private cluster unless DATABASE_URL is set), the mail fake
// (unless SMTP_URL is set), the demo data, then the API serving the built web app on one port.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pino from 'pino';
import { startCluster, type Cluster } from '@bumperline/db/lifecycle/cluster';
import { provisionDatabase } from '@bumperline/db/lifecycle/provision';
import { createDb } from '@bumperline/db/client';
import { seedDemo } from '@bumperline/db/demo/seed';
import { startMailFake } from '@bumperline/fakes/mail/mail-fake';
import { createApp } from './app.ts';
import { readEnv } from './env.ts';
import { createMailer } from './services/mailer.ts';
import { folderPhotoStore } from './services/photo-store.ts';
import { startSmsFake } from '@bumperline/fakes/sms/sms-fake';
import { createSmsSender } from './services/sms.ts';
import { startJobs } from './jobs/scheduler.ts';

const env = readEnv();
const logger = pino({ level: env.LOG_LEVEL, redact: ['password', '*.password'] });
const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');

let cluster: Cluster | undefined;
const adminUrl = env.DATABASE_URL ?? (cluster = await startCluster({ mode: env.DB_CLUSTER, log: (m) => logger.info(m) })).adminUrl;
const urls = await provisionDatabase(adminUrl, env.DATABASE_NAME);
logger.info(`database "${urls.database}" migrated`);

if (env.SEED_DEMO === 'true') {
  const ownerDb = createDb(urls.ownerUrl, { max: 2 });
  const seeded = await seedDemo(ownerDb);
  logger.info(seeded ? 'demo data seeded' : 'demo data already present');
  await ownerDb.$client.end();
}

const mailFake = env.fakesOn ? await startMailFake() : undefined;
const mailer = createMailer({ smtpUrl: env.SMTP_URL, fakePort: mailFake?.port, from: env.MAIL_FROM });
// SMS: the real Twilio service when credentials are set, else the local fake (same SDK either way).
const smsAuthToken = env.TWILIO_AUTH_TOKEN ?? 'fake-twilio-auth-token-for-local-use';
const smsAccountSid = env.TWILIO_ACCOUNT_SID ?? 'ACfakefakefakefakefakefakefakefake0';
const smsFake = env.TWILIO_AUTH_TOKEN
  ? undefined
  : await startSmsFake({
      authToken: smsAuthToken,
      accountSid: smsAccountSid,
      webhookUrl: `${env.appOrigin}/webhooks/sms/inbound`,
      statusCallbackUrl: `${env.appOrigin}/webhooks/sms/status`,
      // Webhooks are signed for the public address but delivered straight to this process (no dev proxy in between).
      deliverTo: `http://${env.HOST}:${env.PORT}`,
    });
const sms = createSmsSender({
  accountSid: smsAccountSid,
  authToken: smsAuthToken,
  from: env.TWILIO_FROM,
  fakeUrl: smsFake?.url,
  statusCallbackUrl: `${env.appOrigin}/webhooks/sms/status`,
});
const db = createDb(urls.appUrl, { max: 20 });
const app = createApp({
  db,
  mailer,
  logger,
  authSecret: env.authSecret,
  appOrigin: env.appOrigin,
  mailFake,
  webDist: path.join(repoRoot, 'dist/web'),
  smsAuthToken,
  smsFake,
  photos: folderPhotoStore(env.UPLOADS_DIR ?? path.join(repoRoot, '.data/uploads')),
});

const jobs = startJobs({ db, sms, mailer, logger, appOrigin: env.appOrigin });
const server = app.listen(env.PORT, env.HOST, () => {
  logger.info(`Bumperline is running at http://${env.HOST}:${env.PORT}${mailFake ? ` (captured e-mail at /dev/outbox)` : ''}`);
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info(`${signal}: stopping`);
  server.close();
  jobs.stop();
  await smsFake?.stop();
  await db.$client.end().catch(() => {});
  await mailFake?.stop();
  cluster?.stop();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
