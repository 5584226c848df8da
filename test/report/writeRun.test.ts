/**
 * The run folder written one scenario at a time (`runToFolder`, what `tileflux run` does) against
 * the folder of the whole run held in memory (`writeRunFolder(runField(...))`): the same files,
 * byte for byte, with the pool model's daily columns only when every scenario runs that model.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFieldFile } from '../../src/io/field.js';
import type { RunMeta } from '../../src/io/runFolder.js';
import { readWeatherFile } from '../../src/io/weather.js';
import { runToFolder, writeRunFolder } from '../../src/report/writeRun.js';
import { planRun, runField, type RunOptions } from '../../src/scenarios/run.js';

const FIELD = 'data-demo/field.yaml';
const WEATHER = 'data-demo/weather.csv';
// 2001-2003: 365 + 365 + 365 days (none a leap year: divisible by 4 only from 2004).
const PERIOD: RunOptions = { from: '2001-01-01', to: '2003-12-31', warmupYears: 1 };
const DAYS = 3 * 365;
const POOL_COLUMNS = [
  'no3n_pool_kg_ha',
  'fertilizer_n_kg_ha',
  'mineralization_n_kg_ha',
  'uptake_n_kg_ha',
  'denitrification_n_kg_ha',
];

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tileflux-write-run-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The demo field, its third scenario on a fixed concentration when `mixed`. */
function fieldFile(mixed: boolean): string {
  let text = readFileSync(FIELD, 'utf8');
  if (mixed) {
    text = text.replace(
      /\n {2}- name: controlled\n/,
      '\n  - name: controlled\n    nitrate: { model: fixed, concentration: 12 mg/L }\n',
    );
  }
  const path = join(dir, mixed ? 'mixed.yaml' : 'pool.yaml');
  writeFileSync(path, text);
  return path;
}

const meta: RunMeta = {
  fieldFile: 'field.yaml',
  fieldSha256: '0',
  weatherFile: 'weather.csv',
  weatherSha256: '0',
  fieldName: 'Demo',
};

function filesOf(folder: string): Record<string, string> {
  return Object.fromEntries(
    readdirSync(folder).map((f) => [f, readFileSync(join(folder, f), 'utf8')]),
  );
}

describe('runToFolder', () => {
  for (const mixed of [false, true]) {
    it(`writes the folder writeRunFolder writes for the whole run (${mixed ? 'pool and fixed models' : 'pool model'})`, async () => {
      const field = readFieldFile(fieldFile(mixed));
      const weather = readWeatherFile(WEATHER, {}).series;
      const o = { charts: false, report: true } as const;
      const whole = join(dir, `whole-${mixed}`);
      const streamed = join(dir, `streamed-${mixed}`);
      const a = await writeRunFolder(runField(field, weather, PERIOD), meta, whole, 'si', o);
      const b = await runToFolder(planRun(field, weather, PERIOD), meta, streamed, 'si', o);
      expect(b.written).toEqual(a.written);
      expect(b.summary).toEqual(a.summary);
      const fa = filesOf(whole);
      const fb = filesOf(streamed);
      expect(Object.keys(fb).sort()).toEqual(Object.keys(fa).sort());
      for (const name of Object.keys(fa)) expect(fb[name], name).toBe(fa[name]);

      // One header line, then every day of each of the three scenarios.
      const lines = fb['daily.csv'].trimEnd().split('\n');
      expect(lines.length).toBe(1 + 3 * DAYS);
      const header = lines[0].split(',');
      for (const c of POOL_COLUMNS) expect(header.includes(c), c).toBe(!mixed);
      // The run kept of each scenario what the tables and report read, not its daily columns.
      for (const s of b.run.scenarios) expect('calendar' in s).toBe(false);
    });
  }
});
