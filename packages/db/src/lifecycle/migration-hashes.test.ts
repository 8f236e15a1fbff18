// Landed migrations stay as they landed: drizzle/migration-hashes.json holds their SHA-256, and a new
// migration must be recorded there (`npm run db:hashes`) before it lands.
import { mkdtempSync, rmSync, unlinkSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { migrationsFolder } from './provision.ts';
import { checkMigrationHashes, hashMigration, readRecordedHashes, recordNewMigrationHashes } from './migration-hashes.ts';

describe('the migrations in drizzle/', () => {
  const check = checkMigrationHashes(migrationsFolder);

  it('are each exactly as they landed', () => {
    expect(check.changed, 'a landed migration was edited: restore it and put the change in a new migration').toEqual([]);
  });

  it('are all still there', () => {
    expect(check.missing, 'a landed migration was removed: restore it; databases have already run it').toEqual([]);
  });

  it('are all recorded', () => {
    expect(
      check.unrecorded,
      'a new migration has no recorded hash: run `npm run db:hashes` and commit drizzle/migration-hashes.json',
    ).toEqual([]);
  });
});

describe('the hash record', () => {
  let folder: string | undefined;
  afterEach(() => {
    if (folder) rmSync(folder, { recursive: true, force: true });
    folder = undefined;
  });

  const fresh = (files: Record<string, string>) => {
    folder = mkdtempSync(path.join(os.tmpdir(), 'bumperline-migration-hashes-'));
    for (const [name, content] of Object.entries(files)) writeFileSync(path.join(folder, name), content);
    return folder;
  };

  it('records new migrations only, and never rewrites a recorded hash', () => {
    const dir = fresh({ '0000_first.sql': 'create table a ();', 'notes.txt': 'not a migration' });
    expect(recordNewMigrationHashes(dir)).toEqual(['0000_first.sql']);
    const first = readRecordedHashes(dir)['0000_first.sql'];
    expect(first).toBe(hashMigration(dir, '0000_first.sql'));

    writeFileSync(path.join(dir, '0000_first.sql'), 'create table a (id int);');
    writeFileSync(path.join(dir, '0001_second.sql'), 'create table b ();');
    expect(recordNewMigrationHashes(dir)).toEqual(['0001_second.sql']);
    expect(readRecordedHashes(dir)['0000_first.sql']).toBe(first);
    expect(recordNewMigrationHashes(dir)).toEqual([]);
  });

  it('reports an edited, a removed and an unrecorded migration', () => {
    const dir = fresh({ '0000_first.sql': 'create table a ();', '0001_second.sql': 'create table b ();' });
    recordNewMigrationHashes(dir);
    expect(checkMigrationHashes(dir)).toEqual({ changed: [], missing: [], unrecorded: [] });

    writeFileSync(path.join(dir, '0000_first.sql'), 'create table a (id int);');
    unlinkSync(path.join(dir, '0001_second.sql'));
    writeFileSync(path.join(dir, '0002_third.sql'), 'create table c ();');
    expect(checkMigrationHashes(dir)).toEqual({
      changed: ['0000_first.sql'],
      missing: ['0001_second.sql'],
      unrecorded: ['0002_third.sql'],
    });
  });
});
