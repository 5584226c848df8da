// The report opened from file:// in Debian's chromium (installed by test/setup.sh, driven by
// playwright-core; no browser is downloaded): charts drawn, tables present, no console error,
// no request leaving the page, and a hostile scenario name shown as text.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchChromium } from '../support/chromium.js';
import { compareScenarios } from '../../src/scenarios/compare.js';
import { buildChartSpecs, CHART_NAMES } from '../../src/report/charts.js';
import { buildReportHtml } from '../../src/report/html.js';
import type { ReportData } from '../../src/report/types.js';
import { makeReportData } from './fixture.mjs';

const XSS = '<img src=x onerror=alert(1)>';

describe('report in a browser', () => {
  const dir = mkdtempSync(join(tmpdir(), 'tileflux-report-'));
  let browser: Browser;
  const data = makeReportData({
    years: 4,
    names: ['conventional', XSS, 'controlled'],
    compareScenarios,
  }) as ReportData;
  const file = join(dir, 'report.html');

  beforeAll(async () => {
    writeFileSync(file, buildReportHtml(data, buildChartSpecs(data)));
    browser = await launchChromium();
  }, 120_000);

  afterAll(async () => {
    await browser?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('draws every chart offline, with the tables, no error and no outside request', async () => {
    const page = await browser.newPage();
    const requests: string[] = [];
    const problems: string[] = [];
    const dialogs: string[] = [];
    page.on('request', (r) => requests.push(r.url()));
    page.on('console', (m) => {
      if (m.type() === 'error' || m.type() === 'warning') problems.push(`${m.type()}: ${m.text()}`);
    });
    page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
    page.on('dialog', (d) => {
      dialogs.push(d.message());
      void d.dismiss();
    });

    await page.goto(pathToFileURL(file).href);
    await page.waitForSelector('html[data-charts="ready"]', { timeout: 60_000 });

    for (const name of CHART_NAMES) {
      const box = page.locator(`.chart[data-chart="${name}"]`);
      await expect(box.locator('svg').count(), `${name}: an svg`).resolves.toBe(1);
      const marks = await box
        .locator('g.mark-line > path, g.mark-rect > path, g.mark-symbol > path')
        .count();
      expect(marks, `${name}: data marks drawn`).toBeGreaterThan(0);
      expect(await box.locator('.chart-error').count()).toBe(0);
    }

    const rows = (id: string) => page.locator(`#${id} tbody tr`).count();
    expect(await rows('comparison-table')).toBeGreaterThanOrEqual(15);
    expect(await rows('scenario-table')).toBe(3);
    expect(await rows('yearly-table')).toBe(data.annual.length);
    expect(await rows('methods-table')).toBe(data.methods.length);
    expect(await rows('balance-table')).toBe(3);

    // The hostile name is text everywhere: in the tables and in the chart legends.
    expect(await page.locator('img').count()).toBe(0);
    expect(await page.locator('#scenario-table tbody tr:nth-child(2) th').textContent()).toBe(XSS);
    const svgTexts = await page.locator('.chart svg text').allTextContents();
    expect(svgTexts).toContain(XSS);
    await page.waitForTimeout(300);
    expect(dialogs).toEqual([]);

    expect(problems).toEqual([]);
    expect(requests.length).toBeGreaterThan(0);
    for (const url of requests) expect(url).toMatch(/^(file|data|blob):/);
    await page.close();
  }, 120_000);
});
