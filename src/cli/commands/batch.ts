/**
 * `tileflux batch MANIFEST.csv --out DIR`: many fields at once, one job per manifest row, split
 * into shards that separate machines can run into the same folder. Each shard writes
 * DIR/annual-KofN.parquet, DIR/summary-KofN.parquet and DIR/status-KofN.csv, each under a
 * temporary name renamed into place, and touches no other shard's files.
 */
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { Command } from 'commander';
import { clip, TilefluxError } from '../../errors.js';
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import {
  loadJob,
  readManifest,
  SCENARIO_SEPARATOR,
  type FieldCache,
  type ManifestJob,
} from '../../io/batchManifest.js';
import { batchRunner, defaultWorkers, sharedWeather } from '../../io/batchPool.js';
import { oneLine, readStatus, statusCsv, type JobStatus } from '../../io/batchStatus.js';
import { BatchStore } from '../../io/batchStore.js';
import type { LoadedField } from '../../io/field.js';
import { readWeatherFile } from '../../io/weather.js';
import { shardRows, shardTag, type Shard } from '../../scenarios/batch.js';
import { shardOf } from '../shard.js';
import { action, CAUTION, emit } from '../common.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import { progress } from '../progress.js';
import {
  addWeatherReadOptions,
  weatherReadOptions,
  type WeatherReadFlags,
} from '../weatherOptions.js';
import { summaryOf } from '../catalog.js';

interface BatchCommandOptions extends WeatherReadFlags {
  out: string;
  shard?: string;
  shards?: string;
  workers?: string;
  resume?: boolean;
  force?: boolean;
  json?: boolean;
}

/** Exit code of a batch that ran but in which some jobs failed (see the status file). */
export const EXIT_JOBS_FAILED = 3;

/** Seconds between the rewrites of a shard's files while it runs (what --resume picks up). */
const CHECKPOINT_S = 30;
/** Test hook: `TILEFLUX_TEST_CHECKPOINT_S=0` rewrites the files after every job. */
const checkpointS = () => Number(process.env.TILEFLUX_TEST_CHECKPOINT_S ?? CHECKPOINT_S);

const SIGNALS = { SIGINT: 2, SIGTERM: 15, SIGHUP: 1 } as const;

/** The files of one shard in DIR. */
export function shardFiles(dir: string, s: Shard) {
  const tag = shardTag(s);
  return {
    annual: join(dir, `annual-${tag}.parquet`),
    summary: join(dir, `summary-${tag}.parquet`),
    status: join(dir, `status-${tag}.csv`),
  };
}

function workersOption(v: string | undefined): number {
  if (v === undefined) return defaultWorkers();
  if (!/^\d+$/.test(v) || Number(v) > 64)
    throw new TilefluxError(
      `--workers expects a whole number from 0 (this thread) to 64; got ${v}`,
    );
  return Number(v);
}

/**
 * Check every manifest row before anything runs (except the rows kept from this shard's earlier
 * run): the first problem is the error, with the lines of the others.
 */
function checkAll(
  manifest: ReturnType<typeof readManifest>,
  skip: ReadonlySet<number>,
  cache: FieldCache,
): Map<number, LoadedField> {
  const fields = new Map<number, LoadedField>();
  const problems: Array<{ line: number; error: TilefluxError }> = [];
  for (const job of manifest.jobs) {
    if (skip.has(job.index)) continue;
    try {
      fields.set(job.index, loadJob(manifest, job, cache));
    } catch (err) {
      if (!(err instanceof TilefluxError)) throw err;
      problems.push({ line: job.line, error: err });
    }
  }
  if (problems.length > 0) {
    const more = problems.slice(1).map((p) => p.line);
    const shown = more.slice(0, 10).join(', ') + (more.length > 10 ? ', ...' : '');
    throw new TilefluxError(
      problems[0].error.message +
        (more.length ? ` (${more.length} more rows have problems: lines ${shown})` : '') +
        '; nothing was run',
    );
  }
  return fields;
}

export function registerBatch(program: Command): void {
  const cmd = program
    .command('batch')
    .summary(summaryOf('batch'))
    .description(
      'Run every job of a manifest CSV (one row per job: id, field, weather, optional ' +
        `scenarios separated by ${SCENARIO_SEPARATOR}, optional columns named by field-file keys ` +
        'such as drains.spacing that change the field, e.g. "15 m"; paths relative to the ' +
        'manifest) and write, per shard, annual-KofN.parquet (one row per job x scenario x ' +
        'year, the columns of annual.csv with job_id), summary-KofN.parquet (one row per job x ' +
        'scenario, the columns of comparison.csv with job_id) and status-KofN.csv (ok, failed ' +
        'with the error, or pending; seconds) into the output folder.\n\n' +
        'Every row is checked before anything runs (the manifest, the field files with the ' +
        'row’s changes, the scenario names, that the weather files exist): a bad row stops the ' +
        'batch with its line and column. A job that fails while running (a bad weather record, ' +
        'a period the record does not cover) is marked failed and the others go on; the exit ' +
        `code is then ${EXIT_JOBS_FAILED}.\n\n` +
        'A shard takes the rows whose 0-based index i has i mod N = K: --shard K/N, or K from ' +
        'JOB_COMPLETION_INDEX (Kubernetes Indexed Job) or SLURM_ARRAY_TASK_ID (Slurm array) ' +
        'with --shards N; without either, the whole manifest is shard 0/1. The shard’s files ' +
        `are rewritten every ${CHECKPOINT_S} s while it runs and on Ctrl-C or SIGTERM, so ` +
        '--resume continues where it stopped.',
    )
    .argument('<manifest>', 'manifest CSV: id,field,weather[,scenarios][,field keys...]')
    .requiredOption('-o, --out <dir>', 'output folder, shared by the shards');
  cmd
    .option('--shard <K/N>', 'run shard K of N (0 <= K < N)')
    .option(
      '--shards <n>',
      'number of shards, with K from JOB_COMPLETION_INDEX or SLURM_ARRAY_TASK_ID',
    )
    .option(
      '--workers <n>',
      'worker threads; 0 runs the jobs in this thread (default: the cores available, at most 8)',
    )
    .option(
      '--resume',
      'keep the jobs this shard’s status file marks ok (and their rows); run the rest',
    )
    .option('-f, --force', 'run the shard again, replacing its files')
    .option('--json', 'print the shard’s summary as JSON on stdout');
  addWeatherReadOptions(cmd);
  cmd
    .addHelpText(
      'after',
      '\nExamples:\n  tileflux batch jobs.csv --out results --workers 2\n' +
        '  tileflux batch jobs.csv --out results --shard 1/4\n' +
        '  JOB_COMPLETION_INDEX=1 tileflux batch jobs.csv --out results --shards 4 --resume\n\n' +
        CAUTION,
    )
    .action(action(async (manifestPath: string, o: BatchCommandOptions) => batch(manifestPath, o)));
}

async function batch(manifestPath: string, o: BatchCommandOptions): Promise<void> {
  const started = performance.now();
  if (o.resume && o.force) throw new TilefluxError('give --resume or --force, not both');
  const shard = shardOf(o, process.env);
  const workers = workersOption(o.workers);
  const weatherOptions = weatherReadOptions(o);
  if (o.out.trim() === '') throw new TilefluxError('--out is empty; give the output folder');
  const manifest = readManifest(manifestPath);
  const files = shardFiles(o.out, shard);
  const tag = `shard ${shard.index}/${shard.count}`;
  if (existsSync(o.out) && !statSync(o.out).isDirectory())
    throw new TilefluxError(`--out ${clip(o.out)} is a file; give a folder (shared by the shards)`);
  const existing = Object.values(files).filter((f) => existsSync(f));
  if (existing.length > 0 && !o.resume && !o.force)
    throw new TilefluxError(
      `${clip(existing[0])} already exists (${tag} of an earlier batch); use --resume to continue it or --force to run it again`,
    );

  const mine = shardRows(manifest.jobs.length, shard).map((i) => manifest.jobs[i]);
  // --resume: jobs this shard's status marks ok for the same manifest row are kept, if their
  // rows are in both Parquet files.
  const earlier = o.resume && existsSync(files.status) ? readStatus(files.status) : [];
  const earlierOk = new Map(
    earlier.filter((s) => s.status === 'ok').map((s) => [s.job_id, s] as const),
  );
  const candidates = new Map(
    mine
      .filter((j) => earlierOk.get(j.id)?.manifest_row_sha256 === j.sha256)
      .map((j) => [j.id, j.index] as const),
  );
  const store = await BatchStore.open();
  try {
    const kept = await store.keepFrom(files, candidates);
    const keptRows = new Set(mine.filter((j) => kept.has(j.id)).map((j) => j.index));
    const fields = checkAll(manifest, keptRows, new Map());

    const status = new Map<number, JobStatus>(
      mine.map((j) => [
        j.index,
        kept.has(j.id)
          ? earlierOk.get(j.id)!
          : {
              job_id: j.id,
              status: 'pending',
              error: '',
              seconds: 0,
              manifest_row_sha256: j.sha256,
            },
      ]),
    );
    const todo = mine.filter((j) => !keptRows.has(j.index));
    mkdirSync(o.out, { recursive: true });

    // The shard's files: the tables first, the status last, so a job marked ok has its rows.
    let writing: Promise<void> = Promise.resolve();
    let lastWrite = performance.now();
    const writeFiles = () => {
      writing = writing.then(async () => {
        lastWrite = performance.now();
        await store.write('annual', files.annual);
        await store.write('summary', files.summary);
        writeFileAtomic(files.status, statusCsv(mine.map((j) => status.get(j.index)!)), true);
      });
      return writing;
    };

    const weatherCache = new Map<string, WeatherSeries | Error>();
    const weatherOf = (job: ManifestJob): WeatherSeries => {
      let w = weatherCache.get(job.weatherPath);
      if (w === undefined) {
        try {
          w = sharedWeather(
            readWeatherFile(job.weatherPath, { ...weatherOptions, file: job.weather }).series,
          );
        } catch (err) {
          w = err instanceof Error ? err : new Error(String(err));
        }
        weatherCache.set(job.weatherPath, w);
      }
      if (w instanceof Error) throw w;
      return w;
    };

    const runner = batchRunner(Math.min(workers, todo.length));
    let stopped: keyof typeof SIGNALS | undefined;
    const onSignal = (s: keyof typeof SIGNALS) => {
      if (stopped) return;
      stopped = s;
      void runner.close();
    };
    const handlers = Object.fromEntries(
      Object.keys(SIGNALS).map((s) => [s, () => onSignal(s as keyof typeof SIGNALS)]),
    ) as Record<keyof typeof SIGNALS, () => void>;
    for (const s of Object.keys(SIGNALS) as Array<keyof typeof SIGNALS>) process.on(s, handlers[s]);
    const bar = progress(todo.length, `${tag} jobs`, { logLines: true });
    try {
      let next = 0;
      const lane = async () => {
        while (next < todo.length && !stopped) {
          const job = todo[next++];
          const t0 = performance.now();
          const done = (state: JobStatus['status'], error = '') =>
            status.set(job.index, {
              job_id: job.id,
              status: state,
              error,
              seconds: (performance.now() - t0) / 1000,
              manifest_row_sha256: job.sha256,
            });
          try {
            const field = fields.get(job.index)!;
            const rows = await runner.run({
              id: job.id,
              field: { base: field.base, scenarios: field.scenarios },
              weather: weatherOf(job),
              ...(job.scenarios && { only: job.scenarios }),
            });
            await store.add(job.index, rows);
            done('ok');
          } catch (err) {
            if (stopped) return;
            done('failed', oneLine(err));
          }
          bar.tick(job.id);
          if (performance.now() - lastWrite >= checkpointS() * 1000) void writeFiles();
        }
      };
      // Two jobs in flight per worker keep every worker busy while results are stored.
      await Promise.all(Array.from({ length: Math.max(1, runner.workers * 2) }, lane));
    } finally {
      bar.stop();
      for (const s of Object.keys(SIGNALS) as Array<keyof typeof SIGNALS>)
        process.off(s, handlers[s]);
      await runner.close();
    }
    await writeFiles();

    const all = mine.map((j) => status.get(j.index)!);
    const failed = all.filter((s) => s.status === 'failed');
    const ok = all.filter((s) => s.status === 'ok').length;
    const pending = all.filter((s) => s.status === 'pending').length;
    const seconds = (performance.now() - started) / 1000;
    const annualRows = await store.rows('annual');
    const summaryRows = await store.rows('summary');
    if (stopped) {
      process.stderr.write(
        `tileflux: stopped by ${stopped}; ${ok} of ${all.length} jobs of ${tag} are recorded in ${files.status}; run again with --resume to finish\n`,
      );
      process.exitCode = 128 + SIGNALS[stopped];
      return;
    }
    const report = {
      shard: { index: shard.index, count: shard.count },
      manifest: manifest.file,
      jobs: all.length,
      ok,
      failed: failed.length,
      kept_from_earlier_run: kept.size,
      pending,
      workers: runner.workers,
      seconds,
      files: { ...files, annual_rows: annualRows, summary_rows: summaryRows },
      failures: failed.map((f) => ({ job_id: f.job_id, error: f.error })),
      caution: CAUTION,
    };
    emit(o.json, report, () =>
      [
        `${tag}: ${all.length} jobs of ${manifest.jobs.length} in ${manifest.file} (${ok} ok, ${failed.length} failed${kept.size ? `, ${kept.size} kept from the earlier run` : ''}), ${seconds.toFixed(1)} s on ${runner.workers === 0 ? 'this thread' : `${runner.workers} worker${runner.workers === 1 ? '' : 's'}`}`,
        ...failed.slice(0, 10).map((f) => `  failed: ${f.job_id}: ${f.error}`),
        ...(failed.length > 10 ? [`  ... and ${failed.length - 10} more in ${files.status}`] : []),
        `Wrote ${files.annual} (${annualRows} rows), ${files.summary} (${summaryRows} rows), ${files.status}.`,
        CAUTION,
      ].join('\n'),
    );
    if (failed.length > 0) process.exitCode = EXIT_JOBS_FAILED;
  } finally {
    store.close();
  }
}
