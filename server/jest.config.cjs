/** Jest for the server: unit tests beside the code, e2e suites in test/ against the real local PostgreSQL. */
module.exports = {
  rootDir: __dirname,
  testEnvironment: 'node',
  testMatch: ['**/test/**/*.e2e.test.ts', '**/src/**/*.test.ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }],
  },
  moduleNameMapper: {
    '^@ladderwright/shared/(.*)$': '<rootDir>/../shared/src/$1/index.ts',
  },
  setupFiles: ['reflect-metadata'],
  testTimeout: 30000,
};
