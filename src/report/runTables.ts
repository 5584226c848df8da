/**
 * The tables of the run report: the comparison of scenarios by measure (layout, water,
 * nitrate-N, crop conditions) with changes and seepage bands, the scenarios, the year-by-year
 * table and the fieldwork-window table. Pure: report data in, escaped HTML out.
 */
import type { ComparisonRow } from '../scenarios/compare.js';
import type { AnnualRow } from '../scenarios/types.js';
import { counted, fixed, signed } from './format.js';
import { isPartialYear } from '../scenarios/annual.js';
import type { ReportData } from './types.js';
import { displayUnits, type DisplayUnit } from './units.js';
import { escapeHtml } from './htmlPage.js';

/** Figure shown in a table cell: value in display units, "n/a" for null. */
export function shown(x: number | null, u: Pick<DisplayUnit, 'factor' | 'decimals'>): string {
  return fixed(x === null ? null : x * u.factor, u.decimals);
}
export const DAYS: DisplayUnit = { factor: 1, label: 'days', decimals: 1 };
export const PERCENT_DECIMALS = 1;
/** The questions the tables are grouped by. */
export const LAYOUT = 'The drains';
export const WATER = 'Water leaving the field';
export const NITRATE = 'Nitrate-N leaving the field';
export const CROP = "The crop's conditions";
/** One measure row of the comparison table (measures down, scenarios across). */
export interface MeasureRow {
  group: string;
  label: string;
  unit: string;
  value: (r: ComparisonRow) => string;
  change?: (r: ComparisonRow) => string;
}
/** A comparison figure by column name (the names are built from the stems of COMPARED). */
export function figure(r: ComparisonRow, column: string): number | null {
  return (r as unknown as Record<string, number | null>)[column] ?? null;
}
/** Length of a window as a plain count, from the baseline's mean (the same calendar for all). */
export function windowDays(
  data: ReportData,
  column: 'spring_window_days' | 'fall_window_days',
): string {
  const base = data.comparison.find((r) => r.is_baseline) ?? data.comparison[0];
  return fixed(base ? base[column] : null, 0);
}
export function comparisonMeasures(data: ReportData): MeasureRow[] {
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
export function comparisonTable(data: ReportData): string {
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
export function scenarioTable(data: ReportData): string {
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
export function yearlyTable(data: ReportData): string {
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
export function windowTable(data: ReportData): string {
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

export function windowText(w: { from: string; to: string }): string {
  return `${dayMonth(w.from)} to ${dayMonth(w.to)}`;
}

export const MONTHS = 'Jan Feb Mar Apr May Jun Jul Aug Sep Oct Nov Dec'.split(' ');
/** "MM-DD" as "15 Apr". */
export function dayMonth(key: string): string {
  return `${Number(key.slice(3))} ${MONTHS[Number(key.slice(0, 2)) - 1]}`;
}
