import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['**/node_modules/**', '**/dist/**', '.data/**', 'drizzle/**', 'coverage/**', 'bench/results.json', 'apps/web/public/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
    },
  },
  {
    files: ['scripts/**/*.mjs', '*.js'],
    rules: { '@typescript-eslint/consistent-type-imports': 'off' },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/apps/api/**', '@varden/api', '@varden/api/*'], message: 'The web app never imports the API.' }] },
      ],
      // On the server a default locale or zone is the server's, not the reader's (src/lib/reader-format.ts).
      'no-restricted-syntax': [
        'error',
        {
          selector: "NewExpression[callee.object.name='Intl'][arguments.length=0], NewExpression[callee.object.name='Intl'] > Identifier.arguments[name='undefined']",
          message: "Use readerNumberFormat or readerDateFormat (src/lib/reader-format.ts): they format in the reader's locale and zone, on the server too.",
        },
        {
          selector: "CallExpression[callee.property.name=/^toLocale(Date|Time)?String$/][arguments.length=0], CallExpression[callee.property.name=/^toLocale(Date|Time)?String$/] > Identifier.arguments[name='undefined']",
          message: "Pass readerLocale() (src/lib/reader-format.ts): the default is the server's locale when the server draws the page.",
        },
      ],
    },
  },
  {
    // The one place that asks Intl for its defaults (the browser's own locale and zone), and tests that compare with them.
    files: ['apps/web/src/lib/reader-format.ts', 'apps/web/src/**/*.test.{ts,tsx}'],
    rules: { 'no-restricted-syntax': 'off' },
  },
  {
    // The engineering package is pure: plain numbers in, plain objects out, no I/O.
    files: ['packages/engineering/src/**/*.ts'],
    ignores: ['packages/engineering/src/**/*.test.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['node:*', 'fs', 'path', 'http', 'express', 'drizzle-orm*', 'mysql2*', 'react*', 'zod'], message: 'packages/engineering is pure: no I/O and no dependencies.' },
          ],
        },
      ],
      'no-restricted-globals': ['error', { name: 'process', message: 'packages/engineering does not read the environment.' }, 'fetch', 'window', 'document'],
    },
  },
  {
    files: ['packages/schemas/src/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['node:*', 'express', 'drizzle-orm*', 'mysql2*', 'react*', '@varden/api', '@varden/web'], message: 'packages/schemas holds contracts only.' }] },
      ],
    },
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['**/apps/web/**', '@varden/web', 'react*'], message: 'The API never imports the web app.' }] },
      ],
    },
  },
  {
    files: ['apps/api/src/**/*.ts'],
    ignores: ['apps/api/src/config.ts'],
    rules: {
      'no-restricted-properties': ['error', { object: 'process', property: 'env', message: 'Read settings from config.ts (parsed once by zod).' }],
    },
  },
);
