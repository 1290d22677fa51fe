// ESLint flat config: TypeScript, React hooks and TanStack Query rules.
const js = require('@eslint/js');
const tseslint = require('typescript-eslint');
const reactHooks = require('eslint-plugin-react-hooks');
const pluginQuery = require('@tanstack/eslint-plugin-query');
const globals = require('globals');

module.exports = tseslint.config(
  { ignores: ['node_modules/', 'dist/', '.kenning/', '.expo/', 'coverage/', 'expo-env.d.ts', 'tests/e2e/screenshots/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...pluginQuery.configs['flat/recommended'],
  {
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-require-imports': 'off',
      'no-restricted-imports': ['error', { patterns: [{ group: ['../../*'], message: 'Use the @/ alias.' }] }],
    },
  },
  {
    files: ['**/*.js', '**/*.mjs'],
    rules: { '@typescript-eslint/no-var-requires': 'off' },
  },
  {
    files: ['tests/**'],
    languageOptions: { globals: globals.jest },
    rules: { '@typescript-eslint/no-non-null-assertion': 'off' },
  },
);
