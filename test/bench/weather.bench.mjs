// Weather benchmarks: CSV parse rate on the 30-year demo record (wall-clock min/median/max of
// seven runs, and the median on process CPU time, which a busy neighbour disturbs less), and the
// throughput of the daily reference-ET and snow computations an engine run starts with. Uses the
// built library.
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseWeatherCsv, formatWeatherCsv } from '../../dist/io/weather.js';
import { referenceEt, snowModel, generateWeather } from '../../dist/climate/index.js';
import { timeIt } from './timing.mjs';

const here = dirname(fileURLToPath(import.meta.url));

export default async function weatherBench() {
  const text = readFileSync(join(here, '..', '..', 'data-demo', 'weather.csv'), 'utf8');
  const { series } = parseWeatherCsv(text, { file: 'weather.csv' });
  const days = series.dates.length;

  const parse = () => parseWeatherCsv(text, { file: 'weather.csv' });
  const wallMs = [];
  const cpuMs = [];
  for (let run = 0; run < 7; run++) {
    const cpu0 = process.cpuUsage();
    let calls = 0;
    const t0 = performance.now();
    while (performance.now() - t0 < 300) {
      parse();
      calls++;
    }
    wallMs.push((performance.now() - t0) / calls);
    const cpu = process.cpuUsage(cpu0);
    cpuMs.push((cpu.user + cpu.system) / 1000 / calls);
  }
  const sorted = (a) => [...a].sort((x, y) => x - y);
  const wall = sorted(wallMs);
  const formatMs = timeIt(() => formatWeatherCsv(series));
  const hargreavesMs = timeIt(() => referenceEt(series, 42));
  const pm = {
    ...series,
    solarMJm2: new Float64Array(days).fill(15),
    rhMeanPct: new Float64Array(days).fill(70),
    wind2mMs: new Float64Array(days).fill(2),
  };
  const pmMs = timeIt(() => referenceEt(pm, 42, 260));
  const snowMs = timeIt(() => snowModel(series.precipMm, series.tmaxC, series.tminC));
  const genMs = timeIt(() => generateWeather({ years: 30, seed: 7 }));

  const rate = (ms) => days / (ms / 1000);
  return [
    {
      name: `parse CSV, demo record (${days} days), slowest run`,
      value: rate(wall[6]),
      unit: 'days/s',
    },
    { name: 'parse CSV, demo record, median run', value: rate(wall[3]), unit: 'days/s' },
    { name: 'parse CSV, demo record, fastest run', value: rate(wall[0]), unit: 'days/s' },
    {
      name: 'parse CSV, demo record, median on CPU time',
      value: rate(sorted(cpuMs)[3]),
      unit: 'days/s',
    },
    { name: 'format CSV, demo record', value: rate(formatMs), unit: 'days/s' },
    { name: 'reference ET, Hargreaves', value: rate(hargreavesMs), unit: 'days/s' },
    { name: 'reference ET, FAO Penman-Monteith', value: rate(pmMs), unit: 'days/s' },
    { name: 'degree-day snow model', value: rate(snowMs), unit: 'days/s' },
    { name: 'weather generator, 30 years', value: rate(genMs), unit: 'days/s' },
  ];
}
