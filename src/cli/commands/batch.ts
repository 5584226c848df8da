/**
 * `tileflux batch MANIFEST.csv --out DIR`: many fields at once, one job per manifest row, split
 * into shards that separate machines can run into the same folder. Each shard writes
 * DIR/annual-KofN.parquet, DIR/summary-KofN.parquet and DIR/status-KofN.csv, each under a
 * temporary name renamed into place, and touches no other shard's files.
 */
import type { Command } from 'commander';
import { action, CAUTION } from '../common.js';
import { SCENARIO_SEPARATOR } from '../helpFacts.js';
import { addWeatherReadOptions } from '../weatherFlags.js';
import { summaryOf } from '../catalog.js';
import type { BatchCommandOptions } from '../actions/batch.js';

/** Exit code of a batch that ran but in which some jobs failed (see the status file). */
export const EXIT_JOBS_FAILED = 3;

/** Seconds between the rewrites of a shard's files while it runs (what --resume picks up). */
export const CHECKPOINT_S = 30;
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
    .action(
      action(async (manifestPath: string, o: BatchCommandOptions) =>
        (await import('../actions/batch.js')).batch(manifestPath, o),
      ),
    );
}
