/** The built CLI as a user runs it, for the CLI tests (npm test builds dist/ first). */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export const CLI = join(process.cwd(), 'dist/cli/main.js');
export const FIELD = join(process.cwd(), 'data-demo/field.yaml');
export const WEATHER = join(process.cwd(), 'data-demo/weather.csv');

/** Build dist/ when a CLI test runs alone before any build. */
export function ensureBuilt(): void {
  if (!existsSync(CLI)) execFileSync('npm', ['run', 'build'], { stdio: 'ignore' });
}

/** Run `tileflux ARGS`; exit code, signal and both streams. */
export function tileflux(
  args: string[],
  opts: { cwd?: string; env?: Record<string, string> } = {},
) {
  const r = spawnSync(process.execPath, [CLI, ...args], {
    encoding: 'utf8',
    cwd: opts.cwd,
    env: { ...process.env, ...opts.env },
  });
  return { code: r.status, signal: r.signal, stdout: r.stdout, stderr: r.stderr };
}
