/**
 * The offline HTML report of a drain-system design: the plan's settings, the reaches and
 * laterals as sized, the notes (grades below the minimum, cover and depth flags, the cost of
 * rounding down), a profile chart per main, the methods and the cautions. Built on the same page
 * as the run report (`buildHtmlPage`), so it opens offline and forbids every network request.
 */
import type { SystemDesign, SystemSettings } from '../drainage/systemDesign.js';
import { MATERIAL_ROUGHNESS, PIPE_MATERIALS } from '../drainage/pipeMaterials.js';
import { columnIn } from '../io/tables.js';
import { US, type UnitSystem } from '../units/quantity.js';
import {
  buildHtmlPage,
  cautionList,
  chartFigures,
  DESIGN_CAUTIONS,
  escapeHtml,
  NOSCRIPT_CHARTS,
} from './htmlPage.js';
import { fixed } from './format.js';
import type { VegaBundles } from './vegaBundles.js';

export interface SystemReportInput {
  planName: string;
  systemFile: string;
  profileFile?: string | undefined;
  /** How the drainage coefficient was chosen. */
  coefficientText: string;
  generatedBy: string;
  units: UnitSystem;
  design: SystemDesign;
  settings: SystemSettings;
  /** The rows of reaches.csv and laterals.csv, SI. */
  reachRows: Array<Record<string, string | number>>;
  lateralRows: Array<Record<string, string | number>>;
  specs: Record<string, object>;
  captions: Record<string, string>;
  bundles?: VegaBundles;
}

/** Unit suffixes shown as the header's unit. */
const UNIT_TEXT: Readonly<Record<string, string>> = {
  m: 'm',
  ft: 'ft',
  mm: 'mm',
  in: 'in',
  ha: 'ha',
  ac: 'ac',
  l_s: 'L/s',
  cfs: 'ft3/s',
  m_s: 'm/s',
  ft_s: 'ft/s',
  mm_d: 'mm/d',
  in_d: 'in/d',
  percent: '%',
  n: '-',
};

/** Table of rows with headers from the column names ("design_flow_l_s" -> "design flow (L/s)"). */
function rowsTable(
  rows: Array<Record<string, string | number>>,
  units: UnitSystem,
  id: string,
): string {
  if (rows.length === 0) return '<p>None.</p>';
  const cols = Object.keys(rows[0]).map((key) => {
    const c = columnIn(key, units);
    const m = /_(l_s|m_s|ft_s|mm_d|in_d|percent|m|ft|mm|in|ha|ac|n)$/.exec(c.name);
    const label = (m ? c.name.slice(0, -m[0].length) : c.name).replace(/_/g, ' ');
    return { key, factor: c.factor, label, unit: m ? UNIT_TEXT[m[1]] : '' };
  });
  const decimals = (unit: string, x: number) =>
    unit === 'L/s' || unit === 'ft3/s' ? (Math.abs(x) < 10 ? 3 : 1) : unit === '%' ? 3 : 2;
  const head = cols
    .map(
      (c) =>
        `<th scope="col">${escapeHtml(c.label)}${c.unit ? ` <span class="unit">(${escapeHtml(c.unit)})</span>` : ''}</th>`,
    )
    .join('');
  const body = rows
    .map(
      (r) =>
        '<tr>' +
        cols
          .map((c, i) => {
            const v = r[c.key];
            const text =
              typeof v === 'number'
                ? fixed(v * c.factor, decimals(c.unit, v * c.factor))
                : escapeHtml(String(v));
            return i === 0
              ? `<th scope="row">${text}</th>`
              : `<td${typeof v === 'number' ? '' : ' class="text"'}>${text}</td>`;
          })
          .join('') +
        '</tr>',
    )
    .join('\n');
  return `<table id="${id}"><thead><tr>${head}</tr></thead>\n<tbody>\n${body}\n</tbody></table>`;
}

/** Cautions of the system report: a planning estimate, then those of every design. */
export const SYSTEM_CAUTIONS = [
  'The sizes, grades and depths of cut are planning estimates: steady full-pipe flow by ' +
    "Manning's equation for a chosen drainage coefficient, uniform grades per reach laid on the " +
    'surveyed stations only. Ground between stations, pipe joints, sediment, the outlet water ' +
    'level and the soil are not modelled; a survey and the installer check every grade.',
  ...DESIGN_CAUTIONS,
];

/**
 * The self-contained system report.
 *
 * @example writeFileSync('report.html', buildSystemReportHtml(input))
 */
export function buildSystemReportHtml(p: SystemReportInput): string {
  const s = p.settings;
  const len = (m: number) =>
    p.units === 'us' ? `${fixed(m / US.mPerFt, 2)} ft` : `${fixed(m, 2)} m`;
  const rate = (mmD: number) =>
    p.units === 'us' ? `${fixed(mmD / US.mmPerIn, 3)} in/d` : `${fixed(mmD, 2)} mm/d`;
  const speed = (ms: number) =>
    p.units === 'us' ? `${fixed(ms / US.mPerFt, 2)} ft/s` : `${fixed(ms, 3)} m/s`;
  const settingRows: Array<[string, string]> = [
    ['System file', p.systemFile],
    ['Profile', p.profileFile ?? 'none: fixed grades only, no depth of cut'],
    ['Drainage coefficient', `${rate(s.coefficientMmD)} (${p.coefficientText})`],
    ['Pipe sizes', `${s.sizes.nominal.join(', ')} ${s.sizes.unit} (${s.sizes.source})`],
    ['Flushing velocity (minimum grade)', speed(s.velocityMs)],
    [
      'Rounding',
      s.round === 'up'
        ? 'up to the next size'
        : 'down to the next size (less than the chosen coefficient)',
    ],
    ['Design depth of cut', len(s.depthM)],
    ['Minimum cover over the pipe', len(s.minimumCoverM)],
    ['Maximum depth of cut', len(s.maximumDepthM)],
    ['Inverts', p.design.invertsAbsolute ? 'elevations' : 'relative to the outlet invert (0)'],
    ['Smallest effective coefficient of a lateral', rate(p.design.lateralCoefficientMmD)],
    [
      'Smallest coefficient from a lateral to the outlet (drains.capacity of a field file)',
      rate(p.design.fieldCoefficientMmD),
    ],
  ];
  const settings =
    `<table class="keep" id="settings-table"><tbody>` +
    settingRows
      .map(
        ([k, v]) =>
          `<tr><th scope="row">${escapeHtml(k)}</th><td class="text">${escapeHtml(v)}</td></tr>`,
      )
      .join('') +
    `</tbody></table>`;
  const notes = p.design.notes.length
    ? `<ul id="notes">${p.design.notes.map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>`
    : '<p id="notes">No grade below its minimum, no station outside the cover and depth limits.</p>';
  const mains = p.design.mains
    .map(
      (m) =>
        `<li>Main ${escapeHtml(m.name)}: ${len(m.lengthM)}` +
        (m.maxCutM === undefined
          ? ''
          : `, deepest cut ${len(m.maxCutM)} at station ${len(m.maxCutStationM ?? 0)}`) +
        '</li>',
    )
    .join('');
  const roughness = PIPE_MATERIALS.map((k) => {
    const t = MATERIAL_ROUGHNESS[k];
    const ns = t.steps.map((x) => x.n.toFixed(3)).join(' / ');
    return `<tr><th scope="row">${escapeHtml(t.label)}</th><td>${ns}</td><td class="text">${escapeHtml(t.source)}</td></tr>`;
  }).join('');
  const methods =
    '<p>Design flow of a reach = drained area above its lower end x drainage coefficient + ' +
    "surface-inlet flow above it (common practice). Required diameter by Manning's equation for " +
    'a full circular pipe, Q = (1/n) A R^(2/3) S^(1/2) (Chow 1959), rounded to the size list. ' +
    'Minimum grade: the grade at which the selected size reaches the flushing velocity flowing full. ' +
    'With a profile, each reach is laid at one grade from its lower invert toward the design depth ' +
    'at its upper end, never flatter than the minimum grade, and held, where it can be, between ' +
    'the minimum cover and the maximum depth at every surveyed station. Effective coefficient = ' +
    '(capacity of the selected size - inlet flow) / drained area. Nominal sizes are taken as ' +
    'inside diameters; cover is measured from the top of the bore.</p>' +
    '<table id="roughness-table"><thead><tr><th scope="col">Material</th><th scope="col">Manning n by size</th>' +
    `<th scope="col" class="text">Source</th></tr></thead><tbody>${roughness}</tbody></table>`;
  const names = Object.keys(p.specs);
  const sections: Array<[string, string, string]> = [
    ['plan', 'The plan', `<p>${escapeHtml(p.planName)}</p><ul>${mains}</ul>${settings}`],
    ['notes', 'What needs a decision', notes],
    ['reaches', 'Mains, reach by reach', rowsTable(p.reachRows, p.units, 'reach-table')],
    ['laterals', 'Laterals', rowsTable(p.lateralRows, p.units, 'lateral-table')],
    ...(names.length
      ? [
          ['profiles', 'Profiles', chartFigures(names, p.captions) + NOSCRIPT_CHARTS] as [
            string,
            string,
            string,
          ],
        ]
      : []),
    ['methods', 'Methods and sources', methods],
    ['cautions', 'Cautions', cautionList(SYSTEM_CAUTIONS)],
  ];
  return buildHtmlPage({
    title: `Drain system: ${p.planName}`,
    meta: `${p.systemFile} \u00b7 ${p.generatedBy}`,
    generatedBy: p.generatedBy,
    sections,
    specs: p.specs,
    bundles: p.bundles,
  });
}
