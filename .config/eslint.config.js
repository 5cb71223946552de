// ESLint flat config. It lives in .config/ to keep the project's top level to the agreed entries;
// package.json passes it with -c. Patterns are relative to the working folder (the project root).
import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import reactRefresh from 'eslint-plugin-react-refresh';
import tseslint from 'typescript-eslint';
import prettier from 'eslint-config-prettier';

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
    // The science engine must stay free of Node, DOM and server code (it runs in both places).
    files: ['shared/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        { patterns: ['node:*', '@/*', '@server/*', '../../server/*', '../../src/*', 'express', 'sequelize'] },
      ],
    },
  },
  // Layout is Prettier's job (npm run format); turn off the stylistic rules that would disagree.
  prettier,
);
