// ESLint flat config (a dotfile, so the top level keeps only the agreed layout): run as `npm run lint`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';

// Boundaries between folders are judged on the file an import resolves to, so every spelling of a path
// (`../games/x`, `../../features/games/x`, a dynamic import()) is caught. Paths are from this folder.
const repoRoot = fileURLToPath(new URL('.', import.meta.url));
const web = 'apps/web/src';
// Every folder under features/ is a feature; a new one is fenced in as soon as it exists.
const features = readdirSync(new URL(`${web}/features`, import.meta.url), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

// The web app reaches the database only through the API.
const webNeverImports = {
  group: ['@bumperline/db', '@bumperline/db/*', '@bumperline/api', '@bumperline/api/*', 'drizzle-orm', 'drizzle-orm/*', 'pg', 'pg/*'],
  message: 'The web app reaches the database only through the API: import types from @bumperline/contracts.',
};
// Contracts files that import no zod, so the first screen may take values from them.
const zodFreeContracts = ['roles', 'call-vocabulary', 'game-vocabulary', 'sign-in-refusals', 'care-vocabulary', 'stock-vocabulary'];

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-results/**', 'drizzle/**', '**/*.tmp.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_' },
      ],
      '@typescript-eslint/no-non-null-assertion': 'off',
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
    },
  },
  {
    // Web imports run one way: shared (lib, components, api) → features → app.
    files: ['apps/web/**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver-next': [createNodeResolver()] },
    rules: {
      'import-x/no-restricted-paths': [
        'error',
        {
          basePath: repoRoot,
          zones: [
            ...features.map((feature) => ({
              target: `${web}/features/${feature}`,
              from: `${web}/features`,
              except: [`./${feature}`],
              message: 'A feature must not import another feature; move shared code to api/, components/ or lib/.',
            })),
            {
              target: [`${web}/api`, `${web}/components`, `${web}/lib`],
              from: `${web}/features`,
              message: 'Shared code (api/, components/, lib/) must not import a feature.',
            },
            {
              target: [`${web}/api`, `${web}/components`, `${web}/features`, `${web}/lib`],
              from: `${web}/app`,
              message: 'Only app/ imports app/ (router, shell, guards); links come from lib/paths.ts.',
            },
          ],
        },
      ],
    },
  },
  {
    // A workspace is reached by its package name, never by a relative path out of its own folder.
    files: ['apps/**/*.{ts,tsx}', 'packages/**/*.ts', 'fakes/**/*.ts'],
    plugins: { 'import-x': importX },
    settings: { 'import-x/resolver-next': [createNodeResolver()] },
    rules: { 'import-x/no-relative-packages': 'error' },
  },
  // Package boundaries by package name. `@typescript-eslint/no-restricted-imports` (not the core rule) so
  // that these blocks never replace another block's `no-restricted-imports` options on the same file.
  {
    files: ['packages/domain/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        { patterns: [{ group: ['@bumperline/*'], message: 'packages/domain is pure computation: it imports nothing of ours.' }] },
      ],
    },
  },
  {
    files: ['packages/contracts/**/*.ts'],
    ignores: ['**/*.test.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '^(?!(zod|libphonenumber-js)(/|$)|\\.\\.?/)',
              message: 'packages/contracts imports only zod, libphonenumber-js and its own files: the web app and the API both load it.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['packages/db/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@bumperline/api', '@bumperline/api/*', '@bumperline/web', '@bumperline/web/*'],
              message: 'packages/db must not import the apps; the apps import it.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    rules: { '@typescript-eslint/no-restricted-imports': ['error', { patterns: [webNeverImports] }] },
  },
  {
    // What the first screen loads (the shell, fetchers, shared components, Today and the technician's home)
    // takes only types from the contracts' zod schemas: a value import would put zod in the main bundle.
    // The words and states a screen shows live in zod-free files (call-vocabulary, game-vocabulary, …).
    files: [`${web}/{app,api,components,lib}/**/*.{ts,tsx}`, `${web}/features/home/**/*.{ts,tsx}`, `${web}/main.tsx`],
    ignores: ['**/*.test.{ts,tsx}'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            webNeverImports,
            {
              regex: `^@bumperline/contracts/(?!(${zodFreeContracts.join('|')})$)`,
              allowTypeImports: true,
              message:
                'The first screen imports only types from the contracts with zod schemas (zod would join the main bundle): take values from a zod-free contracts file.',
            },
          ],
        },
      ],
    },
  },
  {
    // The API reaches the database only through @bumperline/db's client and query functions: no SQL, no
    // drizzle operators, no tables. (The web app's own block above already shuts the database out.)
    files: ['apps/**/*.{ts,tsx}'],
    ignores: ['apps/web/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['drizzle-orm', 'drizzle-orm/*', 'pg', 'pg/*', '@bumperline/db/schema', '@bumperline/db/schema/*'],
              message: 'SQL lives in packages/db: call (or add) a function in @bumperline/db/queries/<table>.',
            },
          ],
        },
      ],
    },
  },
  {
    // Only the env modules read process.env.
    files: ['apps/**/*.{ts,tsx}', 'packages/**/*.ts'],
    ignores: ['apps/api/src/env.ts', '**/*.test.ts', 'packages/db/src/lifecycle/**', 'packages/db/src/cli/**'],
    rules: {
      'no-restricted-properties': [
        'error',
        { object: 'process', property: 'env', message: 'Read configuration through apps/api/src/env.ts.' },
      ],
    },
  },
);
