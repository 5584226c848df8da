/**
 * Vega-Lite chart specs of a sweep (pure, data inlined): the trade-off frontier of nitrate-N
 * load against wetness with cost as colour, heat maps of load and wetness over depth x spacing
 * for each outlet management, and the cost per kg of nitrate-N avoided of the frontier designs;
 * under several climates these four for each climate and one chart setting the climates side by
 * side. Same look as the run charts.
 */
import type { TopLevelSpec } from 'vega-lite';
import { LOAD_MEASURE, WETNESS_MEASURE, type SweepResult } from '../scenarios/sweep.js';
import { climateSlug, frontierUnion, type ClimateStudy } from '../scenarios/sweepClimates.js';
import { CONFIG, PALETTE, VEGA_LITE_SCHEMA } from './chartTheme.js';
import { roundTo } from '../units/decimal.js';

/** Names of the sweep charts (file stems in `charts/`), in report order. */
export const SWEEP_CHART_NAMES = ['frontier', 'load-map', 'wetness-map', 'cost-per-kg'] as const;
export type SweepChartName = (typeof SWEEP_CHART_NAMES)[number];

export const SWEEP_CHART_CAPTIONS: Readonly<Record<SweepChartName, string>> = {
  frontier:
    'Median nitrate-N load against median growing-season aeration-stress days of every design, coloured by ' +
    'annualised cost; filled marks and the line: the trade-off frontier (no other design has ' +
    'less load, fewer aeration-stress days and less cost at once). Lower left is better.',
  'load-map':
    'Median nitrate-N load over drain depth and lateral spacing, one panel per outlet management.',
  'wetness-map':
    'Median growing-season aeration-stress days (too little air in the upper root zone) over drain depth and lateral spacing, one panel per outlet ' +
    'management.',
  'cost-per-kg':
    'Extra annualised cost per kg of nitrate-N kept out of the drains, against the field as ' +
    'given, for the frontier designs that cut the load (negative: the design also costs less).',
};

const COST_RANGE = ['#f3e3b5', '#d1603d', '#5a1f2b'];

/** Rounded for the inlined chart data; null (Vega-Lite's missing value) when not finite. */
function round(x: number, decimals: number): number | null {
  return Number.isFinite(x) ? roundTo(x, decimals) : null;
}

function managements(r: SweepResult): string[] {
  return [...new Set(r.plan.designs.map((d) => d.management))];
}

function managementColour(r: SweepResult) {
  const names = managements(r);
  return {
    field: 'management',
    type: 'nominal' as const,
    title: 'Outlet management',
    scale: { domain: names, range: names.map((_, i) => PALETTE[i % PALETTE.length]) },
  };
}

function points(r: SweepResult) {
  const cost = r.costColumns.annual;
  return r.designs.map((d, i) => ({
    design: String(d.design),
    management: String(d.management),
    depth: Number(d.depth_m),
    spacing: Number(d.spacing_m),
    load: round(Number(d[LOAD_MEASURE]), 3),
    wet: round(Number(d[WETNESS_MEASURE]), 2),
    cost: round(Number(d[cost]), 2),
    frontier: d.on_frontier ? 'frontier' : 'dominated',
    share: round(Number(d.frontier_share), 3),
    inGrid: r.plan.designs[i].inGrid,
  }));
}

/** Load against wetness, cost as colour, the frontier joined. */
export function frontierChart(r: SweepResult): TopLevelSpec {
  const values = points(r);
  const currency = r.plan.costs.currency;
  const x = {
    field: 'wet',
    type: 'quantitative' as const,
    title: 'Aeration-stress days in the growing season (median, days per year)',
  };
  const y = {
    field: 'load',
    type: 'quantitative' as const,
    title: 'Nitrate-N load (median, kg/ha per year)',
    scale: { zero: false },
  };
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Trade-off frontier: nitrate-N load, wetness and cost',
      subtitle: `${r.plan.field.name}: ${r.designs.length} designs x ${r.plan.samples.length} soil samples, ${r.years} years`,
    },
    width: 560,
    height: 360,
    config: CONFIG,
    data: { values },
    layer: [
      {
        transform: [
          { filter: "datum.frontier === 'frontier'" },
          { calculate: 'datum.wet', as: 'x' },
        ],
        mark: { type: 'line', color: '#2e2e2e', strokeWidth: 1.2, interpolate: 'step-after' },
        encoding: { x, y, order: { field: 'wet', type: 'quantitative' } },
      },
      {
        mark: { type: 'point', size: 70, filled: true },
        encoding: {
          x,
          y,
          color: {
            field: 'cost',
            type: 'quantitative',
            title: `${currency}/ha per year`,
            scale: { range: COST_RANGE },
          },
          opacity: {
            condition: { test: "datum.frontier === 'frontier'", value: 1 },
            value: 0.3,
          },
          shape: { field: 'management', type: 'nominal', title: 'Outlet management' },
          tooltip: [
            { field: 'design' },
            { field: 'load', title: 'nitrate-N, kg/ha/yr' },
            { field: 'wet', title: 'aeration-stress days/yr' },
            { field: 'cost', title: `${currency}/ha/yr` },
            { field: 'share', title: 'frontier share' },
          ],
        },
      },
    ],
  } as TopLevelSpec;
}

/** A heat map of a design measure over depth x spacing, one panel per management. */
function heatMap(r: SweepResult, field: 'load' | 'wet', title: string, unit: string): TopLevelSpec {
  const values = points(r).filter((p) => p.inGrid);
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: title,
      subtitle: `${r.plan.field.name}: median over ${r.plan.samples.length} soil samples, ${r.years} years`,
    },
    config: CONFIG,
    data: { values },
    facet: {
      column: {
        field: 'management',
        type: 'nominal',
        title: 'Outlet management',
        sort: managements(r),
      },
    },
    spec: {
      width: { step: 34 },
      height: { step: 30 },
      layer: [
        {
          mark: { type: 'rect' },
          encoding: {
            x: { field: 'spacing', type: 'ordinal', title: 'Lateral spacing (m)' },
            y: { field: 'depth', type: 'ordinal', title: 'Drain depth (m)' },
            color: {
              field,
              type: 'quantitative',
              title: unit,
              scale: { range: ['#eef3f6', '#1f5f8b'] },
            },
            tooltip: [{ field: 'design' }, { field, title: unit }],
          },
        },
        {
          mark: { type: 'text', fontSize: 9 },
          encoding: {
            x: { field: 'spacing', type: 'ordinal' },
            y: { field: 'depth', type: 'ordinal' },
            text: { field, type: 'quantitative', format: '.1f' },
          },
        },
      ],
    },
  } as TopLevelSpec;
}

/** Cost per kg of nitrate-N avoided, frontier designs that cut the load. */
export function costPerKgChart(r: SweepResult): TopLevelSpec {
  const currency = r.plan.costs.currency;
  const values = r.frontier
    .map((i) => r.designs[i])
    .filter((d) => Number.isFinite(Number(d[r.costColumns.perKg])))
    .map((d) => ({
      design: String(d.design),
      management: String(d.management),
      perKg: round(Number(d[r.costColumns.perKg]), 2),
      avoided: round(Number(d.no3n_load_avoided_kg_ha), 2),
    }));
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Cost per kg of nitrate-N avoided',
      subtitle: `${r.plan.field.name}: frontier designs against the field as given (median load cut)`,
    },
    width: 480,
    height: { step: 16 },
    config: CONFIG,
    data: { values },
    mark: { type: 'bar' },
    encoding: {
      y: {
        field: 'design',
        type: 'nominal',
        title: null,
        sort: { field: 'perKg', order: 'ascending' },
        axis: { labelLimit: 260 },
      },
      x: {
        field: 'perKg',
        type: 'quantitative',
        title: `Extra annual cost per kg N avoided (${currency}/kg)`,
      },
      color: managementColour(r),
      tooltip: [
        { field: 'design' },
        { field: 'perKg', title: `${currency}/kg N` },
        { field: 'avoided', title: 'kg N/ha/yr avoided' },
      ],
    },
  } as TopLevelSpec;
}

/**
 * Every sweep chart, keyed by name in SWEEP_CHART_NAMES order.
 *
 * @example Object.keys(buildSweepChartSpecs(result)) // ['frontier', 'load-map', ...]
 */
export function buildSweepChartSpecs(r: SweepResult): Record<SweepChartName, TopLevelSpec> {
  return {
    frontier: frontierChart(r),
    'load-map': heatMap(r, 'load', 'Nitrate-N load over depth and spacing', 'kg N/ha per year'),
    'wetness-map': heatMap(
      r,
      'wet',
      'Aeration-stress days over depth and spacing',
      'days per year',
    ),
    'cost-per-kg': costPerKgChart(r),
  };
}

/** Caption of the chart that sets the climates side by side. */
export const CLIMATES_CAPTION =
  'Median nitrate-N load and aeration-stress days of every design on any climate’s frontier, ' +
  'under each climate; filled marks: on that climate’s frontier, open: dominated there. ' +
  'Designs are listed in the order of the first climate’s frontier.';

/** The designs on any frontier under each climate, load and wetness side by side. */
export function climatesChart(study: ClimateStudy): TopLevelSpec {
  const union = frontierUnion(study);
  const names = study.climates.map((c) => c.name);
  const first = study.climates[0].result;
  const order = union.map((d) => String(first.designs[d].design));
  const values = study.climates.flatMap((c, k) =>
    union.map((d) => {
      const row = c.result.designs[d];
      return {
        design: String(row.design),
        climate: c.name,
        load: round(Number(row[LOAD_MEASURE]), 3),
        wet: round(Number(row[WETNESS_MEASURE]), 2),
        frontier: study.ranks[k][d] > 0 ? 'on the frontier' : 'dominated',
        rank: study.ranks[k][d] || null,
      };
    }),
  );
  const panel = (field: 'load' | 'wet', title: string) => ({
    width: 280,
    height: { step: 18 },
    mark: { type: 'point', size: 70, strokeWidth: 1.6 },
    encoding: {
      y: { field: 'design', type: 'nominal', title: null, sort: order, axis: { labelLimit: 260 } },
      x: { field, type: 'quantitative', title, scale: { zero: false } },
      color: {
        field: 'climate',
        type: 'nominal',
        title: 'Climate',
        scale: { domain: names, range: names.map((_, i) => PALETTE[i % PALETTE.length]) },
      },
      fill: {
        condition: { test: "datum.frontier === 'on the frontier'", field: 'climate' },
        value: 'white',
      },
      tooltip: [
        { field: 'design' },
        { field: 'climate' },
        { field: 'load', title: 'nitrate-N, kg/ha/yr' },
        { field: 'wet', title: 'aeration-stress days/yr' },
        { field: 'rank', title: 'rank on the frontier' },
      ],
    },
  });
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Frontier designs under each climate',
      subtitle: `${first.plan.field.name}: medians over ${first.plan.samples.length} soil samples; climates ${names.join(', ')}`,
    },
    config: CONFIG,
    data: { values },
    hconcat: [
      panel('load', 'Nitrate-N load (median, kg/ha per year)'),
      panel('wet', 'Aeration-stress days (median, per year)'),
    ],
  } as TopLevelSpec;
}

/** The charts of a study with their captions, in report order. */
export interface StudyCharts {
  specs: Record<string, TopLevelSpec>;
  captions: Record<string, string>;
}

/**
 * Every chart of a study. Under one climate: the sweep charts as `buildSweepChartSpecs` gives
 * them. Under several: each sweep chart per climate (file stem `<chart>-<climate>`, the climate
 * in the subtitle and caption), then `climates`.
 *
 * @example Object.keys(buildStudyChartSpecs(study).specs) // ['frontier-today', ..., 'climates']
 */
export function buildStudyChartSpecs(study: ClimateStudy): StudyCharts {
  if (study.climates.length === 1) {
    return {
      specs: buildSweepChartSpecs(study.climates[0].result),
      captions: { ...SWEEP_CHART_CAPTIONS },
    };
  }
  const specs: Record<string, TopLevelSpec> = {};
  const captions: Record<string, string> = {};
  for (const c of study.climates) {
    for (const [name, spec] of Object.entries(buildSweepChartSpecs(c.result))) {
      const key = `${name}-${climateSlug(c.name)}`;
      const title = spec.title as { text: string; subtitle: string };
      specs[key] = {
        ...spec,
        title: { ...title, subtitle: `${title.subtitle}; climate ${c.name}` },
      };
      captions[key] = `${SWEEP_CHART_CAPTIONS[name as SweepChartName]} Climate: ${c.name}.`;
    }
  }
  specs.climates = climatesChart(study);
  captions.climates = CLIMATES_CAPTION;
  return { specs, captions };
}
