// Shared by the `spacing` and `size` CLI tests: run the built CLI (dist/cli/main.js) as a user
// would, rebuilding first when a source it depends on is newer than its output. `npm test`
// builds before the tests; this covers running these files alone. A lock folder keeps the two
// test files (run in parallel workers) from compiling over each other.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { expect } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const main = join(root, 'dist', 'cli', 'main.js');
const lock = join(root, 'dist', '.cli-test-build.lock');

function stale(output: string, sources: string[]): boolean {
  const out = join(root, output);
  if (!existsSync(out)) return true;
  const built = statSync(out).mtimeMs;
  return sources.some((s) => statSync(join(root, s)).mtimeMs > built);
}

/** Rebuild dist/ when `output` is missing or older than any of `sources` (repo-relative). */
export function ensureBuilt(output: string, sources: string[]): void {
  const deadline = Date.now() + 170_000;
  for (;;) {
    try {
      mkdirSync(join(root, 'dist'), { recursive: true });
      mkdirSync(lock);
      break;
    } catch {
      if (Date.now() > deadline) throw new Error(`could not take ${lock}; remove it if stale`);
      spawnSync('sleep', ['0.2']);
    }
  }
  try {
    if (!stale(output, sources)) return;
    // tsc emits even when other work in progress fails to typecheck; the freshness check
    // afterwards tells whether this command was built.
    const r = spawnSync('npx', ['tsc', '-p', 'tsconfig.json'], { cwd: root, encoding: 'utf8' });
    if (stale(output, sources)) throw new Error(`build failed:\n${r.stdout}\n${r.stderr}`);
  } finally {
    rmdirSync(lock);
  }
}

/** Run `tileflux ...args`; returns the exit status and both streams. */
export function cli(args: string[]): { status: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [main, ...args], { cwd: root, encoding: 'utf8' });
  return { status: r.status ?? -1, stdout: r.stdout, stderr: r.stderr };
}

/** Run `tileflux ...args --json` and parse stdout; fails on a non-zero exit. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function cliJson(args: string[]): any {
  const r = cli([...args, '--json']);
  if (r.status !== 0) throw new Error(`exit ${r.status}: ${r.stderr}`);
  return JSON.parse(r.stdout);
}

/** A user error: exit code 1, nothing on stdout, one line on stderr matching `message`. */
export function expectUserError(args: string[], message: RegExp): void {
  const r = cli(args);
  expect(r.status).toBe(1);
  expect(r.stdout).toBe('');
  expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  expect(r.stderr).toMatch(message);
}
