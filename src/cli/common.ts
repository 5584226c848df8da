/**
 * Shared plumbing for the commands: error handling, `--json` output, safe file writes and
 * quantity options. Every command goes through `action()` so that a user's mistake prints one
 * clear line on stderr and exits non-zero, while a bug still shows its stack.
 */
import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync, mkdtempSync } from 'node:fs';
import { dirname, basename, join, resolve } from 'node:path';
import { TilefluxError } from '../errors.js';
import { parseQuantity, type QuantityKind } from '../units/quantity.js';

/** Exit codes: 1 for bad input a user can fix, 2 for an internal error (a bug). */
export const EXIT_USER = 1;
export const EXIT_BUG = 2;

/** Wrap a command's action: user errors become one line on stderr and exit code 1. */
export function action<A extends unknown[]>(
  fn: (...args: A) => Promise<void> | void,
): (...args: A) => Promise<void> {
  return async (...args: A) => {
    try {
      await fn(...args);
    } catch (err) {
      if (err instanceof TilefluxError) {
        process.stderr.write(`tileflux: error: ${err.message}\n`);
        process.exitCode = EXIT_USER;
        return;
      }
      process.stderr.write(`tileflux: internal error (please report it): ${String(err)}\n`);
      if (err instanceof Error && err.stack) process.stderr.write(err.stack + '\n');
      process.exitCode = EXIT_BUG;
    }
  };
}

/** Print a result: the JSON document alone on stdout with `--json`, human text otherwise. */
export function emit(json: boolean | undefined, data: unknown, human: () => string): void {
  if (json) process.stdout.write(JSON.stringify(data, null, 2) + '\n');
  else process.stdout.write(human().replace(/\n?$/, '\n'));
}

/** Parse a quantity option value; undefined stays undefined. */
export function quantityOption(
  value: string | undefined,
  kind: QuantityKind,
  option: string,
): number | undefined {
  return value === undefined ? undefined : parseQuantity(value, kind, option);
}

/** Parse a required quantity option, with a clear error when it is missing. */
export function requiredQuantity(
  value: string | undefined,
  kind: QuantityKind,
  option: string,
): number {
  if (value === undefined) throw new TilefluxError(`${option} is required`);
  return parseQuantity(value, kind, option);
}

/**
 * Write one file atomically (temporary name in the same folder, then rename). An existing file
 * is an error unless `force` is set, so nothing a user has is overwritten by accident.
 */
export function writeFileAtomic(path: string, content: string | Uint8Array, force = false): void {
  const target = resolve(path);
  if (existsSync(target) && !force) {
    throw new TilefluxError(`${path} already exists; use --force to overwrite it`);
  }
  mkdirSync(dirname(target), { recursive: true });
  const tmp = join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
  writeFileSync(tmp, content);
  renameSync(tmp, target);
}

/**
 * Build an output folder atomically: `fill` writes into a fresh temporary folder beside the
 * target, which is renamed into place only when everything succeeded. An existing folder is an
 * error unless `force` is set; with `force` it is replaced only after the new one is complete.
 */
export async function writeDirAtomic(
  path: string,
  force: boolean,
  fill: (tmpDir: string) => Promise<void> | void,
): Promise<void> {
  const target = resolve(path);
  if (existsSync(target) && !force) {
    throw new TilefluxError(`output folder ${path} already exists; use --force to replace it`);
  }
  mkdirSync(dirname(target), { recursive: true });
  const tmp = mkdtempSync(join(dirname(target), `.${basename(target)}.tmp-`));
  try {
    await fill(tmp);
  } catch (err) {
    rmSync(tmp, { recursive: true, force: true });
    throw err;
  }
  if (existsSync(target)) {
    const old = `${target}.old-${process.pid}`;
    renameSync(target, old);
    renameSync(tmp, target);
    rmSync(old, { recursive: true, force: true });
  } else {
    renameSync(tmp, target);
  }
}

/** Format a number for people: a fixed number of decimals, no "-0". */
export function fmt(x: number, decimals = 1): string {
  if (!Number.isFinite(x)) return String(x);
  const s = x.toFixed(decimals);
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

/** One-line caution printed under design and simulation results (DESIGN.md section 8). */
export const CAUTION =
  'Planning estimate from simplified physics. Local drainage guides, conservation practice ' +
  'standards, permits and a licensed professional decide the design.';
