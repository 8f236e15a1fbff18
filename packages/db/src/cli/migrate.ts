// `npm run db:migrate`: applies the migrations in drizzle/ to DATABASE_URL's server, or to this
// checkout's private cluster (started for the purpose and stopped afterwards).
import { startCluster } from '../lifecycle/cluster.ts';
import { provisionDatabase } from '../lifecycle/provision.ts';

const cluster = process.env.DATABASE_URL ? undefined : await startCluster({ mode: 'persistent' });
try {
  const urls = await provisionDatabase(process.env.DATABASE_URL ?? cluster!.adminUrl, process.env.DATABASE_NAME ?? 'bumperline');
  console.log(`Database "${urls.database}" is at the latest migration.`);
} finally {
  cluster?.stop();
}
