/** Jest for the API: unit specs beside the source, integration specs in test/ against a real MariaDB. */
module.exports = {
  rootDir: __dirname,
  testEnvironment: 'node',
  roots: ['<rootDir>/src', '<rootDir>/test', '<rootDir>/../shared/src'],
  testMatch: ['**/*.spec.ts'],
  transform: { '^.+\\.(t|j|mj)s$': ['@swc/jest'] },
  transformIgnorePatterns: [
    '/node_modules/(?!(@nestjs|file-type|strtok3|token-types|@tokenizer|@borewit|uint8array-extras|cookie|set-cookie-parser|content-disposition)/)',
  ],
  moduleNameMapper: {
    '^@crumbproof/shared$': '<rootDir>/../shared/src/index.ts',
    '^@crumbproof/shared/labels$': '<rootDir>/../shared/src/labels/index.ts',
  },
  setupFiles: ['<rootDir>/test/support/env.ts'],
  setupFilesAfterEnv: ['<rootDir>/test/support/after-env.ts'],
  testTimeout: 30000,
};
