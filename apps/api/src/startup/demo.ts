// Everything only the demo has: the fictional data, the local fakes standing in for the mail server and
// the SMS provider, their developer pages, and secrets made for this installation. main.ts loads this
// module only in demo mode, so a production start never loads a fake.
import { Router } from 'express';
import type { Logger } from 'pino';
import { createDb } from '@bumperline/db/client';
import { seedDemo } from '@bumperline/db/demo/seed';
import { startMailFake } from '@bumperline/fakes/mail/mail-fake';
import { startSmsFake } from '@bumperline/fakes/sms/sms-fake';
import { devRouter } from '../routes/dev.ts';
import { devPhoneRouter } from '../routes/dev-phone.ts';
import { devCarePlansRouter } from '../routes/dev-care-plans.ts';
import { installationSecrets } from './installation-secrets.ts';

/** Our demo number (555-01xx numbers are set aside for fiction). */
const DEMO_FROM = '+13125550199';

export interface Demo {
  authSecret: string;
  sms: { accountSid: string; authToken: string; from: string; fakeUrl: string };
  mailFakePort: number;
  /** /dev/outbox and /dev/phone, for app.ts to mount behind its loopback guard. */
  devPages: Router;
  stop(): Promise<void>;
}

export async function startDemo(opts: {
  ownerUrl: string;
  /** The app role's address, for the care-plan clock (/dev/care-plans), which runs the job as the app does. */
  appUrl?: string;
  dataDir: string;
  appOrigin: string;
  /** Where the SMS fake delivers its signed webhooks: this process. */
  listenUrl: string;
  authSecret?: string;
  logger: Logger;
}): Promise<Demo> {
  const ownerDb = createDb(opts.ownerUrl, { max: 2 });
  const seeded = await seedDemo(ownerDb);
  opts.logger.info(seeded ? 'demo data seeded' : 'demo data already present');
  await ownerDb.$client.end();

  const secrets = installationSecrets(opts.dataDir);
  const sms = { accountSid: 'AC' + secrets.smsAuthToken.slice(0, 32), authToken: secrets.smsAuthToken, from: DEMO_FROM };
  const mailFake = await startMailFake();
  const smsFake = await startSmsFake({
    accountSid: sms.accountSid,
    authToken: sms.authToken,
    number: sms.from,
    webhookUrl: `${opts.appOrigin}/webhooks/sms/inbound`,
    statusCallbackUrl: `${opts.appOrigin}/webhooks/sms/status`,
    // Webhooks are signed for the public address but delivered straight to this process (no dev proxy in between).
    deliverTo: opts.listenUrl,
  });
  const devPages = Router();
  devPages.use(devRouter(mailFake), devPhoneRouter(smsFake));
  const appDb = opts.appUrl ? createDb(opts.appUrl, { max: 2 }) : undefined;
  if (appDb) devPages.use(devCarePlansRouter(appDb));
  return {
    authSecret: opts.authSecret ?? secrets.authSecret,
    sms: { ...sms, fakeUrl: smsFake.url },
    mailFakePort: mailFake.port,
    devPages,
    async stop() {
      await appDb?.$client.end();
      await smsFake.stop();
      await mailFake.stop();
    },
  };
}
