/**
 * Which shard of a batch this process runs, from `--shard K/N`, `--shards N` and the scheduler's
 * environment: the CLI's reading of its options, so its messages name the flags.
 */
import { TilefluxError } from '../errors.js';
import type { Shard } from '../scenarios/batch.js';

/** Environment variables that give a shard's index, in the order they are looked at. */
export const SHARD_INDEX_VARIABLES = ['JOB_COMPLETION_INDEX', 'SLURM_ARRAY_TASK_ID'] as const;

const WHOLE = /^(0|[1-9]\d{0,5})$/;

/**
 * The shard to run, from `--shard K/N`, else the index from the environment
 * (JOB_COMPLETION_INDEX of a Kubernetes Indexed Job, SLURM_ARRAY_TASK_ID of a Slurm array) with
 * the count from `--shards N`; without either, the whole manifest as shard 0/1.
 *
 * @example shardOf({ shards: '4' }, { JOB_COMPLETION_INDEX: '2' }) // { index: 2, count: 4 }
 */
export function shardOf(
  o: { shard?: string; shards?: string },
  env: Readonly<Record<string, string | undefined>>,
): Shard {
  let count: number | undefined;
  if (o.shards !== undefined) {
    if (!WHOLE.test(o.shards) || Number(o.shards) < 1)
      throw new TilefluxError(
        `--shards expects a whole number of shards, 1 or more; got ${o.shards}`,
      );
    count = Number(o.shards);
  }
  if (o.shard !== undefined) {
    const m = /^(\d+)\/(\d+)$/.exec(o.shard.trim());
    if (!m || !WHOLE.test(m[1]) || !WHOLE.test(m[2]) || Number(m[2]) < 1)
      throw new TilefluxError(`--shard expects K/N with 0 <= K < N, e.g. 0/4; got ${o.shard}`);
    const s = { index: Number(m[1]), count: Number(m[2]) };
    if (s.index >= s.count)
      throw new TilefluxError(
        `--shard ${o.shard}: K must be below N (shards are numbered 0 to ${s.count - 1})`,
      );
    if (count !== undefined && count !== s.count)
      throw new TilefluxError(`--shard ${o.shard} and --shards ${o.shards} disagree on the count`);
    return s;
  }
  const name = SHARD_INDEX_VARIABLES.find((v) => (env[v] ?? '').trim() !== '');
  if (name === undefined) {
    if (count !== undefined && count > 1)
      throw new TilefluxError(
        `--shards ${count} needs the shard's index: --shard K/${count}, or ${SHARD_INDEX_VARIABLES.join(' or ')} in the environment`,
      );
    return { index: 0, count: 1 };
  }
  const value = env[name]!.trim();
  if (count === undefined)
    throw new TilefluxError(
      `${name}=${value} is set but --shards is not; give --shards N (the number of shards) or --shard K/N`,
    );
  if (!WHOLE.test(value))
    throw new TilefluxError(`${name} expects a whole number from 0 to ${count - 1}; got ${value}`);
  const index = Number(value);
  if (index >= count)
    throw new TilefluxError(
      `${name}=${index} is not below --shards ${count}; shards are numbered 0 to ${count - 1}` +
        (name === 'SLURM_ARRAY_TASK_ID' ? ` (sbatch --array=0-${count - 1})` : ''),
    );
  return { index, count };
}
