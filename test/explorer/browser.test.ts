// The explorer page opened from file:// in Debian's chromium (installed by test/setup.sh, driven
// by playwright-core; no browser is downloaded). The reference for its figures is the command
// line: `tileflux run` on a field file with the same settings, written here by hand from the
// demo field, must print the figures the page shows (same rounding); the page's own saved file
// must give them too.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchChromium } from '../support/chromium.js';

const root = join(import.meta.dirname, '..', '..');
const CLI = join(root, 'dist', 'cli', 'main.js');
const FIELD = join(root, 'data-demo', 'field.yaml');
const WEATHER = join(root, 'data-demo', 'weather.csv');
const XSS = '<img src=x onerror=alert(1)>';

function tileflux(args: string[]): string {
  return execFileSync(process.execPath, [CLI, ...args], { encoding: 'utf8', cwd: root });
}

/** The printed table's row of a scenario: drain flow, load, aeration-stress and wet days. */
function printedRow(stdout: string, scenario: string) {
  const line = stdout.split('\n').find((l) => l.startsWith(`${scenario} `));
  if (!line) throw new Error(`no line for ${scenario} in:\n${stdout}`);
  const cells = line.slice(scenario.length).trim().split(/\s+/);
  // drain flow, change, load, change, aeration-stress days, wet days
  return { flow: cells[0], load: cells[2], aeration: cells[4], wet: cells[5] };
}

/** The page's figures of a design: drain flow, load, aeration-stress and wet days as shown. */
async function pageRow(page: Page, design: 'a' | 'b') {
  const cell = (m: string) =>
    page.locator(`#headline tr[data-measure="${m}"] td[data-design="${design}"]`).textContent();
  return {
    flow: await cell('drainflow'),
    load: await cell('no3n_load'),
    aeration: await cell('aeration_stress'),
    wet: await cell('wet'),
  };
}

/** Wait until the page has shown at least `n` runs and shows the latest settings. */
async function runsShown(page: Page, n: number): Promise<void> {
  await page.waitForFunction(
    (k) => {
      const html = document.documentElement;
      return Number(html.getAttribute('data-runs')) >= k && html.dataset.state === 'ready';
    },
    n,
    { timeout: 60_000 },
  );
}

/** Type a value into a control and leave it with the Tab key, as a person would. */
async function setControl(page: Page, control: string, value: string): Promise<void> {
  const box = page.locator(`[data-control="${control}"]`);
  await box.fill(value);
  await box.press('Tab');
}

describe('explorer page in a browser', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-explorer-'));
  const file = join(dir, 'explorer.html');
  let browser: Browser;

  beforeAll(async () => {
    tileflux(['explorer', FIELD, '--weather', WEATHER, '--out', file]);
    browser = await launchChromium();
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('refuses to overwrite the page without --force, and writes nothing on bad input', () => {
    const again = spawnSync(process.execPath, [CLI, 'explorer', FIELD, '-w', WEATHER, '-o', file], {
      encoding: 'utf8',
    });
    expect(again.status).toBe(1);
    expect(again.stderr).toBe(
      `tileflux: error: ${file} already exists; use --force to overwrite it\n`,
    );
    const bad = spawnSync(
      process.execPath,
      [CLI, 'explorer', join(dir, 'none.yaml'), '-w', WEATHER, '-o', join(dir, 'x.html')],
      { encoding: 'utf8' },
    );
    expect(bad.status).toBe(1);
    expect(bad.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(bad.stderr).toMatch(/cannot read field file .*none\.yaml: no such file or folder/);
  });

  it('loads offline with no other request and no console message, and shows the figures of tileflux run', async () => {
    const page = await browser.newPage();
    const requests: string[] = [];
    const problems: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    page.on('console', (m) => problems.push(`${m.type()}: ${m.text()}`));
    page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
    await page.goto(pathToFileURL(file).href);
    await runsShown(page, 1);
    expect(await page.locator('#status').textContent()).toMatch(/in a background worker/);

    // The unchanged page against the demo run (the field file as given).
    const demo = tileflux([
      'run',
      FIELD,
      '-w',
      WEATHER,
      '--out',
      join(dir, 'demo-run'),
      '--no-explorer',
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
    ]);
    expect(await pageRow(page, 'a')).toEqual(printedRow(demo, 'conventional'));
    expect(await pageRow(page, 'b')).toEqual(printedRow(demo, 'controlled'));

    // Design A's drains at 0.9 m, design B's first outlet row held at 0.25 m instead of 0.15 m.
    await setControl(page, 'a-depth', '0.9');
    await runsShown(page, 2);
    await setControl(page, 'b-level-1', '0.25');
    await runsShown(page, 3);

    // The same settings written by hand into the demo field, run by the command line.
    const text = readFileSync(FIELD, 'utf8')
      .replace(
        '    description: 1.1 m drains 18 m apart, free outlet (as installed)\n',
        '    description: 1.1 m drains 18 m apart, free outlet (as installed)\n    drains: { depth: 0.9 m }\n',
      )
      .replace(
        "- { from: '10-25', depth: 0.15 m }\n        - { from: '04-05'",
        "- { from: '10-25', depth: 0.25 m }\n        - { from: '04-05'",
      );
    expect(text).toMatch(/drains: \{ depth: 0\.9 m \}/);
    expect(text.match(/depth: 0\.25 m/g)).toHaveLength(1);
    const edited = join(dir, 'edited.yaml');
    writeFileSync(edited, text);
    const out = tileflux([
      'run',
      edited,
      '-w',
      WEATHER,
      '--out',
      join(dir, 'edited-run'),
      '--no-explorer',
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
    ]);
    const a = await pageRow(page, 'a');
    const b = await pageRow(page, 'b');
    expect(a).toEqual(printedRow(out, 'conventional'));
    expect(b).toEqual(printedRow(out, 'controlled'));
    // The changes did move the figures (else the comparison above proves nothing).
    expect(a).not.toEqual(printedRow(demo, 'conventional'));
    expect(b).not.toEqual(printedRow(demo, 'controlled'));

    // The saved field file gives the same figures through tileflux run.
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#save')]);
    const saved = join(dir, 'saved.yaml');
    await download.saveAs(saved);
    const again = tileflux([
      'run',
      saved,
      '-w',
      WEATHER,
      '--out',
      join(dir, 'saved-run'),
      '--no-explorer',
      '--no-charts',
      '--no-report',
      '--daily',
      'none',
    ]);
    expect(printedRow(again, 'conventional')).toEqual(a);
    expect(printedRow(again, 'controlled')).toEqual(b);

    // Every chart drawn for the latest run, with data marks, and no chart error.
    await page.waitForFunction(
      () => {
        const html = document.documentElement;
        return html.dataset.charts !== undefined && html.dataset.charts === html.dataset.runs;
      },
      null,
      { timeout: 60_000 },
    );
    for (const name of ['water-table', 'cumulative', 'annual', 'duration']) {
      const box = page.locator(`.chart[data-chart="${name}"]`);
      expect(await box.locator('svg').count(), `${name}: an svg`).toBe(1);
      const marks = await box.locator('g.mark-line > path, g.mark-rect > path').count();
      expect(marks, `${name}: data marks drawn`).toBeGreaterThan(0);
      expect(await page.locator('.chart-error').count()).toBe(0);
    }

    expect(problems).toEqual([]);
    for (const url of requests) expect(url).toMatch(/^(file|blob):/);
    expect(requests.filter((u) => u.startsWith('file:'))).toEqual([pathToFileURL(file).href]);
    await page.close();
  }, 180_000);

  it('keeps the settings and chart year in the address: the link reproduces the view', async () => {
    const page = await browser.newPage();
    await page.goto(pathToFileURL(file).href);
    await runsShown(page, 1);
    await setControl(page, 'a-spacing', '22');
    await runsShown(page, 2);
    await page.click('[data-control="a-add-row"]');
    await runsShown(page, 3);
    await setControl(page, 'a-from-1', '11-15');
    await runsShown(page, 4);
    await page.selectOption('[data-control="chart-year"]', '2001');
    await runsShown(page, 5);
    const link = page.url();
    expect(link).toMatch(/#v1=/);
    const headline = await page.locator('#headline').innerText();

    const again = await browser.newPage();
    await again.goto(link);
    await runsShown(again, 1);
    expect(await again.locator('[data-control="a-spacing"]').inputValue()).toBe('22');
    expect(await again.locator('[data-control="a-from-1"]').inputValue()).toBe('11-15');
    expect(await again.locator('[data-control="chart-year"]').inputValue()).toBe('2001');
    expect(await again.locator('#headline').innerText()).toBe(headline);
    // The changed spacing did change the figures of the unchanged page.
    const plain = await browser.newPage();
    await plain.goto(pathToFileURL(file).href);
    await runsShown(plain, 1);
    expect(await plain.locator('#headline').innerText()).not.toBe(headline);
    await Promise.all([page.close(), again.close(), plain.close()]);
  }, 120_000);

  it('has no serious or critical accessibility violations (axe-core)', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(pathToFileURL(file).href);
    await page.waitForSelector('html[data-charts="1"]', { timeout: 60_000 });
    const result = await new AxeBuilder({ page }).analyze();
    const bad = result.violations
      .filter((v) => v.impact === 'serious' || v.impact === 'critical')
      .map((v) => `${v.id}: ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
    expect(bad).toEqual([]);
    await context.close();
  }, 120_000);

  it('shows hostile field and scenario names as text only', async () => {
    const hostile = join(dir, 'hostile.yaml');
    writeFileSync(
      hostile,
      readFileSync(FIELD, 'utf8')
        .replace('name: Quillfen Farm, Brackenlow north field', `name: "${XSS}"`)
        .replace('  - name: conventional', `  - name: "${XSS} A"`)
        .replace('  - name: controlled', `  - name: "</script><script>alert(2)</script>"`),
    );
    const html = join(dir, 'hostile.html');
    tileflux(['explorer', hostile, '-w', WEATHER, '-o', html]);
    const page = await browser.newPage();
    const dialogs: string[] = [];
    const problems: string[] = [];
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });
    page.on('pageerror', (e) => problems.push(e.message));
    await page.goto(pathToFileURL(html).href);
    await runsShown(page, 1);
    expect(await page.locator('img').count()).toBe(0);
    expect(await page.locator('h1').textContent()).toBe(`Drainage explorer: ${XSS}`);
    expect(await page.locator('#design-a legend .name').textContent()).toBe(`${XSS} A`);
    expect(await page.locator('#design-b legend .name').textContent()).toBe(
      '</script><script>alert(2)</script>',
    );
    expect(await page.locator('script').count()).toBe(5);
    await page.waitForSelector('html[data-charts="1"]', { timeout: 60_000 });
    // Legends may shorten a long name with an ellipsis; it is still text.
    const texts = await page.locator('.chart svg text').allTextContents();
    expect(texts.some((t) => t.startsWith('<img src=x onerror'))).toBe(true);
    await page.waitForTimeout(300);
    expect(dialogs).toEqual([]);
    expect(problems).toEqual([]);
    await page.close();
  }, 120_000);
});
