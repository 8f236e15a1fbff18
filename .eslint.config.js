// ESLint flat config (a dotfile, so the top level keeps only the agreed layout): run as `npm run lint`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

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
      // Imports run one way: shared (lib, components, api) → features → app.
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['../../features/*', '../features/*/*'],
              message: 'A feature must not import another feature; move shared code to api/ or components/.',
            },
          ],
        },
      ],
    },
  },
  {
    files: ['apps/web/src/app/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': 'off' },
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
