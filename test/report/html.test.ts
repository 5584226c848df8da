import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { compareScenarios } from '../../src/scenarios/compare.js';
import { buildChartSpecs, CHART_NAMES } from '../../src/report/charts.js';
import { buildReportHtml, escapeHtml, jsonForScript } from '../../src/report/html.js';
import { cropConditionLines, headlineLines } from '../../src/report/summary.js';
import { counted, fixed, signed } from '../../src/report/format.js';
import { loadVegaBundles } from '../../src/report/vegaBundles.js';
import type { ReportData } from '../../src/report/types.js';
import type { AnnualMeasure } from '../../src/scenarios/types.js';
import { makeReportData } from './fixture.mjs';

const XSS = '<img src=x onerror=alert(1)>';
const stub = { vega: '/*vega*/', vegaLite: '/*vega-lite*/', vegaEmbed: '/*vega-embed*/' };
const data = makeReportData({
  years: 3,
  names: ['conventional', XSS, 'controlled'],
  compareScenarios,
}) as ReportData;
const specs = buildChartSpecs(data);
const html = buildReportHtml(data, specs, stub);

/** Mean of a measure over the annual rows of one scenario, computed here. */
function meanOf(name: string, key: AnnualMeasure): number {
  const rows = data.annual.filter((r) => r.scenario === name);
  return rows.reduce((t, r) => t + r[key], 0) / rows.length;
}

describe('escaping', () => {
  it('escapes markup characters for text and attributes', () => {
    expect(escapeHtml(`<a href="x" title='y'>&</a>`)).toBe(
      '&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;',
    );
  });

  it('makes JSON safe inside <script> and gives back the same value', () => {
    const value = { name: `</script><script>alert(1)</script><!-- ${XSS} & \u2028` };
    const text = jsonForScript(value);
    expect(text).not.toMatch(/[<>&\u2028\u2029]/);
    expect(text).toContain('\\u003cimg src=x onerror=alert(1)\\u003e');
    expect(JSON.parse(text)).toEqual(value);
  });

  it('never lets a user-supplied string through as markup', () => {
    expect(html).not.toContain(XSS);
    expect(html).toContain('&lt;img src=x onerror=alert(1)&gt;');
    const island =
      /<script type="application\/json" id="tileflux-chart-specs">([\s\S]*?)<\/script>/.exec(
        html,
      )![1];
    expect(island).not.toContain('<');
    expect(JSON.parse(island)).toEqual(JSON.parse(JSON.stringify(specs)));
    // Everything else a user controls, planted with markup: all of it shows as text.
    const hostile = buildReportHtml(
      {
        ...data,
        title: '<b>t</b>',
        fieldName: '<i>f</i>',
        weatherFile: '"><script>x()</script>',
        generatedBy: '<u>g</u>',
        scenarios: data.scenarios.map((s) => ({
          ...s,
          description: '<s>d</s>',
          outlet: '<q>o</q>',
        })),
        methods: [{ topic: '<em>m</em>', text: '<p>t</p>', source: '<a href=x>s</a>' }],
      },
      specs,
      stub,
    );
    for (const tag of [
      '<b>',
      '<i>',
      '<u>',
      '<s>',
      '<q>',
      '<em>',
      '<a href=x',
      '<p>t',
      '<script>x()',
    ]) {
      expect(hostile).not.toContain(tag);
    }
  });

  it('refuses a library that would close its script element', () => {
    expect(() => buildReportHtml(data, specs, { ...stub, vega: 'a="</script>"' })).toThrow(/vega/);
  });
});

describe('report content', () => {
  it('has every section in order, and a figure per chart', () => {
    const ids = [...html.matchAll(/<section id="([a-z]+)">/g)].map((m) => m[1]);
    expect(ids).toEqual([
      'question',
      'inputs',
      'comparison',
      'windows',
      'charts',
      'yearly',
      'glossary',
      'methods',
      'balance',
      'cautions',
    ]);
    const charts = [...html.matchAll(/<div class="chart" data-chart="([a-z-]+)"/g)].map(
      (m) => m[1],
    );
    expect(charts).toEqual([...CHART_NAMES]);
  });

  it('says the cautions of README "Cautions"', () => {
    expect(html).toMatch(/planning estimates from simplified physics/);
    expect(html).toMatch(/local drainage guides, conservation practice standards and permits/);
    expect(html).toMatch(/licensed professional/);
    expect(html).toMatch(/Trenching is dangerous work/);
  });

  it("says how the crop's conditions changed against the baseline, with figures averaged here", () => {
    const sign = (x: number) => `${x >= 0.05 ? '+' : ''}${fixed(x, 1)}`;
    for (const name of [XSS, 'controlled']) {
      const change = (k: AnnualMeasure) => meanOf(name, k) - meanOf('conventional', k);
      const text =
        `${escapeHtml(name)}: ${sign(change('aeration_stress_days'))} aeration-stress days, ` +
        `${sign(change('wet_days'))} wet days, ` +
        `${sign(change('spring_fieldwork_days'))} spring fieldwork days of 36 and ` +
        `${sign(change('fall_fieldwork_days'))} fall fieldwork days of 47 a year`;
      expect(html).toContain(text);
    }
    const lines = cropConditionLines(data.comparison);
    expect(lines).toHaveLength(2);
    expect(lines[1]).toMatch(/against conventional$/);
    expect(headlineLines(data.comparison)[1]).toMatch(/^controlled: drain flow -\d+\.\d %/);
  });

  it('tables: the comparison shows the mean annual drain flow averaged here, one column per scenario', () => {
    const table = /<table class="comparison[\s\S]*?<\/table>/.exec(html)![0];
    const flowRow = /<tr><th scope="row">Drain flow <span[\s\S]*?<\/tr>/.exec(table)![0];
    const cells = [...flowRow.matchAll(/<td[^>]*>([\d.]+)/g)].map((m) => m[1]);
    expect(cells).toEqual(
      ['conventional', XSS, 'controlled'].map((n) => fixed(meanOf(n, 'drainflow_mm'), 0)),
    );
    // Every cell has a figure: a misspelt column would show as n/a (no baseline value is 0 here).
    expect(table).not.toMatch(/n\/a|NaN|undefined/);
    // One change line per compared measure (14) in each of the two non-baseline columns.
    const tbody = /<tbody>[\s\S]*<\/tbody>/.exec(table)![0];
    expect(tbody.match(/<span class="chg">/g)).toHaveLength(2 * 14);
    // Rows grouped by the question they answer.
    expect([...tbody.matchAll(/<tr class="group"><th[^>]*>([^<]+)</g)].map((m) => m[1])).toEqual([
      'The drains',
      'Water leaving the field',
      'Nitrate-N leaving the field',
      'The crop&#39;s conditions',
    ]);
    const yearly = /<table class="yearly"[\s\S]*?<\/table>/.exec(html)![0];
    expect(yearly.match(/<tr><th scope="row">/g)).toHaveLength(data.annual.length);
    expect(html).toContain('id="scenario-table"');
    expect(html).toContain('id="methods-table"');
    expect(html).toContain('FAO-56 Eq. 52');
  });

  it("the glossary defines every measure with this run's windows and thresholds", () => {
    const glossary = /<dl class="glossary"[\s\S]*?<\/dl>/.exec(html)![0];
    const terms = [...glossary.matchAll(/<dt>([^<]+)<\/dt>/g)].map((m) => m[1]);
    for (const t of [
      'Drain flow',
      'Aeration-stress days',
      'Aeration deficit',
      'Water-stress days',
    ]) {
      expect(terms).toContain(t);
    }
    expect(terms).toContain('Wet days');
    expect(terms).toContain('Spring and fall fieldwork days');
    expect(glossary).toContain('the growing season (1 Apr to 31 Oct)');
    expect(glossary).toContain('the top 0.25 m is below 12 % by volume');
    expect(glossary).toContain('spring window (20 Apr to 25 May)');
    expect(glossary).toContain('fall window (25 Sep to 10 Nov)');
    expect(glossary).toContain('the top 0.08 m holds at most 85 %');
    expect(glossary).toContain('shallower than 0.30 m');
    // The window lengths stand beside the counts in the comparison table.
    const table = /<table class="comparison[\s\S]*?<\/table>/.exec(html)![0];
    expect(table).toContain('Spring fieldwork days, of 36 in the window');
    expect(table).toContain('Fall fieldwork days, of 47 in the window');
  });

  it('the fieldwork windows: median and 80th-percentile depth and years too wet, per scenario', () => {
    const table = /<table class="windows[\s\S]*?<\/table>/.exec(html)![0];
    const rows = [...table.matchAll(/<tr[^>]*><th scope="row">[\s\S]*?<\/tr>/g)].map((m) => m[0]);
    expect(rows).toHaveLength(2 * data.scenarios.length);
    expect(rows[0]).toContain('spring (20 Apr to 25 May)');
    expect(rows[0]).toContain('<td>0.60</td><td>0.80</td><td>0 of 3</td>');
    expect(rows[5]).toContain('fall (25 Sep to 10 Nov)');
    expect(rows[5]).toContain('<td>0.50</td><td>0.70</td><td>2 of 3</td>');
  });

  it('explains the chosen year and describes the alternatives actually compared', () => {
    expect(html).toContain(
      `The daily charts show ${data.chartYear}, the wettest year of the record`,
    );
    const given = buildReportHtml({ ...data, chartYearReason: 'given' }, specs, stub);
    expect(given).toContain(`show ${data.chartYear}, the year asked for (tileflux run --year)`);
    const question = /<section id="question">[\s\S]*?<\/section>/.exec(html)![0];
    expect(question).toMatch(/controlled: outlet [^<]* instead of /);
    expect(question).not.toMatch(/1 years|1 scenarios/);
  });

  it('plural rules: one year, two years', () => {
    expect(counted(1, 'year')).toBe('1 year');
    expect(counted(2, 'year')).toBe('2 years');
    expect(counted(0, 'scenario')).toBe('0 scenarios');
    const one = buildReportHtml({ ...data, period: { ...data.period, years: 1 } }, specs, stub);
    expect(one).toContain('(1 year)');
    expect(one).toContain('over the same 1 year of weather');
    expect(one).not.toMatch(/\b1 years\b/);
  });

  it('marks balance closure against 1e-6 mm a year', () => {
    expect(html).toMatch(/1\.0e-9<\/td><td><span class="ok">closed/);
    const open = buildReportHtml(
      {
        ...data,
        balances: [
          { scenario: 'conventional', maxAnnualWaterErrorMm: 0.002, maxAnnualNitrogenErrorKgHa: 0 },
        ],
      },
      specs,
      stub,
    );
    expect(open).toMatch(/2\.0e-3<\/td><td><span class="bad">not closed/);
  });

  it('shows US units when asked (in, lb N/ac, ft)', () => {
    const us = buildReportHtml(
      { ...data, units: 'us' },
      buildChartSpecs({ ...data, units: 'us' }),
      stub,
    );
    expect(us).toContain('(in/yr)');
    expect(us).toContain('(lb N/ac/yr)');
    expect(us).toMatch(/Drain depth <span class="unit">\(ft\)/);
  });

  it('names the climate of the period, in the report units', () => {
    // SI: the fixture's 880 mm/yr, 700 mm/yr and 10 degC. US: 880 / 25.4 = 34.65 in and
    // 10 * 9/5 + 32 = 50.0 degF (exact definitions of the inch and the Fahrenheit scale).
    const row = (h: string) => h.match(/<td class="text" id="climate">([^<]*)</)?.[1];
    expect(row(html)).toBe(
      'precipitation 880 mm/yr, reference ET 700 mm/yr, mean air temperature 10.0 °C; ' +
        'GHCN-Daily export, station XX000BRACK, metric units',
    );
    const us = buildReportHtml({ ...data, units: 'us' }, specs, stub);
    expect(row(us)).toMatch(
      /^precipitation 34\.65 in\/yr, reference ET 27\.56 in\/yr, mean air temperature 50\.0 °F;/,
    );
  });

  it('the outlet schedule: dates, levels, boards standing and boards to move (worked by hand)', () => {
    const steps = [
      { from: '10-25', depthM: 0.15 },
      { from: '04-05', depthM: null },
    ];
    const withBoards: ReportData = {
      ...data,
      scenarios: data.scenarios.map((s, i) =>
        i === 2 ? { ...s, drainDepthM: 1.1, outletSteps: steps, boardHeightM: 0.1524 } : s,
      ),
    };
    const page = buildReportHtml(withBoards, specs, stub);
    const table = page.match(/<table class="keep" id="outlet-table">[\s\S]*?<\/table>/)![0];
    const cells = (row: string) =>
      [...row.matchAll(/<t[hd][^>]*>([^<]*)</g)].map((m) => m[1].trim()).filter(Boolean);
    const rows = table.split('<tr>').slice(2).map(cells);
    // (1.1 - 0.15) / 0.1524 = 6.23 -> 6 boards, giving an outlet 1.1 - 0.9144 = 0.19 m deep.
    expect(rows[0]).toEqual([
      'controlled',
      '25 Oct',
      '0.15',
      '6 boards (outlet at 0.19 m)',
      'add 6 boards',
    ]);
    expect(rows[1]).toEqual(['5 Apr', 'free', '0 boards', 'take out all 6 boards (free outlet)']);
    expect(table).toContain('controlled: boards 15.2 cm high');
    // US: the board height in inches, levels in feet (0.15 m = 0.49 ft).
    const us = buildReportHtml({ ...withBoards, units: 'us' }, specs, stub);
    expect(us).toContain('controlled: boards 6.0 in high');
    expect(us).toMatch(/<td class="text">0\.49<\/td>/);
    // Without any managed outlet, the section is left out.
    expect(html).not.toContain('id="outlet-table"');
  });

  it('marks a year the period covers only in part, with its days (2001 has 365)', () => {
    const first = data.annual[0];
    const part = buildReportHtml(
      { ...data, annual: [{ ...first, days: 100 }, ...data.annual.slice(1)] },
      specs,
      stub,
    );
    expect(part).toContain(`<td>${first.year} (part year: 100 days)</td>`);
    expect(part).toContain('id="part-years"');
    expect(html).not.toContain('part year');
  });

  it('formats changes with a sign and no negative zero', () => {
    expect(signed(4.08)).toBe('+4.1');
    expect(signed(-0.04)).toBe('0.0');
    expect(signed(null)).toBe('n/a');
    expect(fixed(-30, 1)).toBe('-30.0');
  });
});

describe('offline page', () => {
  it('inlines the three libraries and requests nothing by itself', () => {
    const real = buildReportHtml(data, specs);
    const b = loadVegaBundles();
    expect(real).toContain(b.vega.slice(0, 200));
    expect(real).toContain(b.vegaLite.slice(0, 200));
    expect(real).toContain(b.vegaEmbed.slice(0, 200));
    // No element of ours loads anything: no src/href to another resource, and a CSP that
    // forbids network access.
    const ours = html.replace(/<script>[\s\S]*?<\/script>/g, '');
    expect(ours).not.toMatch(/\s(src|href)="(?!#|data:)/);
    expect(ours).toMatch(
      /Content-Security-Policy" content="default-src 'none';[^"]*connect-src 'none'/,
    );
  });

  it('lets only its own inline scripts run, by SHA-256 hash (no inline event handlers)', () => {
    const csp = /Content-Security-Policy" content="([^"]*)"/.exec(html)![1];
    const scriptSrc = /script-src ([^;]*);/.exec(csp)![1];
    expect(scriptSrc).not.toContain('unsafe-inline');
    const inline = [...html.matchAll(/<script>([\s\S]*?)<\/script>/g)].map((m) => m[1]);
    expect(inline).toHaveLength(4);
    const hashes = inline.map((s) => `'sha256-${createHash('sha256').update(s).digest('base64')}'`);
    expect(scriptSrc.split(' ').filter((t) => t.startsWith("'sha256-"))).toEqual(hashes);
  });
});
