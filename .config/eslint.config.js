// ESLint flat config. It lives in .config/ to keep the project's top level to the agreed entries;
// package.json passes it with -c. Patterns are relative to the working folder (the project root).
import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import reactRefresh from 'eslint-plugin-react-refresh';
import tseslint from 'typescript-eslint';
import prettier from 'eslint-config-prettier';
import boundaries from 'eslint-plugin-boundaries';

// Names the browser or Node define beyond ECMAScript's own globals: shared/ must not rely on them.
const hostGlobals = [...new Set([...Object.keys(globals.browser), ...Object.keys(globals.node)])]
  .filter((name) => !(name in globals.builtin))
  .map((name) => ({ name, message: `shared/ runs in the browser and on the server: '${name}' belongs to one host.` }));

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-output/**', '.halflight/**', 'coverage/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { ecmaVersion: 2023, globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'separate-type-imports' }],
      'no-console': ['error', { allow: ['warn', 'error'] }],
    },
  },
  {
    files: ['src/**/*.tsx'],
    plugins: { 'react-hooks': reactHooks, 'react-refresh': reactRefresh },
    rules: {
      ...reactHooks.configs.recommended.rules,
      'react-refresh/only-export-components': ['warn', { allowConstantExport: true }],
    },
  },
  {
    // The boot script and benchmarks talk to a person on the terminal.
    files: ['server/index.ts', 'server/dev.ts', 'tests/bench/**'],
    rules: { 'no-console': 'off' },
  },
  {
    // The engine and the schemas use no browser or Node globals either (shared/tsconfig.json has neither
    // set of types; this says so in the editor too). ECMAScript's own globals stay allowed.
    files: ['shared/**/*.ts'],
    rules: { 'no-restricted-globals': ['error', ...hostGlobals] },
  },
  {
    files: ['**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@server', '@server/*'],
              message:
                'There is no @server alias: the client cannot see server code; server files import each other relatively.',
            },
          ],
        },
      ],
    },
  },
  {
    // The layers of DEVELOPERS.md, checked on every import (tests/unit/boundaries.test.ts probes each
    // rule). Imports are resolved through tsconfig's paths, so '@server/x' and '../../server/x' are
    // the same dependency. The first matching element wins: the specific folders come first.
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts'],
    plugins: { boundaries },
    settings: {
      // Each file resolves through its own folder's tsconfig.json, so an alias that folder lacks stays unresolved.
      'import/resolver': {
        typescript: {
          project: ['src/tsconfig.json', 'server/tsconfig.json', 'shared/tsconfig.json'],
          noWarnOnMultipleProjects: true,
        },
      },
      'boundaries/elements': [
        { type: 'feature', pattern: 'src/features/*', capture: ['feature'], partialMatch: false },
        { type: 'client', pattern: 'src', partialMatch: false },
        { type: 'service', pattern: 'server/services', partialMatch: false },
        { type: 'web', pattern: 'server/(middleware|routes|http)', partialMatch: false },
        { type: 'server', pattern: 'server', partialMatch: false },
        { type: 'shared', pattern: 'shared', partialMatch: false },
      ],
    },
    rules: {
      'boundaries/dependencies': [
        'error',
        {
          default: 'allow',
          checkAllOrigins: true,
          policies: [
            {
              from: { element: { type: 'shared' } },
              disallow: { to: { element: { types: { anyOf: ['feature', 'client', 'service', 'web', 'server'] } } } },
              message: 'shared/ runs on both sides: it imports nothing from src/ or server/.',
            },
            {
              from: { element: { type: 'shared' } },
              disallow: { to: { module: { origin: ['core', 'external'] } } },
              message:
                'shared/ runs in the browser and the server: no Node modules, and only the packages listed here.',
            },
            {
              // The packages the engine and the schemas may use: pure computation, no I/O, no DOM.
              from: { element: { type: 'shared' } },
              allow: { to: { module: { origin: 'external', source: ['zod', '@stdlib/*', 'ml-*'] } } },
            },
            {
              from: { element: { types: { anyOf: ['feature', 'client'] } } },
              disallow: { to: { element: { types: { anyOf: ['service', 'web', 'server'] } } } },
              message: 'The client never imports server code; share through shared/.',
            },
            {
              from: { element: { type: 'feature' } },
              disallow: {
                to: { element: { type: 'feature', captured: { feature: '!{{ from.element.captured.feature }}' } } },
              },
              message: 'Features do not import each other; they meet in route modules (src/routes/).',
            },
            {
              from: { element: { type: 'service' } },
              disallow: { to: { element: { type: 'web' } } },
              message: 'Services are the domain layer: they never import middleware, routes or http helpers.',
            },
          ],
        },
      ],
    },
  },
  // Layout is Prettier's job (npm run format); turn off the stylistic rules that would disagree.
  prettier,
);
