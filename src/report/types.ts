/**
 * What the report stage needs from a run: the inputs that were compared, the annual and
 * comparison tables, a few daily series for the charts, balance closure and the methods used.
 * Everything is in the core's SI units; the report converts for display when `units` is 'us'.
 */
import type { ComparisonRow } from '../scenarios/compare.js';
import type { WetnessSettings } from '../scenarios/annual.js';
import type { WindowWaterTable } from '../scenarios/windows.js';
import type { AnnualRow } from '../scenarios/types.js';
import type { OutletStep } from '../engine/outletSchedule.js';

/** Daily series of one scenario, aligned with `ReportData.daily.dates`. */
export interface ScenarioDailySeries {
  scenario: string;
  /** Midpoint water-table depth below the surface, m. */
  waterTableDepthM: Float64Array;
  /** Effective outlet depth in force that day (drain depth when free), m. */
  outletDepthM: Float64Array;
  drainflowMm: Float64Array;
  no3LoadKgHa: Float64Array;
  no3ConcMgL: Float64Array;
}

/**
 * What the whole-period charts read from one scenario (`periodSeriesOf`): cumulative drain flow
 * and load at thinned days, sums by calendar month, and the growing-season duration curve.
 */
export interface ScenarioPeriodSeries {
  scenario: string;
  /** Days of the period. */
  days: number;
  /** Drain flow (mm) and nitrate-N load (kg/ha) added up from the first day, at these dates. */
  cumulative: { dates: string[]; flowMm: number[]; loadKgHa: number[] };
  /** Drain flow (mm) and load (kg/ha) per calendar month, and the (year, month) pairs of each. */
  monthly: { flow: Float64Array; load: Float64Array; count: number[] };
  /**
   * Duration-curve points: water-table depths (m) and the number of growing-season days with
   * the water table at that depth or shallower, of `seasonDays`.
   */
  duration: { depthM: number[]; days: number[]; seasonDays: number };
}

export interface ReportData {
  title: string;
  /** Tool and version, e.g. "tileflux 0.1.0". */
  generatedBy: string;
  fieldName: string;
  weatherFile: string;
  /**
   * The climate of the compared period, so a reader knows which weather the answer holds for:
   * means per year of precipitation and reference ET (mm/yr) and the mean air temperature
   * (degC), and how the file was read (format, station, fills), when known.
   */
  climate: { precipMmPerYr: number; refEtMmPerYr: number; tmeanC: number; source?: string };
  /** ISO dates of the first and last day, and the number of years compared. */
  period: { from: string; to: string; years: number };
  baseline: string;
  scenarios: Array<{
    name: string;
    description: string;
    drainDepthM: number;
    spacingM: number;
    /** Outlet management in words, e.g. "free" or "held at 0.3 m Nov-Mar". */
    outlet: string;
    /** The control-structure schedule (absent for a free outlet), SI. */
    outletSteps?: OutletStep[];
    /** Height of one stop-log board, m, when the field file gives it. */
    boardHeightM?: number;
  }>;
  comparison: ComparisonRow[];
  annual: AnnualRow[];
  /**
   * Daily dates, precipitation (mm/d, rain and snowfall as water) and each scenario's series:
   * over the whole period, or only the chart year's days when `periodSeries` is given.
   */
  daily: { dates: string[]; precipMm: Float64Array; series: ScenarioDailySeries[] };
  /**
   * Each scenario's whole-period series, when `daily` holds only the chart year (`reportDataOf`
   * gives them, so a long record's report does not hold every daily column); without them the
   * charts compute them from `daily`.
   */
  periodSeries?: ScenarioPeriodSeries[];
  /** Water table shallower than this depth counts as wet, m. */
  wetThresholdM: number;
  /** Windows and thresholds of the crop measures (the field file's `wetness` section, SI). */
  measures: WetnessSettings;
  /** Calendar year shown in the water-table chart, and why: the wettest year or the one asked for. */
  chartYear: number;
  chartYearReason: 'wettest' | 'given';
  /** The water table in the spring and fall fieldwork windows, two rows per scenario. */
  windows: WindowWaterTable[];
  balances: Array<{
    scenario: string;
    maxAnnualWaterErrorMm: number;
    maxAnnualNitrogenErrorKgHa: number;
  }>;
  methods: Array<{ topic: string; text: string; source: string }>;
  /** Display units: SI (mm, m, kg/ha) or US customary (in, ft, lb/ac). */
  units: 'si' | 'us';
}
