/**
 * The sweep's offline HTML report: the question, the inputs (designs, soil uncertainty, costs and
 * their basis), the ranked frontier with its robustness to the soil samples, the charts, the
 * methods and the cautions. Built on the run report's page (same look, same offline rules).
 */
import type { TopLevelSpec } from 'vega-lite';
import {
  LOAD_MEASURE,
  WETNESS_MEASURE,
  measureColumn,
  recommendationLines,
  type SweepResult,
} from '../scenarios/sweep.js';
import { VERSION } from '../version.js';
import {
  buildHtmlPage,
  cautionList,
  chartFigures,
  DESIGN_CAUTIONS,
  escapeHtml,
  NOSCRIPT_CHARTS,
} from './htmlPage.js';
import { SWEEP_CHART_CAPTIONS } from './sweepCharts.js';

function num(x: unknown, d: number): string {
  const v = Number(x);
  return Number.isFinite(v) ? v.toFixed(d) : 'n/a';
}

function table(id: string, head: string[], rows: string[][], caption = ''): string {
  const th = head.map((h, i) => `<th scope="col"${i ? '' : ' class="text"'}>${h}</th>`).join('');
  const body = rows
    .map(
      (r) =>
        `<tr>${r.map((c, i) => (i ? `<td>${c}</td>` : `<th scope="row">${c}</th>`)).join('')}</tr>`,
    )
    .join('\n');
  return (
    `<table id="${id}">${caption ? `<caption>${caption}</caption>` : ''}` +
    `<thead><tr>${th}</tr></thead>\n<tbody>\n${body}\n</tbody></table>`
  );
}

/** The ranked frontier: lowest median load first, with the spread across soil samples. */
function frontierTable(r: SweepResult): string {
  const cur = escapeHtml(r.plan.costs.currency);
  const rows = r.frontier.map((i, k) => {
    const d = r.designs[i];
    return [
      `${k + 1}. ${escapeHtml(String(d.design))}`,
      `${num(d[LOAD_MEASURE], 1)} <span class="chg">${num(d[measureColumn(LOAD_MEASURE, 'p10')], 1)} to ${num(d[measureColumn(LOAD_MEASURE, 'p90')], 1)}</span>`,
      `${num(d[WETNESS_MEASURE], 1)} <span class="chg">${num(d[measureColumn(WETNESS_MEASURE, 'p10')], 1)} to ${num(d[measureColumn(WETNESS_MEASURE, 'p90')], 1)}</span>`,
      num(d.drainflow_mm, 0),
      num(d[r.costColumns.annual], 0),
      num(d[r.costColumns.perKg], 2),
      `${Math.round(100 * Number(d.frontier_share))} %`,
    ];
  });
  return table(
    'frontier-table',
    [
      'Design',
      'Nitrate-N load <span class="unit">(kg/ha/yr; median, 10th to 90th percentile)</span>',
      'Aeration-stress days <span class="unit">(days/yr; median, 10th to 90th percentile)</span>',
      'Drain flow <span class="unit">(mm/yr, median)</span>',
      `Annual cost <span class="unit">(${cur}/ha/yr)</span>`,
      `Cost per kg N avoided <span class="unit">(${cur}/kg)</span>`,
      'On the frontier in <span class="unit">(share of soil samples)</span>',
    ],
    rows,
    'Frontier designs: no other design has less nitrate-N load, fewer aeration-stress days and a lower annual ' +
      'cost at once (at the medians across the soil samples). The share of soil samples in which a ' +
      'design stays on the frontier tells how robust its place is to the soil uncertainty.',
  );
}

/**
 * The sweep report as one self-contained HTML page.
 *
 * @example writeFileSync('report.html', buildSweepReportHtml(result, buildSweepChartSpecs(result), 'weather.csv'))
 */
export function buildSweepReportHtml(
  r: SweepResult,
  specs: Record<string, TopLevelSpec>,
  weatherFile: string,
): string {
  const { plan } = r;
  const c = plan.costs;
  const cur = escapeHtml(c.currency);
  const base = r.designs[plan.baselineIndex];
  const managements = [...new Set(plan.designs.map((d) => d.management))];
  const depths = [...new Set(plan.designs.filter((d) => d.inGrid).map((d) => d.depthM))];
  const spacings = [...new Set(plan.designs.filter((d) => d.inGrid).map((d) => d.spacingM))];
  const generatedBy = `tileflux ${VERSION}`;
  const inputs = table(
    'input-table',
    ['Input', 'Value'],
    [
      ['Field', escapeHtml(plan.field.name)],
      ['Weather file', escapeHtml(weatherFile)],
      ['Period', `${escapeHtml(r.from)} to ${escapeHtml(r.to)} (${r.years} years)`],
      ['Drain depths', `${depths.join(', ')} m`],
      ['Lateral spacings', `${spacings.join(', ')} m`],
      ['Outlet managements', escapeHtml(managements.join(', '))],
      [
        'Designs',
        `${plan.designs.length} (the field as given: ${escapeHtml(String(base.design))})`,
      ],
      ['Soil samples', `${plan.samples.length} (Latin hypercube, seed ${plan.seed})`],
    ].map(([a, b]) => [a, `<span class="text">${b}</span>`]),
  );
  const uncertain = plan.params.length
    ? table(
        'uncertain-table',
        ['Soil value', 'Low', 'High', 'Sampled'],
        plan.params.map((p) => [
          escapeHtml(p.key),
          String(p.low),
          String(p.high),
          p.scale === 'log' ? 'evenly in the logarithm' : 'evenly',
        ]),
        'Uncertain soil values (in the unit of each key, see tileflux init).',
      )
    : '<p>No soil value is uncertain: one sample per design.</p>';
  const main =
    c.main.perHa !== undefined
      ? `${num(c.main.perHa, 0)} ${cur}/ha`
      : `${num((c.main.ofLateral ?? 0) * 100, 0)} % of the lateral cost`;
  const costs = table(
    'cost-table',
    ['Cost item', 'Value'],
    [
      ['Lateral, installed', `${num(c.lateral, 2)} ${cur}/m`],
      ['Mains and submains', main],
      [
        'Control structure (managed outlets)',
        `${num(c.controlStructure.each, 0)} ${cur} per ${num(c.controlStructure.drainsArea, 1)} ha`,
      ],
      ['Economic life', `${c.lifeYears} years`],
      ['Discount rate', `${num(c.discountRate * 100, 1)} % per year`],
    ],
    plan.costsGiven
      ? 'Costs from the field file.'
      : 'Illustrative default costs, not local prices: about US$3 per metre of installed lateral ' +
          '(US Midwest pattern drainage, common practice, from memory), mains 15 % of the laterals, ' +
          'a control structure of 2,000 per 8 ha, 25 years at 4 %. Put local prices in costs:.',
  );
  const sections: Array<[string, string, string]> = [
    [
      'question',
      'The question',
      `<p>Which drain depth, lateral spacing and outlet management cut the nitrate-N that leaves ` +
        `${escapeHtml(plan.field.name)} through its drains the most, for the least wetness and money, ` +
        `and does that answer hold when the soil values are uncertain?</p>` +
        `<p>Recommended candidates (frontier designs, lowest load first):</p><ul>` +
        recommendationLines(r)
          .map((l) => `<li>${escapeHtml(l)}</li>`)
          .join('') +
        '</ul>',
    ],
    ['inputs', 'Inputs', inputs + uncertain + costs],
    ['frontier', 'Ranked frontier', frontierTable(r)],
    ['charts', 'Charts', chartFigures(Object.keys(specs), SWEEP_CHART_CAPTIONS) + NOSCRIPT_CHARTS],
    [
      'methods',
      'Methods and assumptions',
      `<ul><li>Every design runs the daily water-balance engine and the nitrate model of a ` +
        `tileflux run over the same weather; the figures are mean annual values over the period, ` +
        `the concentration flow-weighted over the whole period.</li>` +
        `<li>Soil samples: Latin hypercube (McKay, Beckman &amp; Conover 1979): each sampled ` +
        `value's range is cut into as many equally likely strata as there are samples and each ` +
        `stratum is used once; every design meets the same samples, and changes against the field ` +
        `as given are taken sample by sample.</li>` +
        `<li>Costs: installed cost per hectare (laterals at 10 000 / spacing m/ha, mains, a ` +
        `control structure for managed outlets), annualised by the capital recovery factor ` +
        `i(1+i)^n / ((1+i)^n - 1).</li>` +
        `<li>Frontier: a design is dominated when another has no more load, no more aeration-stress days and ` +
        `no more annual cost, and less of one; aeration-stress days count growing-season days with ` +
        `too little air in the upper root zone (README "Measures").</li></ul>`,
    ],
    [
      'cautions',
      'Cautions',
      cautionList([
        'The figures are planning estimates from simplified physics: a daily water balance with ' +
          'a single water table midway between the drains, quasi-steady drain equations and ' +
          'simple nitrate models. They rank designs under the same assumptions and weather; they ' +
          'do not predict what the field will do in a particular year, nor certify a design.',
        ...DESIGN_CAUTIONS,
        plan.costsGiven
          ? 'Costs are the ones in the field file; prices, layouts and cost shares vary widely.'
          : 'The costs are illustrative defaults, not prices: replace them with local quotes before ranking designs by cost.',
        'The soil uncertainty covers only the sampled values and their ranges; everything else ' +
          '(weather, crops, nitrate parameters) is held fixed.',
      ]),
    ],
  ];
  return buildHtmlPage({
    title: `Drainage design study: ${plan.field.name}`,
    meta: `${plan.field.name} · ${r.from} to ${r.to} · ${generatedBy}`,
    generatedBy,
    sections,
    specs,
  });
}
