/**
 * What `tileflux fit` does (registered in cli/commands/fit.ts): read the field, the weather and
 * the observations, search the parameters (on worker threads), write the fit folder and print
 * the summary.
 */
import { availableParallelism } from 'node:os';
import { writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { TilefluxError } from '../../errors.js';
import { readFieldFile } from '../../io/field.js';
import { fittedFieldText } from '../../io/fittedField.js';
import { checkInsideWeather, readObservationsFile } from '../../io/observations.js';
import { columnsToCsv } from '../../io/tables.js';
import { readWeatherFile } from '../../io/weather.js';
import { buildFitChartSpecs } from '../../report/fitCharts.js';
import { buildFitReportHtml } from '../../report/fitReport.js';
import { writeCharts } from '../../report/index.js';
import {
  FIT_OBJECTIVES,
  calibrationLoss,
  fitField,
  type FitObjective,
  type FitResult,
} from '../../scenarios/fit.js';
import { buildFitProblem, parsePeriod } from '../../scenarios/fitProblem.js';
import { fitColumns, fitDocument, fitSeriesOf, type FitDocument } from '../../report/fitSummary.js';
import { localRunner, type SearchRunner } from '../../scenarios/optimise.js';
import { parseQuantity } from '../../units/quantity.js';
import { VERSION } from '../../version.js';
import { emit, CAUTION, chartsLines, imagesOf } from '../common.js';
import { writeDirAtomic } from '../../io/atomicOutput.js';
import { poolRunner } from '../fitPool.js';
import { progress } from '../progress.js';
import { weatherReadOptions, type WeatherReadFlags } from '../weatherOptions.js';
import { fixedText } from '../../units/decimal.js';

export interface FitCommandOptions extends WeatherReadFlags {
  weather: string;
  observed: string;
  out?: string;
  params?: string;
  objective?: string;
  calibrate?: string;
  validate?: string;
  seed?: string;
  area?: string;
  warmupYears?: string;
  workers?: string;
  charts?: boolean;
  images?: boolean;
  report?: boolean;
  force?: boolean;
  json?: boolean;
}

function integerOption(
  text: string | undefined,
  option: string,
  lo: number,
  hi: number,
  dflt: number,
): number {
  if (text === undefined) return dflt;
  const x = Number(text);
  if (!Number.isInteger(x) || x < lo || x > hi) {
    throw new TilefluxError(`${option} expects a whole number from ${lo} to ${hi}; got ${text}`);
  }
  return x;
}

function objectiveOf(text: string | undefined): FitObjective {
  const o = text ?? 'kge';
  if (!(FIT_OBJECTIVES as readonly string[]).includes(o)) {
    throw new TilefluxError(`--objective expects one of ${FIT_OBJECTIVES.join(', ')}; got ${o}`);
  }
  return o as FitObjective;
}

/** The human summary: parameters, statistics per period with ratings, files. */
function fitReportText(doc: FitDocument, out: string, written: string[], images: boolean): string {
  const lines = [
    `${doc.field_name}: fitted ${doc.parameters.length} parameters to ${doc.observations_file} ` +
      `(objective ${doc.objective}, seed ${doc.seed}, ${doc.model_runs} model runs)`,
    '',
    `${'parameter'.padEnd(30)} ${'start'.padStart(10)} ${'fitted'.padStart(10)}  behavioural range`,
  ];
  const g = (x: number | null) => (x === null ? 'unlimited' : String(Number(x.toPrecision(4))));
  for (const p of doc.parameters) {
    lines.push(
      `${`${p.path} (${p.unit})`.padEnd(30)} ${g(p.start).padStart(10)} ${g(p.best).padStart(10)}  ` +
        `${g(p.behavioural_min)} to ${g(p.behavioural_max)}`,
    );
  }
  for (const [name, p] of [
    ['calibration', doc.calibration],
    ['validation', doc.validation],
  ] as const) {
    if (!p) continue;
    lines.push('', `${name} ${p.from} to ${p.to}:`);
    if (p.drainflow) {
      const s = p.drainflow;
      const r = p.drainflow_ratings!;
      lines.push(
        `  drain flow (${s.n_days} days): NSE ${fixedText(s.nse ?? NaN, 3)} (${r.nse ?? 'n/a'}), ` +
          `KGE ${fixedText(s.kge ?? NaN, 3)}, log-NSE ${fixedText(s.log_nse ?? NaN, 3)}, ` +
          `PBIAS ${fixedText(s.pbias_percent ?? NaN, 1)} % (${r.pbias_percent ?? 'n/a'}), ` +
          `R^2 ${fixedText(s.r2 ?? NaN, 3)} (${r.r2 ?? 'n/a'}), RMSE ${fixedText(s.rmse_mm ?? NaN, 3)} mm/d`,
      );
    }
    if (p.water_table) {
      const s = p.water_table;
      lines.push(
        `  water-table depth (${s.n_days} days): NSE ${fixedText(s.nse ?? NaN, 3)}, KGE ` +
          `${fixedText(s.kge ?? NaN, 3)}, RMSE ${fixedText(s.rmse_m ?? NaN, 3)} m`,
      );
    }
  }
  if (!doc.validation) {
    lines.push(
      '',
      'No validation period: give --validate FROM..TO to test the fit on other years.',
    );
  }
  lines.push('', `Wrote ${out}/ (${written.join(', ')}).`, ...chartsLines(out, written, images));
  if (written.includes('report.html')) lines.push(`Report: ${join(out, 'report.html')}`);
  lines.push(`Run the fitted field: tileflux run ${join(out, 'fitted.yaml')} --weather ...`);
  lines.push(CAUTION);
  return lines.join('\n');
}

/** Header comment of fitted.yaml: what was fitted, against what, and how well. */
function headerLines(doc: FitDocument, r: FitResult): string[] {
  const stat = (x: number | null | undefined, d: number) =>
    x === null || x === undefined ? 'n/a' : fixedText(x, d);
  const lines = [
    `Fitted by ${doc.generated_by} fit against ${doc.observations_file} on ${doc.weather_file}`,
    `(objective ${doc.objective}, seed ${doc.seed}, ${doc.model_runs} model runs; details in fit.json).`,
    `Fitted: ${r.parameters.map((p) => `${p.path} = ${Number(p.best.toPrecision(4))}${p.unit === '-' ? '' : ` ${p.unit}`}`).join(', ')}.`,
  ];
  for (const [name, p] of [
    ['Calibration', doc.calibration],
    ['Validation', doc.validation],
  ] as const) {
    if (!p) continue;
    const parts: string[] = [];
    if (p.drainflow) {
      parts.push(
        `drain flow NSE ${stat(p.drainflow.nse, 3)}, KGE ${stat(p.drainflow.kge, 3)}, ` +
          `PBIAS ${stat(p.drainflow.pbias_percent, 1)} %`,
      );
    }
    if (p.water_table) {
      parts.push(
        `water table NSE ${stat(p.water_table.nse, 3)}, RMSE ${stat(p.water_table.rmse_m, 3)} m`,
      );
    }
    lines.push(`${name} ${p.from} to ${p.to}: ${parts.join('; ')}.`);
  }
  lines.push(
    'Scenarios in this file that set these keys themselves keep their own values.',
    'Planning estimate: effective parameters of a simplified model at one site.',
  );
  return lines;
}

/** Fit the field file at `fieldPath` to the observations and write the fit folder. */
export async function fit(fieldPath: string, o: FitCommandOptions): Promise<void> {
  const images = imagesOf(o);
  const objective = objectiveOf(o.objective);
  const seed = integerOption(o.seed, '--seed', 0, 2 ** 31 - 1, 1);
  const warmupYears = integerOption(o.warmupYears, '--warmup-years', 0, 50, 1);
  const workers = integerOption(o.workers, '--workers', 0, 64, Math.min(4, availableParallelism()));
  const areaHa = o.area === undefined ? undefined : parseQuantity(o.area, 'area', '--area');
  if (areaHa !== undefined && !(areaHa > 0)) {
    throw new TilefluxError(`--area must be greater than 0; got ${o.area}`);
  }
  const calibrate = o.calibrate ? parsePeriod(o.calibrate, 'calibrate') : undefined;
  const validate = o.validate ? parsePeriod(o.validate, 'validate') : undefined;
  const paths = o.params
    ?.split(',')
    .map((s) => s.trim())
    .filter(Boolean);

  const field = readFieldFile(fieldPath);
  const weather = readWeatherFile(o.weather, weatherReadOptions(o)).series;
  const obs = readObservationsFile(o.observed, { areaHa });
  checkInsideWeather(obs, weather.dates);
  const problem = buildFitProblem({
    base: field.base,
    weather,
    observed: obs,
    objective,
    paths,
    calibrate,
    validate,
    warmupYears,
  });
  const bar = progress(3 + 1, 'fitting');
  let runner: SearchRunner;
  let close = async () => {};
  if (workers > 0) {
    ({ runner, close } = poolRunner(problem, weather, workers, () => bar.tick('searching')));
  } else runner = localRunner(calibrationLoss(problem));
  let result: FitResult;
  try {
    result = await fitField(problem, runner, {
      seed,
      behaviouralTolerance: field.base.fit?.behaviouralTolerance ?? 0.05,
    });
  } finally {
    await close();
    bar.stop();
  }
  const doc = fitDocument(result, {
    generatedBy: `tileflux ${VERSION}`,
    fieldFile: basename(fieldPath),
    fieldName: field.base.name,
    weatherFile: basename(o.weather),
    observationsFile: basename(o.observed),
    columnsUsed: obs.columnsUsed,
    warmupYears,
    workers,
  });
  const series = fitSeriesOf(
    result,
    problem.observed,
    { ...problem, reportStart: problem.period.reportStart },
    field.base.name,
  );
  const out = o.out ?? `${basename(fieldPath).replace(/\.[^.]*$/, '')}-fit`;
  const written = ['fitted.yaml', 'fit.json', 'fit.csv'];
  await writeDirAtomic(out, Boolean(o.force), async (dir) => {
    const values = Object.fromEntries(result.parameters.map((p) => [p.path, p.best]));
    writeFileSync(
      join(dir, 'fitted.yaml'),
      fittedFieldText(
        field.text,
        values,
        headerLines(doc, result),
        fieldPath,
        join(out, 'fitted.yaml'),
      ),
    );
    writeFileSync(join(dir, 'fit.json'), JSON.stringify(doc, null, 2) + '\n');
    const no3 = problem.observed.no3MgL?.slice(problem.period.reportStart);
    writeFileSync(join(dir, 'fit.csv'), columnsToCsv(fitColumns(series, no3), 'si'));
    if (o.charts === false && o.report === false) return;
    const specs = buildFitChartSpecs(series);
    if (o.charts !== false) {
      await writeCharts(dir, specs, { images });
      written.push('charts/');
    }
    if (o.report !== false) {
      writeFileSync(join(dir, 'report.html'), buildFitReportHtml(doc, specs));
      written.push('report.html');
    }
  });
  emit(o.json, doc, () => fitReportText(doc, out, written, images));
}
