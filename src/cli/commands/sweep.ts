/**
 * `tileflux sweep FIELD --weather [NAME=]CSV ... --out DIR`: the planner's study. Runs every
 * design of the field file's `sweep:` section (drain depth x spacing x outlet management) for
 * each soil sample on worker threads, under each climate given by a --weather, and writes
 * designs.csv, samples.csv, summary.json, charts/ and report.html atomically. Ctrl-C stops it
 * with nothing written.
 */
import { writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import type { Command } from 'commander';
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
import { action, CAUTION, emit } from '../common.js';
import { writeDirAtomic } from '../../io/atomicOutput.js';
import { progress } from '../progress.js';
import {
  addWeatherReadOptions,
  weatherReadNote,
  readWeatherOption,
  type WeatherReadFlags,
} from '../weatherOptions.js';
import { summaryOf } from '../catalog.js';
import { roundTo } from '../../units/decimal.js';

interface SweepCommandOptions extends WeatherReadFlags {
  weather: string[];
  out?: string;
  samples?: string;
  seed?: string;
  workers?: string;
  force?: boolean;
  json?: boolean;
  charts?: boolean;
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
export function studyText(study: ClimateStudy, out: string, written: readonly string[]): string[] {
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
    ...(written.includes('report.html') ? [`Report: ${join(out, 'report.html')}`] : []),
    ...(first.plan.costsGiven
      ? []
      : ['Costs are illustrative defaults (no costs: section); put local prices there.']),
    CAUTION,
  ];
}

export function registerSweep(program: Command): void {
  const cmd = program
    .command('sweep')
    .summary(summaryOf('sweep'))
    .description(
      'Run every design of the field file’s sweep: section (drain depth x lateral spacing x ' +
        'outlet management) over a weather record, for each Latin-hypercube sample of the ' +
        'uncertain soil values, with installed and annualised costs (costs: section, or ' +
        'illustrative defaults). Writes designs.csv (one row per design: medians and 10th/90th ' +
        'percentiles across the samples, changes against the field as given, cost per kg N ' +
        'avoided, on_frontier, frontier_share), samples.csv, summary.json, charts/ and ' +
        'report.html, and prints the recommended candidates. Give --weather once per climate ' +
        '(NAME=FILE) to rank the same designs and soil samples under each: every climate gets ' +
        'its own baseline, results and frontier, the tables a climate column, and the report ' +
        'and summary show which frontier designs hold under every climate. Results are the ' +
        'same for any --workers with the same --seed.',
    )
    .argument('<field>', 'field file with a sweep: section (`tileflux init` shows one)')
    .requiredOption(
      '-w, --weather <[name=]file>',
      'daily weather file of a climate (see `tileflux weather check`); repeat it for more ' +
        'climates, each NAME=FILE with a name of letters, digits, - or _ (default name: the ' +
        'file name without its extension); the reading options apply to every file',
      (v: string, prev: string[] | undefined) => [...(prev ?? []), v],
    );
  addWeatherReadOptions(cmd);
  cmd
    .option('-o, --out <dir>', 'output folder (default: <field file name>-sweep)')
    .option('--samples <n>', 'soil samples per design (default: sweep.samples, else 1)')
    .option('--seed <s>', 'seed of the Latin hypercube (default 1)')
    .option('--workers <k>', 'worker threads (default: the cores available)')
    .option('--no-charts', 'skip the charts/ folder')
    .option('--no-report', 'skip report.html')
    .option('-f, --force', 'replace the output folder if it exists')
    .option('--json', 'print summary.json on stdout instead of the summary')
    .addHelpText(
      'after',
      '\nExamples:\n' +
        '  A sweep written in SI units (sweep: depth: [0.9 m, 1.2 m], spacing: { from: 10 m, ... }):\n' +
        '    tileflux sweep my-field.yaml --weather weather.csv --out study --samples 40 --seed 7\n' +
        '  A study written in US units (depth: [3 ft, 4 ft], spacing: { from: 30 ft, ... }) on a\n' +
        '  GHCN-Daily export in standard units (inches, degF); results are written in SI:\n' +
        '    tileflux sweep my-field-us.yaml --weather export.csv --station XX000000001 \\\n' +
        '      --export-units standard --out study-us --samples 40 --seed 7\n' +
        '  A quick look on the demo field with two workers:\n' +
        '    tileflux sweep data-demo/field.yaml --weather data-demo/weather.csv --out quick --samples 8 --workers 2\n' +
        "  The same designs under today's weather and a wetter, warmer climate made from it by\n" +
        '  weather make --like data-demo/weather.csv --years 30 --seed 1 --precip-change +20%\n' +
        '  --temp-change +2C --out wetter.csv (a scenario you choose, not a projection):\n' +
        '    tileflux sweep data-demo/field.yaml --weather today=data-demo/weather.csv \\\n' +
        '      --weather wetter=wetter.csv --out climates --samples 8\n\n' +
        CAUTION,
    )
    .action(
      action(async (fieldPath: string, o: SweepCommandOptions) => {
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
                await writeCharts(dir, charts.specs);
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
          emit(o.json, summary, () => studyText(study, out, written).join('\n'));
        } catch (err) {
          bar?.stop();
          if (!stop.signal.aborted) throw err;
          process.stderr.write('tileflux: stopped by SIGINT; nothing was written\n');
          process.exitCode = 130;
        } finally {
          process.off('SIGINT', onSigint);
        }
      }),
    );
}
