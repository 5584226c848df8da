// Vitest reads its settings from a config file only (not from package.json), hence this file.
import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    // One fast-check seed for every property test (TILEFLUX_FC_SEED overrides it).
    setupFiles: ['test/support/fastCheckSeed.ts'],
    // CLI, demo, notebook and browser tests run dist/: build it once per test run.
    globalSetup: ['test/support/buildOnce.ts'],
    testTimeout: 120_000,
    hookTimeout: 300_000,
  },
});
