/**
 * The fit's offline report (report.html): the question, the fitted parameters with their
 * behavioural ranges, the statistics of calibration and validation with the performance
 * ratings of daily field-scale drain flow, the charts, the methods and the cautions. Built on the
 * same page, escaping and security policy as the run report.
 */
import type { FitDocument } from './fitSummary.js';
import { FIT_CHART_CAPTIONS } from './fitCharts.js';
import { fixed } from './format.js';
import {
  DESIGN_CAUTIONS,
  NOSCRIPT_CHARTS,
  buildHtmlPage,
  cautionList,
  chartFigures,
  escapeHtml,
} from './htmlPage.js';
import type { VegaBundles } from './vegaBundles.js';

/** Cautions that belong to a calibration, after the general ones. */
export const FIT_CAUTIONS = [
  'The figures are planning estimates from simplified physics: a daily water balance with a ' +
    'single water table midway between the drains and quasi-steady drain equations.',
  'Fitted parameters are effective values of a simplified model at this site and over these ' +
    'years; they are not measured soil properties and need not transfer to another field, other ' +
    'weather or other management.',
  'A fit is judged on its validation period, not its calibration period. Without a validation ' +
    'period (tileflux fit --validate) the statistics show only how closely the model can be made to follow ' +
    'the calibration data.',
  'The behavioural range is the spread of the evaluated parameter sets within the stated ' +
    'tolerance of the best loss; it is not a confidence interval.',
  'The rating bands were recalled from the cited paper without the document at hand; check them ' +
    'there before quoting a rating.',
];

const STAT_ROWS: Array<[key: string, label: string, unit: string, decimals: number]> = [
  ['n_days', 'Days compared', 'days', 0],
  ['nse', 'Nash-Sutcliffe efficiency (NSE)', '-', 3],
  ['kge', 'Kling-Gupta efficiency (KGE)', '-', 3],
  ['kge_r', 'KGE correlation r', '-', 3],
  ['kge_alpha', 'KGE variability ratio alpha', '-', 3],
  ['kge_beta', 'KGE bias ratio beta', '-', 3],
  ['log_nse', 'NSE of log flows (log-NSE)', '-', 3],
  ['pbias_percent', 'Percent bias (PBIAS; + = model low)', '%', 1],
  ['rmse_mm', 'Root-mean-square error', 'mm/d', 3],
  ['rmse_m', 'Root-mean-square error', 'm', 3],
  ['r2', 'Coefficient of determination R^2', '-', 3],
  ['mean_observed_mm', 'Mean observed', 'mm/d', 3],
  ['mean_simulated_mm', 'Mean simulated', 'mm/d', 3],
  ['mean_observed_m', 'Mean observed depth', 'm', 3],
  ['mean_simulated_m', 'Mean simulated depth', 'm', 3],
  ['peak_error_percent', 'Peak-flow error', '%', 1],
  ['volume_error_mm', 'Volume error', 'mm', 1],
  ['volume_error_percent', 'Volume error', '%', 1],
];

const RATED: Record<string, string> = {
  nse: 'nse',
  r2: 'r2',
  pbias_percent: 'pbias_percent',
  kge: 'kge',
};

type Period = NonNullable<FitDocument['validation']>;

function statsTable(
  doc: FitDocument,
  what: 'drainflow' | 'water_table',
  id: string,
  caption: string,
): string {
  const periods: Array<[string, Period]> = [['Calibration', doc.calibration]];
  if (doc.validation) periods.push(['Validation', doc.validation]);
  const rated = what === 'drainflow';
  const head = periods
    .map(
      ([name, p]) =>
        `<th scope="col">${name}<span class="chg">${escapeHtml(`${p.from ?? '?'} to ${p.to ?? '?'}`)}</span></th>` +
        (rated ? `<th scope="col" class="text">Rating</th>` : ''),
    )
    .join('');
  const rows = STAT_ROWS.filter(([key]) => periods.some(([, p]) => p[what] && key in p[what]!))
    .map(([key, label, unit, decimals]) => {
      const cells = periods
        .map(([, p]) => {
          const v = p[what]?.[key] ?? null;
          const rating = rated && RATED[key] ? (p.drainflow_ratings?.[RATED[key]] ?? 'n/a') : '';
          return (
            `<td>${fixed(v, decimals)}</td>` +
            (rated ? `<td class="text">${escapeHtml(rating)}</td>` : '')
          );
        })
        .join('');
      return `<tr><th scope="row">${label} <span class="unit">(${escapeHtml(unit)})</span></th>${cells}</tr>`;
    })
    .join('\n');
  return (
    `<table class="keep" id="${id}"><caption>${escapeHtml(caption)}</caption>` +
    `<thead><tr><th scope="col">Statistic</th>${head}</tr></thead>\n<tbody>\n${rows}\n</tbody></table>`
  );
}

function parameterTable(doc: FitDocument): string {
  const g = (x: number | null) => (x === null ? 'unlimited' : Number(x.toPrecision(4)).toString());
  const rows = doc.parameters
    .map(
      (p) =>
        `<tr><th scope="row"><code>${escapeHtml(p.path)}</code> <span class="unit">(${escapeHtml(p.unit)})</span></th>` +
        `<td>${g(p.lower)} to ${g(p.upper)}</td><td>${g(p.start)}</td><td><strong>${g(p.best)}</strong></td>` +
        `<td>${g(p.behavioural_min)} to ${g(p.behavioural_max)}</td></tr>`,
    )
    .join('\n');
  return (
    `<table class="keep" id="parameter-table"><caption>Start: the field file's value. Behavioural ` +
    `range: ${doc.behavioural.sets} evaluated sets within ${doc.behavioural.tolerance} of the best ` +
    `loss.</caption><thead><tr><th scope="col">Parameter</th><th scope="col">Search bounds</th>` +
    `<th scope="col">Start</th><th scope="col">Fitted</th><th scope="col">Behavioural range</th></tr></thead>\n` +
    `<tbody>\n${rows}\n</tbody></table>`
  );
}

/**
 * The self-contained HTML report of a fit.
 * @example writeFileSync('report.html', buildFitReportHtml(doc, specs))
 */
export function buildFitReportHtml(
  doc: FitDocument,
  specs: Record<string, object>,
  bundles?: VegaBundles,
): string {
  const flow = doc.calibration.drainflow !== null;
  const wt = doc.calibration.water_table !== null;
  const observed = [flow ? 'daily drain flow' : '', wt ? 'water-table depth' : '']
    .filter(Boolean)
    .join(' and ');
  const list = (items: string[], cls = '') =>
    `<ul${cls ? ` class="${cls}"` : ''}>${items.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul>`;
  const sections: Array<[string, string, string]> = [
    [
      'question',
      'The question',
      `<p>Does the model represent <strong>${escapeHtml(doc.field_name)}</strong> well enough to ` +
        `trust its comparisons? The ${escapeHtml(observed)} observed in ` +
        `<code>${escapeHtml(doc.observations_file)}</code> were compared with the simulation on ` +
        `<code>${escapeHtml(doc.weather_file)}</code>, and ${doc.parameters.length} parameters were ` +
        `adjusted to minimise ${escapeHtml(doc.objective_loss)} over the calibration period ` +
        `(${escapeHtml(doc.calibration.from ?? '?')} to ${escapeHtml(doc.calibration.to ?? '?')}).` +
        (doc.validation
          ? ` The validation period (${escapeHtml(doc.validation.from ?? '?')} to ` +
            `${escapeHtml(doc.validation.to ?? '?')}) was not used for fitting.`
          : ' No validation period was given.') +
        `</p><p>${doc.model_runs} model runs, seed ${doc.seed}; the loss fell from ` +
        `${fixed(doc.start_loss, 4)} at the field file's values to ${fixed(doc.best_loss, 4)}.</p>`,
    ],
    ['parameters', 'Fitted parameters', parameterTable(doc)],
    [
      'statistics',
      'How well it fits',
      (flow
        ? statsTable(
            doc,
            'drainflow',
            'flow-statistics',
            'Daily drain flow. Ratings for daily field-scale flow: ' + doc.rating_source + '.',
          ) +
          `<p class="meta">Bands: ${doc.rating_bands.map((b) => escapeHtml(`${b.statistic}: ${b.bands}`)).join('; ')}. ` +
          'KGE is compared with the mean-flow benchmark (KGE = 1 - sqrt 2, about -0.41).</p>'
        : '') +
        (wt
          ? statsTable(
              doc,
              'water_table',
              'water-table-statistics',
              'Water-table depth midway between drains (no published rating bands).',
            )
          : ''),
    ],
    ['charts', 'Charts', chartFigures(Object.keys(specs), FIT_CHART_CAPTIONS) + NOSCRIPT_CHARTS],
    [
      'methods',
      'Methods',
      list([
        'Statistics: NSE (Nash and Sutcliffe 1970); KGE with its correlation, variability and bias ' +
          'components (Gupta et al. 2009); log-NSE on ln(Q + mean observed Q / 100); PBIAS = 100 ' +
          'sum(O - S) / sum O (Moriasi et al. 2007); RMSE; R^2 as the squared Pearson correlation; ' +
          'peak-flow error of the largest daily flow; volume error of the summed flows. Days ' +
          'without an observation are left out.',
        'Search: Latin hypercube sample (McKay et al. 1979) of the bounded parameter space, then ' +
          'bounded Nelder-Mead simplex searches (Nelder and Mead 1965) from the field file\u2019s ' +
          'values and from the best sample points; seeded, so the same inputs give the same fit.',
        'Each candidate reruns the daily engine with the forcing, crop calendar and outlet ' +
          'schedule prepared once; the first ' +
          `${doc.warmup_years} year(s) of weather are a warm-up and are not compared.`,
        'Simulated water-table depth is the midpoint depth between drains; wells should stand ' +
          'midway between laterals.',
      ]),
    ],
    ['cautions', 'Cautions', cautionList([...FIT_CAUTIONS, ...DESIGN_CAUTIONS])],
  ];
  return buildHtmlPage({
    title: `Fit of ${doc.field_name} to observations`,
    meta: `${doc.field_name} \u00b7 ${doc.observations_file} \u00b7 ${doc.generated_by}`,
    generatedBy: doc.generated_by,
    sections,
    specs,
    bundles,
  });
}
