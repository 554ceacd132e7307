import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import nextPlugin from '@next/eslint-plugin-next';

// Layers: app → lib services → models and the engine (lib/sim). Each block below names what a
// folder may not import; `import type` counts too, so types that components need live in
// lib/view-types. A later block for the same files would replace the rule, so the folders
// do not overlap.
const restrict = (...patterns) => ({ 'no-restricted-imports': ['error', { patterns }] });
const ban = (regex, message) => ({ regex, message });

const ENGINE_OUT = 'The engine (lib/sim) imports nothing of the app: keep it a library.';
// A relative path out of lib/sim, for a file `depth` folders below it.
const engineBlocks = [0, 1, 2, 3].map((depth) => ({
  files: [`lib/sim/${'*/'.repeat(depth)}*.{ts,tsx,mts}`],
  rules: restrict(
    ban('^@/(?!lib/sim(/|$))', ENGINE_OUT),
    ban(`^(\\./)?(\\.\\./){${depth + 1},}`, ENGINE_OUT),
  ),
}));

const ENGINE_DOOR = ban(
  '^(@/lib/|(\\.\\.?/)+(lib/)?)sim/(?!runtime$)',
  'Outside lib/sim, import the engine through its doors only: `@/lib/sim` or `@/lib/sim/runtime`.',
);

export default tseslint.config(
  {
    ignores: [
      'node_modules/',
      '.next/',
      '.next-test-*/',
      '.build/',
      '.data/',
      'next-env.d.ts',
      'test-results/',
      'playwright-report/',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,mts}'],
    plugins: { 'react-hooks': reactHooks, '@next/next': nextPlugin },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...nextPlugin.configs.recommended.rules,
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    // Every file outside the engine; the blocks below repeat ENGINE_DOOR, since a later block
    // replaces this rule for its files.
    files: ['**/*.{ts,tsx,mts,mjs}'],
    ignores: ['lib/sim/**'],
    rules: restrict(ENGINE_DOOR),
  },
  {
    files: ['components/**/*.{ts,tsx}'],
    rules: restrict(
      ENGINE_DOOR,
      ban(
        '^(@/|(\\.\\./)+)(models|lib/services)(/|$)',
        'Components never touch models or services: take the shape from lib/view-types and the data from an API route or a page.',
      ),
    ),
  },
  {
    files: ['app/**/*.{ts,tsx}'],
    rules: restrict(
      ENGINE_DOOR,
      ban(
        '^(@/|(\\.\\./)+)models(/|$)',
        'Pages and routes reach the database through a service in lib/services.',
      ),
    ),
  },
  {
    files: ['models/**/*.ts'],
    rules: restrict(
      ENGINE_DOOR,
      ban(
        '^(@/|\\.\\./)(app|components|lib/(services|mail|billing|http|view-types|brief|registers|runs)|lib/auth/(?!roles$))',
        'Models import nothing above them: only the database connection, plain types and the role list.',
      ),
    ),
  },
  {
    files: ['lib/mail/**/*.ts'],
    rules: restrict(
      ENGINE_DOOR,
      ban(
        '^(@/lib/|(\\.\\./)+(lib/)?)services(/|$)',
        'Mail imports no service: the service that sends a mail passes its recipients in.',
      ),
    ),
  },
  {
    // Client components import these modules: shapes only, never server code.
    files: ['lib/view-types/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            ENGINE_DOOR,
            {
              regex: '^@/(models|lib/(services|db|mail|auth/(?!roles$)))(/|$)',
              allowTypeImports: true,
              message: 'View types hold shapes only: import server modules with `import type`.',
            },
          ],
        },
      ],
    },
  },
  ...engineBlocks,
  {
    // Published coefficient tables keep all the digits their sources print.
    files: ['lib/sim/**/math/**/*.ts'],
    rules: { 'no-loss-of-precision': 'off', '@typescript-eslint/no-loss-of-precision': 'off' },
  },
  {
    // Tests read loosely typed JSON replies.
    files: ['tests/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // The console guard (tests/e2e/fixtures.ts) holds only for specs that take its test.
    files: ['tests/e2e/**/*.spec.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: '@playwright/test',
              importNames: ['test', 'expect'],
              allowTypeImports: true,
              message: "Take test and expect from './fixtures', which fails a test on a console error.",
            },
          ],
        },
      ],
    },
  },
  {
    files: ['**/*.cjs'],
    languageOptions: {
      sourceType: 'commonjs',
      globals: {
        require: 'readonly',
        module: 'writable',
        process: 'readonly',
        __dirname: 'readonly',
        console: 'readonly',
      },
    },
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    files: ['**/*.mjs'],
    languageOptions: { globals: { process: 'readonly', console: 'readonly' } },
  },
);
