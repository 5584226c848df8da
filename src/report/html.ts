/**
 * The HTML report: one self-contained file that opens offline. vega, vega-lite and vega-embed
 * are inlined, the chart specs travel as JSON inside the page, and a Content-Security-Policy
 * forbids every network request. Every user-supplied string is escaped, in markup and in the
 * embedded JSON alike.
 */
import { createHash } from 'node:crypto';
import type { ComparisonRow } from '../scenarios/compare.js';
import type { AnnualRow } from '../scenarios/types.js';
import { CHART_CAPTIONS, type ChartName } from './charts.js';
import { counted, fixed, signed } from './format.js';
import { boardTable } from '../scenarios/boards.js';
import { isPartialYear } from '../scenarios/annual.js';
import { cropConditionLines, headlineLines } from './summary.js';
import type { ReportData } from './types.js';
import { displayUnits, type DisplayUnit } from './units.js';
import { loadVegaBundles, type VegaBundles } from './vegaBundles.js';

/** Largest annual balance residual reported as closed (the engine closes it to 1e-6 mm per year). */
export const BALANCE_TOLERANCE = { waterMm: 1e-6, nitrogenKgHa: 1e-6 } as const;

const HTML_ESCAPES: Readonly<Record<string, string>> = {
  '&': '&amp;',
  '<': '&lt;',
  '>': '&gt;',
  '"': '&quot;',
  "'": '&#39;',
};

/**
 * Escape text for HTML element content and quoted attribute values.
 *
 * @example escapeHtml('<img src=x>') // '&lt;img src=x&gt;'
 */
export function escapeHtml(text: string): string {
  return String(text).replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

/**
 * JSON that is safe inside a <script> element: `<`, `>` and `&` become \u003c, \u003e and
 * \u0026 (so no "</script>" or "<!--" can appear), and the JavaScript line separators U+2028
 * and U+2029 are escaped too. JSON.parse gives back the same value.
 *
 * @example jsonForScript({ a: '</script>' }) // '{"a":"\\u003c/script\\u003e"}'
 */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/>/g, '\\u003e')
    .replace(/&/g, '\\u0026')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

/** A library's source inside <script>; refuses text that would end or confuse the element. */
function inlineScript(source: string, name: string): string {
  if (/<\/script|<!--|<script/i.test(source)) {
    throw new Error(`${name} cannot be inlined: it contains a script tag or comment opener`);
  }
  return `<script>${source}</script>`;
}

/**
 * Content-Security-Policy of the page: nothing may be fetched, and only our own inline scripts
 * run, named by their SHA-256 hashes, so that an inline event handler slipped into the markup
 * would not run either. vega compiles its expressions with Function(), hence 'unsafe-eval'.
 */
function contentSecurityPolicy(scripts: string[]): string {
  const hashes = scripts
    .map((s) => `'sha256-${createHash('sha256').update(s, 'utf8').digest('base64')}'`)
    .join(' ');
  return (
    `default-src 'none'; script-src ${hashes} 'unsafe-eval'; style-src 'unsafe-inline'; ` +
    "img-src data: blob:; font-src data:; connect-src 'none'; form-action 'none'; base-uri 'none'"
  );
}

/** The style of every tileflux page (reports and the explorer). */
export const PAGE_CSS = `
:root { --ink: #1b1b1b; --muted: #5a5a5a; --rule: #d4d4d4; --accent: #1f5f8b; --band: #eef3f6;
  --warn: #8c1c13; }
* { box-sizing: border-box; }
body { font: 15px/1.5 "DejaVu Sans", "Segoe UI", Roboto, Helvetica, Arial, sans-serif;
  color: var(--ink); background: #fff; max-width: 62rem; margin: 0 auto; padding: 1.5rem; }
header { border-bottom: 3px solid var(--accent); margin-bottom: 1rem; }
h1 { font-size: 1.6rem; margin: 0 0 0.3rem; }
h2 { font-size: 1.25rem; color: var(--accent); margin: 2.2rem 0 0.6rem;
  border-bottom: 1px solid var(--rule); padding-bottom: 0.2rem; }
.meta { color: var(--muted); margin: 0 0 0.8rem; }
nav ol { columns: 2; margin: 0; padding-left: 1.4rem; }
nav a { color: var(--accent); }
table { border-collapse: collapse; width: 100%; font-size: 0.86rem;
  font-variant-numeric: tabular-nums; margin: 0.5rem 0 1rem; }
caption { text-align: left; color: var(--muted); font-size: 0.85rem; padding-bottom: 0.3rem; }
th, td { padding: 0.28rem 0.5rem; border-bottom: 1px solid var(--rule); text-align: right;
  vertical-align: top; }
th:first-child, td:first-child { text-align: left; }
td.text, th.text { text-align: left; }
thead th { border-bottom: 2px solid var(--ink); font-weight: 600; }
tbody th { font-weight: normal; }
.unit { color: var(--muted); font-size: 0.85em; white-space: nowrap; }
.chg { display: block; color: var(--muted); font-size: 0.8em; }
.is-baseline { background: var(--band); }
.chart { min-height: 4rem; overflow-x: auto; }
.chart svg { max-width: 100%; height: auto; }
.chart-error { color: var(--warn); }
figure { margin: 1.6rem 0; }
figcaption { color: var(--muted); font-size: 0.88rem; margin-top: 0.3rem; }
.cautions { border-left: 4px solid var(--warn); background: #fbf3f2; padding: 0.6rem 1rem; }
.cautions li { margin: 0.3rem 0; }
tr.group th { text-align: left; font-weight: 600; color: var(--accent); padding-top: 0.7rem; }
thead th.group { text-align: center; border-bottom: 1px solid var(--rule); }
dl.glossary dt { font-weight: 600; margin-top: 0.6rem; }
dl.glossary dd { margin: 0.1rem 0 0 1.2rem; }
.scroll { overflow-x: auto; max-width: 100%; }
.ok { color: #2c6e2f; }
.bad { color: var(--warn); font-weight: 600; }
footer { margin-top: 2.5rem; color: var(--muted); font-size: 0.8rem;
  border-top: 1px solid var(--rule); padding-top: 0.5rem; }
@page { margin: 14mm; }
@media print {
  body { max-width: none; padding: 0; font-size: 10pt; }
  nav, noscript { display: none; }
  h2 { break-after: avoid; }
  figure, .cautions, table.keep { break-inside: avoid; }
  thead { display: table-header-group; }
  table.yearly { font-size: 7.5pt; }
  .scroll { overflow: visible; }
  a { color: inherit; text-decoration: none; }
}
`;

/** Figure shown in a table cell: value in display units, "n/a" for null. */
function shown(x: number | null, u: Pick<DisplayUnit, 'factor' | 'decimals'>): string {
  return fixed(x === null ? null : x * u.factor, u.decimals);
}

/**
 * The climate the comparison holds for, in words and in the report's units, e.g. "precipitation
 * 880 mm/yr, reference ET 702 mm/yr, mean air temperature 9.3 °C; GHCN-Daily, station X".
 */
export function climateText(data: Pick<ReportData, 'climate' | 'units'>): string {
  const du = displayUnits(data.units);
  const c = data.climate;
  const water = (mm: number) => `${shown(mm, du.water)} ${du.water.label}/yr`;
  const temp =
    data.units === 'us' ? `${fixed(c.tmeanC * 1.8 + 32, 1)} °F` : `${fixed(c.tmeanC, 1)} °C`;
  return (
    `precipitation ${water(c.precipMmPerYr)}, reference ET ${water(c.refEtMmPerYr)}, ` +
    `mean air temperature ${temp}` +
    (c.source ? `; ${c.source}` : '')
  );
}

const DAYS: DisplayUnit = { factor: 1, label: 'days', decimals: 1 };
const PERCENT_DECIMALS = 1;

/** The questions the tables are grouped by. */
const LAYOUT = 'The drains';
const WATER = 'Water leaving the field';
const NITRATE = 'Nitrate-N leaving the field';
const CROP = "The crop's conditions";

/** One measure row of the comparison table (measures down, scenarios across). */
interface MeasureRow {
  group: string;
  label: string;
  unit: string;
  value: (r: ComparisonRow) => string;
  change?: (r: ComparisonRow) => string;
}

/** A comparison figure by column name (the names are built from the stems of COMPARED). */
function figure(r: ComparisonRow, column: string): number | null {
  return (r as unknown as Record<string, number | null>)[column] ?? null;
}

/** Length of a window as a plain count, from the baseline's mean (the same calendar for all). */
function windowDays(data: ReportData, column: 'spring_window_days' | 'fall_window_days'): string {
  const base = data.comparison.find((r) => r.is_baseline) ?? data.comparison[0];
  return fixed(base ? base[column] : null, 0);
}

function comparisonMeasures(data: ReportData): MeasureRow[] {
  const du = displayUnits(data.units);
  const perYear = (u: DisplayUnit) => `${u.label}/yr`;
  const depth = { ...du.length, decimals: 2 };
  const spacing = { ...du.length, decimals: 1 };
  // [group, label, display unit, unit text, mean column, stem and unit of the change columns]
  const compared: Array<[string, string, DisplayUnit, string, string, string, string]> = [
    [
      LAYOUT,
      'Lateral pipe length',
      du.pipe,
      du.pipe.label,
      'pipe_length_m_ha',
      'pipe_length',
      'm_ha',
    ],
    [WATER, 'Drain flow', du.water, perYear(du.water), 'drainflow_mm', 'drainflow', 'mm'],
    [WATER, 'Surface runoff', du.water, perYear(du.water), 'runoff_mm', 'runoff', 'mm'],
    [WATER, 'Deep seepage', du.water, perYear(du.water), 'seepage_mm', 'seepage', 'mm'],
    [WATER, 'Evapotranspiration', du.water, perYear(du.water), 'et_mm', 'et', 'mm'],
    [
      NITRATE,
      'Nitrate-N load in drain flow',
      du.load,
      perYear(du.load),
      'no3n_load_kg_ha',
      'no3n_load',
      'kg_ha',
    ],
    [
      NITRATE,
      'Flow-weighted nitrate-N concentration',
      du.conc,
      du.conc.label,
      'fwmc_mg_l',
      'fwmc',
      'mg_l',
    ],
    [
      CROP,
      'Aeration-stress days',
      DAYS,
      'days/yr',
      'aeration_stress_days',
      'aeration_stress',
      'days',
    ],
    [
      CROP,
      'Aeration deficit',
      DAYS,
      'days without air/yr',
      'aeration_deficit_days',
      'aeration_deficit',
      'days',
    ],
    [CROP, 'Water-stress days', DAYS, 'days/yr', 'stress_days', 'stress', 'days'],
    [CROP, 'Wet days', DAYS, 'days/yr', 'wet_days', 'wet', 'days'],
    [
      CROP,
      `Spring fieldwork days, of ${windowDays(data, 'spring_window_days')} in the window`,
      DAYS,
      'days/yr',
      'spring_fieldwork_days',
      'spring_fieldwork',
      'days',
    ],
    [
      CROP,
      `Fall fieldwork days, of ${windowDays(data, 'fall_window_days')} in the window`,
      DAYS,
      'days/yr',
      'fall_fieldwork_days',
      'fall_fieldwork',
      'days',
    ],
    [
      CROP,
      'Mean water-table depth',
      depth,
      du.length.label,
      'wt_mean_depth_m',
      'wt_mean_depth',
      'm',
    ],
  ];
  const spread: Array<[string, string, DisplayUnit, string, string]> = [
    [WATER, 'Drain flow across years', du.water, 'drainflow', 'mm'],
    [NITRATE, 'Nitrate-N load across years', du.load, 'no3n_load', 'kg_ha'],
  ];
  const scenario = (r: ComparisonRow) => data.scenarios.find((s) => s.name === r.scenario);
  const rows: MeasureRow[] = [
    {
      group: LAYOUT,
      label: 'Drain depth',
      unit: du.length.label,
      value: (r) => shown(scenario(r)?.drainDepthM ?? null, depth),
    },
    {
      group: LAYOUT,
      label: 'Lateral spacing',
      unit: du.length.label,
      value: (r) => shown(r.spacing_m, spacing),
    },
    ...compared.map(([group, label, u, unit, column, stem, suffix]): MeasureRow => ({
      group,
      label,
      unit,
      value: (r) => shown(figure(r, column), u),
      change: (r) => {
        const abs = figure(r, `${stem}_change_${suffix}`);
        const pct = figure(r, `${stem}_change_percent`);
        return `${signed(abs === null ? null : abs * u.factor, u.decimals)} (${signed(pct, PERCENT_DECIMALS)} %)`;
      },
    })),
    ...spread.map(([group, label, u, stem, suffix]): MeasureRow => ({
      group,
      label,
      unit: `${perYear(u)}, min / median / max`,
      value: (r) =>
        ['min', 'median', 'max']
          .map((k) => shown(figure(r, `${stem}_${k}_${suffix}`), u))
          .join(' / '),
    })),
  ];
  const order = [LAYOUT, WATER, NITRATE, CROP];
  return rows.sort((x, y) => order.indexOf(x.group) - order.indexOf(y.group));
}

function comparisonTable(data: ReportData): string {
  const rows = data.comparison;
  const head = rows
    .map(
      (r) =>
        `<th scope="col"${r.is_baseline ? ' class="is-baseline"' : ''}>${escapeHtml(r.scenario)}` +
        `${r.is_baseline ? '<span class="chg">baseline</span>' : ''}</th>`,
    )
    .join('');
  let group = '';
  const body = comparisonMeasures(data)
    .map((m) => {
      const heading =
        m.group === group
          ? ''
          : `<tr class="group"><th scope="rowgroup" colspan="${rows.length + 1}">${escapeHtml((group = m.group))}</th></tr>\n`;
      const cells = rows
        .map((r) => {
          const change =
            m.change && !r.is_baseline ? `<span class="chg">${m.change(r)}</span>` : '';
          return `<td${r.is_baseline ? ' class="is-baseline"' : ''}>${m.value(r)}${change}</td>`;
        })
        .join('');
      return `${heading}<tr><th scope="row">${escapeHtml(m.label)} <span class="unit">(${escapeHtml(m.unit)})</span></th>${cells}</tr>`;
    })
    .join('\n');
  return (
    `<table class="comparison keep" id="comparison-table">` +
    `<caption>Mean annual figures over ${counted(data.period.years, 'year')}; under each, the change against ` +
    `${escapeHtml(data.baseline)} (absolute and percent). Pipe length counts the parallel laterals ` +
    `only (${data.units === 'us' ? '43 560 ft²/ac divided by the spacing in ft' : '10 000 m²/ha divided by the spacing in m'}); ` +
    `mains and submains are not included.</caption>` +
    `<thead><tr><th scope="col">Measure</th>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

function scenarioTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const body = data.scenarios
    .map(
      (s) =>
        `<tr${s.name === data.baseline ? ' class="is-baseline"' : ''}><th scope="row">${escapeHtml(s.name)}</th>` +
        `<td class="text">${escapeHtml(s.description)}</td>` +
        `<td>${shown(s.drainDepthM, du.length)}</td><td>${shown(s.spacingM, du.length)}</td>` +
        `<td class="text">${escapeHtml(s.outlet)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="scenarios keep" id="scenario-table"><thead><tr><th scope="col">Scenario</th>` +
    `<th scope="col" class="text">Description</th>` +
    `<th scope="col">Drain depth <span class="unit">(${du.length.label})</span></th>` +
    `<th scope="col">Spacing <span class="unit">(${du.length.label})</span></th>` +
    `<th scope="col" class="text">Outlet</th></tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

function yearlyTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const order = data.scenarios.map((s) => s.name);
  const rows: AnnualRow[] = data.annual
    .filter((r) => order.includes(r.scenario))
    .sort((a, b) => order.indexOf(a.scenario) - order.indexOf(b.scenario) || a.year - b.year);
  const of = (n: number, of: number) => `${fixed(n, 0)} / ${fixed(of, 0)}`;
  const groups: Array<[string, Array<[string, string, (r: AnnualRow) => string]>]> = [
    [
      WATER,
      [
        ['Drains', du.water.label, (r) => shown(r.drainflow_mm, du.water)],
        ['Surface', du.water.label, (r) => shown(r.runoff_mm, du.water)],
        ['Seepage', du.water.label, (r) => shown(r.seepage_mm, du.water)],
        ['To the air (ET)', du.water.label, (r) => shown(r.et_mm, du.water)],
      ],
    ],
    [
      NITRATE,
      [
        ['In drain water', du.load.label, (r) => shown(r.no3n_load_kg_ha, du.load)],
        ['Concentration', du.conc.label, (r) => shown(r.fwmc_mg_l, du.conc)],
      ],
    ],
    [
      CROP,
      [
        ['Aeration stress', 'days', (r) => fixed(r.aeration_stress_days, 0)],
        ['Water stress', 'days', (r) => fixed(r.stress_days, 0)],
        ['Wet', 'days', (r) => fixed(r.wet_days, 0)],
        [
          'Spring fieldwork',
          'days of window',
          (r) => of(r.spring_fieldwork_days, r.spring_window_days),
        ],
        ['Fall fieldwork', 'days of window', (r) => of(r.fall_fieldwork_days, r.fall_window_days)],
      ],
    ],
    [
      "The year's weather",
      [['Precipitation', du.water.label, (r) => shown(r.precip_mm, du.water)]],
    ],
  ];
  const cols = groups.flatMap(([, c]) => c);
  const top = groups
    .map(
      ([g, c]) => `<th scope="colgroup" colspan="${c.length}" class="group">${escapeHtml(g)}</th>`,
    )
    .join('');
  const head = cols
    .map(([h, u]) => `<th scope="col">${h} <span class="unit">(${escapeHtml(u)})</span></th>`)
    .join('');
  const body = rows
    .map(
      (r) =>
        `<tr><th scope="row">${escapeHtml(r.scenario)}</th>` +
        `<td>${r.year}${isPartialYear(r.year, r.days) ? ` (part year: ${r.days} days)` : ''}</td>` +
        cols.map(([, , f]) => `<td>${f(r)}</td>`).join('') +
        '</tr>',
    )
    .join('\n');
  const partial = rows.some((r) => isPartialYear(r.year, r.days));
  return (
    (partial
      ? `<p id="part-years">Years marked "part year" are covered only in part by the period ` +
        `compared: their figures are sums over those days, not annual rates.</p>`
      : '') +
    `<div class="scroll"><table class="yearly" id="yearly-table"><thead>` +
    `<tr><th scope="col" rowspan="2">Scenario</th><th scope="col" rowspan="2">Year</th>${top}</tr>` +
    `<tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table></div>`
  );
}

/** The water table in the fieldwork windows: median, 80th percentile, years too wet. */
function windowTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const depth = (x: number) => shown(x, { ...du.length, decimals: 2 });
  const body = data.windows
    .map(
      (w) =>
        `<tr${w.scenario === data.baseline ? ' class="is-baseline"' : ''}>` +
        `<th scope="row">${escapeHtml(w.scenario)}</th>` +
        `<td class="text">${w.window} (${windowText(w)})</td>` +
        `<td>${depth(w.medianDepthM)}</td><td>${depth(w.p80DepthM)}</td>` +
        `<td>${w.tooWetYears} of ${w.years}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="windows keep" id="window-table"><caption>Water-table depth midway between the ` +
    `drains on every day of the window over the ${counted(data.period.years, 'year')}; on 80 % of ` +
    `those days the water table was at the 80th-percentile depth or shallower. Too wet: years ` +
    `in which fewer than half of the window's days were suitable for fieldwork.</caption>` +
    `<thead><tr><th scope="col">Scenario</th><th scope="col" class="text">Window</th>` +
    `<th scope="col">Median depth <span class="unit">(${du.length.label})</span></th>` +
    `<th scope="col">80th-percentile depth <span class="unit">(${du.length.label})</span></th>` +
    `<th scope="col">Years too wet for half the window</th></tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

/** What the run compares, from the scenarios themselves: one phrase per alternative. */
function alternativesText(data: ReportData): { lines: string[]; layout: boolean; outlet: boolean } {
  const du = displayUnits(data.units);
  const len = (x: number, d: number) =>
    `${shown(x, { ...du.length, decimals: d })} ${du.length.label}`;
  const base = data.scenarios.find((s) => s.name === data.baseline);
  let layout = false;
  let outlet = false;
  const lines = data.scenarios
    .filter((s) => s.name !== data.baseline)
    .map((s) => {
      const parts: string[] = [];
      if (base && (s.drainDepthM !== base.drainDepthM || s.spacingM !== base.spacingM)) {
        layout = true;
        parts.push(
          `drains ${len(s.drainDepthM, 2)} deep and ${len(s.spacingM, 1)} apart instead of ` +
            `${len(base.drainDepthM, 2)} and ${len(base.spacingM, 1)}`,
        );
      }
      if (base && s.outlet !== base.outlet) {
        outlet = true;
        parts.push(`outlet ${s.outlet} instead of ${base.outlet}`);
      }
      return `${s.name}: ${parts.length ? parts.join('; ') : 'the same layout and outlet'}`;
    });
  return { lines, layout, outlet };
}

/** Why the water-table chart shows the year it shows. */
function chartYearText(data: ReportData): string {
  return data.chartYearReason === 'given'
    ? `The daily charts show ${data.chartYear}, the year asked for with --year.`
    : `The daily charts show ${data.chartYear}, the wettest year of the record (the most ` +
        `precipitation); choose another with --year.`;
}

const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');

/** "MM-DD" as "15 Apr". */
function dayMonth(key: string): string {
  return `${Number(key.slice(3))} ${MONTHS[Number(key.slice(0, 2)) - 1]}`;
}

/** A step date in words: "25 Oct" for a yearly step, "25 Oct 2015" for a dated one. */
function stepDate(from: string): string {
  return from.length === 5 ? dayMonth(from) : `${dayMonth(from.slice(5))} ${from.slice(0, 4)}`;
}

/** "3 boards", "1 board". */
function boardsText(n: number): string {
  return counted(Math.abs(n), 'board');
}

/**
 * The outlet schedule of every scenario with a control structure: dates, levels and, when the
 * field gives a board height, boards standing and boards to add or take out on each date.
 * Empty when every outlet is free.
 */
export function outletScheduleTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const level = (m: number) => `${shown(m, { ...du.length, decimals: 2 })} ${du.length.label}`;
  const managed = data.scenarios.filter((s) => s.outletSteps && s.outletSteps.length > 0);
  if (managed.length === 0) return '';
  const withBoards = managed.some((s) => s.boardHeightM !== undefined);
  const rows = managed.flatMap((s) => {
    const table = boardTable(s.outletSteps!, s.drainDepthM, s.boardHeightM);
    return table.map((r, k) => {
      const free = r.levelM === null || r.levelM >= s.drainDepthM;
      const asked = free ? 'free' : shown(r.levelM, { ...du.length, decimals: 2 });
      let action: string;
      if (r.change !== null) {
        action =
          r.change > 0
            ? `add ${boardsText(r.change)}`
            : r.change < 0
              ? r.boards === 0
                ? `take out all ${boardsText(r.change)} (free outlet)`
                : `take out ${boardsText(r.change)}`
              : 'no change';
      } else {
        action = free ? 'free the outlet' : `set the outlet to ${level(r.levelM!)}`;
      }
      const boards =
        r.boards === null
          ? withBoards
            ? '<td class="text">no board height given</td>'
            : ''
          : `<td class="text">${boardsText(r.boards)}` +
            (r.levelM !== null && r.boards > 0 && Math.abs(r.boardLevelM! - r.levelM) > 0.005
              ? ` (outlet at ${escapeHtml(level(r.boardLevelM!))})`
              : '') +
            `</td>`;
      return (
        `<tr>${k === 0 ? `<th scope="row" rowspan="${table.length}">${escapeHtml(s.name)}</th>` : ''}` +
        `<td class="text">${escapeHtml(stepDate(r.from))}</td>` +
        `<td class="text">${escapeHtml(asked)}</td>${boards}` +
        `<td class="text">${escapeHtml(action)}</td></tr>`
      );
    });
  });
  const heights = managed
    .filter((s) => s.boardHeightM !== undefined)
    .map((s) => {
      const h =
        data.units === 'us'
          ? `${fixed(s.boardHeightM! / 0.0254, 1)} in`
          : `${fixed(s.boardHeightM! * 100, 1)} cm`;
      return `${s.name}: boards ${h} high`;
    });
  return (
    `<table class="keep" id="outlet-table"><caption>The control structure through the year. ` +
    `Dates given as day and month repeat every year; the level is the outlet's height below the ` +
    `surface (free: at the drains). ` +
    (withBoards
      ? `Boards are counted up from the outlet pipe at drain depth, rounded to whole boards ` +
        `(${escapeHtml(heights.join('; '))}).`
      : `Give outlet.boardHeight in the field file (e.g. 6 in) to see the schedule in boards.`) +
    `</caption><thead><tr><th scope="col">Scenario</th><th scope="col">From</th>` +
    `<th scope="col">Outlet level <span class="unit">(${du.length.label} below surface)</span></th>` +
    (withBoards ? `<th scope="col">Boards standing</th>` : '') +
    `<th scope="col">On that date</th></tr></thead>\n<tbody>\n${rows.join('\n')}\n</tbody></table>`
  );
}

function windowText(w: { from: string; to: string }): string {
  return `${dayMonth(w.from)} to ${dayMonth(w.to)}`;
}

/** The glossary: every measure in the tables, with the windows and thresholds of this run. */
function glossary(data: ReportData): string {
  const du = displayUnits(data.units);
  const m = data.measures;
  const len = (x: number) => `${shown(x, { ...du.length, decimals: 2 })} ${du.length.label}`;
  const pct = (x: number) => `${fixed(100 * x, 0)} %`;
  const season = `the growing season (${windowText(m.growingSeason)})`;
  const entries: Array<[string, string]> = [
    [
      'Drain flow',
      "Water leaving through the drains, as a depth over the drained area, from Hooghoudt's " +
        "equation (Kirkham's when the surface is ponded) and the outlet level in force.",
    ],
    ['Surface runoff', 'Water running off once the depression storage on the surface is full.'],
    [
      'Deep seepage',
      'Water leaking down through the restrictive layer to the regional groundwater (Darcy leakage).',
    ],
    [
      'Evapotranspiration (ET)',
      'Water returned to the air by the crop and the soil surface (FAO-56 crop coefficient and ' +
        'water-stress coefficient).',
    ],
    [
      'Nitrate-N load',
      `Nitrate-N leaving with drain water, ${du.load.label}: drain flow times its concentration.`,
    ],
    [
      'Flow-weighted concentration',
      'Total nitrate-N load divided by total drain flow over the period, mg/L.',
    ],
    [
      'Aeration-stress days',
      `Days in ${season} on which the air-filled porosity of the top ${len(m.aerationLayer)} ` +
        `is below ${pct(m.aerationThreshold)} by volume, the usual limit below which roots lack ` +
        'oxygen. Air-filled porosity is the pore space drained above the water table within that ' +
        'layer (its drainable porosity) plus the water the crop has taken from it below field ' +
        "capacity, over the layer's volume.",
    ],
    [
      'Aeration deficit',
      'How severe the aeration stress was: each aeration-stress day adds its shortfall of air as ' +
        'a share of the limit (1 when the layer holds no air, 0.5 at half the limit), summed over ' +
        'the season. Unit: days without air; ten days at half the limit count 5.',
    ],
    [
      'Water-stress days',
      `Days in ${season} on which the root zone is dry enough to hold transpiration below its ` +
        'potential (FAO-56 water-stress coefficient Ks below 1).',
    ],
    [
      'Wet days',
      `Days in ${season} with the water table midway between the drains shallower than ` +
        `${len(m.threshold)}.`,
    ],
    [
      'Spring and fall fieldwork days',
      `Days suitable for fieldwork in the spring window (${windowText(m.springWindow)}) and the ` +
        `fall window (${windowText(m.fallWindow)}): the top ${len(m.surfaceLayer)} holds at most ` +
        `${pct(m.trafficabilityLimit)} of its field-capacity water content, no water stands on the ` +
        'surface and no snow covers it. Counts are given with the length of the window ' +
        '("31 of 47 days").',
    ],
    [
      'Mean water-table depth',
      'Depth of the water table midway between the drains below the surface, averaged over the year.',
    ],
  ];
  return (
    `<dl class="glossary" id="glossary">` +
    entries.map(([t, d]) => `<dt>${escapeHtml(t)}</dt><dd>${escapeHtml(d)}</dd>`).join('\n') +
    `</dl>`
  );
}

function methodsTable(data: ReportData): string {
  const body = data.methods
    .map(
      (m) =>
        `<tr><th scope="row">${escapeHtml(m.topic)}</th><td class="text">${escapeHtml(m.text)}</td>` +
        `<td class="text">${escapeHtml(m.source)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="methods" id="methods-table"><thead><tr><th scope="col">Topic</th>` +
    `<th scope="col" class="text">Method and assumptions</th><th scope="col" class="text">Source</th>` +
    `</tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

function closed(x: number, tol: number): string {
  return Math.abs(x) <= tol
    ? '<span class="ok">closed</span>'
    : '<span class="bad">not closed</span>';
}

function balanceTable(data: ReportData): string {
  const du = displayUnits(data.units);
  const body = data.balances
    .map(
      (b) =>
        `<tr><th scope="row">${escapeHtml(b.scenario)}</th>` +
        `<td>${(b.maxAnnualWaterErrorMm * du.water.factor).toExponential(1)}</td><td>${closed(b.maxAnnualWaterErrorMm, BALANCE_TOLERANCE.waterMm)}</td>` +
        `<td>${(b.maxAnnualNitrogenErrorKgHa * du.load.factor).toExponential(1)}</td>` +
        `<td>${closed(b.maxAnnualNitrogenErrorKgHa, BALANCE_TOLERANCE.nitrogenKgHa)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="balances keep" id="balance-table"><thead><tr><th scope="col">Scenario</th>` +
    `<th scope="col">Largest annual water-balance residual <span class="unit">(${du.water.label})</span></th>` +
    `<th scope="col">Water</th>` +
    `<th scope="col">Largest annual nitrogen-balance residual <span class="unit">(${du.load.label})</span></th>` +
    `<th scope="col">Nitrogen</th></tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

/**
 * Figure containers for charts drawn in the page, numbered in order, each with its caption
 * (the chart's name when `captions` has none).
 */
export function chartFigures(
  names: string[],
  captions: Readonly<Record<string, string | undefined>> = CHART_CAPTIONS,
): string {
  return names
    .map((name, i) => {
      const caption = captions[name as ChartName] ?? name;
      return (
        `<figure id="figure-${escapeHtml(name)}"><div class="chart" data-chart="${escapeHtml(name)}" role="img" ` +
        `aria-label="${escapeHtml(caption)}"></div>` +
        `<figcaption><strong>Figure ${i + 1}.</strong> ${escapeHtml(caption)}</figcaption></figure>`
      );
    })
    .join('\n');
}

/** What the page says when JavaScript is off: the charts are in the folder beside it. */
export const NOSCRIPT_CHARTS =
  '<noscript><p>The charts need JavaScript. SVG and PNG copies are in the charts folder ' +
  'beside this report.</p></noscript>';

/**
 * Cautions of every design output (README, Cautions): codes, standards and a licensed
 * professional decide; trenching is dangerous.
 */
export const DESIGN_CAUTIONS = [
  'Drain design, outlet works and any wetland or water-quality determination follow local ' +
    'drainage guides, conservation practice standards and permits, and need a licensed professional.',
  'Trenching is dangerous work with its own safety rules: locate buried utilities before digging ' +
    'and follow the excavation safety rules that apply where the work is done.',
];

/** The cautions as the page's list. */
export function cautionList(items: readonly string[]): string {
  return `<ul class="cautions">${items.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`;
}

/** The cautions of every simulation page: planning estimates, then the design cautions. */
export const PLANNING_CAUTIONS = [
  'The figures are planning estimates from simplified physics: a daily water balance with a ' +
    'single water table midway between the drains, quasi-steady drain equations and simple ' +
    'nitrate models. They compare alternatives under the same assumptions and the same weather; ' +
    'they do not predict what a particular field will do in a particular year.',
  ...DESIGN_CAUTIONS,
];

/** Browser side: draw every chart container with its spec, then mark the page as ready. */
const EMBED_SCRIPT = `(function () {
  'use strict';
  var specs = JSON.parse(document.getElementById('tileflux-chart-specs').textContent);
  var boxes = document.querySelectorAll('.chart[data-chart]');
  var jobs = [];
  Array.prototype.forEach.call(boxes, function (box) {
    var name = box.getAttribute('data-chart');
    if (!Object.prototype.hasOwnProperty.call(specs, name)) return;
    jobs.push(
      vegaEmbed(box, specs[name], { actions: false, renderer: 'svg' }).catch(function (err) {
        box.textContent = 'This chart could not be drawn: ' + (err && err.message ? err.message : err);
        box.className += ' chart-error';
        console.error(err);
      })
    );
  });
  Promise.all(jobs).then(function () {
    document.documentElement.setAttribute('data-charts', 'ready');
  });
})();`;

/**
 * The self-contained HTML report: the question, the inputs, the comparison table, the charts
 * (drawn in the page by vega-embed from `specs`), the year-by-year table, methods and sources,
 * water and nitrogen balance closure, and the cautions (README "Cautions"). Opens from
 * file:// with no network access; `bundles` defaults to the builds in node_modules.
 *
 * @example writeFileSync('report.html', buildReportHtml(data, buildChartSpecs(data)))
 */
export function buildReportHtml(
  data: ReportData,
  specs: Record<string, object>,
  bundles: VegaBundles = loadVegaBundles(),
): string {
  const du = displayUnits(data.units);
  const names = Object.keys(specs);
  const others = data.scenarios.filter((s) => s.name !== data.baseline).map((s) => s.name);
  const headline = headlineLines(data.comparison);
  const wetness = cropConditionLines(data.comparison);
  const alt = alternativesText(data);
  const list = (lines: string[]) =>
    lines.length ? `<ul>${lines.map((l) => `<li>${escapeHtml(l)}</li>`).join('')}</ul>` : '';
  const sections: Array<[id: string, heading: string, body: string]> = [
    [
      'question',
      'The question',
      `<p>How do ${others.length ? escapeHtml(others.join(', ')) : 'the alternatives'} compare with ` +
        `<strong>${escapeHtml(data.baseline)}</strong> on ${escapeHtml(data.fieldName)} in the water and ` +
        `nitrate-N that leave through the drains, and in how wet the field stays, over the same ` +
        `${counted(data.period.years, 'year')} of weather?</p>` +
        (alt.lines.length
          ? `<p>What differs from ${escapeHtml(data.baseline)}:</p>${list(alt.lines)}`
          : '') +
        (alt.layout || alt.outlet
          ? `<p>${[
              alt.layout ? 'Drains set shallower or closer together' : '',
              alt.outlet ? 'an outlet held up by a control structure' : '',
            ]
              .filter(Boolean)
              .join(', or ')
              .replace(/^a/, 'A')} usually send less water and nitrate downstream; the price can ` +
            `be a wetter field at planting and harvest. This report puts figures on both sides of ` +
            `that trade.</p>`
          : '') +
        (headline.length ? `<p>Drain flow and nitrate-N load:</p>${list(headline)}` : '') +
        (wetness.length
          ? `<p id="wetness-summary">How the crop's conditions changed:</p>${list(wetness)}`
          : '<p>Only the baseline was simulated.</p>'),
    ],
    [
      'inputs',
      'Inputs',
      `<table class="keep" id="input-table"><tbody>` +
        `<tr><th scope="row">Field</th><td class="text">${escapeHtml(data.fieldName)}</td></tr>` +
        `<tr><th scope="row">Weather file</th><td class="text">${escapeHtml(data.weatherFile)}</td></tr>` +
        `<tr><th scope="row">Climate of the period</th><td class="text" id="climate">` +
        `${escapeHtml(climateText(data))}</td></tr>` +
        `<tr><th scope="row">Period</th><td class="text">${escapeHtml(data.period.from)} to ` +
        `${escapeHtml(data.period.to)} (${counted(data.period.years, 'year')})</td></tr>` +
        `<tr><th scope="row">Baseline</th><td class="text">${escapeHtml(data.baseline)}</td></tr>` +
        `<tr><th scope="row">Wet threshold</th><td class="text">water table shallower than ` +
        `${shown(data.wetThresholdM, { ...du.length, decimals: 2 })} ${du.length.label}</td></tr>` +
        `</tbody></table>` +
        scenarioTable(data),
    ],
    ['outlet', 'The outlet schedule', outletScheduleTable(data)],
    ['comparison', 'Comparison', comparisonTable(data)],
    ['windows', 'Water table in the fieldwork windows', windowTable(data)],
    [
      'charts',
      'Charts',
      `<p id="chart-year">${escapeHtml(chartYearText(data))}</p>` +
        chartFigures(names) +
        NOSCRIPT_CHARTS,
    ],
    ['yearly', 'Year by year', yearlyTable(data)],
    ['glossary', 'What the measures mean', glossary(data)],
    ['methods', 'Methods and assumptions', methodsTable(data)],
    [
      'balance',
      'Water and nitrogen balance closure',
      `<p>Every run checks that precipitation equals evapotranspiration, runoff, drain flow, ` +
        `seepage and the change in storage. The table gives the largest annual residual of each ` +
        `scenario; a residual within ${(BALANCE_TOLERANCE.waterMm * du.water.factor).toExponential(0)} ${du.water.label} ` +
        `(${(BALANCE_TOLERANCE.nitrogenKgHa * du.load.factor).toExponential(0)} ${du.load.label} for nitrogen) counts as closed.</p>` +
        balanceTable(data),
    ],
    ['cautions', 'Cautions', cautionList(PLANNING_CAUTIONS)],
  ];
  return buildHtmlPage({
    title: data.title,
    meta: `${data.fieldName} \u00b7 ${data.period.from} to ${data.period.to} \u00b7 ${data.generatedBy}`,
    generatedBy: data.generatedBy,
    sections: sections.filter(([, , body]) => body !== ''),
    specs,
    bundles,
  });
}

/** A page of the report: title, one line under it, sections of markup and the chart specs. */
export interface HtmlPage {
  title: string;
  /** Plain text under the title (escaped here). */
  meta: string;
  generatedBy: string;
  /** [id, heading, body markup] in page order; listed in the contents. */
  sections: Array<[id: string, heading: string, body: string]>;
  /** Chart specs drawn into the `.chart[data-chart]` containers by name. */
  specs: Record<string, object>;
  bundles?: VegaBundles;
}

/**
 * The self-contained page around report sections: Content-Security-Policy, style, contents,
 * the inlined vega libraries, the chart specs as JSON and the script that draws them. Every
 * report of tileflux goes through it, so they open offline and look alike.
 *
 * @example buildHtmlPage({ title: 'Plan', meta: 'a plan', generatedBy: 'tileflux', sections: [], specs: {} })
 */
export function buildHtmlPage(page: HtmlPage): string {
  const bundles = page.bundles ?? loadVegaBundles();
  const { sections, specs } = page;
  const title = escapeHtml(page.title);
  const scripts = [bundles.vega, bundles.vegaLite, bundles.vegaEmbed, EMBED_SCRIPT];
  const nav = sections.map(([id, h]) => `<li><a href="#${id}">${h}</a></li>`).join('');
  const body = sections
    .map(([id, h, content]) => `<section id="${id}">\n<h2>${h}</h2>\n${content}\n</section>`)
    .join('\n');
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${contentSecurityPolicy(scripts)}">
<meta name="generator" content="${escapeHtml(page.generatedBy)}">
<title>${title}</title>
<link rel="icon" href="data:,">
<style>${PAGE_CSS}</style>
</head>
<body>
<header>
<h1>${title}</h1>
<p class="meta">${escapeHtml(page.meta)}</p>
</header>
<nav aria-label="Contents"><ol>${nav}</ol></nav>
${body}
<footer>Generated by ${escapeHtml(page.generatedBy)}. Planning estimate; see the cautions above.</footer>
${inlineScript(bundles.vega, 'vega')}
${inlineScript(bundles.vegaLite, 'vega-lite')}
${inlineScript(bundles.vegaEmbed, 'vega-embed')}
<script type="application/json" id="tileflux-chart-specs">${jsonForScript(specs)}</script>
<script>${EMBED_SCRIPT}</script>
</body>
</html>
`;
}
