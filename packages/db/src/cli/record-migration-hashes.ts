// `npm run db:hashes`: records the SHA-256 of each new migration in drizzle/migration-hashes.json (never
// rewriting one already there). With `--remind` (run after `db:generate`) it records nothing and only
// says what is new: a custom migration is generated empty and written by hand, so it is recorded once
// it is finished, not the moment it appears.
import { migrationsFolder } from '../lifecycle/provision.ts';
import { checkMigrationHashes, recordNewMigrationHashes } from '../lifecycle/migration-hashes.ts';

const remindOnly = process.argv.includes('--remind');
const { changed, missing, unrecorded } = checkMigrationHashes(migrationsFolder);

if (remindOnly) {
  if (unrecorded.length > 0) {
    console.log(`New migration(s): ${unrecorded.join(', ')}. When finished, record them with \`npm run db:hashes\` and commit both.`);
  }
} else {
  const added = recordNewMigrationHashes(migrationsFolder);
  console.log(added.length > 0 ? `Recorded: ${added.join(', ')}.` : 'Every migration is already recorded.');
}

if (changed.length > 0 || missing.length > 0) {
  console.error(
    [
      ...changed.map((name) => `drizzle/${name} changed after it landed.`),
      ...missing.map((name) => `drizzle/${name} was removed after it landed.`),
      'A landed migration is never edited or removed (databases have already run it): restore it and add a new migration.',
    ].join('\n'),
  );
  process.exitCode = 1;
}
