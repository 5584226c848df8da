// The shared CLI test harness: run the built CLI (dist/cli/main.js) as a user would and check
// its output. dist/ is built once per test run by the global setup (test/support/buildOnce.ts).
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { expect } from 'vitest';

const root = join(import.meta.dirname, '..', '..');
const main = join(root, 'dist', 'cli', 'main.js');

/**
 * Run `tileflux ...args`; returns the exit status and both streams. `node` adds options for node
 * itself (before the script) and variables to its environment.
 */
export function cli(
  args: string[],
  node: { options?: string[]; env?: Record<string, string> } = {},
): { status: number; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [...(node.options ?? []), main, ...args], {
    cwd: root,
    encoding: 'utf8',
    env: { ...process.env, ...node.env },
  });
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
