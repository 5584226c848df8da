/**
 * Shared plumbing for the commands: error handling, `--json` output and the units option
 * (quantity options are in cli/quantityOptions.ts, safe file writes in io/atomicOutput.ts).
 * Every command goes through `action()` so that a user's mistake prints one clear line on
 * stderr and exits non-zero, while a bug still shows its stack. The command modules register
 * their options with this module, so it stays cheap to load: nothing here may import the unit
 * parser, the engine or the schemas (a command's `--help` would pay for them).
 */
import { SettingError, TilefluxError } from '../errors.js';
import { fsErrorReason } from '../io/files.js';
import type { UnitSystem } from '../units/usCustomary.js';

/** Exit codes: 1 for bad input a user can fix, 2 for an internal error (a bug). */
export const EXIT_USER = 1;
export const EXIT_BUG = 2;

/** The flag of each library setting a core error may name (SettingError). */
const FLAG_OF_SETTING: Readonly<Record<string, string>> = {
  from: '--from',
  to: '--to',
  only: '--scenario',
  params: '--params',
  calibrate: '--calibrate',
  validate: '--validate',
  warmupYears: '--warmup-years',
  samples: '--samples',
  shard: '--shard',
  shards: '--shards',
  sizes: '--sizes',
  force: '--force',
  out: '--out',
  profile: '--profile',
  chartYear: '--year',
  // The weather and observation readers' settings.
  fill: '--fill',
  columns: '--columns',
  precipUnit: '--precip-unit',
  tempUnit: '--temp-unit',
  where: '--where',
  station: '--station',
  exportUnits: '--export-units',
  format: '--format',
  areaHa: '--area',
};

/** A user error's message as the CLI says it: settings called by their flags. */
export function cliMessage(err: TilefluxError): string {
  return err instanceof SettingError
    ? err.messageWith((s) => FLAG_OF_SETTING[s] ?? s)
    : err.message;
}

/** Wrap a command's action: user errors become one line on stderr and exit code 1. */
export function action<A extends unknown[]>(
  fn: (...args: A) => Promise<void> | void,
): (...args: A) => Promise<void> {
  return async (...args: A) => {
    try {
      await fn(...args);
    } catch (err) {
      if (err instanceof TilefluxError) {
        process.stderr.write(`tileflux: error: ${cliMessage(err)}\n`);
        process.exitCode = EXIT_USER;
        return;
      }
      const reason = fsErrorReason(err);
      if (reason !== undefined) {
        // The environment refused (full disk, read-only folder...): the user's to fix.
        const path = (err as NodeJS.ErrnoException).path;
        process.stderr.write(`tileflux: error: ${path ? `${path}: ` : ''}${reason}\n`);
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

/** Print a warning on stderr (stdout stays clean for `--json`). */
export function warn(message: string): void {
  process.stderr.write(`tileflux: warning: ${message}\n`);
}

/** Parse --units: si (the default) or us. */
export function parseUnits(u: string | undefined): UnitSystem {
  if (u === undefined || u === 'si') return 'si';
  if (u === 'us') return 'us';
  throw new TilefluxError(`--units expects si or us; got ${u}`);
}

/** One-line caution printed under design and simulation results (README, Cautions). */
export const CAUTION =
  'Planning estimate from simplified physics. Local drainage guides, conservation practice ' +
  'standards, permits and a licensed professional decide the design.';

/**
 * The help of --images, alike in every command that writes charts/: the folder always holds
 * the Vega-Lite specs, and drawing them (vega, then resvg) is most of a short run's time.
 */
export const IMAGES_HELP =
  'also draw each chart in charts/ as SVG and PNG, for documents and slides (about half a ' +
  'second more; report.html draws the charts from their specs without them)';

/**
 * Whether a command draws its charts as images: `--images`, refused beside `--no-charts`
 * (which skips the charts it would draw). Called before any work, so the refusal comes first.
 * @example imagesOf({ charts: true, images: true }) // true
 */
export function imagesOf(o: { charts?: boolean | undefined; images?: boolean | undefined }) {
  if (o.images === true && o.charts === false) {
    throw new TilefluxError(
      '--images draws the charts that --no-charts skips; give one of them, not both',
    );
  }
  return o.images === true;
}

/**
 * The printed line naming the charts of an output folder and what they are (none when the
 * folder has no charts/), so the images are found without reading the help.
 * @example chartsLines('my-run', ['charts/'], false) // ['Charts: my-run/charts/ (Vega-Lite specs; ...)']
 */
export function chartsLines(out: string, written: readonly string[], images: boolean): string[] {
  if (!written.includes('charts/')) return [];
  const what = images
    ? 'Vega-Lite specs, SVG and PNG'
    : 'Vega-Lite specs; --images adds SVG and PNG';
  return [`Charts: ${out}/charts/ (${what})`];
}
