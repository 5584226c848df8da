/**
 * The list of commands, cheap to load: name, the usage term `--help` shows, the one-line
 * summary, and a loader that imports the command's module only when it is asked for. `main.ts`
 * uses it so that `tileflux --help` and a single command load no other command's code (the
 * engine, charts and schemas take most of a cold start). Each command module takes its summary
 * from here, and a test checks that the terms match what the modules register.
 */
import type { Command } from 'commander';

/** One command of the CLI as the top-level help lists it. */
export interface CatalogEntry {
  /** The word typed after `tileflux`. */
  readonly name: string;
  /** The usage term shown in the top-level help (the name with its options and arguments). */
  readonly term: string;
  /** The one-line summary shown in the top-level help. */
  readonly summary: string;
  /** Imports the command's module and returns its registration. */
  readonly load: () => Promise<(program: Command) => void>;
}

/** Every command, in the order the top-level help lists them. */
export const COMMANDS: readonly CatalogEntry[] = [
  {
    name: 'demo',
    term: 'demo [options]',
    summary: 'compare drainage alternatives on the bundled demo field (start here)',
    load: async () => (await import('./commands/demo.js')).registerDemo,
  },
  {
    name: 'run',
    term: 'run [options] <field>',
    summary: 'simulate a field’s drainage scenarios over a weather record',
    load: async () => (await import('./commands/run.js')).registerRun,
  },
  {
    name: 'sweep',
    term: 'sweep [options] <field>',
    summary: 'sweep designs and managements under uncertain soils, with costs, and rank them',
    load: async () => (await import('./commands/sweep.js')).registerSweep,
  },
  {
    name: 'batch',
    term: 'batch [options] <manifest>',
    summary: 'run many fields from a manifest CSV, sharded across machines, into Parquet',
    load: async () => (await import('./commands/batch.js')).registerBatch,
  },
  {
    name: 'fit',
    term: 'fit [options] <field>',
    summary: 'fit a field to a monitored site’s drain flow and water table; show how well it fits',
    load: async () => (await import('./commands/fit.js')).registerFit,
  },
  {
    name: 'explorer',
    term: 'explorer [options] <field>',
    summary: 'write an interactive page that reruns two designs in the browser',
    load: async () => (await import('./commands/explorer.js')).registerExplorer,
  },
  {
    name: 'init',
    term: 'init [options] [file]',
    summary: 'write a commented starter field file',
    load: async () => (await import('./commands/init.js')).registerInit,
  },
  {
    name: 'weather',
    term: 'weather',
    summary: 'check a daily weather CSV, or make a synthetic one',
    load: async () => (await import('./commands/weather.js')).registerWeather,
  },
  {
    name: 'spacing',
    term: 'spacing [options]',
    summary: 'drain spacing for a drainage rate (Hooghoudt) or a drawdown time (Glover-Dumm)',
    load: async () => (await import('./commands/spacing.js')).registerSpacing,
  },
  {
    name: 'size',
    term: 'size [options]',
    summary: 'pipe size for a drain line or main (Manning, next commercial size up)',
    load: async () => (await import('./commands/size.js')).registerSize,
  },
  {
    name: 'system',
    term: 'system [options] <system>',
    summary: 'design a drain system: mains and laterals sized, grades and depth of cut',
    load: async () => (await import('./commands/system.js')).registerSystem,
  },
];

/** The summary of the command `name`, for its module's `.summary(...)`. */
export function summaryOf(name: string): string {
  const entry = COMMANDS.find((c) => c.name === name);
  if (!entry) throw new Error(`no command "${name}" in the catalog`);
  return entry.summary;
}

/**
 * The catalog entry a command line asks for: its first word that is not an option, or the word
 * after `help` (`tileflux help size`). Undefined when it names no known command (no arguments,
 * `--help`, `-V`, or a misspelt command, which the full catalog then reports).
 */
export function requestedCommand(args: readonly string[]): CatalogEntry | undefined {
  const words = args.filter((a) => !a.startsWith('-'));
  const word = words[0] === 'help' ? words[1] : words[0];
  return COMMANDS.find((c) => c.name === word);
}
