/**
 * From a run to what the report and the charts need: the comparison table, the daily series of
 * each scenario, balance closure, the climate of the period, and the methods with their sources.
 */
import { ET_METHOD_SOURCE, HARGREAVES_BIAS } from '../climate/referenceEt.js';
import type { EngineForcing } from '../engine/types.js';
import { capacityText, rootText, seepageText } from '../scenarios/assumptions.js';
import { wetnessSchema } from '../scenarios/fieldSchema.js';
import type { ComparisonRow } from '../scenarios/compare.js';
import type { EngineResult } from '../engine/types.js';
import type { NitrateResult } from '../nitrate/types.js';
import type { WetnessSettings } from '../scenarios/annual.js';
import type { RunResult, ScenarioOutput, ScenarioResult } from '../scenarios/run.js';
import type { AnnualRow } from '../scenarios/types.js';
import { windowWaterTable, type WindowWaterTable } from '../scenarios/windows.js';
import { yearRange } from './chartSeries.js';
import { periodSeriesOf, seasonDays } from './periodSeries.js';
import { comparisonOf } from '../scenarios/runComparison.js';
import type { UnitSystem } from '../units/quantity.js';
import { VERSION } from '../version.js';
import type { ReportData, ScenarioDailySeries, ScenarioPeriodSeries } from './types.js';

/** The methods behind every number in a run, with their published sources. */
export function methodsOf(run: RunResult, units: UnitSystem = 'si'): ReportData['methods'] {
  const models = [...new Set(run.scenarios.map((s) => s.spec.nitrate.model))];
  const ratings = run.scenarios.filter((s) => s.spec.nitrate.model === 'rating');
  const ratingNote = ratings.map((s) => {
    const c = s.spec.nitrate as Extract<typeof s.spec.nitrate, { model: 'rating' }>;
    const [lo, hi] = c.fitFlowRangeMm;
    return (
      `${s.spec.name}: C = ${c.a.toPrecision(3)} Q^${c.b.toPrecision(3)} for flows ${lo.toPrecision(2)} to ` +
      `${hi.toPrecision(3)} mm/d; ${s.nitrate.outOfRangeDays} days with flow outside that range used the edge concentration`
    );
  });
  const rating = ratings.length
    ? [
        {
          topic: 'Nitrate rating',
          text: ratingNote.join('. ') + '.',
          source:
            'Concentration-discharge rating fitted in log space (least squares, simple-statistics)',
        },
      ]
    : [];
  const methods: ReportData['methods'] = [
    {
      topic: 'Reference evapotranspiration',
      text: `${run.refEtMethod}${run.etFactor !== 1 ? `, times the field file's factor ${run.etFactor}` : ''}${run.refEtMethod === 'Hargreaves' ? ` (${HARGREAVES_BIAS})` : ''}; crop ET = Kc x ET0 with the FAO-56 single crop coefficient curve and the water-stress coefficient Ks (Eq. 84).`,
      source: `${ET_METHOD_SOURCE[run.refEtMethod]}; Allen et al. (1998), FAO Irrigation and Drainage Paper 56`,
    },
    {
      topic: 'Snow',
      text: 'Temperature-index (degree-day) accumulation and melt; no ET under snow cover.',
      source: 'Degree-day method (e.g. Martinec 1960; FAO-56 does not cover snow)',
    },
    {
      topic: 'Water balance of the drained profile',
      text: 'Each day precipitation = ET + surface runoff + drain flow + deep seepage + change in storage (snow, surface water, soil), closed every year. Soil storage is the root-zone depletion below field capacity plus the pore volume drained above a water table midway between the drains; the layered drainable porosity ties that volume to the water-table depth.',
      source:
        'Conservation of mass; drainable porosity (specific yield) as in Ritzema (1994), ILRI Publ. 16',
    },
    {
      topic: 'Drain outflow',
      text: 'Hooghoudt steady-state equation applied each sub-step with the midpoint head above the effective outlet level (drain or control-structure level), solved exactly over each step with the recharge; equivalent depth of the layer below the drains by van der Molen & Wesseling; Kirkham ponded-surface rate when the surface is ponded and the profile saturated, if larger; capped by the pipe capacity.',
      source:
        'Hooghoudt (1940); van der Molen & Wesseling (1991), Agric. Water Manage. 19; Kirkham (1957)',
    },
    {
      topic: 'Seepage',
      text: `${seepageText(run, units)} Every scenario is also run under the low, medium and high settings; the changes against the baseline under low and high are given beside each change (the seepage band).`,
      source:
        "Leaky-layer leakage q = K'/b' x head difference (Darcy); Dupuit-Forchheimer flow to the field edge; till conductivities after Freeze & Cherry (1979), from memory",
    },
    {
      topic: 'Roots and pipe capacity',
      text: `${rootText(run, units)} Drain flow is capped at ${capacityText(run, units)}.`,
      source:
        'FAO-56 Table 22 and chapter 8 (Allen et al. 1998); drainage-coefficient tables for humid areas (common practice, from memory)',
    },
    {
      topic: 'Load change: flow and concentration parts',
      text: 'Mean annual load L = Q C / 100 (Q drain flow, mm; C flow-weighted concentration, mg/L). A change is split symmetrically: flow part (Q1 - Q0)(C0 + C1)/200, concentration part (C1 - C0)(Q0 + Q1)/200; the two add up to the change.',
      source: 'Midpoint (symmetric) decomposition of a product change',
    },
    {
      topic: 'Nitrate-N',
      text: `Concentration model: ${models.join(', ')}. Load (kg N/ha) = drain flow (mm) x concentration (mg/L) / 100. The pool model balances fertilizer, mineralization (Q10), crop uptake, denitrification rising with saturation and temperature, and leaching.`,
      source:
        'See README "Nitrate models" and src/nitrate/defaults.ts for the source of each default',
    },
    {
      topic: 'Crop conditions',
      text: 'Aeration stress from the air-filled porosity of the upper root zone; days suitable for fieldwork from the water content of the surface layer against a trafficability limit, standing water and snow; wet days from the water-table depth; water-stress days from FAO-56 Ks. The top layers dry and rewet first. Definitions, windows and thresholds are in the glossary.',
      source:
        'Aeration limit about 10 % air by volume: Grable & Siemer (1968), Soil Sci. Soc. Am. Proc. 32; workability a little drier than field capacity: Earl (1997), Soil Till. Res. 40; Allen et al. (1998), FAO-56 Eq. 84',
    },
  ];
  const nitrateAt = methods.findIndex((m) => m.topic === 'Nitrate-N');
  methods.splice(nitrateAt + 1, 0, ...rating);
  return methods;
}

/** The wettest calendar year of the run (most precipitation), used by default for the water-table chart. */
export function wettestYear(run: RunResult): number {
  return wettestYearOf(run.scenarios[0]?.annual ?? [], run.from);
}

/** The wettest year of these annual rows (the first of equals), or the year of `from` without rows. */
function wettestYearOf(annual: readonly AnnualRow[], from: string): number {
  let best = annual[0];
  for (const r of annual) if (r.precip_mm > best.precip_mm) best = r;
  return best ? best.year : Number(from.slice(0, 4));
}

/**
 * What the report keeps of one scenario: the chart year's daily series, the whole-period series
 * of the cumulative, monthly and duration charts, and the water table in the fieldwork windows.
 */
export interface ScenarioReportPart {
  chartYear: number;
  daily: ScenarioDailySeries;
  period: ScenarioPeriodSeries;
  windows: WindowWaterTable[];
}

/** How every scenario's report part is cut: the chart year, its days, the growing season's. */
export interface ReportCut {
  chartYear: number;
  /** First and one-past-last index of the chart year in the run's dates. */
  range: [number, number];
  inSeason: number[];
  measures: WetnessSettings;
}

/**
 * The cut of a run's report parts: the chart year (`chartYear`, or the wettest year of the
 * baseline's annual rows), its days (a year outside the period is a SettingError) and the
 * growing-season days of the first scenario's crop measures.
 */
export function reportCutOf(
  run: Pick<RunResult, 'forcing' | 'from'>,
  first: Pick<ScenarioResult, 'annual' | 'spec'> | undefined,
  chartYear?: number,
): ReportCut {
  const measures = first?.spec.field.wetness ?? wetnessSchema.parse(undefined);
  const year = chartYear ?? wettestYearOf(first?.annual ?? [], run.from);
  return {
    chartYear: year,
    range: yearRange(run.forcing.dates, year),
    inSeason: seasonDays(run.forcing.dates, measures.growingSeason),
    measures,
  };
}

/** A scenario with the daily series the report reads, over the run's dates. */
type DailyScenario = Pick<ScenarioOutput, 'spec' | 'annual'> & {
  engine: Pick<EngineResult, 'waterTableDepthM' | 'outletDepthM' | 'drainflowMm'>;
  nitrate: Pick<NitrateResult, 'loadKgHa' | 'concMgL'>;
};

/**
 * One scenario's report part from its daily series over the run's `dates` (its own copies, so
 * the part outlives the columns it was cut from).
 * @example reportPartOf(run.forcing.dates, run.scenarios[0], reportCutOf(run, run.scenarios[0]))
 */
export function reportPartOf(
  dates: readonly string[],
  s: DailyScenario,
  cut: ReportCut,
): ScenarioReportPart {
  const [a, b] = cut.range;
  const e = s.engine;
  const n = s.nitrate;
  const name = s.spec.name;
  return {
    chartYear: cut.chartYear,
    daily: {
      scenario: name,
      waterTableDepthM: e.waterTableDepthM.slice(a, b),
      outletDepthM: e.outletDepthM.slice(a, b),
      drainflowMm: e.drainflowMm.slice(a, b),
      no3LoadKgHa: n.loadKgHa.slice(a, b),
      no3ConcMgL: n.concMgL.slice(a, b),
    },
    period: periodSeriesOf(
      name,
      dates,
      { drainflowMm: e.drainflowMm, no3LoadKgHa: n.loadKgHa, waterTableDepthM: e.waterTableDepthM },
      cut.inSeason,
    ),
    windows: windowWaterTable(name, dates, e.waterTableDepthM, s.annual, cut.measures),
  };
}

/** Days in a mean Gregorian year, for rates per year over records of any length. */
const DAYS_PER_YEAR = 365.2425;

/**
 * The climate of a simulated period: precipitation and reference ET per mean year (totals over
 * the days divided by days / 365.2425, so a partial year is not counted as a whole one) and the
 * mean daily air temperature.
 *
 * @example climateOf(forcing) // { precipMmPerYr: 880.1, refEtMmPerYr: 702.4, tmeanC: 9.3 }
 */
export function climateOf(f: EngineForcing): {
  precipMmPerYr: number;
  refEtMmPerYr: number;
  tmeanC: number;
} {
  const n = f.dates.length;
  let p = 0;
  let et = 0;
  let t = 0;
  for (let i = 0; i < n; i++) {
    p += f.precipMm[i];
    et += f.refEtMm[i];
    t += f.tmeanC[i];
  }
  const years = n / DAYS_PER_YEAR;
  return n
    ? { precipMmPerYr: p / years, refEtMmPerYr: et / years, tmeanC: t / n }
    : { precipMmPerYr: NaN, refEtMmPerYr: NaN, tmeanC: NaN };
}

/**
 * Everything the report needs from a run.
 * @example reportDataOf(run, { fieldName: 'North field', weatherFile: 'w.csv', units: 'si' })
 */
export function reportDataOf(
  run: RunResult,
  o: {
    fieldName: string;
    weatherFile: string;
    /** How the weather file was read, in words (format, station, fills), for the report. */
    weatherSource?: string | undefined;
    units: 'si' | 'us';
    chartYear?: number | undefined;
    comparison?: ComparisonRow[];
    /**
     * Each scenario's report part (`reportPartOf`), for a run whose scenarios are digests; a run
     * of full scenario outputs has them cut here.
     */
    parts?: ScenarioReportPart[];
  },
): ReportData {
  const measures = run.scenarios[0]?.spec.field.wetness ?? wetnessSchema.parse(undefined);
  const cut = reportCutOf(run, run.scenarios[0], o.chartYear);
  const parts =
    o.parts ??
    run.scenarios.map((s) => {
      if (!('calendar' in s)) {
        throw new Error(`report data of scenario "${s.spec.name}" needs its report part`);
      }
      return reportPartOf(run.forcing.dates, s, cut);
    });
  if (parts.length !== run.scenarios.length || parts.some((p) => p.chartYear !== cut.chartYear)) {
    throw new Error(`report parts were cut for another chart year or other scenarios`);
  }
  const [a, b] = cut.range;
  return {
    title: `Drainage alternatives for ${o.fieldName}`,
    generatedBy: `tileflux ${VERSION}`,
    fieldName: o.fieldName,
    weatherFile: o.weatherFile,
    climate: {
      ...climateOf(run.forcing),
      ...(o.weatherSource !== undefined && { source: o.weatherSource }),
    },
    period: { from: run.from, to: run.to, years: run.scenarios[0]?.annual.length ?? 0 },
    baseline: run.baseline,
    scenarios: run.scenarios.map((s) => ({
      name: s.spec.name,
      description: s.spec.description,
      drainDepthM: s.spec.params.drainDepthM,
      spacingM: s.spec.params.spacingM,
      outlet: s.spec.outletLabel,
      ...(s.spec.outlet.steps.length > 0 && { outletSteps: s.spec.outlet.steps }),
      ...(typeof s.spec.field.outlet === 'object' && s.spec.field.outlet.boardHeight !== undefined
        ? { boardHeightM: s.spec.field.outlet.boardHeight }
        : {}),
    })),
    comparison: o.comparison ?? comparisonOf(run),
    annual: run.scenarios.flatMap((s) => s.annual),
    daily: {
      dates: run.forcing.dates.slice(a, b),
      precipMm: run.forcing.precipMm.slice(a, b),
      series: parts.map((p) => p.daily),
    },
    periodSeries: parts.map((p) => p.period),
    wetThresholdM: measures.threshold,
    measures,
    chartYear: cut.chartYear,
    chartYearReason: o.chartYear === undefined ? 'wettest' : 'given',
    windows: parts.flatMap((p) => p.windows),
    balances: run.scenarios.map((s) => ({
      scenario: s.spec.name,
      maxAnnualWaterErrorMm: Math.max(0, ...s.annual.map((r) => Math.abs(r.balance_error_mm))),
      maxAnnualNitrogenErrorKgHa: Math.max(
        0,
        ...s.annual.map((r) => Math.abs(r.n_balance_error_kg_ha)),
      ),
    })),
    methods: methodsOf(run, o.units),
    units: o.units,
  };
}
