// A fresh database per test file, copied from the migrated template, so runs and workers never share rows.
import { randomBytes } from 'node:crypto';
import { inject } from 'vitest';
import { createDatabase, dropDatabase, urlsFor, type DatabaseUrls } from '@bumperline/db/lifecycle/provision';
import { createDb, type Db } from '@bumperline/db/client';

export interface TestDatabase extends DatabaseUrls {
  /** Connected as the API's role: row-level security applies. */
  app: Db;
  /** Connected as the owner: for arranging rows across companies. */
  owner: Db;
  drop(): Promise<void>;
}

export async function freshDatabase(): Promise<TestDatabase> {
  const adminUrl = inject('adminUrl');
  const name = `bl_test_${randomBytes(6).toString('hex')}`;
  await createDatabase(adminUrl, name, inject('templateDatabase'));
  const urls = urlsFor(adminUrl, name);
  const app = createDb(urls.appUrl, { max: 4 });
  const owner = createDb(urls.ownerUrl, { max: 2 });
  return {
    ...urls,
    app,
    owner,
    async drop() {
      await app.$client.end();
      await owner.$client.end();
      await dropDatabase(adminUrl, name);
    },
  };
}
