// A migration that has landed may already have run on a database; editing it afterwards changes nothing
// there and makes a fresh database differ from an old one. drizzle/migration-hashes.json records the
// SHA-256 of each landed migration, so a test notices an edit (or a removal) the moment it happens.
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/** File name (inside drizzle/) → SHA-256 of its bytes, hex. */
export type MigrationHashes = Record<string, string>;

const HASHES_FILE_NAME = 'migration-hashes.json';

export interface MigrationHashCheck {
  /** Recorded migrations whose content is no longer what was recorded. */
  changed: string[];
  /** Recorded migrations that are gone. */
  missing: string[];
  /** Migrations on disk with no recorded hash yet: new ones, to be recorded with `npm run db:hashes`. */
  unrecorded: string[];
}

/** The migration files drizzle-kit writes (`0000_name.sql`), in order. */
function migrationFiles(folder: string): string[] {
  return readdirSync(folder)
    .filter((name) => /^\d{4}_.+\.sql$/.test(name))
    .sort();
}

export function hashMigration(folder: string, name: string): string {
  return createHash('sha256')
    .update(readFileSync(path.join(folder, name)))
    .digest('hex');
}

export function readRecordedHashes(folder: string): MigrationHashes {
  const file = path.join(folder, HASHES_FILE_NAME);
  return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as MigrationHashes) : {};
}

export function checkMigrationHashes(folder: string, recorded: MigrationHashes = readRecordedHashes(folder)): MigrationHashCheck {
  const onDisk = migrationFiles(folder);
  const recordedNames = Object.keys(recorded).sort();
  return {
    changed: recordedNames.filter((name) => onDisk.includes(name) && hashMigration(folder, name) !== recorded[name]),
    missing: recordedNames.filter((name) => !onDisk.includes(name)),
    unrecorded: onDisk.filter((name) => !(name in recorded)),
  };
}

/**
 * Adds the hashes of migrations not recorded yet and returns their names. A hash already recorded is
 * never rewritten, even when its file has changed: that is the mistake the check exists to report.
 */
export function recordNewMigrationHashes(folder: string): string[] {
  const recorded = readRecordedHashes(folder);
  const added = checkMigrationHashes(folder, recorded).unrecorded;
  if (added.length === 0) return [];
  const next: MigrationHashes = { ...recorded };
  for (const name of added) next[name] = hashMigration(folder, name);
  writeFileSync(path.join(folder, HASHES_FILE_NAME), `${JSON.stringify(next, null, 2)}\n`);
  return added;
}
