// The real API (createApp) on the database named by BENCH_APP_URL, as main.ts builds it (a pool of 20, info
// request logs), without the scheduled jobs: the benchmarks measure requests, not background work.
// Started as a child process so the load generator does not share its event loop; sends its port over IPC.
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { createApp } from '@bumperline/api/app';
import { createLogger } from '@bumperline/api/http/logger';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { createDb } from '@bumperline/db/client';

const db = createDb(process.env.BENCH_APP_URL!, { max: 20 });
const app = createApp({
  db,
  // No mail is sent by the reads measured here; nothing listens on this port.
  mailer: createMailer({ fakePort: 9, from: 'Bumperline bench <bench@bumperline.example>' }),
  logger: createLogger({ level: process.env.LOG_LEVEL ?? 'info' }),
  authSecret: process.env.BENCH_AUTH_SECRET!,
  appOrigin: 'http://127.0.0.1',
  smsAuthToken: 'bench-sms-auth-token',
  photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-bench-photos')),
});
const server = app.listen(0, '127.0.0.1', () => process.send!({ port: (server.address() as AddressInfo).port }));
