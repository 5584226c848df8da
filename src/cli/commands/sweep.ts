/**
 * `tileflux sweep FIELD --weather CSV --out DIR`: the planner's study. Runs every design of the
 * field file's `sweep:` section (drain depth x spacing x outlet management) for each soil sample
 * on worker threads, and writes designs.csv, samples.csv, summary.json, charts/ and report.html
 * atomically. Ctrl-C stops it with nothing written.
 */
import { writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import type { Command } from 'commander';
import { TilefluxError } from '../../errors.js';
import { readFieldFile } from '../../io/field.js';
import { sweepParallel } from '../../io/sweepPool.js';
import { toCsv } from '../../io/tables.js';
import { readWeatherFile } from '../../io/weather.js';
import { writeCharts } from '../../report/index.js';
import { buildSweepChartSpecs } from '../../report/sweepCharts.js';
import { buildSweepReportHtml } from '../../report/sweepReport.js';
import {
  LOAD_MEASURE,
  WETNESS_MEASURE,
  recommendationLines,
  type SweepResult,
} from '../../scenarios/sweep.js';
import { VERSION } from '../../version.js';
import { action, CAUTION, emit } from '../common.js';
import { writeDirAtomic } from '../../io/atomicOutput.js';
import { progress } from '../progress.js';
import {
  addWeatherReadOptions,
  weatherReadOptions,
  type WeatherReadFlags,
} from '../weatherOptions.js';

interface SweepCommandOptions extends WeatherReadFlags {
  weather: string;
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

/** Sweep CSV rows: booleans as text, NaN as an empty cell (toCsv). */
function csvRows(rows: SweepResult['designs']): Array<Record<string, string | number>> {
  return rows.map((r) =>
    Object.fromEntries(
      Object.entries(r).map(([k, v]) => [k, typeof v === 'boolean' ? String(v) : v]),
    ),
  );
}

export function registerSweep(program: Command): void {
  const cmd = program
    .command('sweep')
    .summary('sweep designs and managements under uncertain soils, with costs, and rank them')
    .description(
      'Run every design of the field file’s sweep: section (drain depth x lateral spacing x ' +
        'outlet management) over a weather record, for each Latin-hypercube sample of the ' +
        'uncertain soil values, with installed and annualised costs (costs: section, or ' +
        'illustrative defaults). Writes designs.csv (one row per design: medians and 10th/90th ' +
        'percentiles across the samples, changes against the field as given, cost per kg N ' +
        'avoided, on_frontier, frontier_share), samples.csv, summary.json, charts/ and ' +
        'report.html, and prints the recommended candidates. Results are the same for any ' +
        '--workers with the same --seed.',
    )
    .argument('<field>', 'field file with a sweep: section (`tileflux init` shows one)')
    .requiredOption('-w, --weather <csv>', 'daily weather CSV (see `tileflux weather check`)');
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
        '    tileflux sweep data-demo/field.yaml --weather data-demo/weather.csv --out quick --samples 8 --workers 2\n\n' +
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
          const field = readFieldFile(fieldPath);
          const weather = readWeatherFile(o.weather, weatherReadOptions(o));
          const out = o.out ?? `${basename(fieldPath).replace(/\.[^.]*$/, '')}-sweep`;
          let last = 0;
          const result = await sweepParallel(field.base, weather.series, {
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
          const summary = sweepSummary(result, basename(fieldPath), basename(o.weather));
          await writeDirAtomic(
            out,
            Boolean(o.force),
            async (dir) => {
              const check = () => {
                if (stop.signal.aborted) throw new Error('stopped');
              };
              writeFileSync(join(dir, 'designs.csv'), toCsv(csvRows(result.designs), 'si'));
              writeFileSync(join(dir, 'samples.csv'), toCsv(csvRows(result.samples), 'si'));
              writeFileSync(join(dir, 'summary.json'), JSON.stringify(summary, null, 2) + '\n');
              check();
              if (o.charts === false && o.report === false) return;
              const specs = buildSweepChartSpecs(result);
              if (o.charts !== false) {
                await writeCharts(dir, specs);
                written.push('charts/');
                check();
              }
              if (o.report !== false) {
                writeFileSync(
                  join(dir, 'report.html'),
                  buildSweepReportHtml(result, specs, basename(o.weather)),
                );
                written.push('report.html');
              }
              check();
            },
            { inputs: [fieldPath, o.weather] },
          );
          emit(o.json, summary, () =>
            [
              `${result.plan.field.name}: ${result.designs.length} designs x ${result.plan.samples.length} soil samples, ${result.from} to ${result.to} (${result.years} years)`,
              '',
              `Recommended candidates (${result.frontier.length} on the trade-off frontier of nitrate-N load, aeration-stress days and cost; baseline: ${result.designs[result.plan.baselineIndex].design}):`,
              ...recommendationLines(result),
              '',
              `Wrote ${out}/ (${written.join(', ')}).`,
              ...(written.includes('report.html') ? [`Report: ${join(out, 'report.html')}`] : []),
              ...(result.plan.costsGiven
                ? []
                : ['Costs are illustrative defaults (no costs: section); put local prices there.']),
              CAUTION,
            ].join('\n'),
          );
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
