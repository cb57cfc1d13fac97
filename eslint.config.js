// ESLint (flat config). Syntax-level rules only (no type-aware linting), so `npm run lint` stays fast on a small machine;
// `npm run typecheck` does the type checking. The import boundaries below are the layering written in DEVELOPERS.md.
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'eslint/config';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import { createNodeResolver, importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const here = (p) => fileURLToPath(new URL(p, import.meta.url));
const subfolders = (dir) =>
  readdirSync(here(dir), { withFileTypes: true })
    .filter((entry) => entry.isDirectory())
    .map((entry) => entry.name);

// Worker-side files run in threads and queue workers without a database: they must not reach the web process's state.
const WORKER_SIDE = ['tasks', 'worker', 'worker-pool', 'queue-worker', 'redis-common', 'worker-main'].map(
  (name) => `./server/jobs/${name}.ts`,
);

const boundaries = [
  // Client: a feature imports no other feature (shared UI and helpers live in src/components and src/lib) and never the app shell.
  ...subfolders('./src/features').map((feature) => ({
    target: `./src/features/${feature}`,
    from: './src/features',
    except: [`./${feature}`],
    message: 'A client feature imports no other feature: move what both need to src/components or src/lib.',
  })),
  { target: './src/features', from: './src/app', message: 'Features do not import the app shell (routes, router, providers).' },
  {
    target: ['./src/components', './src/lib', './src/config'],
    from: ['./src/features', './src/app'],
    message: 'Shared client code (components, lib, config) imports no feature and no route.',
  },
  { target: './src', from: ['./server', './migrations', './scripts'], message: 'The client imports shared/ only, never server code.' },
  // Server: infrastructure imports no feature; features register what infrastructure runs at bootstrap (server/bootstrap.ts).
  // The one exception: row types (*.table.ts, plain interfaces) feed the single Kysely Database type in server/db/schema.ts.
  {
    target: ['./server/db', './server/jobs', './server/common', './server/config'],
    from: [here('./server/features/**')],
    except: ['**/*.table.ts'],
    message: 'Server infrastructure (db, jobs, common, config) imports no feature: register the feature at bootstrap instead.',
  },
  {
    target: ['./server/db', './server/jobs', './server/common', './server/config'],
    from: ['./server/app.ts', './server/bootstrap.ts', './server/index.ts'],
    message: 'Server infrastructure (db, jobs, common, config) does not import the composition root (app.ts, bootstrap.ts, index.ts).',
  },
  {
    target: WORKER_SIDE,
    from: ['./server/db', './server/features', './server/app-context.ts', './server/bootstrap.ts'],
    message: 'Worker-side files import neither the database nor server features (DEVELOPERS.md, the job runner).',
  },
  { target: './server', from: ['./src', './scripts'], message: 'Server code imports neither the client nor scripts.' },
  // shared/ is used by both sides and depends on neither.
  { target: './shared', from: ['./server', './src', './scripts', './migrations'], message: 'shared/ imports neither server/ nor src/.' },
  // Migrations are frozen in time: they import no application code (only kysely and each other through migrations/index.ts).
  {
    target: './migrations',
    from: ['./server', './src', './shared', './scripts', './fixtures'],
    message: 'A migration is frozen in time and imports no application code.',
  },
];

export default defineConfig(
  { ignores: ['dist/', 'node_modules/', 'coverage/', 'data/', 'tests/output/', 'public/'] },
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'import-x': importX },
    languageOptions: { ecmaVersion: 2023, sourceType: 'module' },
    settings: {
      'import-x/resolver-next': [
        createNodeResolver({
          extensions: ['.ts', '.tsx', '.js', '.mjs', '.json'],
          alias: { '@': [here('./src')], '@shared': [here('./shared')] },
        }),
      ],
    },
    rules: {
      'import-x/no-restricted-paths': ['error', { basePath: here('.'), zones: boundaries }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: globals.browser },
    rules: {
      ...reactHooks.configs.flat.recommended.rules,
      // Only tells that the React Compiler would skip a component (TanStack Table, react-hook-form's watch); the build has no compiler.
      'react-hooks/incompatible-library': 'off',
    },
  },
  {
    // Published coefficient tables (Gauss–Kronrod nodes, equation-of-state fits) are kept digit for digit as printed.
    files: ['shared/physics/**'],
    rules: { 'no-loss-of-precision': 'off' },
  },
  {
    // Migrations take Kysely<any> on purpose (Kysely's migration guide): frozen in time, they must not follow today's schema.
    files: ['migrations/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['server/**', 'shared/**', 'migrations/**', 'scripts/**', 'tests/**', 'fixtures/**', '*.{js,ts}'],
    languageOptions: { globals: globals.node },
  },
);
