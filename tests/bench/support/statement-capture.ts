// "The same SQL" as an endpoint: every statement the API sends while answering one request, captured by
// wrapping pg's Client.prototype.query in this process while an in-process copy of the API (createApp on
// the same database and secret) answers each request once. Statements are grouped by connection into
// transactions; the tenant-scoped ones (BEGIN, set_config('app.tenant_id', …), the handler's queries,
// COMMIT) are what the raw-SQL side replays. What runs outside them — the per-request sign-in check —
// is the API's own overhead and is left out of the replay, but counted in `total`.
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { createApp } from '@bumperline/api/app';
import { createLogger } from '@bumperline/api/http/logger';
import { createMailer } from '@bumperline/api/services/mailer';
import { folderPhotoStore } from '@bumperline/api/services/photo-store';
import { createDb } from '@bumperline/db/client';
import type { CapturedStatement } from './load.ts';
import { recordStatements, type SentStatement } from '../../support/statement-log.ts';

export interface CapturedRequest {
  /** Statements the request sent in all, the sign-in check included. */
  total: number;
  /** Its tenant-scoped transactions, each from BEGIN to COMMIT. */
  transactions: CapturedStatement[][];
}

export async function captureStatements(appUrl: string, authSecret: string, requests: { path: string; cookie: string }[]) {
  const db = createDb(appUrl, { max: 4 });
  const app = createApp({
    db,
    mailer: createMailer({ fakePort: 9, from: 'Bumperline bench <bench@bumperline.example>' }),
    logger: createLogger({ level: 'silent' }),
    authSecret,
    appOrigin: 'http://127.0.0.1',
    smsAuthToken: 'bench-sms-auth-token',
    photos: folderPhotoStore(path.join(os.tmpdir(), 'bumperline-bench-photos')),
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

  const statements = recordStatements();
  const captured = new Map<string, CapturedRequest>();
  try {
    for (const r of requests) {
      statements.take();
      const res = await fetch(base + r.path, { headers: { cookie: r.cookie } });
      await res.arrayBuffer();
      if (res.status !== 200) throw new Error(`${r.path} answered ${res.status} while its statements were captured`);
      const sent = statements.take();
      captured.set(r.path, { total: sent.length, transactions: scopedTransactions(sent) });
    }
  } finally {
    statements.stop();
    server.close();
    await db.$client.end();
  }
  return captured;
}

function scopedTransactions(sent: SentStatement[]): CapturedStatement[][] {
  const open = new Map<unknown, SentStatement[]>();
  const done: CapturedStatement[][] = [];
  for (const statement of sent) {
    const text = statement.text.trim().toLowerCase();
    if (text.startsWith('begin')) open.set(statement.client, []);
    const tx = open.get(statement.client);
    if (!tx) continue;
    tx.push(statement);
    if (text.startsWith('commit') || text.startsWith('rollback')) {
      open.delete(statement.client);
      if (tx.some((s) => s.text.includes("set_config('app.tenant_id'"))) {
        done.push(tx.map((s) => ({ query: s.query, values: s.values.length ? s.values : undefined })));
      }
    }
  }
  return done;
}
