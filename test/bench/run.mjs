// Runs every benchmark in test/bench/*.bench.mjs against the built library (dist/) and prints
// one line per figure. Each bench module default-exports an async function that returns
// [{ name, value, unit }]. Timings are wall-clock on this machine; nothing here is a pass/fail test.
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv[2];
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.mjs') && (!only || f.includes(only)))
  .sort();
const results = [];
for (const f of files) {
  const mod = await import(pathToFileURL(join(here, f)).href);
  const figures = await mod.default();
  for (const r of figures) {
    results.push({ bench: f.replace('.bench.mjs', ''), ...r });
    const v = r.value >= 100 ? Math.round(r.value).toLocaleString('en-US') : r.value.toPrecision(3);
    console.log(`${f.replace('.bench.mjs', '').padEnd(12)} ${r.name.padEnd(52)} ${v} ${r.unit}`);
  }
}
if (process.env.BENCH_JSON) console.log(JSON.stringify(results, null, 2));
