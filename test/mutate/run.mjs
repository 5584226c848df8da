// Mutation testing of the core with Stryker (`npm run mutate`, `npm run mutate -- drainage`):
// each folder is mutated on its own with only its own tests, one after the other, and its score
// printed. Not part of `npm test` (it takes minutes). Incremental: results of unchanged code and
// tests are reused from node_modules/.cache/tileflux/, which a fresh clone seeds from the
// committed results of a whole run (test/mutate/baseline/<folder>.json.gz), so that only the
// mutants of code and tests changed since then are run again.
//   --full            start from nothing (no cache, no baseline): every mutant is run
//   --save-baseline   after each folder, store its results as the committed baseline
// TILEFLUX_MUTATE_CONCURRENCY sets the worker count (default 2, the machine's cores).
import { Stryker } from '@stryker-mutator/core';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';

const root = join(import.meta.dirname, '..', '..');
const cache = 'node_modules/.cache/tileflux';

/** Mutated sources and the tests that must kill their mutants, per folder. */
const TARGETS = {
  // Since the drain-system layout joined the folder, 726 of its 1620 mutants are static (the zod
  // schema of systemSchema.ts and the pipe and material tables at module level), each needing
  // the whole folder's tests: about 75 min on this machine. They are skipped and counted, as
  // for nitrate.
  drainage: {
    mutate: ['src/drainage/**/*.ts'],
    tests: ['test/drainage/**/*.test.ts'],
    ignoreStatic: true,
  },
  climate: { mutate: ['src/climate/**/*.ts'], tests: ['test/climate/**/*.test.ts'] },
  engine: { mutate: ['src/engine/**/*.ts'], tests: ['test/engine/**/*.test.ts'] },
  // Half of nitrate's mutants are static (module-level: the zod schemas of schema.ts and the
  // default tables), each needing the whole folder's tests (~40 s): about 4 hours on this
  // machine. They are skipped (Stryker's ignoreStatic), counted and printed as "static".
  // plausibility.test.ts (ranges from field syntheses) runs the whole field model at module
  // level on every file run; it is left out, so the unit tests must kill the mutants alone.
  nitrate: {
    mutate: ['src/nitrate/**/*.ts'],
    tests: ['test/nitrate/**/*.test.ts'],
    exclude: ['test/nitrate/plausibility.test.ts'],
    ignoreStatic: true,
  },
  // The unit tests of the two files only: the folder's other tests (runs, sweeps, fits) reach
  // annual.ts through whole field runs at module level, minutes per mutant on this machine.
  scenarios: {
    mutate: ['src/scenarios/annual.ts', 'src/scenarios/compare.ts'],
    tests: ['test/scenarios/annual.test.ts', 'test/scenarios/compare.test.ts'],
  },
};

const concurrency = Number(process.env.TILEFLUX_MUTATE_CONCURRENCY ?? 2);
const FLAGS = ['--full', '--save-baseline'];
const args = process.argv.slice(2);
const full = args.includes('--full');
const saveBaseline = args.includes('--save-baseline');
const asked = args.filter((a) => !FLAGS.includes(a));
for (const name of asked) {
  if (name.startsWith('-')) {
    console.error(`unknown option "${name}"; accepted: ${FLAGS.join(', ')}`);
    process.exit(1);
  }
  if (!(name in TARGETS)) {
    console.error(`unknown folder "${name}"; accepted: ${Object.keys(TARGETS).join(', ')}`);
    process.exit(1);
  }
}
const names = asked.length > 0 ? asked : Object.keys(TARGETS);

/** Mutation score, %: killed (or timed out) over all mutants that compile and run. */
function score(results) {
  const count = (...states) => results.filter((r) => states.includes(r.status)).length;
  const detected = count('Killed', 'Timeout');
  const undetected = count('Survived', 'NoCoverage');
  const ignored = count('Ignored');
  return { detected, undetected, ignored, percent: (100 * detected) / (detected + undetected) };
}

mkdirSync(join(root, cache), { recursive: true });
const rows = [];
const started = Date.now();
for (const name of names) {
  const t0 = Date.now();
  const target = TARGETS[name];
  // The tests of this folder only (read by test/mutate/vitest.config.ts in the workers).
  process.env.TILEFLUX_MUTATE_TESTS = target.tests.join(',');
  process.env.TILEFLUX_MUTATE_EXCLUDE = (target.exclude ?? []).join(',');
  // TILEFLUX_MUTATE_FILES=src/nitrate/pool.ts,... mutates only those files of the folder. Its
  // results go to a file of their own: Stryker keeps only the mutated files' results, and the
  // folder's file would lose the others.
  const only = process.env.TILEFLUX_MUTATE_FILES;
  const results = join(root, cache, `stryker-${name}${only ? '-files' : ''}.json`);
  const baseline = join(root, 'test', 'mutate', 'baseline', `${name}.json.gz`);
  if (full) rmSync(results, { force: true });
  else if (!only && !existsSync(results) && existsSync(baseline)) {
    writeFileSync(results, gunzipSync(readFileSync(baseline)));
    console.log(`${name}: starting from the committed results of a whole run (${baseline})`);
  }
  const stryker = new Stryker({
    mutate: only ? only.split(',') : target.mutate,
    testRunner: 'vitest',
    vitest: { configFile: 'test/mutate/vitest.config.ts', related: false },
    coverageAnalysis: 'perTest',
    concurrency,
    incremental: true,
    incrementalFile: results,
    tempDirName: `${cache}/stryker-tmp`,
    cleanTempDir: 'always',
    // data-demo stays: tests read its weather record.
    ignorePatterns: ['dist', 'notebooks', 'tileflux-demo', 'coverage', '*.md'],
    reporters: ['clear-text', 'progress-append-only'],
    clearTextReporter: { reportTests: false, reportMutants: true, reportScoreTable: true },
    // A mutant times out after 1.5 times the dry-run time of its tests plus this allowance. The
    // timed-out mutants are mostly endless loops (a loop bound or step mutated); at 30 s the
    // sixty or so of them cost half an hour of a full run. 10 s stays well above the run-to-run
    // spread of these tests on a shared machine (at most a few seconds).
    timeoutMS: 10_000,
    ignoreStatic: target.ignoreStatic ?? false,
    plugins: ['@stryker-mutator/vitest-runner'],
  });
  const s = score(await stryker.runMutationTest());
  if (saveBaseline && !only) {
    mkdirSync(join(root, 'test', 'mutate', 'baseline'), { recursive: true });
    writeFileSync(baseline, gzipSync(readFileSync(results), { level: 9 }));
  }
  const minutes = (Date.now() - t0) / 60_000;
  rows.push(
    `${name.padEnd(10)} ${s.percent.toFixed(1).padStart(5)} %  ${String(s.detected).padStart(4)} killed  ${String(s.undetected).padStart(4)} survived  ${String(s.ignored).padStart(4)} static (not run)  ${minutes.toFixed(1)} min`,
  );
}
console.log(`\nmutation score per folder (concurrency ${concurrency}):`);
for (const r of rows) console.log(`  ${r}`);
console.log(`  total ${((Date.now() - started) / 60_000).toFixed(1)} min`);
