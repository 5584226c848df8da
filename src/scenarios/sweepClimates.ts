/**
 * A design study under several climates: the same designs and the same soil samples (one plan,
 * one seed) run over each climate's weather record. Each climate gets its own sweep (baseline,
 * results, frontier), then the frontiers are set side by side: the rank of each design on each
 * climate's frontier, and whether it stays on the frontier under every climate ("robust across
 * climates"). A study under one climate is that climate's sweep, unchanged.
 *
 * @example
 * const study = sweepClimates(field.base, [
 *   { name: 'today', weather: today },
 *   { name: 'wetter', weather: wetter, source: 'generated, +20 % precipitation intensity' },
 * ]);
 * study.robust; // one flag per design
 */
import type { EtMethod } from '../climate/referenceEt.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { TilefluxError } from '../errors.js';
import type { Field } from './fieldSchema.js';
import { prepareField, type PeriodOptions, type PreparedField } from './prepared.js';
import { sweepField, type DesignRow, type SweepOptions, type SweepResult } from './sweep.js';

/** A climate to sweep under: a name, its daily weather and how that weather was read or made. */
export interface ClimateInput {
  name: string;
  weather: WeatherSeries;
  /** How the weather was read or made, in words (e.g. "weather.csv, format tileflux"). */
  source?: string;
}

/** Mean annual forcing of a climate over the reported period, as the runs see it. */
export interface ClimateFigures {
  /** Mean annual precipitation, mm per year of 365.25 days. */
  precipMmYr: number;
  /** Mean annual reference ET (after the field's `weather.etFactor`), mm per year. */
  refEtMmYr: number;
  refEtMethod: EtMethod;
}

/** One climate's sweep. */
export interface ClimateSweep {
  name: string;
  source: string;
  figures: ClimateFigures;
  result: SweepResult;
}

/** A sweep under every climate, with the frontiers compared. */
export interface ClimateStudy {
  climates: ClimateSweep[];
  /** ranks[c][d]: 1-based rank of design d on climate c's frontier (lowest load first), 0 off it. */
  ranks: number[][];
  /** robust[d]: design d is on the frontier under every climate. */
  robust: boolean[];
}

/** Climate names: they head table columns and name chart files. */
export const CLIMATE_NAME = /^[A-Za-z0-9][A-Za-z0-9_-]{0,31}$/;
/** Most climates one study takes (each is a whole sweep). */
export const MAX_CLIMATES = 12;

/** The file stem of a climate's charts: the name in lower case, `_` as `-`. */
export function climateSlug(name: string): string {
  return name.toLowerCase().replace(/_/g, '-');
}

/**
 * Refuse a bad list of climate names: none, too many, a name outside CLIMATE_NAME, or the same
 * name twice (names differing only in case count as the same, as their chart files would).
 */
export function checkClimateNames(names: readonly string[], option = 'climate'): void {
  if (names.length === 0) throw new TilefluxError(`${option}: give at least one climate`);
  if (names.length > MAX_CLIMATES) {
    throw new TilefluxError(
      `${option}: at most ${MAX_CLIMATES} climates in one study; got ${names.length}`,
    );
  }
  const seen = new Set<string>();
  for (const name of names) {
    if (!CLIMATE_NAME.test(name)) {
      throw new TilefluxError(
        `${option}: climate name "${name}" is not accepted; use 1 to 32 letters, digits, - or _, ` +
          'starting with a letter or digit (e.g. today, wetter-2C)',
      );
    }
    const slug = climateSlug(name);
    if (seen.has(slug)) {
      throw new TilefluxError(
        `${option}: climate name "${name}" is given twice (names are compared without case); ` +
          'give each climate its own name',
      );
    }
    seen.add(slug);
  }
}

/**
 * Mean annual precipitation and reference ET over a prepared field's reported period: the
 * forcing every design of the sweep meets (ET with the site's latitude and the field's ET factor).
 */
export function climateFigures(p: PreparedField): ClimateFigures {
  const { precipMm, refEtMm } = p.forcing;
  let precip = 0;
  let et = 0;
  for (let i = p.reportStart; i < precipMm.length; i++) {
    precip += precipMm[i];
    et += refEtMm[i];
  }
  const years = (precipMm.length - p.reportStart) / 365.25;
  return { precipMmYr: precip / years, refEtMmYr: et / years, refEtMethod: p.refEtMethod };
}

/** The forcing figures of a climate for a field, over the period of `o`. */
export function climateFiguresOf(
  field: Field,
  weather: WeatherSeries,
  o: PeriodOptions = {},
): ClimateFigures {
  return climateFigures(prepareField(field, weather, o));
}

/**
 * Compare the climates' frontiers: ranks per climate and the robust flags. Every sweep must
 * come from the same plan (same designs in the same order).
 */
export function studyOf(climates: ClimateSweep[]): ClimateStudy {
  checkClimateNames(climates.map((c) => c.name));
  const n = climates[0].result.designs.length;
  const ranks = climates.map(({ result }) => {
    const rank = new Array<number>(n).fill(0);
    result.frontier.forEach((d, k) => (rank[d] = k + 1));
    return rank;
  });
  const robust = Array.from({ length: n }, (_, d) => ranks.every((r) => r[d] > 0));
  return { climates, ranks, robust };
}

/**
 * Run a whole study in this thread (notebooks; the CLI runs each climate's sweep on worker
 * threads). `onProgress` counts the jobs of every climate together.
 *
 * @example sweepClimates(field.base, [{ name: 'today', weather }], { samples: 10 }).robust
 */
export function sweepClimates(
  field: Field,
  climates: readonly ClimateInput[],
  o: SweepOptions & { onProgress?: (done: number, total: number) => void } = {},
): ClimateStudy {
  checkClimateNames(climates.map((c) => c.name));
  const sweeps = climates.map((c, k) => {
    const result = sweepField(field, c.weather, {
      ...o,
      onProgress: (done, total) => o.onProgress?.(k * total + done, total * climates.length),
    });
    return climateSweepOf(c, result, climateFiguresOf(field, c.weather, o));
  });
  return studyOf(sweeps);
}

/** A climate's sweep with its name, source and figures. */
export function climateSweepOf(
  c: ClimateInput,
  result: SweepResult,
  figures: ClimateFigures,
): ClimateSweep {
  return { name: c.name, source: c.source ?? 'weather given', figures, result };
}

/**
 * The rows of designs.csv or samples.csv of a study: every climate's rows in climate order,
 * each with a `climate` column first.
 */
export function studyRows(study: ClimateStudy, table: 'designs' | 'samples'): DesignRow[] {
  return study.climates.flatMap((c) => c.result[table].map((row) => ({ climate: c.name, ...row })));
}

/**
 * The designs on any climate's frontier, in the order of the first climate's ranks (then by
 * their best rank elsewhere): the rows of the "frontier under each climate" table.
 */
export function frontierUnion(study: ClimateStudy): number[] {
  const n = study.robust.length;
  const key = (d: number) => study.ranks.map((r) => r[d] || Infinity);
  return Array.from({ length: n }, (_, d) => d)
    .filter((d) => study.ranks.some((r) => r[d] > 0))
    .sort((p, q) => {
      const a = key(p);
      const b = key(q);
      return a[0] - b[0] || Math.min(...a) - Math.min(...b) || p - q;
    });
}

/**
 * One line per climate: its name, how its weather was read or made, the period and the mean
 * annual precipitation and reference ET.
 *
 * @example climateLines(study)[0] // "today: weather.csv, format tileflux; 1992-01-01 to ..."
 */
export function climateLines(study: ClimateStudy): string[] {
  return study.climates.map(({ name, source, figures: f, result: r }) => {
    return (
      `${name}: ${source}; ${r.from} to ${r.to} (${r.years} years); precipitation ` +
      `${f.precipMmYr.toFixed(0)} mm/yr, reference ET ${f.refEtMmYr.toFixed(0)} mm/yr (${f.refEtMethod})`
    );
  });
}

/**
 * The frontier under each climate in words: a header and one line per design on any frontier
 * (at most `max`, then how many more), its rank under each climate ("-" when dominated there)
 * and the robust marker.
 */
export function robustnessLines(study: ClimateStudy, max = 12): string[] {
  const names = study.climates.map((c) => c.name);
  const designs = study.climates[0].result.designs;
  const union = frontierUnion(study);
  const rows = union
    .slice(0, max)
    .map((d) => [
      String(designs[d].design),
      ...study.ranks.map((r) => (r[d] ? String(r[d]) : '-')),
      study.robust[d] ? 'robust across climates' : '',
    ]);
  const head = ['design', ...names, ''];
  const widths = head.map((h, k) => Math.max(h.length, ...rows.map((r) => r[k].length)));
  const line = (r: string[]) =>
    r
      .map((c, k) => (k === 0 ? c.padEnd(widths[k]) : k < r.length - 1 ? c.padStart(widths[k]) : c))
      .join('  ')
      .trimEnd();
  const more = union.length > max ? [`... and ${union.length - max} more (summary.json).`] : [];
  return [line(head), ...rows.map(line), ...more];
}
