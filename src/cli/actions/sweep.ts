/**
 * What `tileflux sweep` does (registered in cli/commands/sweep.ts): read the field and every
 * climate, run the sweep on worker threads, write the study folder and print the recommended
 * candidates; also the summary and the text it prints.
 */
import { writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { TilefluxError } from '../../errors.js';
import { readFieldFile } from '../../io/field.js';
import { sweepClimatesParallel } from '../../io/sweepPool.js';
import { toCsv } from '../../io/tables.js';
import { writeCharts } from '../../report/index.js';
import { buildStudyChartSpecs } from '../../report/sweepCharts.js';
import { buildSweepReportHtml } from '../../report/sweepReport.js';
import {
  LOAD_MEASURE,
  WETNESS_MEASURE,
  recommendationLines,
  type SweepResult,
} from '../../scenarios/sweep.js';
import {
  checkClimateNames,
  climateLines,
  robustnessLines,
  studyRows,
  frontierUnion,
  type ClimateInput,
  type ClimateStudy,
} from '../../scenarios/sweepClimates.js';
import { VERSION } from '../../version.js';
import { CAUTION, chartsLines, emit, imagesOf } from '../common.js';
import { writeDirAtomic } from '../../io/atomicOutput.js';
import { progress } from '../progress.js';
import { weatherReadNote, readWeatherOption, type WeatherReadFlags } from '../weatherOptions.js';
import { roundTo } from '../../units/decimal.js';

/** The options of `tileflux sweep`. */
export interface SweepCommandOptions extends WeatherReadFlags {
  weather: string[];
  out?: string;
  samples?: string;
  seed?: string;
  workers?: string;
  force?: boolean;
  json?: boolean;
  charts?: boolean;
  images?: boolean;
  report?: boolean;
}

function wholeNumber(v: string | undefined, option: string, min: number, max: number) {
  if (v === undefined) return undefined;
  const n = Number(v);
  if (!Number.isInteger(n) || n < min || n > max) {
    throw new TilefluxError(`${option} expects a whole number from ${min} to ${max}; got ${v}`);
  }
  return n;
}

/** A --weather value: the climate's name (given, or the file's stem) and the file. */
export interface ClimateSpec {
  name: string;
  file: string;
}

/**
 * Read a --weather value: `NAME=FILE` or `FILE` (named after the file: its stem with characters
 * other than letters, digits, - and _ as -). A `=` after a path separator belongs to the file.
 *
 * @example climateSpec('wetter=future.csv') // { name: 'wetter', file: 'future.csv' }
 */
export function climateSpec(text: string): ClimateSpec {
  const eq = text.indexOf('=');
  const named = eq >= 0 && !/[\\/]/.test(text.slice(0, eq));
  const name = named ? text.slice(0, eq).trim() : '';
  const file = named ? text.slice(eq + 1).trim() : text.trim();
  if (file === '' || (named && name === '')) {
    throw new TilefluxError(
      `--weather expects FILE or NAME=FILE (e.g. --weather today=weather.csv); got "${text}"`,
    );
  }
  if (named) return { name, file };
  const stem = basename(file)
    .replace(/\.[^.]*$/, '')
    .replace(/[^A-Za-z0-9_-]+/g, '-')
    .replace(/^[-_]+/, '')
    .slice(0, 32);
  return { name: stem || 'weather', file };
}

/** summary.json of a sweep: the inputs, the frontier and where the tables are. */
export function sweepSummary(r: SweepResult, fieldFile: string, weatherFile: string) {
  const pick = (i: number) => {
    const d = r.designs[i];
    return {
      design: d.design,
      depth_m: d.depth_m,
      spacing_m: d.spacing_m,
      management: d.management,
      [LOAD_MEASURE]: d[LOAD_MEASURE],
      [WETNESS_MEASURE]: d[WETNESS_MEASURE],
      [r.costColumns.annual]: d[r.costColumns.annual],
      [r.costColumns.perKg]: Number.isFinite(Number(d[r.costColumns.perKg]))
        ? d[r.costColumns.perKg]
        : null,
      frontier_share: d.frontier_share,
    };
  };
  return {
    generated_by: `tileflux ${VERSION}`,
    field: r.plan.field.name,
    field_file: fieldFile,
    weather_file: weatherFile,
    from: r.from,
    to: r.to,
    years: r.years,
    designs: r.designs.length,
    samples: r.plan.samples.length,
    seed: r.plan.seed,
    uncertain: r.plan.params.map((p) => ({ key: p.key, low: p.low, high: p.high, scale: p.scale })),
    costs: { ...r.plan.costs, illustrative_defaults: !r.plan.costsGiven },
    baseline: pick(r.plan.baselineIndex),
    frontier: r.frontier.map(pick),
    caution: CAUTION,
  };
}

/**
 * summary.json of a study: the first climate's sweep as `sweepSummary` gives it (so a study
 * under one climate reads as before), then every climate with its own baseline and frontier,
 * each design on any frontier with its rank per climate, and the designs robust across climates.
 */
export function studySummary(s: ClimateStudy, fieldFile: string, files: readonly string[]) {
  const { caution, ...first } = sweepSummary(s.climates[0].result, fieldFile, files[0]);
  const designs = s.climates[0].result.designs;
  return {
    ...first,
    climates: s.climates.map((c, k) => {
      const one = sweepSummary(c.result, fieldFile, files[k]);
      return {
        name: c.name,
        weather_file: files[k],
        read_as: c.source,
        from: one.from,
        to: one.to,
        years: one.years,
        precip_mean_mm_yr: roundTo(c.figures.precipMmYr, 1),
        ref_et_mean_mm_yr: roundTo(c.figures.refEtMmYr, 1),
        ref_et_method: c.figures.refEtMethod,
        baseline: one.baseline,
        frontier: one.frontier,
      };
    }),
    frontier_by_climate: frontierUnion(s).map((d) => ({
      design: designs[d].design,
      rank: Object.fromEntries(s.climates.map((c, k) => [c.name, s.ranks[k][d] || null])),
      robust_across_climates: s.robust[d],
    })),
    robust_across_climates: frontierUnion(s)
      .filter((d) => s.robust[d])
      .map((d) => designs[d].design),
    caution,
  };
}

/** Sweep CSV rows: booleans as text, NaN as an empty cell (toCsv). */
function csvRows(rows: SweepResult['designs']): Array<Record<string, string | number>> {
  return rows.map((r) =>
    Object.fromEntries(
      Object.entries(r).map(([k, v]) => [k, typeof v === 'boolean' ? String(v) : v]),
    ),
  );
}

/** The printed summary of a study: the climates, the candidates under each, what was written. */
export function studyText(
  study: ClimateStudy,
  out: string,
  written: readonly string[],
  images = false,
): string[] {
  const first = study.climates[0].result;
  const several = study.climates.length > 1;
  const head = several
    ? `${first.plan.field.name}: ${first.designs.length} designs x ${first.plan.samples.length} soil samples under ${study.climates.length} climates`
    : `${first.plan.field.name}: ${first.designs.length} designs x ${first.plan.samples.length} soil samples, ${first.from} to ${first.to} (${first.years} years)`;
  const candidates = study.climates.flatMap(({ name, result: r }) => [
    '',
    `Recommended candidates${several ? ` under ${name}` : ''} (${r.frontier.length} on the trade-off frontier of nitrate-N load, aeration-stress days and cost; baseline: ${r.designs[r.plan.baselineIndex].design}):`,
    ...recommendationLines(r),
  ]);
  const robust = several
    ? [
        '',
        `Frontier designs under each climate (rank on each frontier, lowest load first; - = dominated there; ${study.robust.filter(Boolean).length} robust across climates):`,
        ...robustnessLines(study).map((l) => `  ${l}`),
      ]
    : [];
  return [
    head,
    ...climateLines(study).map((l) => `  climate ${l}`),
    ...candidates,
    ...robust,
    '',
    `Wrote ${out}/ (${written.join(', ')}).`,
    ...chartsLines(out, written, images),
    ...(written.includes('report.html') ? [`Report: ${join(out, 'report.html')}`] : []),
    ...(first.plan.costsGiven
      ? []
      : ['Costs are illustrative defaults (no costs: section); put local prices there.']),
    CAUTION,
  ];
}

/** Run the sweep of the field file at `fieldPath` and write the study folder. */
export async function sweep(fieldPath: string, o: SweepCommandOptions): Promise<void> {
  const images = imagesOf(o);
  const samples = wholeNumber(o.samples, '--samples', 1, 10000);
  const seed = wholeNumber(o.seed, '--seed', 0, Number.MAX_SAFE_INTEGER);
  const workers = wholeNumber(o.workers, '--workers', 1, 64);
  // Ctrl-C: stop the workers, write nothing, exit 130.
  const stop = new AbortController();
  const onSigint = () => stop.abort();
  process.on('SIGINT', onSigint);
  let bar: ReturnType<typeof progress> | undefined;
  try {
    const specs = o.weather.map(climateSpec);
    checkClimateNames(
      specs.map((c) => c.name),
      '--weather',
    );
    const field = readFieldFile(fieldPath);
    const climates: ClimateInput[] = specs.map((c) => {
      const r = readWeatherOption(c.file, o);
      return {
        name: c.name,
        weather: r.series,
        source: `${basename(c.file)}, ${weatherReadNote(r)}`,
      };
    });
    const files = specs.map((c) => basename(c.file));
    const out = o.out ?? `${basename(fieldPath).replace(/\.[^.]*$/, '')}-sweep`;
    let last = 0;
    const study = await sweepClimatesParallel(field.base, climates, {
      samples,
      seed,
      workers,
      signal: stop.signal,
      onProgress: (done, total) => {
        bar ??= progress(total, 'sweeping');
        for (; last < done; last++) bar.tick('designs x samples');
      },
    });
    bar?.stop();
    const written = ['designs.csv', 'samples.csv', 'summary.json'];
    const summary = studySummary(study, basename(fieldPath), files);
    await writeDirAtomic(
      out,
      Boolean(o.force),
      async (dir) => {
        const check = () => {
          if (stop.signal.aborted) throw new Error('stopped');
        };
        const csv = (t: 'designs' | 'samples') => toCsv(csvRows(studyRows(study, t)), 'si');
        writeFileSync(join(dir, 'designs.csv'), csv('designs'));
        writeFileSync(join(dir, 'samples.csv'), csv('samples'));
        writeFileSync(join(dir, 'summary.json'), JSON.stringify(summary, null, 2) + '\n');
        check();
        if (o.charts === false && o.report === false) return;
        const charts = buildStudyChartSpecs(study);
        if (o.charts !== false) {
          await writeCharts(dir, charts.specs, { images });
          written.push('charts/');
          check();
        }
        if (o.report !== false) {
          writeFileSync(join(dir, 'report.html'), buildSweepReportHtml(study, charts));
          written.push('report.html');
        }
        check();
      },
      { inputs: [fieldPath, ...specs.map((c) => c.file)] },
    );
    emit(o.json, summary, () => studyText(study, out, written, images).join('\n'));
  } catch (err) {
    bar?.stop();
    if (!stop.signal.aborted) throw err;
    process.stderr.write('tileflux: stopped by SIGINT; nothing was written\n');
    process.exitCode = 130;
  } finally {
    process.off('SIGINT', onSigint);
  }
}
