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
    // vitest's default is one worker fewer than the cores (one on our 2-core machines); most suites wait on
    // PostgreSQL or on child processes, so two workers keep both cores busy and halve the wall time.
    maxWorkers: 2,
    reporters: ['default'],
  },
});
