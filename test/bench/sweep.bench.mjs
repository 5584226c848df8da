// Sweeps on worker threads (tileflux sweep's engine room), 30 reported years each design:
// 1,000 designs x 1 soil sample and 100 designs x 40 samples on 2 workers (wall time, including
// worker start-up, the field's preparation and the summary), the 100 x 40 study under two climates
// (today's record and a wetter, warmer one made from it with the generator's deltas), the
// parallel efficiency of 2 workers against 1 on both sweeps, and the single-core rate in this
// thread beside them. Each figure is given as min / median / max of three runs.
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { changeClimate, fitGenerator, generateWeather } from '../../dist/climate/index.js';
import { parseField } from '../../dist/io/field.js';
import { sweepClimatesParallel, sweepParallel } from '../../dist/io/sweepPool.js';
import { prepareField } from '../../dist/scenarios/prepared.js';
import { planSweep, runSweepJobs } from '../../dist/scenarios/sweep.js';
import { spread } from './prepared.bench.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const RUNS = 3;

function fieldWith(sweep) {
  const text = readFileSync(join(root, 'data-demo/field.yaml'), 'utf8');
  const base = parseField(text, 'field.yaml').base;
  return { ...base, sweep: { ...base.sweep, ...sweep } };
}

const range = (from, step, n) =>
  Array.from({ length: n }, (_, k) => Math.round((from + k * step) * 1e6) / 1e6);

async function timed(field, weather, o) {
  const t = performance.now();
  const r = await sweepParallel(field, weather, o);
  return { s: (performance.now() - t) / 1000, jobs: r.samples.length };
}

function line(name, xs, unit) {
  const r = spread(xs);
  return [
    { name: `${name}, min`, value: r.min, unit },
    { name: `${name}, median`, value: r.median, unit },
    { name: `${name}, max`, value: r.max, unit },
  ];
}

export default async function () {
  const weather = generateWeather({ years: 31, seed: 11 });
  // 10 depths x 50 spacings x 2 managements = 1,000 designs (+ the field as given).
  const big = fieldWith({ depth: range(0.7, 0.07, 10), spacing: range(10, 0.4, 50), samples: 1 });
  // 5 depths x 10 spacings x 2 managements = 100 designs, 40 soil samples.
  const wide = fieldWith({ depth: range(0.75, 0.13, 5), spacing: range(12, 2, 10), samples: 40 });
  const figures = [];
  const t1000 = [];
  for (let k = 0; k < RUNS; k++) t1000.push((await timed(big, weather, { workers: 2 })).s);
  figures.push(...line('1,000 designs x 1 sample x 30 years, 2 workers', t1000, 's'));
  const t4000 = [];
  for (let k = 0; k < RUNS; k++) t4000.push((await timed(wide, weather, { workers: 2 })).s);
  figures.push(...line('100 designs x 40 samples x 30 years, 2 workers', t4000, 's'));
  // Two climates: the same record and one fitted to it with +20 % intensity and +2 degC.
  const twelve = (x) => new Array(12).fill(x);
  const future = generateWeather({
    years: 31,
    seed: 12,
    params: changeClimate(fitGenerator(weather), {
      precipChangePct: twelve(20),
      tempChangeC: twelve(2),
    }),
  });
  const climates = [
    { name: 'today', weather },
    { name: 'wetter', weather: future },
  ];
  const tTwo = [];
  for (let k = 0; k < RUNS; k++) {
    const t = performance.now();
    await sweepClimatesParallel(wide, climates, { workers: 2 });
    tTwo.push((performance.now() - t) / 1000);
  }
  figures.push(...line('100 designs x 40 samples x 30 years x 2 climates, 2 workers', tTwo, 's'));
  // Efficiency of 2 workers against 1, runs interleaved so a busy neighbour spoils both alike:
  // on the 1,000-design sweep (start-up and summary weigh most) and on the 100 x 40 study.
  const efficiency = async (field, runs) => {
    const eff = [];
    for (let k = 0; k < runs; k++) {
      const one = (await timed(field, weather, { workers: 1 })).s;
      const two = (await timed(field, weather, { workers: 2 })).s;
      eff.push((100 * one) / (2 * two));
    }
    return eff;
  };
  figures.push(
    ...line(
      'parallel efficiency, 2 workers against 1, 1,000 designs',
      await efficiency(big, 5),
      '%',
    ),
  );
  figures.push(
    ...line(
      'parallel efficiency, 2 workers against 1, 100 x 40',
      await efficiency(wide, RUNS),
      '%',
    ),
  );
  // Single core, this thread, no workers: designs per second over a prepared field.
  const plan = planSweep(big, { samples: 1 });
  const prepared = prepareField(big, weather);
  runSweepJobs(prepared, plan, 0, 20);
  const rates = [];
  for (let k = 0; k < RUNS; k++) {
    const t = performance.now();
    runSweepJobs(prepared, plan, 100, 200);
    rates.push(100 / ((performance.now() - t) / 1000));
  }
  figures.push(...line('single core, designs of 30 years', rates, 'designs/s'));
  return figures;
}
