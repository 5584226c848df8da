// Weather benchmarks: CSV parse rate on the 30-year demo record, and the throughput of the
// daily reference-ET and snow computations an engine run starts with. Uses the built library.
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

  const parseMs = timeIt(() => parseWeatherCsv(text, { file: 'weather.csv' }));
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
    { name: `parse CSV, demo record (${days} days)`, value: rate(parseMs), unit: 'days/s' },
    { name: 'format CSV, demo record', value: rate(formatMs), unit: 'days/s' },
    { name: 'reference ET, Hargreaves', value: rate(hargreavesMs), unit: 'days/s' },
    { name: 'reference ET, FAO Penman-Monteith', value: rate(pmMs), unit: 'days/s' },
    { name: 'degree-day snow model', value: rate(snowMs), unit: 'days/s' },
    { name: 'weather generator, 30 years', value: rate(genMs), unit: 'days/s' },
  ];
}
