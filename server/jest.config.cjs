/** Jest for the server: unit tests beside the code, e2e suites in test/ against the real local PostgreSQL. */
module.exports = {
  rootDir: __dirname,
  testEnvironment: 'node',
  testMatch: ['**/test/**/*.e2e.test.ts', '**/src/**/*.test.ts'],
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }],
    // ESM-only packages of the shared code (ml-levenberg-marquardt and its helpers): jest's CommonJS
    // runtime cannot load them as they are, so ts-jest compiles them to CommonJS.
    '^.+\\.js$': ['ts-jest', { tsconfig: { allowJs: true, module: 'commonjs', target: 'es2022' } }],
  },
  transformIgnorePatterns: ['/node_modules/(?!(ml-levenberg-marquardt|is-any-array|ml-array-[a-z]+)/)'],
  moduleNameMapper: {
    '^@ladderwright/shared/(.*)$': '<rootDir>/../shared/src/$1/index.ts',
  },
  setupFiles: ['reflect-metadata'],
  testTimeout: 30000,
};
