/**
 * The sweep's offline HTML report: the question, the inputs (climates, designs, soil
 * uncertainty, costs and their basis), the ranked frontier of each climate with its robustness
 * to the soil samples, under several climates the frontier designs ranked under each, the charts,
 * the methods and the cautions. Built on the run report's page (same look, same offline rules).
 */
import {
  LOAD_MEASURE,
  WETNESS_MEASURE,
  measureColumn,
  recommendationLines,
  type SweepResult,
} from '../scenarios/sweep.js';
import { climateSlug, frontierUnion, type ClimateStudy } from '../scenarios/sweepClimates.js';
import { VERSION } from '../version.js';
import {
  buildHtmlPage,
  cautionList,
  chartFigures,
  DESIGN_CAUTIONS,
  escapeHtml,
  NOSCRIPT_CHARTS,
} from './htmlPage.js';
import type { StudyCharts } from './sweepCharts.js';

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
function frontierTable(r: SweepResult, id: string, climate = ''): string {
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
    id,
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
    (climate ? `Under ${escapeHtml(climate)}. ` : '') +
      'Frontier designs: no other design has less nitrate-N load, fewer aeration-stress days and a lower annual ' +
      'cost at once (at the medians across the soil samples). The share of soil samples in which a ' +
      'design stays on the frontier tells how robust its place is to the soil uncertainty.',
  );
}

/** The climates: how each weather was read or made, its period, precipitation and reference ET. */
function climateTable(study: ClimateStudy): string {
  return table(
    'climate-table',
    [
      'Climate',
      'Weather',
      'Period',
      'Precipitation <span class="unit">(mm/yr, mean)</span>',
      'Reference ET <span class="unit">(mm/yr, mean)</span>',
    ],
    study.climates.map(({ name, source, figures: f, result: r }) => [
      escapeHtml(name),
      `<span class="text">${escapeHtml(source)}</span>`,
      `<span class="text">${escapeHtml(r.from)} to ${escapeHtml(r.to)} (${r.years} years)</span>`,
      num(f.precipMmYr, 0),
      `${num(f.refEtMmYr, 0)} <span class="chg">${escapeHtml(f.refEtMethod)}</span>`,
    ]),
    'Climates: every design and soil sample runs under each. Means over the reported period, ' +
      'per year of 365.25 days; reference ET at the field’s latitude, as the runs use it.',
  );
}

/** Every design on any climate's frontier, with its rank under each and the robust marker. */
function robustnessTable(study: ClimateStudy): string {
  const designs = study.climates[0].result.designs;
  const rows = frontierUnion(study).map((d) => [
    escapeHtml(String(designs[d].design)),
    ...study.ranks.map((r) => (r[d] ? String(r[d]) : '–')),
    study.robust[d] ? '<strong>robust across climates</strong>' : '',
  ]);
  return table(
    'climate-frontier-table',
    ['Design', ...study.climates.map((c) => `Rank under ${escapeHtml(c.name)}`), 'Holds'],
    rows,
    'Designs on the frontier under any climate, with their rank on each climate’s frontier ' +
      '(lowest median nitrate-N load first; – = dominated under that climate). Robust across ' +
      'climates: on the frontier under every climate.',
  );
}

/**
 * The sweep report of a study as one self-contained HTML page.
 *
 * @example
 * const charts = buildStudyChartSpecs(study);
 * writeFileSync('report.html', buildSweepReportHtml(study, charts));
 */
export function buildSweepReportHtml(study: ClimateStudy, charts: StudyCharts): string {
  const several = study.climates.length > 1;
  const r = study.climates[0].result;
  const { specs } = charts;
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
      [
        several ? 'Climates' : 'Climate',
        escapeHtml(study.climates.map((x) => x.name).join(', ')) + ' (table below)',
      ],
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
        (several
          ? `<p>And does it hold under each of the ${study.climates.length} climates ` +
            `(${escapeHtml(study.climates.map((x) => x.name).join(', '))})? ` +
            `${study.robust.filter(Boolean).length} design(s) stay on the frontier under every ` +
            `climate (section “Under each climate”).</p>`
          : '') +
        study.climates
          .map(
            (x) =>
              `<p>Recommended candidates${several ? ` under ${escapeHtml(x.name)}` : ''} ` +
              `(frontier designs, lowest load first):</p><ul>` +
              recommendationLines(x.result)
                .map((l) => `<li>${escapeHtml(l)}</li>`)
                .join('') +
              '</ul>',
          )
          .join(''),
    ],
    ['inputs', 'Inputs', inputs + climateTable(study) + uncertain + costs],
    [
      'frontier',
      'Ranked frontier',
      several
        ? study.climates
            .map((x) => frontierTable(x.result, `frontier-table-${climateSlug(x.name)}`, x.name))
            .join('\n')
        : frontierTable(r, 'frontier-table'),
    ],
    ...(several
      ? [['climates', 'Under each climate', robustnessTable(study)] as [string, string, string]]
      : []),
    ['charts', 'Charts', chartFigures(Object.keys(specs), charts.captions) + NOSCRIPT_CHARTS],
    [
      'methods',
      'Methods and assumptions',
      `<ul><li>Every design runs the daily water-balance engine and the nitrate model of a ` +
        `tileflux run over the same weather; the figures are mean annual values over the period, ` +
        `the concentration flow-weighted over the whole period.</li>` +
        (several
          ? `<li>Climates: the same designs and soil samples run under each climate's weather; ` +
            `each climate has its own baseline (the field as given under that weather), changes ` +
            `and frontier. A design is robust across climates when it is on the frontier under ` +
            `every one.</li>`
          : '') +
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
          (several
            ? '(crops, nitrate parameters) is held fixed, and the weather is one of the climates given.'
            : '(weather, crops, nitrate parameters) is held fixed.'),
        'A generated or changed climate (tileflux weather make --like, --precip-change or --temp-change) is ' +
          'a scenario chosen by the user with the statistics of a record, not a forecast or a ' +
          'projection for any place.',
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
