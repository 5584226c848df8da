// `--units us` leaves no SI unit in what a person reads: the report's visible text and the
// printed summary. The methods table is left out of the scan on purpose: it states the
// published equations in the SI units they are published in, with their citations. The field
// file's own scenario descriptions are the user's words and stay as written.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse, stringify } from 'yaml';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli } from './harness.js';

const PERIOD = ['--from', '2008-01-01', '--to', '2012-12-31', '--no-charts'];
let dir: string;
let standardField: string;
let userDescriptions: string[];

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'tileflux-us-'));
  const field = parse(readFileSync('data-demo/field.yaml', 'utf8'));
  userDescriptions = field.scenarios.map((s: { description: string }) => s.description.trim());
  delete field.scenarios; // the three standard alternatives, described by tileflux itself
  standardField = join(dir, 'standard.yaml');
  writeFileSync(standardField, stringify(field));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Text a reader sees in the report: no scripts, styles, tags or the methods table. */
function visibleText(html: string): string[] {
  const text = html
    .replace(/<script[\s\S]*?<\/script>/g, '')
    .replace(/<style[\s\S]*?<\/style>/g, '')
    .replace(/<table[^>]*id="methods-table"[\s\S]*?<\/table>/, '')
    .replace(/<[^>]+>/g, '\n')
    .replace(/&#39;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&lt;/g, '<')
    .replace(/&gt;/g, '>')
    .replace(/&amp;/g, '&');
  return text
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l && !userDescriptions.includes(l));
}

/**
 * SI unit labels as they appear after a number or in a unit bracket: m, mm, cm, ha, kg, °C, m/d,
 * mm/d, mm/yr, kg N/ha, m/ha (the SI spellings of the International System's brochure).
 */
const SI =
  /(\d\s?(mm|cm|m|ha|kg|°C)(\/(d|yr|ha))?\b)|\((mm|m|kg N\/ha|m\/ha|mm\/yr|mm\/d)\)|\bkg N\/ha\b|°C/;

function siLines(lines: string[]): string[] {
  return lines.filter((l) => SI.test(l));
}

function runIn(units: 'si' | 'us', field: string, name: string) {
  const out = join(dir, name);
  const r = cli([
    'run',
    field,
    '-w',
    'data-demo/weather.csv',
    '--out',
    out,
    '--units',
    units,
    ...PERIOD,
  ]);
  expect(r.status, r.stderr).toBe(0);
  // The output folder's random name (e.g. .../tileflux-us-MnCs7m/) is no unit: take it out.
  return {
    stdout: r.stdout.replaceAll(dir, 'OUT'),
    html: readFileSync(join(out, 'report.html'), 'utf8'),
  };
}

describe('US customary units all the way', () => {
  it('the scan finds SI labels in an SI report (so it can fail)', () => {
    const si = runIn('si', 'data-demo/field.yaml', 'si');
    expect(siLines(visibleText(si.html)).length).toBeGreaterThan(10);
    expect(siLines(si.stdout.split('\n')).length).toBeGreaterThan(2);
  });

  it('the demo field in US units: no SI label in the report or the printed summary', () => {
    const us = runIn('us', 'data-demo/field.yaml', 'us');
    expect(siLines(visibleText(us.html))).toEqual([]);
    expect(siLines(us.stdout.split('\n'))).toEqual([]);
    // The converted assumptions, by the exact foot (0.3048 m): a 3 m regional head is 9.84 ft.
    expect(us.stdout).toContain('regional head 9.84 ft below the surface');
  });

  it('the standard alternatives are described in feet and inches per day', () => {
    const us = runIn('us', standardField, 'standard-us');
    const lines = visibleText(us.html);
    expect(siLines(lines)).toEqual([]);
    // The demo drains are 1.1 m deep: 1.1 / 0.3048 = 3.61 ft.
    expect(lines.join('\n')).toContain('drains as given: 3.61 ft deep');
    expect(lines.join('\n')).toMatch(/same drainage intensity \(\d\.\d\d in\/d\)/);
  });
});
