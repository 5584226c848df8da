/**
 * What `tileflux run` and `tileflux demo` share: reading the field and weather with the run
 * options, the printed summary, and writing the run folder with --daily and --year read here.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, dirname, resolve } from 'node:path';
import { clip, TilefluxError } from '../errors.js';
import { dayNumber } from '../climate/calendar.js';
import { HARGREAVES_BIAS } from '../climate/referenceEt.js';
import { readFieldFile } from '../io/field.js';
import { join } from 'node:path';
import { type RunMeta } from '../io/runFolder.js';
import { columnIn } from '../io/tables.js';
import { cropConditionLines, headlineLines } from '../report/summary.js';
import type { ComparisonRow } from '../scenarios/compare.js';
import { capacityText, rootText, seepageText } from '../scenarios/assumptions.js';
import { counted } from '../report/format.js';
import { readWeatherFile, type WeatherReadResult } from '../io/weather.js';
import { capacityLimitedDaysOf, planRun, type RunPlan, type RunResult } from '../scenarios/run.js';
import type { UnitSystem } from '../units/quantity.js';
import { warn, CAUTION, chartsLines, imagesOf, parseUnits } from './common.js';
import { explorerHtmlOf } from '../explorer/page.js';
import { progress } from './progress.js';
import { weatherReadOptions, type WeatherReadFlags } from './weatherOptions.js';

import { startChartThreads } from '../report/chartThreads.js';
import { runToFolder, type RunFolderOptions } from '../report/writeRun.js';
import { fixedText } from '../units/decimal.js';

export interface RunCommandOptions extends WeatherReadFlags {
  weather: string;
  out?: string;
  scenario?: string[];
  from?: string;
  to?: string;
  warmupYears?: string;
  force?: boolean;
  json?: boolean;
  units?: string | undefined;
  charts?: boolean;
  images?: boolean;
  report?: boolean;
  year?: string;
  daily?: string;
  explorer?: boolean;
}

function sha256(path: string): string {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/**
 * Validate the options shared by run and demo and plan the field's run (`writeRunFolderOf` runs
 * it into the folder, scenario by scenario); `stop` ends the progress bar.
 */
export function runFromFiles(
  fieldPath: string,
  o: RunCommandOptions,
): {
  plan: RunPlan;
  meta: RunMeta;
  explorerHtml: (units: UnitSystem) => string;
  stop: () => void;
} {
  imagesOf(o);
  for (const [opt, v] of [
    ['--from', o.from],
    ['--to', o.to],
  ] as const) {
    if (v !== undefined && dayNumber(v) === undefined)
      throw new TilefluxError(
        `${opt} expects a real calendar date YYYY-MM-DD such as 2015-01-01; got ${clip(v)}`,
      );
  }
  let warmupYears: number | undefined;
  if (o.warmupYears !== undefined) {
    warmupYears = Number(o.warmupYears);
    if (!Number.isInteger(warmupYears) || warmupYears < 0 || warmupYears > 50) {
      throw new TilefluxError(
        `--warmup-years expects a whole number from 0 to 50; got ${o.warmupYears}`,
      );
    }
  }
  const field = readFieldFile(fieldPath);
  for (const w of field.warnings) warn(w);
  const weather = readWeatherFile(o.weather, weatherReadOptions(o));
  const bar = progress(field.scenarios.length || 3, 'simulating');
  const plan = planRun(field, weather.series, {
    from: o.from,
    to: o.to,
    warmupYears,
    only: o.scenario,
    units: parseUnits(o.units),
    onScenario: (_k, _n, name) => bar.tick(name),
  });
  const { run } = plan;
  const recordDays = weather.series.dates.length;
  if (recordDays < 731) {
    warn(
      `the weather record holds ${recordDays} days, less than two years: results start from a ` +
        `guessed initial state (initial.waterTableDepth) without a full warm-up, and years the ` +
        `record covers in part are marked partial_year in annual.csv, not annual rates`,
    );
  } else if (run.warmupYears < run.warmupYearsRequested - 0.01) {
    warn(
      `the weather record starts ${run.simulatedFrom}, so the warm-up before ${run.from} is ` +
        `${run.warmupYears} years, not the ${run.warmupYearsRequested} asked for (--warmup-years); ` +
        `the first reported year leans on the guessed initial state`,
    );
  }
  return {
    plan,
    stop: () => bar.stop(),
    explorerHtml: (units) =>
      explorerHtmlOf(field, weather.series, o.weather, units, {
        from: o.from,
        to: o.to,
        warmupYears,
      }),
    meta: {
      fieldFile: basename(fieldPath),
      fieldSha256: sha256(fieldPath),
      weatherFile: basename(o.weather),
      weatherSha256: sha256(o.weather),
      weatherSource: weatherSourceText(weather),
      fieldName: field.base.name,
      ratingFits: field.ratingFits,
      inputPaths: [
        fieldPath,
        o.weather,
        ...Object.keys(field.ratingFits).map((f) => resolve(dirname(fieldPath), f)),
      ],
    },
  };
}

/**
 * How a weather file was read, in words for the report: the format (with station and units for
 * public exports) and the days that were filled.
 *
 * @example weatherSourceText(read) // "tileflux's own CSV; 3 missing days filled"
 */
export function weatherSourceText(r: WeatherReadResult): string {
  const parts = r.format === 'tileflux' ? ["tileflux's own CSV"] : [...r.notes];
  if (r.filledDays > 0) parts.push(`${counted(r.filledDays, 'missing day')} filled`);
  return parts.join('; ');
}

/**
 * Human summary table: one line per scenario with flow and load against the baseline and the
 * crop's conditions (aeration-stress and wet days in the growing season).
 */
export function headline(comparison: readonly ComparisonRow[], units: UnitSystem): string {
  const flow = columnIn('drainflow_mm', units);
  const load = columnIn('no3n_load_kg_ha', units);
  const flowU = units === 'us' ? 'in/yr' : 'mm/yr';
  const loadU = units === 'us' ? 'lb N/ac/yr' : 'kg N/ha/yr';
  const pct = (x: number | null) => (x === null ? '' : `${x >= 0 ? '+' : ''}${fixedText(x, 0)}%`);
  // The name column is as wide as the longest name, so different names never print the same.
  const w = Math.max(16, ...comparison.map((r) => r.scenario.length));
  const lines = [
    `${'scenario'.padEnd(w)} ${`drain flow ${flowU}`.padStart(18)} ${'change'.padStart(8)} ${`nitrate-N ${loadU}`.padStart(22)} ${'change'.padStart(8)} ${'aeration-stress d/yr'.padStart(21)} ${'wet d/yr'.padStart(9)}`,
  ];
  for (const r of comparison) {
    lines.push(
      `${r.scenario.padEnd(w)} ${fixedText(r.drainflow_mm * flow.factor, units === 'us' ? 2 : 0).padStart(18)} ${pct(r.drainflow_change_percent).padStart(8)} ${fixedText(r.no3n_load_kg_ha * load.factor, 1).padStart(22)} ${pct(r.no3n_load_change_percent).padStart(8)} ${fixedText(r.aeration_stress_days, 1).padStart(21)} ${fixedText(r.wet_days, 1).padStart(9)}`,
    );
  }
  return lines.join('\n');
}

/**
 * What the run assumed that decides its answer, always printed: seepage, roots, pipe capacity
 * (with the days it limited flow) and the reference-ET method with its known bias.
 */
export function assumptionLines(run: RunResult, units: UnitSystem = 'si'): string[] {
  const limited = run.scenarios.map((s) => `${s.spec.name} ${capacityLimitedDaysOf(s)}`).join(', ');
  const et =
    `Reference ET: ${run.refEtMethod}` +
    (run.etFactor !== 1 ? ` x ${run.etFactor} (weather.etFactor)` : '') +
    (run.refEtMethod === 'Hargreaves' ? `. ${HARGREAVES_BIAS}.` : '.');
  return [
    `Assumed: ${seepageText(run, units)}`,
    `Assumed: ${rootText(run, units)}`,
    `Assumed: drain flow capped at ${capacityText(run, units)}; days the cap limited flow: ${limited}.`,
    et,
  ];
}

/** The human summary printed after a run: the table, what changed, where the files are. */
export function runReport(
  run: RunResult,
  meta: RunMeta,
  units: UnitSystem,
  out: string,
  written: string[],
  comparison: ComparisonRow[],
  images = false,
): string {
  const lines = [
    `${meta.fieldName}: ${counted(run.scenarios.length, 'scenario')}, ${run.from} to ${run.to} (${counted(run.scenarios[0]?.annual.length ?? 0, 'year')}), reference ET by ${run.refEtMethod}`,
    '',
    headline(comparison, units),
    '',
    ...headlineLines(comparison),
    ...cropConditionLines(comparison),
    '',
    ...assumptionLines(run, units),
    '',
    `Wrote ${out}/ (${written.join(', ')}).`,
    ...chartsLines(out, written, images),
  ];
  if (written.includes('report.html')) lines.push(`Report: ${join(out, 'report.html')}`);
  if (written.includes('explorer.html')) {
    lines.push(`Explorer (change the designs in a browser): ${join(out, 'explorer.html')}`);
  }
  lines.push(CAUTION);
  return lines.join('\n');
}

/** Parse --daily: csv (the default) writes daily.csv, none skips it for large studies. */
export function dailyOption(d: string | undefined): boolean {
  if (d === undefined || d === 'csv') return true;
  if (d === 'none') return false;
  throw new TilefluxError(`--daily expects csv or none; got ${d}`);
}

/** Parse --year: a calendar year inside the reported period. */
export function chartYearOf(
  run: Pick<RunResult, 'from' | 'to'>,
  year: string | undefined,
): number | undefined {
  if (year === undefined) return undefined;
  const y = Number(year);
  const first = Number(run.from.slice(0, 4));
  const last = Number(run.to.slice(0, 4));
  if (!Number.isInteger(y) || y < first || y > last) {
    throw new TilefluxError(`--year expects a year from ${first} to ${last}; got ${year}`);
  }
  return y;
}

/** The fewest cores on which `tileflux run` and `demo` draw their charts on chart threads. */
const CHART_THREAD_CORES = 4;

/**
 * Run a planned field into its output folder as the command does: --daily and --year read here,
 * the scenarios run and written one at a time by the library's `runToFolder`.
 */
export async function writeRunFolderOf(
  plan: RunPlan,
  meta: RunMeta,
  out: string,
  units: UnitSystem,
  o: Omit<RunFolderOptions, 'chartYear' | 'daily'> & { year?: string; daily?: string },
  stop: () => void = () => {},
) {
  const chartYear = chartYearOf(plan.run, o.year);
  const daily = dailyOption(o.daily);
  const images = imagesOf(o);
  // With cores to spare, chart threads start before the scenarios run, so vega loads and warms
  // up meanwhile. On fewer than four cores they only compete with the run (two cores: no gain
  // in wall time, about 1 s more CPU), so the charts are drawn in this thread there.
  const charts =
    images && availableParallelism() >= CHART_THREAD_CORES ? startChartThreads() : undefined;
  const options = {
    force: o.force,
    charts: o.charts,
    images,
    report: o.report,
    chartYear,
    daily,
    explorerHtml: o.explorerHtml,
    drawCharts: charts?.draw,
  };
  try {
    return await runToFolder(plan, meta, out, units, options);
  } finally {
    stop();
    await charts?.close();
  }
}
