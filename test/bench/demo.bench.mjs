// Wall time of `tileflux demo` as a user runs it (a fresh node process: 30 years, three
// scenarios, daily/annual/comparison tables, six charts as SVG and PNG, and the HTML report).
// The median of five runs is reported, with the fastest.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

export default async function () {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-demo-bench-'));
  const times = [];
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now();
    execFileSync(process.execPath, [
      join(root, 'dist/cli/main.js'),
      'demo',
      '--out',
      join(dir, 'out'),
      '--force',
    ]);
    times.push((performance.now() - t0) / 1000);
  }
  rmSync(dir, { recursive: true, force: true });
  times.sort((a, b) => a - b);
  return [
    {
      name: 'tileflux demo, median of 5 (30 y x 3 scenarios, charts, report)',
      value: times[2],
      unit: 's',
    },
    { name: 'tileflux demo, fastest of 5', value: times[0], unit: 's' },
  ];
}
