// Roles, database and migrations on a server we may administer (our private cluster or DATABASE_URL).
// Two roles: the owner runs migrations and seeds (it owns the tables and may bypass row security);
// the app role, which the API uses, owns nothing and cannot bypass row security.
import { createHash } from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { drizzle } from 'drizzle-orm/node-postgres';
import { migrate } from 'drizzle-orm/node-postgres/migrator';

export const OWNER_ROLE = 'bumperline_owner';
export const APP_ROLE = 'bumperline_app';

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../../../drizzle');

export interface DatabaseUrls {
  ownerUrl: string;
  appUrl: string;
  database: string;
}

// Role passwords are derived from the admin URL, so every process that knows the server agrees on them
// without a file, and nothing secret is committed.
function rolePassword(adminUrl: string, role: string): string {
  return createHash('sha256').update(`${adminUrl}#${role}`).digest('base64url');
}

function withDatabase(url: string, database: string, user?: string, password?: string): string {
  const u = new URL(url);
  u.pathname = `/${database}`;
  if (user) u.username = user;
  if (password) u.password = encodeURIComponent(password);
  return u.toString();
}

/** Runs fn on a connection of its own to the admin URL, closed afterwards. */
export async function adminQuery<T>(adminUrl: string, fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

const ident = (s: string) => `"${s.replace(/"/g, '""')}"`;
const literal = (s: string) => `'${s.replace(/'/g, "''")}'`;

/** Creates (or updates the passwords of) the owner and app roles. Safe to run again. */
export async function ensureRoles(adminUrl: string): Promise<void> {
  await adminQuery(adminUrl, async (c) => {
    for (const [role, attrs] of [
      [OWNER_ROLE, 'LOGIN BYPASSRLS NOSUPERUSER'],
      [APP_ROLE, 'LOGIN NOBYPASSRLS NOSUPERUSER NOCREATEDB NOCREATEROLE'],
    ] as const) {
      const exists = await c.query('select 1 from pg_roles where rolname = $1', [role]);
      const verb = exists.rowCount ? 'ALTER' : 'CREATE';
      try {
        await c.query(`${verb} ROLE ${ident(role)} ${attrs} PASSWORD ${literal(rolePassword(adminUrl, role))}`);
      } catch (err) {
        // Two processes creating the same role at once: the loser finds it made by the winner.
        if ((err as { code?: string }).code !== '23505' && (err as { code?: string }).code !== '42710') throw err;
      }
    }
  });
}

export async function databaseExists(adminUrl: string, database: string): Promise<boolean> {
  return adminQuery(adminUrl, async (c) => {
    const r = await c.query('select 1 from pg_database where datname = $1', [database]);
    return (r.rowCount ?? 0) > 0;
  });
}

/** Creates a database owned by the owner role, optionally as a copy of a template (fast for tests). */
export async function createDatabase(adminUrl: string, database: string, template?: string): Promise<void> {
  await adminQuery(adminUrl, (c) =>
    c.query(`CREATE DATABASE ${ident(database)} OWNER ${ident(OWNER_ROLE)}${template ? ` TEMPLATE ${ident(template)}` : ''}`),
  );
}

export async function dropDatabase(adminUrl: string, database: string): Promise<void> {
  await adminQuery(adminUrl, (c) => c.query(`DROP DATABASE IF EXISTS ${ident(database)} WITH (FORCE)`));
}

export function urlsFor(adminUrl: string, database: string): DatabaseUrls {
  return {
    database,
    ownerUrl: withDatabase(adminUrl, database, OWNER_ROLE, rolePassword(adminUrl, OWNER_ROLE)),
    appUrl: withDatabase(adminUrl, database, APP_ROLE, rolePassword(adminUrl, APP_ROLE)),
  };
}

/** Applies the generated migrations in drizzle/ as the owner role. */
export async function runMigrations(ownerUrl: string): Promise<void> {
  const pool = new pg.Pool({ connectionString: ownerUrl, max: 1 });
  try {
    await migrate(drizzle(pool), { migrationsFolder });
  } finally {
    await pool.end();
  }
}

/** Any constant: the advisory lock provisioning holds on the admin connection ("BL" and "prov" in its bytes). */
const PROVISION_LOCK = 0x424c_7072_6f76;

/**
 * Roles, database (created when missing) and migrations: everything a fresh server needs. Several API
 * instances starting at once take turns (an advisory lock on the admin database, held by a connection
 * of its own), so the first provisions and the others find everything done.
 */
export async function provisionDatabase(adminUrl: string, database: string): Promise<DatabaseUrls> {
  return adminQuery(adminUrl, async (lock) => {
    await lock.query('select pg_advisory_lock($1)', [PROVISION_LOCK]);
    try {
      await ensureRoles(adminUrl);
      if (!(await databaseExists(adminUrl, database))) await createDatabase(adminUrl, database);
      const urls = urlsFor(adminUrl, database);
      await runMigrations(urls.ownerUrl);
      return urls;
    } finally {
      await lock.query('select pg_advisory_unlock($1)', [PROVISION_LOCK]);
    }
  });
}
