// tileflux run of a long record with many scenarios, as a user runs it (the built CLI in a child
// process): the demo field up to its `scenarios:` with 20 scenarios instead (drains 0.75, 0.9,
// 1.1 and 1.3 m deep x 12, 15, 18, 21 and 24 m apart) over a synthetic record made by `tileflux
// weather make --like data-demo/weather.csv`. Figures: wall time and the process's peak resident
// memory (getrusage maxrss) of the run with --no-charts, and of the whole run (charts drawn with
// --images, report and explorer page). Each scenario's daily.csv rows are written as soon as it is computed and only
// what the report reads is kept, so peak memory should stay under 1 GB at 1,000 years. Years are
// 100 by default; TILEFLUX_BENCH_SCALE_YEARS=1000 runs the full size (several minutes here).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const CLI = join(root, 'dist', 'cli', 'main.js');
const DEPTHS = ['0.75', '0.9', '1.1', '1.3'];
const SPACINGS = [12, 15, 18, 21, 24];

/** The demo field with its scenarios replaced by the 20 designs of DEPTHS x SPACINGS. */
function field20() {
  const demo = readFileSync(join(root, 'data-demo', 'field.yaml'), 'utf8');
  const head = demo.slice(0, demo.search(/^scenarios:/m));
  const lines = ['scenarios:'];
  let k = 0;
  for (const depth of DEPTHS) {
    for (const spacing of SPACINGS) {
      k++;
      lines.push(
        `  - name: d${k}`,
        `    description: ${depth} m drains ${spacing} m apart`,
        `    drains: { depth: ${depth} m, spacing: ${spacing} m }`,
      );
    }
  }
  return head + lines.join('\n') + '\n';
}

function cli(args, env = process.env) {
  const r = spawnSync(process.execPath, args, { encoding: 'utf8', env });
  if (r.status !== 0) throw new Error(`${args.join(' ')} failed (${r.status}): ${r.stderr}`);
}

/** One run: wall time (s) and peak resident memory (MB) of the process. */
function run(dir, extra) {
  const out = join(dir, 'out');
  const rss = join(dir, 'rss.txt');
  const t = performance.now();
  cli(
    [
      '--import',
      join(dir, 'rss.mjs'),
      CLI,
      'run',
      join(dir, 'field20.yaml'),
      '--weather',
      join(dir, 'weather.csv'),
      '--out',
      out,
      '--force',
      ...extra,
    ],
    { ...process.env, BENCH_RSS_FILE: rss },
  );
  const s = (performance.now() - t) / 1000;
  rmSync(out, { recursive: true, force: true });
  return { s, mb: JSON.parse(readFileSync(rss, 'utf8')).maxRSS / 1024 };
}

export default async function () {
  const years = Number(process.env.TILEFLUX_BENCH_SCALE_YEARS ?? 100);
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-scale-bench-'));
  try {
    writeFileSync(join(dir, 'field20.yaml'), field20());
    cli([
      CLI,
      'weather',
      'make',
      '--like',
      join(root, 'data-demo', 'weather.csv'),
      '--years',
      String(years),
      '--seed',
      '1',
      '--out',
      join(dir, 'weather.csv'),
    ]);
    writeFileSync(
      join(dir, 'rss.mjs'),
      "import { writeFileSync } from 'node:fs';\n" +
        "process.on('exit', () => writeFileSync(process.env.BENCH_RSS_FILE, JSON.stringify({ maxRSS: process.resourceUsage().maxRSS })));\n",
    );
    const bare = run(dir, ['--no-charts']);
    const full = run(dir, ['--images']);
    const size = `${years} years x 20`;
    return [
      { name: `run ${size}, --no-charts, wall`, value: bare.s, unit: 's' },
      { name: `run ${size}, --no-charts, peak memory`, value: bare.mb, unit: 'MB' },
      { name: `run ${size}, with charts and images, wall`, value: full.s, unit: 's' },
      { name: `run ${size}, with charts and images, peak memory`, value: full.mb, unit: 'MB' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
