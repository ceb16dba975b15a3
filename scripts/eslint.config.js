// ESLint flat config (kept in scripts/ so the top level stays as ARCHITECTURE.md fixes it;
// `npm run lint` passes --config). Enforces the import boundaries of shared/STYLE.md:
//   analysis/  pure: imports nothing from src/, server/ or node:* (the CLI entry is the one exception)
//   server/    never imports src/
//   src/       imports server/contracts/ and analysis/ only from the server side;
//              app → features → components | lib | config, and no feature imports another.
import { readdirSync, existsSync } from 'node:fs';
import path from 'node:path';
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import { importX, createNodeResolver } from 'eslint-plugin-import-x';
import globals from 'globals';

const root = path.resolve(import.meta.dirname, '..');
const featuresDir = path.join(root, 'src/features');
const features = existsSync(featuresDir)
  ? readdirSync(featuresDir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name)
  : [];

const nodeBuiltins = ['fs', 'path', 'os', 'child_process', 'worker_threads', 'stream', 'crypto', 'http', 'https', 'net', 'url', 'util', 'buffer', 'process'];

export default tseslint.config(
  {
    basePath: root,
    ignores: ['node_modules/**', 'dist/**', '.data/**', 'storage/**', 'samples/**', 'test-results/**', 'coverage/**', 'tests/bench/out/**', '**/*.py'],
  },
  {
    basePath: root,
    files: ['**/*.{ts,tsx,js}'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    plugins: { 'import-x': importX },
    settings: {
      'import-x/resolver-next': [createNodeResolver({ extensions: ['.ts', '.tsx', '.js', '.json'] })],
    },
    languageOptions: {
      ecmaVersion: 2023,
      sourceType: 'module',
      globals: { ...globals.node, ...globals.browser },
    },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
      'import-x/no-cycle': 'off',
      'import-x/no-restricted-paths': [
        'error',
        {
          basePath: root,
          zones: [
            { target: './analysis', from: './src', message: 'analysis/ is pure: no client code.' },
            { target: './analysis', from: './server', message: 'analysis/ is pure: no server code.' },
            { target: './server', from: './src', message: 'the server never imports the client.' },
            { target: './src', from: './server', except: ['./contracts'], message: 'the client imports only server/contracts/.' },
            { target: './src/features', from: './src/app', message: 'features never import the app layer.' },
            { target: ['./src/components', './src/lib', './src/config'], from: ['./src/features', './src/app'], message: 'shared code never imports features or the app.' },
            ...features.map((f) => ({
              target: `./src/features/${f}`,
              from: './src/features',
              except: [`./${f}`],
              message: 'no feature imports another; combine them in a route.',
            })),
          ],
        },
      ],
    },
  },
  {
    basePath: root,
    files: ['analysis/**/*.ts'],
    ignores: ['analysis/cli.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['node:*'], message: 'analysis/ is pure: no node:* imports (only analysis/cli.ts may do I/O).' },
            { group: nodeBuiltins, message: 'analysis/ is pure: no Node built-ins.' },
          ],
        },
      ],
    },
  },
  {
    basePath: root,
    files: ['server/contracts/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: [{ group: ['express', 'node:*', 'knex', '../modules/*', '../db/*'], message: 'contracts hold zod schemas only; the client imports them.' }] },
      ],
    },
  },
);
