// Vitest global setup for the integration suites: one PostgreSQL for the run (a throwaway private
// cluster, or DATABASE_URL's server), with a migrated template database that each test file copies.
import type { TestProject } from 'vitest/node';
import { startCluster, type Cluster } from '@bumperline/db/lifecycle/cluster';
import { dropDatabase, provisionDatabase } from '@bumperline/db/lifecycle/provision';
import { ensurePgbouncerInstalled } from '@bumperline/db/lifecycle/pgbouncer';

declare module 'vitest' {
  export interface ProvidedContext {
    adminUrl: string;
    templateDatabase: string;
  }
}

let cluster: Cluster | undefined;
let adminUrl = '';
const templateDatabase = `bumperline_template_${process.pid}`;

export async function setup(project: TestProject): Promise<void> {
  // The scale-out suite (tests/api/pgbouncer.test.ts) runs PgBouncer: installed here, outside any test's time limit.
  try {
    ensurePgbouncerInstalled();
  } catch {
    // Not root: that suite fails with the package to install, the others run.
  }
  if (process.env.DATABASE_URL) {
    adminUrl = process.env.DATABASE_URL;
  } else {
    cluster = await startCluster({ mode: 'ephemeral', log: () => {} });
    adminUrl = cluster.adminUrl;
  }
  await dropDatabase(adminUrl, templateDatabase);
  await provisionDatabase(adminUrl, templateDatabase);
  project.provide('adminUrl', adminUrl);
  project.provide('templateDatabase', templateDatabase);
}

export async function teardown(): Promise<void> {
  if (cluster) cluster.stop();
  else if (adminUrl) await dropDatabase(adminUrl, templateDatabase);
}
