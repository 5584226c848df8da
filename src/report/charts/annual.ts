/** Year-by-year drain flow and nitrate-N load bars. Pure. */
import type { TopLevelSpec } from 'vega-lite';
import type { ReportData } from '../types.js';
import { displayUnits } from '../units.js';
import { VEGA_LITE_SCHEMA, CONFIG, roundTo } from '../chartTheme.js';
import { scenarioNames, groupedBars } from '../chartSeries.js';

/**
 * Annual drain flow and nitrate-N load by scenario: grouped bars, one group per calendar year.
 *
 * @example annualChart(data).vconcat.length // 2
 */
export function annualChart(data: ReportData): TopLevelSpec {
  const du = displayUnits(data.units);
  const names = scenarioNames(data);
  const rows = data.annual
    .filter((r) => names.includes(r.scenario))
    .sort((a, b) => names.indexOf(a.scenario) - names.indexOf(b.scenario) || a.year - b.year);
  const values = rows.map((r) => ({
    year: r.year,
    scenario: r.scenario,
    flow: roundTo(r.drainflow_mm * du.water.factor, 2),
    load: roundTo(r.no3n_load_kg_ha * du.load.factor, 3),
  }));
  const years = [...new Set(rows.map((r) => r.year))].sort((a, b) => a - b);
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: {
      text: 'Annual drain flow and nitrate-N load',
      subtitle: `${data.fieldName}, ${years[0]} to ${years[years.length - 1]}`,
    },
    config: CONFIG,
    data: { values },
    vconcat: groupedBars(
      names,
      'year',
      'Year',
      // Years are numbers: ascending order needs no list (Vega-Lite turns a list into one
      // nested condition per value, which overflows the expression parser on long records).
      'ascending',
      [
        ['flow', `Drain flow (${du.water.label}/yr)`],
        ['load', `Nitrate-N load (${du.load.label}/yr)`],
      ],
      years.length > 12 ? -90 : 0,
    ),
    spacing: 16,
  };
}
