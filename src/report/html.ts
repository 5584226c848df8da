/**
 * The HTML report: one self-contained file that opens offline. vega, vega-lite and vega-embed
 * are inlined, the chart specs travel as JSON inside the page, and a Content-Security-Policy
 * forbids every network request. Every user-supplied string is escaped, in markup and in the
 * embedded JSON alike.
 */
import { counted } from './format.js';
import { cropConditionLines, headlineLines } from './summary.js';
import type { ReportData } from './types.js';
import { displayUnits } from './units.js';
import { loadVegaBundles, type VegaBundles } from './vegaBundles.js';
import {
  escapeHtml,
  chartFigures,
  NOSCRIPT_CHARTS,
  cautionList,
  PLANNING_CAUTIONS,
  buildHtmlPage,
} from './htmlPage.js';
import { shown, comparisonTable, scenarioTable, yearlyTable, windowTable } from './runTables.js';
import {
  BALANCE_TOLERANCE,
  climateText,
  alternativesText,
  chartYearText,
  outletScheduleTable,
  glossary,
  methodsTable,
  balanceTable,
} from './runSections.js';

export { BALANCE_TOLERANCE } from './runSections.js';
export { buildHtmlPage, escapeHtml, jsonForScript } from './htmlPage.js';

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
