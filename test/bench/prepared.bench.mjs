// Prepared-field runs: designs (30 years each, engine + pool nitrate model + annual table) per
// second on one core, over a field prepared once. Several passes of 40 designs each; the figures
// are the slowest, median and fastest pass, so a busy neighbour shows as spread.
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
  for (let pass = 0; pass < 7; pass++) {
    const t = performance.now();
    for (const s of specs) runDesign(prepared, s);
    rates.push(specs.length / ((performance.now() - t) / 1000));
  }
  const r = spread(rates);
  const years = runDesign(prepared, specs[0]).annual.length;
  return [
    { name: `prepare field (${years} + 1 years: forcing, calendar)`, value: prepMs, unit: 'ms' },
    { name: `designs of ${years} years, one core, slowest pass`, value: r.min, unit: 'designs/s' },
    {
      name: `designs of ${years} years, one core, median pass`,
      value: r.median,
      unit: 'designs/s',
    },
    { name: `designs of ${years} years, one core, fastest pass`, value: r.max, unit: 'designs/s' },
  ];
}
