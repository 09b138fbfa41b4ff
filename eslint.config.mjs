import js from '@eslint/js';
import nextPlugin from '@next/eslint-plugin-next';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['.next/**', 'node_modules/**', '.data/**', 'test-results/**', 'playwright-report/**', '.reports/**', 'next-env.d.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { '@next/next': nextPlugin, 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      ...nextPlugin.configs.recommended.rules,
      ...nextPlugin.configs['core-web-vitals'].rules,
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
    },
  },
  {
    // Knex is reached only through queries files (lib/<domain>/queries.ts, *-queries.ts), db/ and tests/;
    // knexfile, the db-setup and clip-move scripts (they close the pool) and the benches (which make throwaway channels) are the other users.
    files: ['**/*.{ts,tsx,mts}'],
    ignores: ['**/queries.ts', '**/*-queries.ts', 'db/**', 'tests/**', 'bench/**', 'knexfile.ts', 'scripts/db-setup.ts', 'scripts/move-clips-to-s3.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            { name: 'knex', message: 'Put the SQL in a queries file (lib/<domain>/queries.ts).' },
            { name: 'pg', message: 'Put the SQL in a queries file (lib/<domain>/queries.ts).' },
          ],
          patterns: [{ group: ['@/db/client', '**/db/client'], message: 'Put the SQL in a queries file (lib/<domain>/queries.ts).' }],
        },
      ],
    },
  },
  { files: ['scripts/**/*.mjs', '*.mjs', 'lib/**/*.mjs'], languageOptions: { globals: globals.node } },
  {
    files: ['**/*.cjs'],
    languageOptions: { sourceType: 'commonjs', globals: globals.node },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
);
