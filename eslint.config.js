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
    // The first bundle (routes, the shell, sign-in, the home, the session and the API client) leaves zod
    // and the schemas to the deferred chunk: they reach it through `lazySchema` (issue 12's first-load budget).
    files: [
      'app/**',
      'components/shell/*.tsx',
      'components/auth/sign-in-form.tsx',
      'components/auth/auth-frame.tsx',
      'components/home/**',
      'components/data/{api-client,session,sites,deferred-chunk,route-params,first-landing,query-client,server-errors}.ts',
      'components/offline/persisted-cache.ts',
      'components/plans/use-plan-id.ts',
    ],
    rules: {
      'no-restricted-imports': 'off',
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          paths: [
            {
              name: 'zod',
              allowTypeImports: true,
              message: 'Not in the first bundle: use lazySchema (components/data/api-client).',
            },
            {
              name: '@hookform/resolvers/zod',
              message: 'Not in the first bundle: resolve with a schema from the deferred chunk.',
            },
          ],
          patterns: [
            { group: ['../../*'], message: 'Use the @/ alias.' },
            {
              group: ['@/shared/schemas/*', '!@/shared/schemas/site-kinds', '!@/shared/schemas/audit-entity-types'],
              allowTypeImports: true,
              message: 'Schemas (zod) are not in the first bundle: import types only, or use lazySchema.',
            },
          ],
        },
      ],
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
