import type { Config } from 'jest';

// Two projects: `unit` runs pure modules in-process; `integration` talks to the real
// production build over HTTP against the real MariaDB (see tests/integration/global-setup.ts).
const shared = {
  testEnvironment: 'node',
  moduleNameMapper: {
    '^@/(.*)$': '<rootDir>/src/$1',
    // The marker throws outside Next's server bundle; tests import database, mail and payments code directly.
    '^server-only$': '<rootDir>/node_modules/server-only/empty.js',
  },
  transform: {
    '^.+\\.tsx?$': [
      'ts-jest',
      {
        tsconfig: {
          jsx: 'react-jsx',
          module: 'commonjs',
          moduleResolution: 'node',
          esModuleInterop: true,
          isolatedModules: true,
        },
      },
    ],
  },
} satisfies Config['projects'] extends (infer P)[] | undefined ? Exclude<P, string> : never;

const config: Config = {
  // Per-project testTimeout is ignored by Jest 30; integration tests talk to real servers, so allow 30 s.
  testTimeout: 30_000,
  projects: [
    { ...shared, displayName: 'unit', testMatch: ['<rootDir>/tests/unit/**/*.test.ts'] },
    {
      ...shared,
      displayName: 'integration',
      testMatch: ['<rootDir>/tests/integration/**/*.test.ts'],
      globalSetup: '<rootDir>/tests/integration/global-setup.ts',
      globalTeardown: '<rootDir>/tests/integration/global-teardown.ts',
    },
  ],
};

export default config;
