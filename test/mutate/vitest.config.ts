// Vitest settings for mutation runs (test/mutate/run.mjs): the same fast-check seed as the suite,
// only the tests named in TILEFLUX_MUTATE_TESTS, and no build (these tests import src/).
import { join } from 'node:path';
import { defineConfig } from 'vitest/config';

const tests = process.env.TILEFLUX_MUTATE_TESTS;
const exclude = process.env.TILEFLUX_MUTATE_EXCLUDE;

export default defineConfig({
  root: join(import.meta.dirname, '..', '..'),
  test: {
    include: tests ? tests.split(',') : ['test/**/*.test.ts'],
    exclude: ['**/node_modules/**', ...(exclude ? exclude.split(',') : [])],
    setupFiles: ['test/support/fastCheckSeed.ts'],
    testTimeout: 120_000,
    hookTimeout: 300_000,
  },
});
