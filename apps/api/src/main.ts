// Starts Bumperline in one of two modes (env.ts):
// - demo: a private PostgreSQL cluster unless DATABASE_URL is set, local fakes for mail and SMS, the
//   fictional demo data and the /dev pages (loopback only) — what the README's `npm start` runs;
// - production: real providers from settings, no fakes, no demo data; refuses to start without them.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startCluster, type Cluster } from '@bumperline/db/lifecycle/cluster';
import { provisionDatabase } from '@bumperline/db/lifecycle/provision';
import { createDb } from '@bumperline/db/client';
import { createApp } from './app.ts';
import { MissingSettingsError, readEnv, type Env } from './env.ts';
import { createLogger } from './http/logger.ts';
import { createMailer } from './services/mailer.ts';
import { folderPhotoStore } from './services/photo-store.ts';
import { createSmsSender } from './services/sms.ts';
import { startJobs } from './jobs/scheduler.ts';

let env: Env;
try {
  env = readEnv();
} catch (err) {
  if (!(err instanceof MissingSettingsError)) throw err;
  console.error(err.message);
  process.exit(1);
}
const logger = createLogger({ level: env.LOG_LEVEL });
const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const dataDir = path.join(repoRoot, '.data');

let cluster: Cluster | undefined;
const adminUrl = env.DATABASE_URL ?? (cluster = await startCluster({ mode: env.DB_CLUSTER, log: (m) => logger.info(m) })).adminUrl;
const urls = await provisionDatabase(adminUrl, env.DATABASE_NAME);
logger.info(`database "${urls.database}" migrated`);

// Demo only: its data, fakes and developer pages, loaded on demand so a production start never loads a fake.
const demoKit =
  env.mode === 'demo'
    ? await (
        await import('./startup/demo.ts')
      ).startDemo({
        ownerUrl: urls.ownerUrl,
        appUrl: urls.appUrl,
        dataDir,
        appOrigin: env.appOrigin,
        listenUrl: `http://${env.HOST}:${env.PORT}`,
        authSecret: env.authSecret,
        logger,
      })
    : undefined;
const authSecret = env.mode === 'demo' ? demoKit!.authSecret : env.authSecret;
const sms = env.mode === 'demo' ? demoKit!.sms : env.twilio;
const mailer = createMailer({
  smtpUrl: env.mode === 'production' ? env.smtpUrl : undefined,
  fakePort: demoKit?.mailFakePort,
  from: env.MAIL_FROM,
});
const smsSender = createSmsSender({ ...sms, statusCallbackUrl: `${env.appOrigin}/webhooks/sms/status` });
const db = createDb(urls.appUrl, { max: 20 });
const app = createApp({
  db,
  mailer,
  logger,
  authSecret,
  appOrigin: env.appOrigin,
  trustProxy: env.TRUST_PROXY,
  webDist: path.join(repoRoot, 'dist/web'),
  smsAuthToken: sms.authToken,
  ...(demoKit ? { devPages: demoKit.devPages } : {}),
  photos: folderPhotoStore(env.UPLOADS_DIR ?? path.join(dataDir, 'uploads')),
});

const jobs = startJobs({ db, sms: smsSender, mailer, logger, appOrigin: env.appOrigin });
const server = app.listen(env.PORT, env.HOST, () => {
  const at = `http://${env.HOST}:${env.PORT}`;
  if (demoKit) {
    console.log(
      [
        '',
        '  Bumperline — DEMO MODE',
        `  ${at}`,
        '  Fictional demo data (sign-ins in the README). E-mail and SMS go to local fakes, never out:',
        `  captured e-mail at ${at}/dev/outbox, texts at ${at}/dev/phone (answering this machine only).`,
        '  Not for real use: see "Running in production" in the README.',
        '',
      ].join('\n'),
    );
  } else {
    logger.info(`Bumperline is running at ${at} (public origin ${env.appOrigin})`);
  }
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info(`${signal}: stopping`);
  server.close();
  jobs.stop();
  await db.$client.end().catch(() => {});
  await demoKit?.stop();
  cluster?.stop();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
