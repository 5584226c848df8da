/**
 * What `tileflux run` writes and prints: --daily, spreadsheet-safe CSV cells, the width of the
 * scenario column and the default output folder.
 */
import {
  copyFileSync,
  existsSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  rmSync,
  writeFileSync,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, FIELD, tileflux, WEATHER } from './cli.js';

let dir: string;

const run = (args: string[], cwd?: string) => tileflux(args, cwd === undefined ? {} : { cwd });
const year2001 = [
  '--from',
  '2001-01-01',
  '--to',
  '2001-12-31',
  '--no-charts',
  '--no-report',
  '--no-explorer',
];

/** `run` of the demo field with these scenario names over 2001 into `out`. */
function runNames(names: string[], out: string) {
  return run(['run', fieldWithScenarios(names), '-w', WEATHER, ...year2001, '--out', out]);
}

/** The demo field with its scenarios replaced by these names (each the base layout). */
function fieldWithScenarios(names: string[]): string {
  const base = readFileSync(FIELD, 'utf8');
  const text =
    base.slice(0, base.indexOf('\nscenarios:')) +
    '\nscenarios:\n' +
    names.map((n) => `  - name: ${JSON.stringify(n)}\n`).join('');
  const f = join(dir, `f${names.length}-${names[0].length}.yaml`);
  writeFileSync(f, text);
  return f;
}

beforeAll(() => {
  ensureBuilt();
  dir = mkdtempSync(join(tmpdir(), 'tileflux-outputs-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('run outputs', () => {
  it('writes explorer.html beside the other files unless --no-explorer, for the same period', () => {
    const out = join(dir, 'with-explorer');
    const args = year2001.filter((a) => a !== '--no-explorer');
    const r = run(['run', FIELD, '-w', WEATHER, ...args, '--out', out, '--daily', 'none']);
    expect(r.code).toBe(0);
    expect(readdirSync(out).sort()).toEqual([
      '.tileflux-run',
      'annual.csv',
      'comparison.csv',
      'explorer.html',
      'summary.json',
    ]);
    expect(r.stdout).toMatch(/Explorer \(change the designs in a browser\): .*explorer\.html/);
    // The page runs the period the run reported (its figures then match the run's).
    const html = readFileSync(join(out, 'explorer.html'), 'utf8');
    expect(html).toContain('"period":{"from":"2001-01-01","to":"2001-12-31"}');
  });

  it('--daily none skips daily.csv; --daily accepts only csv or none', () => {
    const out = join(dir, 'nodaily');
    const r = run(['run', FIELD, '-w', WEATHER, ...year2001, '--out', out, '--daily', 'none']);
    expect(r.code).toBe(0);
    expect(readdirSync(out).sort()).toEqual([
      '.tileflux-run',
      'annual.csv',
      'comparison.csv',
      'summary.json',
    ]);
    expect(r.stdout).toMatch(/Wrote .*nodaily\/ \(annual\.csv, comparison\.csv, summary\.json\)/);
    const bad = run(['run', FIELD, '-w', WEATHER, '--out', join(dir, 'x'), '--daily', 'parquet']);
    expect(bad.stderr).toBe('tileflux: error: --daily expects csv or none; got parquet\n');
  });

  it('text cells that a spreadsheet would run as formulas start with an apostrophe', () => {
    const names = ['=HYPERLINK("http://x","y")', '+1', '-drains', '@SUM(A1)'];
    const out = join(dir, 'inject');
    const r = runNames(names, out);
    expect(r.stderr).toBe('');
    for (const file of ['daily.csv', 'annual.csv', 'comparison.csv']) {
      const cells = readFileSync(join(out, file), 'utf8')
        .trim()
        .split('\n')
        .slice(1)
        .map((line) => line.match(/^("(?:[^"]|"")*"|[^,]*)/)![0]);
      const seen = new Set(cells);
      expect([...seen].sort(), file).toEqual(
        ['"\'=HYPERLINK(""http://x"",""y"")"', "'+1", "'-drains", "'@SUM(A1)"].sort(),
      );
    }
    // JSON is not a spreadsheet: names stay as given there.
    const s = JSON.parse(readFileSync(join(out, 'summary.json'), 'utf8'));
    expect(s.scenarios.map((x: { name: string }) => x.name)).toEqual(names);
  });

  it('the table is as wide as the longest scenario name, so long names stay distinct', () => {
    const names = ['controlled outlet 0.3 m early', 'controlled outlet 0.3 m late'];
    const r = runNames(names, join(dir, 'wide'));
    expect(r.code).toBe(0);
    // Table rows only: the headline lines read 'name: ...'.
    const rows = r.stdout.split('\n').filter((l) => /^controlled outlet[^:]*%/.test(l));
    expect(rows.map((l) => l.slice(0, names[0].length).trimEnd())).toEqual(names);
    const header = r.stdout.split('\n').find((l) => l.startsWith('scenario'))!;
    expect(header.indexOf('drain flow')).toBeGreaterThan(names[0].length);
  });

  it('the default output folder is the field file’s name without extension plus -run, as --help says', () => {
    const work = mkdtempSync(join(dir, 'cwd-'));
    copyFileSync(FIELD, join(work, 'north-40.yaml'));
    const r = run(['run', 'north-40.yaml', '-w', WEATHER, ...year2001], work);
    expect(r.code).toBe(0);
    expect(existsSync(join(work, 'north-40-run', 'summary.json'))).toBe(true);
    const help = run(['run', '--help']).stdout.replace(/\s+/g, ' ');
    expect(help).toContain(
      'output folder (default: the field file’s name without extension, plus -run)',
    );
    expect(help).not.toContain('<field name>-run');
  });
});
