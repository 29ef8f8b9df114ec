import type { Config } from 'jest';

// Two projects: `unit` runs pure modules in-process; `integration` talks to the real
// production build over HTTP against the real MariaDB (see tests/integration/global-setup.ts).
const shared = {
  testEnvironment: 'node',
  moduleNameMapper: { '^@/(.*)$': '<rootDir>/src/$1' },
  transform: {
    '^.+\\.tsx?$': ['ts-jest', { tsconfig: { jsx: 'react-jsx', module: 'commonjs', moduleResolution: 'node', esModuleInterop: true, isolatedModules: true } }],
  },
} satisfies Config['projects'] extends (infer P)[] | undefined ? Exclude<P, string> : never;

const config: Config = {
  projects: [
    { ...shared, displayName: 'unit', testMatch: ['<rootDir>/tests/unit/**/*.test.ts'] },
    {
      ...shared,
      displayName: 'integration',
      testMatch: ['<rootDir>/tests/integration/**/*.test.ts'],
      globalSetup: '<rootDir>/tests/integration/global-setup.ts',
      globalTeardown: '<rootDir>/tests/integration/global-teardown.ts',
      testTimeout: 60_000,
    },
  ],
};

export default config;
