/**
 * The written form of a fit: fit.json's document (parameters, behavioural range, statistics per
 * period with their ratings), the daily table of fit.csv and the series for charts. Keys end with
 * their unit. Pure.
 */
import type { Column } from '../io/tables.js';
import type { FitResult, PeriodStatistics } from '../scenarios/fit.js';
import { RATING_BANDS, RATING_SOURCE, kgeVerdict, rate } from '../scenarios/fitRatings.js';
import type { FitStatistics } from '../scenarios/fitStatistics.js';
import type { FitSeries } from './fitCharts.js';

/** Statistics of one series in fit.json: unit-suffixed keys (flow in mm/d, depths in m). */
export function statisticsRecord(
  s: FitStatistics,
  what: 'drainflow' | 'waterTable',
): Record<string, number | null> {
  const u = what === 'drainflow' ? 'mm' : 'm';
  const out: Record<string, number | null> = {
    n_days: s.n,
    nse: s.nse,
    kge: s.kge,
    kge_r: s.kgeR,
    kge_alpha: s.kgeAlpha,
    kge_beta: s.kgeBeta,
    log_nse: s.logNse,
    pbias_percent: s.pbiasPercent,
    [`rmse_${u}`]: s.rmse,
    r2: s.r2,
    [`mean_observed_${u}`]: s.meanObserved,
    [`mean_simulated_${u}`]: s.meanSimulated,
  };
  if (what === 'drainflow') {
    out.peak_error_percent = s.peakErrorPercent;
    out.volume_error_mm = s.volumeError;
    out.volume_error_percent = s.volumeErrorPercent;
  }
  return out;
}

/** Ratings of drain flow on one period (null where a statistic has no value). */
export function ratingsOf(s: FitStatistics): Record<string, string | null> {
  return {
    nse: rate('nse', s.nse),
    r2: rate('r2', s.r2),
    pbias_percent: rate('pbiasPercent', s.pbiasPercent),
    kge: kgeVerdict(s.kge),
  };
}

function periodRecord(p: PeriodStatistics) {
  return {
    from: p.from,
    to: p.to,
    loss: p.loss,
    drainflow: p.drainflow ? statisticsRecord(p.drainflow, 'drainflow') : null,
    water_table: p.waterTable ? statisticsRecord(p.waterTable, 'waterTable') : null,
    drainflow_ratings: p.drainflow ? ratingsOf(p.drainflow) : null,
  };
}

export interface FitMeta {
  generatedBy: string;
  fieldFile: string;
  fieldName: string;
  weatherFile: string;
  observationsFile: string;
  columnsUsed: Record<string, string>;
  warmupYears: number;
  workers: number;
}

/** The fit.json document. */
export function fitDocument(r: FitResult, meta: FitMeta) {
  return {
    generated_by: meta.generatedBy,
    field_file: meta.fieldFile,
    field_name: meta.fieldName,
    weather_file: meta.weatherFile,
    observations_file: meta.observationsFile,
    observation_columns: meta.columnsUsed,
    objective: r.objective,
    objective_loss:
      r.objective === 'rmse'
        ? 'RMSE / standard deviation of the observations (RSR), weighted over the observed series'
        : `1 - ${r.objective === 'kge' ? 'KGE' : r.objective === 'nse' ? 'NSE' : 'log-NSE'}, weighted over the observed series`,
    seed: r.seed,
    warmup_years: meta.warmupYears,
    simulated_from: r.bestRun.dates[0],
    model_runs: r.modelRuns,
    workers: meta.workers,
    start_loss: r.startLoss,
    best_loss: r.bestLoss,
    parameters: r.parameters.map((p) => ({
      path: p.path,
      unit: p.unit,
      lower: p.bounds[0],
      upper: p.bounds[1],
      start: Number.isFinite(p.start) ? p.start : null,
      best: p.best,
      behavioural_min: p.behavioural[0],
      behavioural_max: p.behavioural[1],
    })),
    behavioural: {
      tolerance: r.behaviouralTolerance,
      sets: r.behaviouralSets,
      definition:
        'every evaluated parameter set whose calibration loss is at most the best loss plus the ' +
        'tolerance; the range is the smallest and largest value of each parameter among them',
    },
    calibration: periodRecord(r.calibration),
    validation: r.validation ? periodRecord(r.validation) : null,
    rating_bands: RATING_BANDS.map((b) => ({ statistic: b.statistic, bands: b.text })),
    rating_source: RATING_SOURCE,
  };
}

/** Day-by-day period labels over the reported days. */
export function periodLabels(
  r: FitResult,
  calibration: Uint8Array,
  validation: Uint8Array,
  from: number,
): string[] {
  const out: string[] = [];
  for (let i = from; i < r.bestRun.dates.length; i++) {
    out.push(validation[i] ? 'validation' : calibration[i] ? 'calibration' : '');
  }
  return out;
}

/** Observed and simulated series over the reported days (warm-up left out). */
export function fitSeriesOf(
  r: FitResult,
  observed: { drainflowMm?: Float64Array; waterTableDepthM?: Float64Array },
  masks: { calibration: Uint8Array; validation: Uint8Array; reportStart: number },
  fieldName: string,
): FitSeries {
  const a = masks.reportStart;
  return {
    fieldName,
    dates: r.bestRun.dates.slice(a),
    period: periodLabels(r, masks.calibration, masks.validation, a),
    ...(observed.drainflowMm && { observedFlowMm: observed.drainflowMm.slice(a) }),
    simulatedFlowMm: r.bestRun.drainflowMm.slice(a),
    ...(observed.waterTableDepthM && { observedWaterTableM: observed.waterTableDepthM.slice(a) }),
    simulatedWaterTableM: r.bestRun.waterTableDepthM.slice(a),
  };
}

/** The columns of fit.csv: date, period, then observed and simulated side by side. */
export function fitColumns(s: FitSeries, no3MgL?: Float64Array): Column[] {
  const cols: Column[] = [
    { name: 'date', values: s.dates },
    { name: 'period', values: s.period },
  ];
  if (s.observedFlowMm) cols.push({ name: 'observed_drainflow_mm', values: s.observedFlowMm });
  cols.push({ name: 'simulated_drainflow_mm', values: s.simulatedFlowMm });
  if (s.observedWaterTableM) {
    cols.push({ name: 'observed_water_table_depth_m', values: s.observedWaterTableM });
  }
  cols.push({ name: 'simulated_water_table_depth_m', values: s.simulatedWaterTableM });
  if (no3MgL) cols.push({ name: 'observed_no3n_mg_l', values: no3MgL });
  return cols;
}

export type FitDocument = ReturnType<typeof fitDocument>;
