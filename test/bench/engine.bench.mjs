// Engine throughput: simulated days per second on one core (engine only, forcing prepared
// beforehand), and the wall time of a 30-year, three-scenario `tileflux run` on the demo field.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateWeather } from '../../dist/climate/index.js';
import { forcingOf, scenariosOf } from '../../dist/scenarios/run.js';
import { parseField } from '../../dist/io/field.js';
import { cropCalendar } from '../../dist/engine/cropCalendar.js';
import { outletSeries } from '../../dist/engine/outletSchedule.js';
import { simulate } from '../../dist/engine/simulate.js';
import { readFileSync } from 'node:fs';
import { timeIt } from './timing.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

export default async function () {
  const weather = generateWeather({ years: 30, seed: 11 });
  const field = parseField(readFileSync(join(root, 'data-demo/field.yaml'), 'utf8'), 'field.yaml');
  const { forcing } = forcingOf(weather, 42, 260);
  const specs = scenariosOf(field);
  const figures = [];
  for (const spec of specs) {
    const cal = cropCalendar(forcing.dates, spec.rotation, spec.crops);
    const outlet = outletSeries(forcing.dates, spec.outlet);
    let steps = 0;
    const ms = timeIt(() => {
      steps = simulate(forcing, cal, outlet, spec.params).substepsPerDay;
    });
    figures.push({
      name: `engine, ${spec.name} (${steps} sub-steps/day)`,
      value: forcing.dates.length / (ms / 1000),
      unit: 'simulated days/s',
    });
  }
  const out = mkdtempSync(join(tmpdir(), 'tileflux-bench-'));
  const t0 = performance.now();
  execFileSync(process.execPath, [
    join(root, 'dist/cli/main.js'),
    'run',
    join(root, 'data-demo/field.yaml'),
    '--weather',
    join(root, 'data-demo/weather.csv'),
    '--out',
    join(out, 'run'),
  ]);
  figures.push({
    name: 'tileflux run, 30 years x 3 scenarios ',
    value: (performance.now() - t0) / 1000,
    unit: 's',
  });
  rmSync(out, { recursive: true, force: true });
  return figures;
}
