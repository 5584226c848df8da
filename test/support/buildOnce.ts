// Vitest global setup: compile src/ to dist/ once per test run, so that the tests that run the
// built CLI and library (test/cli, the notebooks, the report's browser test) never see a stale
// dist/. tsc decides what is out of date (incremental build, no list of sources kept here);
// the explorer's browser script is bundled again each time (about a second).
import { spawnSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, rmSync } from 'node:fs';
import { join } from 'node:path';

const root = join(import.meta.dirname, '..', '..');

export default function buildOnce(): void {
  const cache = join(root, 'node_modules', '.cache', 'tileflux');
  const buildInfo = join(cache, 'dist.tsbuildinfo');
  const main = join(root, 'dist', 'cli', 'main.js');
  mkdirSync(cache, { recursive: true });
  // tsc trusts its build info and would not notice a deleted dist/: start over then.
  if (!existsSync(main)) rmSync(buildInfo, { force: true });
  const tsc = join(root, 'node_modules', 'typescript', 'bin', 'tsc');
  const r = spawnSync(
    process.execPath,
    [tsc, '-p', 'tsconfig.json', '--incremental', '--tsBuildInfoFile', buildInfo],
    { cwd: root, encoding: 'utf8' },
  );
  if (r.status !== 0) {
    throw new Error(`building dist/ failed (tsc -p tsconfig.json):\n${r.stdout}${r.stderr}`);
  }
  chmodSync(main, 0o755);
  // The explorer's browser script (one file the page inlines), as `npm run build` makes it.
  const vite = join(root, 'node_modules', 'vite', 'bin', 'vite.js');
  const v = spawnSync(process.execPath, [vite, 'build', '--config', 'explorer.vite.config.ts'], {
    cwd: root,
    encoding: 'utf8',
  });
  if (v.status !== 0) {
    throw new Error(`building the explorer script failed (vite build):\n${v.stdout}${v.stderr}`);
  }
}
