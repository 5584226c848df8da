// tileflux batch as a user runs it (the built CLI in a child process): N jobs, each the demo
// field (3 scenarios, with the seepage band as in `tileflux run`) with its own lateral spacing
// and conductivity over one of 20 synthetic weather files of 31 years (30 reported), 2 workers.
// Figures: wall time and jobs per second on 2 workers, the process's peak resident memory
// (getrusage maxrss, worker threads included), the parallel efficiency of 2 workers against 1 on
// the first min(N, 40) jobs (one run each, interleaved), and the CPU time per job of both (user +
// system of the whole process, all threads): on a machine shared with other work the wall-clock
// efficiency falls with the load, while the CPU time per job shows what a second worker costs. N is 100 by default;
// TILEFLUX_BENCH_BATCH_JOBS=1000 runs the full size (about ten minutes here).
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateWeather } from '../../dist/climate/index.js';
import { formatWeatherCsv } from '../../dist/io/weather.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const CLI = join(root, 'dist', 'cli', 'main.js');
const WEATHER_FILES = 20;

function manifest(dir, jobs) {
  const lines = ['id,field,weather,drains.spacing,soil.conductivity'];
  for (let j = 0; j < jobs; j++) {
    const spacing = (12 + (j % 19)).toFixed(0);
    const k = (0.4 + 0.1 * (j % 13)).toFixed(2);
    lines.push(`job-${j},field.yaml,w${j % WEATHER_FILES}.csv,${spacing} m,${k} m/d`);
  }
  const path = join(dir, `jobs-${jobs}.csv`);
  writeFileSync(path, lines.join('\n') + '\n');
  return path;
}

/** One batch run: wall time (s) and peak resident memory (MB) of the process. */
function run(dir, manifestPath, workers) {
  const out = join(dir, `out-${workers}-${Math.random().toString(36).slice(2)}`);
  const rss = join(dir, 'rss.txt');
  const t = performance.now();
  const r = spawnSync(
    process.execPath,
    [
      '--import',
      join(dir, 'rss.mjs'),
      CLI,
      'batch',
      manifestPath,
      '--out',
      out,
      '--workers',
      String(workers),
    ],
    { encoding: 'utf8', env: { ...process.env, BENCH_RSS_FILE: rss } },
  );
  const s = (performance.now() - t) / 1000;
  if (r.status !== 0) throw new Error(`batch failed (${r.status}): ${r.stderr}`);
  rmSync(out, { recursive: true, force: true });
  const u = JSON.parse(readFileSync(rss, 'utf8'));
  return { s, mb: u.maxRSS / 1024, cpu: u.cpuUs / 1e6 };
}

export default async function () {
  const jobs = Number(process.env.TILEFLUX_BENCH_BATCH_JOBS ?? 100);
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-batch-bench-'));
  try {
    copyFileSync(join(root, 'data-demo', 'field.yaml'), join(dir, 'field.yaml'));
    for (let k = 0; k < WEATHER_FILES; k++)
      writeFileSync(
        join(dir, `w${k}.csv`),
        formatWeatherCsv(generateWeather({ years: 31, seed: 20 + k })),
      );
    writeFileSync(
      join(dir, 'rss.mjs'),
      "import { writeFileSync } from 'node:fs';\n" +
        "process.on('exit', () => { const u = process.resourceUsage(); writeFileSync(process.env.BENCH_RSS_FILE, JSON.stringify({ maxRSS: u.maxRSS, cpuUs: u.userCPUTime + u.systemCPUTime })); });\n",
    );
    const big = run(dir, manifest(dir, jobs), 2);
    const small = manifest(dir, Math.min(jobs, 40));
    const one = run(dir, small, 1);
    const two = run(dir, small, 2);
    return [
      { name: `${jobs} jobs x 30 years x 3 scenarios, 2 workers, wall`, value: big.s, unit: 's' },
      { name: `${jobs} jobs, 2 workers, rate`, value: jobs / big.s, unit: 'jobs/s' },
      { name: `${jobs} jobs, 2 workers, peak resident memory`, value: big.mb, unit: 'MB' },
      {
        name: `${Math.min(jobs, 40)} jobs, 1 worker, rate`,
        value: Math.min(jobs, 40) / one.s,
        unit: 'jobs/s',
      },
      {
        name: `parallel efficiency, 2 workers against 1 (${Math.min(jobs, 40)} jobs)`,
        value: (100 * one.s) / (2 * two.s),
        unit: '%',
      },
      { name: `CPU time per job, 1 worker`, value: one.cpu / Math.min(jobs, 40), unit: 's' },
      { name: `CPU time per job, 2 workers`, value: two.cpu / Math.min(jobs, 40), unit: 's' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
