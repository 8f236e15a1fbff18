// The scale data's own database on a server we administer: made afresh, migrated, loaded, and marked
// complete, so a benchmark can tell a finished load from one that was interrupted.
import { adminQuery, dropDatabase, provisionDatabase, urlsFor, type DatabaseUrls } from '../lifecycle/provision.ts';
import { SCALE_DATABASE, seedScale, type ScaleOptions, type ScaleResult } from './scale-seed.ts';

const MARK = 'bumperline scale data, complete';

/** Drops the scale database if present, makes it again at the latest migration, and loads the scale data. */
export async function refreshScaleDatabase(
  adminUrl: string,
  options: ScaleOptions & { database?: string } = {},
): Promise<ScaleResult & { urls: DatabaseUrls }> {
  const database = options.database ?? SCALE_DATABASE;
  await dropDatabase(adminUrl, database);
  const urls = await provisionDatabase(adminUrl, database);
  const result = await seedScale({ ...options, ownerUrl: urls.ownerUrl });
  await adminQuery(adminUrl, (c) => c.query(`COMMENT ON DATABASE "${database}" IS '${MARK}'`));
  return { ...result, urls };
}

/** The scale database's URLs when a load finished in it (migrated to the latest first), else undefined. */
export async function readyScaleDatabase(adminUrl: string, database = SCALE_DATABASE): Promise<DatabaseUrls | undefined> {
  const comment = await adminQuery(adminUrl, (c) =>
    c.query<{ comment: string | null }>(`select shobj_description(oid, 'pg_database') as comment from pg_database where datname = $1`, [
      database,
    ]),
  );
  if (comment.rows[0]?.comment !== MARK) return undefined;
  // Migrations that landed since the load apply to its rows like to any other database's.
  await provisionDatabase(adminUrl, database);
  return urlsFor(adminUrl, database);
}
