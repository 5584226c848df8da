/**
 * What `tileflux batch` does (registered in cli/commands/batch.ts): check every row of the
 * manifest, run this shard's jobs on worker threads, and keep its Parquet and status files up to
 * date (checkpoints, signals, --resume).
 */
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { clip, TilefluxError } from '../../errors.js';
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import {
  loadJob,
  readManifest,
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
import { CAUTION, emit } from '../common.js';
import { writeFileAtomic } from '../../io/atomicOutput.js';
import { progress } from '../progress.js';
import { weatherReadOptions, type WeatherReadFlags } from '../weatherOptions.js';

import { CHECKPOINT_S, EXIT_JOBS_FAILED } from '../commands/batch.js';

/** The options of `tileflux batch`. */
export interface BatchCommandOptions extends WeatherReadFlags {
  out: string;
  shard?: string;
  shards?: string;
  workers?: string;
  resume?: boolean;
  force?: boolean;
  json?: boolean;
}

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

/** Run the shard of the manifest at `manifestPath` that the options name. */
export async function batch(manifestPath: string, o: BatchCommandOptions): Promise<void> {
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
