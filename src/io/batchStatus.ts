/**
 * The status file of a batch shard (status-KofN.csv): one line per job of the shard with its
 * outcome (ok, failed or pending), the one-line error of a failed job, the seconds it took and
 * the hash of its manifest row, so `--resume` keeps only results that still fit the manifest.
 */
import { readFileSync } from 'node:fs';
import { stringify } from 'csv-stringify/sync';
import { clip, SettingError } from '../errors.js';
import { safeCell } from './tables.js';
import { CsvRows, CsvSyntaxError } from './weather/csvRows.js';

export const STATUS_COLUMNS = ['job_id', 'status', 'error', 'seconds', 'manifest_row_sha256'];

export type JobState = 'ok' | 'failed' | 'pending';

export interface JobStatus {
  job_id: string;
  status: JobState;
  /** The one-line error of a failed job, else empty. */
  error: string;
  /** Wall time of the job, s (0 while pending). */
  seconds: number;
  manifest_row_sha256: string;
}

/** The status file's text. */
export function statusCsv(rows: readonly JobStatus[]): string {
  return stringify([
    STATUS_COLUMNS,
    ...rows.map((r) => [
      safeCell(r.job_id),
      r.status,
      safeCell(r.error),
      r.seconds.toFixed(3),
      r.manifest_row_sha256,
    ]),
  ]);
}

/** Names of the user errors (TilefluxError and its subclasses), which keep their message. */
const USER_ERRORS = new Set(['TilefluxError', 'SettingError', 'WeatherInputError']);

/**
 * An error as one line for the status file: no line breaks, at most 1,000 characters. Errors
 * are told apart by name, as a job's error may come back from a worker thread as a plain Error.
 */
export function oneLine(err: unknown): string {
  const text =
    err instanceof Error
      ? USER_ERRORS.has(err.name)
        ? err.message
        : `internal error: ${err.message}`
      : String(err);
  return clip(text, 1000);
}

/** Read a status file written by an earlier run of the same shard. */
export function readStatus(path: string): JobStatus[] {
  const text = readFileSync(path, 'utf8');
  const rows = new CsvRows(text);
  const bad = (line: number, what: string) =>
    new SettingError(
      (n) =>
        `${path}: line ${line}: ${what}; this is not a status file of tileflux batch (remove it or use ${n('force')} to start the shard again)`,
    );
  try {
    if (!rows.next() || rows.fields().join(',') !== STATUS_COLUMNS.join(','))
      throw bad(rows.line || 1, `the header is not ${STATUS_COLUMNS.join(',')}`);
    const out: JobStatus[] = [];
    while (rows.next()) {
      const f = rows.fields();
      const status = f[1] as JobState;
      if (f.length !== STATUS_COLUMNS.length || !['ok', 'failed', 'pending'].includes(status))
        throw bad(
          rows.line,
          `expected ${STATUS_COLUMNS.length} cells with status ok, failed or pending`,
        );
      // Ids were written with the spreadsheet-formula guard (safeCell): take it off again.
      const id = /^'[=+\-@\t\r]/.test(f[0]) ? f[0].slice(1) : f[0];
      out.push({
        job_id: id,
        status,
        error: f[2],
        seconds: Number(f[3]),
        manifest_row_sha256: f[4],
      });
    }
    return out;
  } catch (err) {
    if (err instanceof CsvSyntaxError) throw bad(err.line, err.message);
    throw err;
  }
}
