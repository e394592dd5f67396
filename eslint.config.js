// ESLint flat config for the whole workspace: TypeScript rules everywhere, type-aware ones
// (typescript-eslint recommendedTypeChecked, typed by each file's nearest tsconfig.json) in every
// TypeScript workspace, React hooks rules in the dashboard. Type checking itself is `tsc`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import importPlugin from 'eslint-plugin-import';
import { readdirSync } from 'node:fs';

const WEB = './apps/web/src';
const FEATURES = readdirSync(new URL('./apps/web/src/features', import.meta.url));
const APP_ONLY = 'Only app/ (router, shell, providers) brings features together.';

/** The dashboard's import rules, with `extraZones` for the files the block covers. */
function webImportRules(extraZones) {
  return {
    plugins: { import: importPlugin },
    settings: {
      'import/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import/resolver': { typescript: { project: './apps/web/tsconfig.json' } },
    },
    rules: {
      'import/no-cycle': 'error',
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            ...FEATURES.map((feature) => ({
              target: `${WEB}/features/${feature}`,
              from: `${WEB}/features`,
              except: [`./${feature}`],
              message: 'Features do not import other features; share it from lib/ or components/.',
            })),
            {
              target: `${WEB}/components`,
              from: `${WEB}/features`,
              message: 'Shared components know no feature.',
            },
            {
              target: [`${WEB}/lib`, `${WEB}/config`],
              from: [`${WEB}/features`, `${WEB}/app`, `${WEB}/components`],
              message: 'lib/ and config/ sit below components and features.',
            },
            ...extraZones,
          ],
        },
      ],
    },
  };
}

export default tseslint.config(
  {
    ignores: [
      '**/dist/**',
      '**/node_modules/**',
      '**/.turbo/**',
      '**/coverage/**',
      'packages/client/src/schema.d.ts',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
      'no-restricted-syntax': [
        'error',
        { selector: 'ExportDefaultDeclaration', message: 'Use named exports.' },
      ],
    },
  },
  {
    files: ['**/*.{ts,tsx}'],
    // Tool configuration files belong to no tsconfig.json (their tools load them).
    ignores: ['**/*.config.ts'],
    extends: [tseslint.configs.recommendedTypeCheckedOnly],
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    rules: {
      // React drops what an event handler returns and TanStack Query awaits what a mutation
      // callback returns, so an async function there is no misused promise; the rule still
      // checks conditions, spreads and every other place a promise could be lost.
      '@typescript-eslint/no-misused-promises': [
        'error',
        { checksVoidReturn: { attributes: false, properties: false } },
      ],
      // Off: `async` is how a function meets a Promise-returning interface (stores, queues, fetch
      // stand-ins in tests) and turns a throw into a rejection; no-floating-promises and
      // await-thenable catch the mistakes that matter.
      '@typescript-eslint/require-await': 'off',
    },
  },
  {
    // Off in the dashboard: d3's zoom behaviours and the session store are closures handed to
    // selection.call and useSyncExternalStore by design; none of them reads `this`.
    files: ['apps/web/**/*.{ts,tsx}'],
    rules: { '@typescript-eslint/unbound-method': 'off' },
  },
  {
    // Tests read HTTP answers (supertest's res.body, Response.json()) that are `any` by design and
    // check their shape with assertions; the no-unsafe rules would want a cast on every line.
    files: ['**/__tests__/**/*.{ts,tsx}', '**/*.test.{ts,tsx}', 'tests/**/*.ts'],
    rules: {
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.recommended.rules,
  },
  {
    // Dashboard boundaries (STYLE.md, bulletproof-react): a feature imports no other feature and
    // not app/ (which brings features together); features use lib/, components/ and config/;
    // components/ imports no feature; lib/ and config/ import neither features nor components.
    // Paths are resolved by the TypeScript resolver, so `../../../features/x` is caught as well
    // as `../x`. Tests may take the app's providers.
    files: ['apps/web/src/**/*.{ts,tsx}'],
    ignores: ['apps/web/src/**/*.test.{ts,tsx}'],
    ...webImportRules([
      { target: `${WEB}/features`, from: `${WEB}/app`, message: APP_ONLY },
      { target: `${WEB}/components`, from: `${WEB}/app`, message: APP_ONLY },
    ]),
  },
  {
    files: ['apps/web/src/**/*.test.{ts,tsx}'],
    ...webImportRules([]),
  },
  {
    // Tool configuration files are loaded by their tools through a default export.
    files: ['**/*.config.{js,ts,mjs}', '**/vite.config.ts', '**/vitest.config.ts'],
    rules: { 'no-restricted-syntax': 'off' },
  },
);
