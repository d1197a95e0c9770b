import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    // Prepares the migrated PGlite template and the PostgreSQL template database once per run
    // (see tests/support/global-setup.ts and DEVELOPERS.md, "Tests").
    globalSetup: ['tests/support/global-setup.ts'],
    testTimeout: 60_000,
    hookTimeout: 120_000,
    pool: 'forks',
    reporters: ['default'],
  },
});
