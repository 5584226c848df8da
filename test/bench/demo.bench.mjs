// Wall time of `tileflux demo` as a user runs it (a fresh node process: 30 years, three
// scenarios, daily/annual/comparison tables, the chart specs, the HTML report and the explorer
// page), beside `demo --images` (each chart also drawn to SVG and PNG) and beside
// `tileflux run` of the same field and weather with --no-charts --no-report --no-explorer (the
// tables alone). The three run in interleaved rounds, so a busy neighbour slows all of them
// alike; each is reported as fastest / median / slowest of the rounds, and the ratios to the
// tables alone are medians of the ratios within one round.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { spread } from './prepared.bench.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const main = join(root, 'dist/cli/main.js');
const ROUNDS = 5;

export default async function () {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-demo-bench-'));
  const out = join(dir, 'out');
  const cases = [
    ['tileflux demo', ['demo', '--out', out, '--force']],
    ['tileflux demo --images', ['demo', '--out', out, '--force', '--images']],
    [
      'tileflux run of the demo, tables only',
      [
        'run',
        join(root, 'data-demo/field.yaml'),
        '--weather',
        join(root, 'data-demo/weather.csv'),
        '--out',
        out,
        '--force',
        '--no-charts',
        '--no-report',
        '--no-explorer',
      ],
    ],
  ];
  const times = cases.map(() => []);
  for (let round = -1; round < ROUNDS; round++) {
    cases.forEach(([, args], k) => {
      const t0 = performance.now();
      execFileSync(process.execPath, [main, ...args], { stdio: 'ignore' });
      // Round -1 warms the file cache and is not counted.
      if (round >= 0) times[k].push((performance.now() - t0) / 1000);
    });
  }
  rmSync(dir, { recursive: true, force: true });
  const figures = [];
  cases.forEach(([name], k) => {
    const s = spread(times[k]);
    figures.push(
      { name: `${name}, fastest of ${ROUNDS}`, value: s.min, unit: 's' },
      { name: `${name}, median`, value: s.median, unit: 's' },
      { name: `${name}, slowest`, value: s.max, unit: 's' },
    );
  });
  const tables = times[2];
  for (const k of [0, 1]) {
    const ratios = times[k].map((t, r) => t / tables[r]);
    figures.push({
      name: `${cases[k][0]} / tables only, median of the rounds' ratios`,
      value: spread(ratios).median,
      unit: 'x',
    });
  }
  return figures;
}
