// The import boundaries are lint rules (.eslint.config.js). Each case plants a snippet at a path in the
// tree (the file need not exist: the path alone picks the per-folder rules) and lints it with the
// project's own config: an import across a boundary must be reported, an allowed one must pass clean.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint } from 'eslint';
import { describe, expect, it } from 'vitest';

const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const eslint = new ESLint({ cwd: repoRoot, overrideConfigFile: path.join(repoRoot, '.eslint.config.js') });

/** The rules ESLint reports for `code` as if it were the file at `file` (relative to the repository). */
async function reportedRules(file: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(repoRoot, file) });
  return result!.messages.map((m) => m.ruleId ?? m.message);
}

// Loading the config and the TypeScript parser takes a moment the first time.
const timeout = 30_000;

const forbidden: { name: string; file: string; code: string; rule: string }[] = [
  {
    name: 'a feature importing another feature by a sibling path',
    file: 'apps/web/src/features/calls/planted.tsx',
    code: "import { GamesPage } from '../games/games-page.tsx';\nexport const planted = GamesPage;\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'a feature importing another feature through features/',
    file: 'apps/web/src/features/calls/planted.tsx',
    code: "import { GamesPage } from '../../features/games/games-page.tsx';\nexport const planted = GamesPage;\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'a feature loading another feature lazily',
    file: 'apps/web/src/features/calls/planted.tsx',
    code: "export const planted = () => import('../games/games-page.tsx');\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'a feature importing app/',
    file: 'apps/web/src/features/calls/planted.tsx',
    code: "import { router } from '../../app/router.tsx';\nexport const planted = router;\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'a shared component importing app/',
    file: 'apps/web/src/components/planted.tsx',
    code: "import { RequireSignedIn } from '../app/guards.tsx';\nexport const planted = RequireSignedIn;\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'an api/ module importing a feature',
    file: 'apps/web/src/api/planted.ts',
    code: "import { GamesPage } from '../features/games/games-page.tsx';\nexport const planted = GamesPage;\n",
    rule: 'import-x/no-restricted-paths',
  },
  {
    name: 'packages/domain importing packages/contracts by name',
    file: 'packages/domain/src/planted.ts',
    code: "import { roles } from '@bumperline/contracts/roles';\nexport const planted = roles;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'packages/domain importing packages/contracts by a relative path',
    file: 'packages/domain/src/planted.ts',
    code: "import { roles } from '../../contracts/src/roles.ts';\nexport const planted = roles;\n",
    rule: 'import-x/no-relative-packages',
  },
  {
    name: 'packages/contracts importing something other than zod or libphonenumber-js',
    file: 'packages/contracts/src/planted.ts',
    code: "import { sql } from 'drizzle-orm';\nexport const planted = sql;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'packages/db importing the API',
    file: 'packages/db/src/planted.ts',
    code: "import { createApp } from '@bumperline/api/app';\nexport const planted = createApp;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the web app importing packages/db, even a type',
    file: 'apps/web/src/api/planted.ts',
    code: "import type { Db } from '@bumperline/db/client';\nexport type Planted = Db;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the web app importing the API',
    file: 'apps/web/src/lib/planted.ts',
    code: "import { createApp } from '@bumperline/api/app';\nexport const planted = createApp;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the web app importing drizzle-orm or pg',
    file: 'apps/web/src/features/games/planted.tsx',
    code: "import { sql } from 'drizzle-orm';\nimport pg from 'pg';\nexport const planted = [sql, pg];\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the first screen taking a value from a contracts file with zod schemas (zod would join the main bundle)',
    file: 'apps/web/src/features/home/planted.tsx',
    code: "import { callListQuery } from '@bumperline/contracts/calls';\nexport const planted = callListQuery;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'a fetcher taking a value from a contracts file with zod schemas',
    file: 'apps/web/src/api/planted.ts',
    code: "import { gameInput } from '@bumperline/contracts/games';\nexport const planted = gameInput;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the first screen still shut off from packages/db by its own stricter rule',
    file: 'apps/web/src/components/planted.tsx',
    code: "import { createDb } from '@bumperline/db/client';\nexport const planted = createDb;\n",
    rule: '@typescript-eslint/no-restricted-imports',
  },
  {
    name: 'the API writing SQL with drizzle-orm',
    file: 'apps/api/src/routes/planted.ts',
    code: "import { eq, sql } from 'drizzle-orm';\nexport const planted = [eq, sql];\n",
    rule: 'no-restricted-imports',
  },
  {
    name: 'the API importing the schema or pg',
    file: 'apps/api/src/jobs/planted.ts',
    code: "import { users } from '@bumperline/db/schema/index';\nimport pg from 'pg';\nexport const planted = [users, pg];\n",
    rule: 'no-restricted-imports',
  },
];

const allowed: { name: string; file: string; code: string }[] = [
  {
    name: 'the first screen taking types from any contracts file and values from the zod-free ones',
    file: 'apps/web/src/features/home/planted.tsx',
    code: [
      "import type { CallListQuery } from '@bumperline/contracts/calls';",
      "import { type Game } from '@bumperline/contracts/games';",
      "import { problemLabels } from '@bumperline/contracts/call-vocabulary';",
      "import { roleLabels } from '@bumperline/contracts/roles';",
      'export type Planted = [CallListQuery, Game];',
      'export const planted = [problemLabels, roleLabels];',
      '',
    ].join('\n'),
  },
  {
    name: 'a form screen, loaded on demand, taking its zod schema',
    file: 'apps/web/src/features/games/planted.tsx',
    code: "import { gameInput } from '@bumperline/contracts/games';\nexport const planted = gameInput;\n",
  },
  {
    name: 'a feature importing its own files, shared code, lib/paths.ts and contracts',
    file: 'apps/web/src/features/calls/planted.tsx',
    code: [
      "import { roleLabels } from '@bumperline/contracts/roles';",
      "import { useMe } from '../../api/me.ts';",
      "import { GameStatusBadge } from '../../components/game-status-badge.tsx';",
      "import { paths } from '../../lib/paths.ts';",
      "import { CallsPage } from './calls-page.tsx';",
      'export const planted = [roleLabels, useMe, GameStatusBadge, paths, CallsPage];',
      '',
    ].join('\n'),
  },
  {
    name: 'app/ importing features and lib/paths.ts',
    file: 'apps/web/src/app/planted.tsx',
    code: [
      "import { paths } from '../lib/paths.ts';",
      "import { SignInPage } from '../features/auth/sign-in-page.tsx';",
      "export const planted = [paths, SignInPage, () => import('../features/games/games-page.tsx')];",
      '',
    ].join('\n'),
  },
  {
    name: 'packages/contracts importing zod, libphonenumber-js and its own files',
    file: 'packages/contracts/src/planted.ts',
    code: [
      "import { z } from 'zod';",
      "import { parsePhoneNumberFromString } from 'libphonenumber-js';",
      "import { uuid } from './common.ts';",
      'export const planted = [z, parsePhoneNumberFromString, uuid];',
      '',
    ].join('\n'),
  },
  {
    name: 'the API calling the database through its client, query functions and errors',
    file: 'apps/api/src/routes/planted.ts',
    code: [
      "import { withScope } from '@bumperline/db/client';",
      "import { InvalidCursorError } from '@bumperline/db/errors';",
      "import { getCall } from '@bumperline/db/queries/calls';",
      'export const planted = [withScope, InvalidCursorError, getCall];',
      '',
    ].join('\n'),
  },
];

describe('import boundaries', () => {
  for (const c of forbidden) {
    it(`reports ${c.name}`, { timeout }, async () => {
      expect(await reportedRules(c.file, c.code)).toContain(c.rule);
    });
  }

  for (const c of allowed) {
    it(`allows ${c.name}`, { timeout }, async () => {
      expect(await reportedRules(c.file, c.code)).toEqual([]);
    });
  }
});
