// One seed for every fast-check property in the suite, so that `npm test` draws the same cases on
// every machine and every run. TILEFLUX_FC_SEED=<integer> explores other cases; a failing
// property prints the seed it ran with and how to repeat it.
import fc from 'fast-check';
import { beforeEach } from 'vitest';

/** The seed used when TILEFLUX_FC_SEED is not set. */
export const DEFAULT_SEED = 20261202;

/** The seed from `TILEFLUX_FC_SEED` (an integer), else DEFAULT_SEED. */
export function suiteSeed(env: string | undefined = process.env.TILEFLUX_FC_SEED): number {
  if (env === undefined || env.trim() === '') return DEFAULT_SEED;
  const seed = Number(env);
  if (!Number.isSafeInteger(seed)) {
    throw new Error(`TILEFLUX_FC_SEED must be an integer; got "${env}"`);
  }
  return seed | 0;
}

const seed = suiteSeed();
fc.configureGlobal({ seed });

beforeEach(({ onTestFailed }) => {
  onTestFailed(({ task }) => {
    const errors = task.result?.errors ?? [];
    if (errors.some((e) => /Property failed/.test(String(e.message)))) {
      console.error(
        `fast-check seed ${seed} (repeat with TILEFLUX_FC_SEED=${seed}; ` +
          `default ${DEFAULT_SEED})`,
      );
    }
  });
});
