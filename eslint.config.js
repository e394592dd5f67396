// ESLint flat config for the whole workspace: TypeScript rules everywhere, React hooks rules in
// the dashboard. Type checking itself is `tsc` (run by `npm test`).
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
              from: [`${WEB}/features`, `${WEB}/app`],
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
    ...webImportRules([{ target: `${WEB}/features`, from: `${WEB}/app`, message: APP_ONLY }]),
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
