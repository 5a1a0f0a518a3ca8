// One jest run, four projects. scripts/test.ts runs them one after another so the output shows each suite's count.
const swc = ['@swc/jest', { jsc: { parser: { syntax: 'typescript' }, target: 'es2022' }, module: { type: 'commonjs' } }];
const sharedAlias = { '^@shared/(.*)$': '<rootDir>/shared/$1' };
// netcdfjs (the NetCDF reader the tests read files back with) and its iobuffer ship as ES modules only.
const esmPackages = { transform: { '^.+\\.ts$': swc, '/node_modules/(netcdfjs|iobuffer)/.+\\.js$': swc }, transformIgnorePatterns: ['/node_modules/(?!(netcdfjs|iobuffer)/)'] };

/** @type {import('jest').Config} */
module.exports = {
  // API and browser tests hash passwords with argon2id and talk to PostgreSQL: on a busy 2-core machine the
  // 5 s default failed tests that were only slow. Speed is measured by the benchmarks, never by a timeout.
  testTimeout: 30_000,
  projects: [
    {
      displayName: 'unit',
      testEnvironment: 'node',
      rootDir: __dirname,
      roots: ['<rootDir>/shared', '<rootDir>/server', '<rootDir>/scripts', '<rootDir>/fixtures'],
      testMatch: ['**/*.spec.ts'],
      ...esmPackages,
      moduleNameMapper: sharedAlias,
    },
    {
      displayName: 'client',
      rootDir: __dirname,
      roots: ['<rootDir>/client/src'],
      preset: 'jest-preset-angular',
      setupFilesAfterEnv: ['<rootDir>/client/src/test-setup.ts'],
      testMatch: ['**/*.spec.ts'],
      moduleNameMapper: sharedAlias,
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': ['jest-preset-angular', { tsconfig: '<rootDir>/client/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' }],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$)'],
    },
    {
      displayName: 'api',
      testEnvironment: 'node',
      rootDir: __dirname,
      roots: ['<rootDir>/test/api'],
      testMatch: ['**/*.api.spec.ts'],
      ...esmPackages,
      moduleNameMapper: sharedAlias,
      globalSetup: '<rootDir>/test/setup/api-global-setup.ts',
      setupFilesAfterEnv: ['<rootDir>/test/setup/api-timeout.ts'],
    },
    {
      displayName: 'e2e',
      testEnvironment: 'node',
      rootDir: __dirname,
      roots: ['<rootDir>/test/e2e'],
      testMatch: ['**/*.e2e.spec.ts'],
      transform: { '^.+\\.ts$': swc },
      moduleNameMapper: sharedAlias,
    },
  ],
};
