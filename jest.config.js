/**
 * Jest projects. Node-side code (the computational core, the server, the
 * browser tests) goes through ts-jest in transpile-only mode — `npm run
 * typecheck` is the type gate. Component tests use the jest-expo web preset.
 * Caches stay inside the ignored .kenning folder, not the system temp folder.
 */
const path = require('node:path');

const cacheDirectory = path.join(__dirname, '.kenning', 'cache', 'jest');

const tsJest = [
  'ts-jest',
  {
    diagnostics: false,
    tsconfig: {
      module: 'commonjs',
      moduleResolution: 'node',
      target: 'es2022',
      esModuleInterop: true,
      jsx: 'react-jsx',
      resolveJsonModule: true,
      allowJs: true,
      isolatedModules: true,
    },
  },
];

const nodeProject = (name, extra = {}) => ({
  displayName: name,
  testEnvironment: 'node',
  roots: ['<rootDir>/tests/' + name],
  testMatch: ['**/*.test.ts'],
  transform: { '^.+\\.tsx?$': tsJest },
  moduleNameMapper: {
    '^@/(.*)$': '<rootDir>/$1',
    '^quick-lru$': '<rootDir>/tests/support/quick-lru-stub.js',
    // d3-contour and d3-array are ES modules only in their package entry; Jest's CommonJS runtime takes their UMD builds.
    '^d3-(contour|array)$': '<rootDir>/node_modules/d3-$1/dist/d3-$1.js',
  },
  cacheDirectory,
  ...extra,
});

module.exports = {
  // testTimeout is global in Jest 29 (ignored per project): browser tests and cold router renders need the room.
  testTimeout: 120000,
  projects: [
    nodeProject('unit'),
    nodeProject('api'),
    nodeProject('e2e'),
    {
      displayName: 'components',
      preset: 'jest-expo/web',
      roots: ['<rootDir>/tests/components'],
      testMatch: ['**/*.test.tsx'],
      setupFiles: ['<rootDir>/tests/components/setup.ts'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
      cacheDirectory,
    },
  ],
};
