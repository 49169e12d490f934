// One jest run, one project per kind of test. Node code is transpiled by ts-jest (type checking is
// the linter's and tsc's job); aedes ships ES modules only, so it is transpiled too.
const nodeTransform = {
  '^.+\\.(t|j)s$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.spec.json', diagnostics: false }],
};
const nodeProject = (displayName, roots, extra = {}) => ({
  displayName,
  rootDir: __dirname,
  roots,
  testEnvironment: 'node',
  transform: nodeTransform,
  transformIgnorePatterns: ['/node_modules/(?!(aedes)/)'],
  moduleNameMapper: { '^@cellwarden/shared$': '<rootDir>/shared/src/index.ts' },
  ...extra,
});

module.exports = {
  testTimeout: 30000,
  projects: [
    nodeProject('unit', ['<rootDir>/shared', '<rootDir>/server', '<rootDir>/simulator', '<rootDir>/db'], {
      testMatch: ['**/*.spec.ts'],
    }),
    {
      displayName: 'web',
      rootDir: __dirname,
      roots: ['<rootDir>/web'],
      preset: 'jest-preset-angular',
      setupFilesAfterEnv: ['<rootDir>/web/src/test-setup.ts'],
      testEnvironment: 'jsdom',
      transform: {
        '^.+\\.(ts|js|mjs|html|svg)$': [
          'jest-preset-angular',
          { tsconfig: '<rootDir>/tsconfig.spec.json', stringifyContentPathRegex: '\\.(html|svg)$' },
        ],
      },
      transformIgnorePatterns: ['node_modules/(?!.*\\.mjs$|chart\\.js|chartjs-adapter-date-fns|date-fns)'],
      moduleNameMapper: { '^@cellwarden/shared$': '<rootDir>/shared/src/index.ts' },
      testMatch: ['**/*.spec.ts'],
    },
    // A 2-core CI machine also runs PostgreSQL, the broker and Chromium: a ceiling for a stuck test, not a timing.
    nodeProject('integration', ['<rootDir>/test/integration'], {
      testMatch: ['**/*.test.ts'],
      testTimeout: 120000,
    }),
    nodeProject('reliability', ['<rootDir>/test/reliability'], {
      testMatch: ['**/*.test.ts'],
      testTimeout: 120000,
    }),
    nodeProject('cluster', ['<rootDir>/test/cluster'], { testMatch: ['**/*.test.ts'], testTimeout: 120000 }),
    nodeProject('browser', ['<rootDir>/test/browser'], { testMatch: ['**/*.test.ts'], testTimeout: 120000 }),
  ],
};
