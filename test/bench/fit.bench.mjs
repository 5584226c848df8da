// Calibration speed: a 3-parameter fit (conductivity, seepage conductance, drain capacity) on
// 4 years of daily drain flow (a twin of the demo field on its synthetic weather, one warm-up
// year before), in this thread and on two worker threads; model runs per second.
import { readFileSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseField } from '../../dist/io/field.js';
import { readWeatherFile } from '../../dist/io/weather.js';
import { calibrationLoss, fitField } from '../../dist/scenarios/fit.js';
import { buildFitProblem } from '../../dist/scenarios/fitProblem.js';
import { localRunner } from '../../dist/scenarios/optimise.js';
import { scenarioOf } from '../../dist/scenarios/resolve.js';
import { preparePeriod, prepareScenario, runEngine } from '../../dist/scenarios/run.js';
import { poolRunner } from '../../dist/cli/fitPool.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

export default async function () {
  const text = readFileSync(join(root, 'data-demo/field.yaml'), 'utf8');
  const field = parseField(text, 'field.yaml').base;
  const weather = readWeatherFile(join(root, 'data-demo/weather.csv')).series;
  const five = weather.dates.findIndex((d) => d === '2006-01-01');
  const w = Object.fromEntries(
    Object.entries(weather).map(([k, v]) => [k, v && v.slice ? v.slice(0, five) : v]),
  );
  // Truth: the demo field with conductivity x 0.7 and capacity 10 mm/d; observed = simulated.
  const truth = {
    ...field,
    soil: { ...field.soil, conductivity: field.soil.conductivity * 0.7 },
    drains: { ...field.drains, capacity: 10 },
  };
  const period = preparePeriod(w, truth.site, {
    from: w.dates[0],
    to: w.dates.at(-1),
    warmupYears: 0,
  });
  const run = runEngine(period, prepareScenario(period, scenarioOf('truth', '', truth)));
  const problem = buildFitProblem({
    base: field,
    weather: w,
    observed: { dates: period.forcing.dates, drainflowMm: run.drainflowMm },
    objective: 'kge',
    paths: ['soil.conductivity', 'soil.seepageConductance', 'drains.capacity'],
  });
  const figures = [];
  for (const workers of [0, 2]) {
    const t0 = performance.now();
    const pool = workers ? poolRunner(problem, w, workers) : undefined;
    const runner = pool ? pool.runner : localRunner(calibrationLoss(problem));
    const r = await fitField(problem, runner, { seed: 1, behaviouralTolerance: 0.05 });
    await pool?.close();
    const s = (performance.now() - t0) / 1000;
    const label = workers ? `${workers} workers` : 'one thread';
    figures.push({ name: `3-parameter fit, 4 years daily flow, ${label}`, value: s, unit: 's' });
    figures.push({
      name: `  model runs per second, ${label} (${r.modelRuns} runs)`,
      value: r.modelRuns / s,
      unit: 'runs/s',
    });
  }
  return figures;
}
