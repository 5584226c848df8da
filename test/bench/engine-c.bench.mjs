// The engine against a C yardstick: engine-kernel.c runs the same daily sub-steps as
// src/engine/simulate.ts on the same forcing and coefficients, compiled here with the machine's
// gcc -O2. For each scenario of the demo field (30 years plus warm-up) the CPU time of one run
// is taken in both (JavaScript: process.cpuUsage; C: the process CPU clock), in five interleaved
// rounds of about 0.4 s each, and the ratio JS / C of the medians is reported with the figures.
// The daily sums of both runs are compared first: a yardstick that computes something else
// would say nothing. Without gcc the benchmark says so and reports nothing.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateWeather } from '../../dist/climate/index.js';
import { airAbove, porosityTable } from '../../dist/engine/porosityProfile.js';
import { outletLevels, simulate } from '../../dist/engine/simulate.js';
import { parseField } from '../../dist/io/field.js';
import { prepareField } from '../../dist/scenarios/prepared.js';
import { scenariosOf } from '../../dist/scenarios/run.js';
import { spread } from './prepared.bench.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const ROUNDS = 5;
const ROUND_S = 0.4;

function hasGcc() {
  try {
    execFileSync('gcc', ['--version'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

/** The kernel's input file: header, porosity table, outlet levels, daily columns (float64). */
function kernelInput(f, cal, outlet, p, substeps) {
  const n = f.dates.length;
  const table = porosityTable(p.porosity, p.barrierDepthM);
  const levelFor = outletLevels(p, table);
  const levels = [];
  const dayLevel = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    // The engine's choice of the day's level (simulate.ts).
    const c = outlet[i];
    const lv =
      Number.isNaN(c) || c >= p.drainDepthM ? levelFor(p.drainDepthM) : levelFor(Math.max(0, c));
    if (!levels.includes(lv)) levels.push(lv);
    dayLevel[i] = levels.indexOf(lv);
  }
  const sp = p.seepage;
  const hasSeepage =
    p.seepageMmPerDay > 0 ||
    p.seepageConductanceMmPerDayPerM > 0 ||
    (sp !== undefined && (sp.leakancePerDay > 0 || sp.lateralKMPerDay > 0));
  const wt0 = Math.min(Math.max(p.initialWaterTableDepthM, 0), p.barrierDepthM);
  const header = [
    n,
    table.tops.length,
    levels.length,
    substeps,
    Math.max(1, Math.ceil(substeps / 8)),
    airAbove(table, wt0),
    Math.max(0, (p.fieldCapacity - p.wiltingPoint) * 1000),
    p.kAboveMPerDay,
    p.capacityMmPerDay,
    p.capillaryDecayM,
    p.surfaceStorageMm,
    p.barrierDepthM,
    p.seepageMmPerDay,
    p.seepageConductanceMmPerDayPerM,
    hasSeepage ? 1 : 0,
    sp ? 1 : 0,
    sp?.leakancePerDay ?? 0,
    sp?.regionalHeadDepthM ?? 0,
    sp?.lateralKMPerDay ?? 0,
    sp?.edgeDistanceM ?? Infinity,
    sp?.edgeLevelDepthM ?? 0,
    table.maxAirMm,
    f.sweMm[0] - f.snowfallMm[0] + f.snowmeltMm[0],
    1e-6,
  ];
  const rootDepth = cal.rootDepthM ?? new Float64Array(n).fill(p.rootZoneDepthM);
  const parts = [
    header,
    table.tops,
    table.bottoms,
    table.values,
    table.airAtTop,
    levels.flatMap((l) => [l.depthM, l.a, l.b, l.kirkham0, l.kirkham1]),
    f.rainMm,
    f.snowmeltMm,
    f.sweMm,
    f.precipMm,
    cal.kc,
    f.refEtMm,
    cal.depletionFraction,
    rootDepth,
    dayLevel,
    Float64Array.from(f.days.year),
  ];
  const all = new Float64Array(parts.reduce((k, a) => k + a.length, 0));
  let at = 0;
  for (const a of parts) {
    all.set(a, at);
    at += a.length;
  }
  return new Uint8Array(all.buffer);
}

/** Fastest, median and slowest of a list of times, ms. */
function triple(name, xs) {
  const r = spread(xs);
  return [
    { name: `${name}, fastest`, value: r.min, unit: 'ms' },
    { name: `${name}, median`, value: r.median, unit: 'ms' },
    { name: `${name}, slowest`, value: r.max, unit: 'ms' },
  ];
}

const cpuMs = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

export default async function () {
  if (!hasGcc()) {
    console.log('engine-c      skipped: gcc not found (the C yardstick needs it)');
    return [];
  }
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-kernel-'));
  const exe = join(dir, 'engine-kernel');
  execFileSync('gcc', ['-O2', '-o', exe, join(here, 'engine-kernel.c'), '-lm']);
  const root = join(here, '..', '..');
  const field = parseField(readFileSync(join(root, 'data-demo/field.yaml'), 'utf8'), 'field.yaml');
  const prepared = prepareField(field.base, generateWeather({ years: 31, seed: 11 }));
  const f = prepared.forcing;
  const figures = [];
  for (const spec of scenariosOf(field)) {
    const cal = prepared.calendarOf(spec.rotation, spec.crops, spec.rotationFirstYear, spec.roots);
    const outlet = prepared.outletOf(spec.outlet);
    const js = simulate(f, cal, outlet, spec.params);
    // The kernel allocates its daily columns once, before its timed runs; so do these, by
    // handing every run the first run's columns to overwrite (as sweeps and fits do).
    const run = () => simulate(f, cal, outlet, spec.params, js);
    const input = join(dir, `${spec.name}.f64`);
    writeFileSync(input, kernelInput(f, cal, outlet, spec.params, js.substepsPerDay));
    const kernel = (seconds) =>
      JSON.parse(execFileSync(exe, [input, String(seconds)], { encoding: 'utf8' }));
    const first = kernel(0);
    const sum = (a) => a.reduce((s, x) => s + x, 0);
    for (const k of ['drainflowMm', 'runoffMm', 'etMm', 'seepageMm', 'waterTableDepthM']) {
      const a = sum(js[k]);
      if (Math.abs(a - first[k]) > 1e-9 * Math.max(1, Math.abs(a))) {
        throw new Error(
          `C yardstick differs from the engine in ${spec.name} ${k}: ${first[k]} vs ${a}`,
        );
      }
    }
    for (let k = 0; k < 10; k++) run(); // warm-up
    const jsMs = [];
    const cMs = [];
    for (let r = 0; r < ROUNDS; r++) {
      cMs.push(kernel(ROUND_S).msPerRun);
      const t = cpuMs();
      let runs = 0;
      while (cpuMs() - t < ROUND_S * 1000) {
        run();
        runs++;
      }
      jsMs.push((cpuMs() - t) / runs);
    }
    const tag = `${spec.name}, CPU time of one run`;
    figures.push(...triple(`${tag}, JS`, jsMs), ...triple(`${tag}, C -O2`, cMs));
    figures.push({
      name: `${spec.name}, JS / C (medians)`,
      value: spread(jsMs).median / spread(cMs).median,
      unit: 'x',
    });
  }
  rmSync(dir, { recursive: true, force: true });
  return figures;
}
