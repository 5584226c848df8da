// Prepared-field runs: designs (30 years each, engine + pool nitrate model + annual table) per
// second on one core, over a field prepared once. Several passes of 40 designs each; the figures
// are the slowest, median and fastest pass, on the wall clock and on this process's CPU time (the
// machine is shared: CPU time shows the cost of a design even while a neighbour takes the core).
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { generateWeather } from '../../dist/climate/index.js';
import { parseField } from '../../dist/io/field.js';
import { prepareField, runDesign } from '../../dist/scenarios/prepared.js';
import { scenarioOf } from '../../dist/scenarios/resolve.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

/** Min, median and max of a list of numbers. */
export function spread(xs) {
  const s = [...xs].sort((a, b) => a - b);
  return { min: s[0], median: s[Math.floor(s.length / 2)], max: s[s.length - 1] };
}

export default async function () {
  const field = parseField(readFileSync(join(root, 'data-demo/field.yaml'), 'utf8'), 'field.yaml');
  const weather = generateWeather({ years: 31, seed: 11 });
  const t0 = performance.now();
  const prepared = prepareField(field.base, weather);
  const prepMs = performance.now() - t0;
  const specs = [];
  for (let k = 0; k < 40; k++) {
    const f = { ...field.base, drains: { ...field.base.drains, spacing: 10 + k * 0.5 } };
    specs.push(scenarioOf(`s${k}`, '', f));
  }
  for (const s of specs.slice(0, 10)) runDesign(prepared, s); // warm-up
  const rates = [];
  const cpuRates = [];
  for (let pass = 0; pass < 7; pass++) {
    const t = performance.now();
    const c = process.cpuUsage();
    for (const s of specs) runDesign(prepared, s);
    const cpu = process.cpuUsage(c);
    rates.push(specs.length / ((performance.now() - t) / 1000));
    cpuRates.push(specs.length / ((cpu.user + cpu.system) / 1e6));
  }
  const r = spread(rates);
  const c = spread(cpuRates);
  const years = runDesign(prepared, specs[0]).annual.length;
  const each = `designs of ${years} years, one core`;
  return [
    { name: `prepare field (${years} + 1 years: forcing, calendar)`, value: prepMs, unit: 'ms' },
    { name: `${each}, slowest pass`, value: r.min, unit: 'designs/s' },
    { name: `${each}, median pass`, value: r.median, unit: 'designs/s' },
    { name: `${each}, fastest pass`, value: r.max, unit: 'designs/s' },
    { name: `${each}, CPU time, slowest pass`, value: c.min, unit: 'designs/CPU-s' },
    { name: `${each}, CPU time, median pass`, value: c.median, unit: 'designs/CPU-s' },
    { name: `${each}, CPU time, fastest pass`, value: c.max, unit: 'designs/CPU-s' },
  ];
}
