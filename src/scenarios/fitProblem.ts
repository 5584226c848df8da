/**
 * From a field, a weather record and observations to a fit problem: which parameters and
 * bounds, the calibration and validation periods, the warm-up, and the observations aligned
 * with the simulated days. Every choice a user can get wrong is a TilefluxError that says what
 * is accepted.
 */
import { dayNumber, dayNumberOf, isoDate } from '../climate/calendar.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { SettingError, TilefluxError } from '../errors.js';
import type { AlignedObservations, FitObjective, FitProblem } from './fit.js';
import type { Field } from './fieldSchema.js';
import { DEFAULT_FIT_PATHS, FIT_PARAMETERS, fieldValue, fitParameter } from './fitParams.js';
import { preparePeriod } from './run.js';

/** Fewest days an observation period must span (first to last observed day). */
export const MIN_OBSERVED_SPAN_DAYS = 90;

export interface FitSetup {
  base: Field;
  weather: WeatherSeries;
  observed: {
    dates: string[];
    drainflowMm?: Float64Array;
    waterTableDepthM?: Float64Array;
    no3MgL?: Float64Array;
  };
  objective: FitObjective;
  /** Parameters to fit (default: the field's fit.params, else DEFAULT_FIT_PATHS). */
  paths?: string[] | undefined;
  calibrate?: [string, string] | undefined;
  validate?: [string, string] | undefined;
  /** Years of weather simulated before the first compared day (default 1). */
  warmupYears?: number | undefined;
}

/** Parse "FROM..TO" (ISO dates) for the setting `calibrate` or `validate`. */
export function parsePeriod(text: string, setting: 'calibrate' | 'validate'): [string, string] {
  const m = /^(\d{4}-\d{2}-\d{2})\.\.(\d{4}-\d{2}-\d{2})$/.exec(text.trim());
  if (!m || dayNumber(m[1]) === undefined || dayNumber(m[2]) === undefined || m[2] < m[1]) {
    throw new SettingError(
      (n) =>
        `${n(setting)} expects FROM..TO with two dates, the first not after the second, such as ` +
        `2013-01-01..2014-12-31; got ${text}`,
    );
  }
  return [m[1], m[2]];
}

function addYears(iso: string, years: number): string {
  const y = Number(iso.slice(0, 4)) + years;
  return isoDate(dayNumberOf(y, Number(iso.slice(5, 7)), Number(iso.slice(8, 10))));
}

/** Check and resolve the parameters to fit and their bounds. */
function parametersOf(base: Field, paths: string[]): Array<[number, number]> {
  const accepted = FIT_PARAMETERS.map((p) => p.path).join(', ');
  const seen = new Set<string>();
  return paths.map((path) => {
    const p = fitParameter(path);
    if (!p)
      throw new SettingError(
        (n) => `${n('params')}: unknown parameter "${path}"; accepted: ${accepted}`,
      );
    if (seen.has(path)) throw new SettingError((n) => `${n('params')} names ${path} twice`);
    seen.add(path);
    if (fieldValue(base, path) === undefined) {
      throw new SettingError(
        (n) =>
          `${n('params')}: ${path} is given as layers in the field file; fit adjusts a single value, so ` +
          'give one drainable porosity for the profile or fit other parameters',
      );
    }
    const given = (base.fit?.bounds as Record<string, [number, number] | undefined> | undefined)?.[
      path
    ];
    const [lo, hi] = given ?? p.bounds;
    if (!(lo < hi)) {
      throw new TilefluxError(
        `fit.bounds.${path}: the lower bound ${lo} must be below the upper ${hi} ${p.unit}`,
      );
    }
    return [lo, hi];
  });
}

/**
 * Build the fit problem; refuses observation periods shorter than MIN_OBSERVED_SPAN_DAYS.
 * @example buildFitProblem({ base, weather, observed, objective: 'kge' })
 */
export function buildFitProblem(s: FitSetup): FitProblem {
  const paths = s.paths ?? s.base.fit?.params ?? [...DEFAULT_FIT_PATHS];
  const bounds = parametersOf(s.base, paths);
  const warmupYears = s.warmupYears ?? 1;
  const obs = s.observed;
  const has = (i: number) =>
    Number.isFinite(obs.drainflowMm?.[i] ?? NaN) ||
    Number.isFinite(obs.waterTableDepthM?.[i] ?? NaN);
  let firstObs = -1;
  let lastObs = -1;
  for (let i = 0; i < obs.dates.length; i++) {
    if (!has(i)) continue;
    if (firstObs < 0) firstObs = i;
    lastObs = i;
  }
  if (firstObs < 0) {
    throw new TilefluxError('the observation file has no drain-flow or water-table values');
  }
  const wFirst = s.weather.dates[0];
  const earliest = addYears(wFirst, warmupYears);
  const needWarmup = (period: [string, string], option: string) => {
    if (period[0] < earliest) {
      throw new SettingError(
        (n) =>
          `${n(option)} starts ${period[0]}, but the model first runs ${warmupYears} warm-up ` +
          `year${warmupYears === 1 ? '' : 's'} on the weather from ${wFirst}: start on ${earliest} ` +
          `or later, give weather from earlier, or use ${n('warmupYears')} 0`,
      );
    }
  };
  if (s.calibrate) needWarmup(s.calibrate, 'calibrate');
  if (s.validate) needWarmup(s.validate, 'validate');
  const usableFrom = obs.dates[firstObs] > earliest ? obs.dates[firstObs] : earliest;
  const usableTo = obs.dates[lastObs];
  if (!s.calibrate && usableFrom > usableTo) {
    throw new SettingError(
      (n) =>
        `every observation lies in the warm-up (the first ${warmupYears} year${warmupYears === 1 ? '' : 's'} ` +
        `of the weather, ${wFirst} to before ${earliest}); give weather from earlier or use ${n('warmupYears')} 0`,
    );
  }
  if (
    s.calibrate &&
    s.validate &&
    s.calibrate[0] <= s.validate[1] &&
    s.validate[0] <= s.calibrate[1]
  ) {
    const [calibrate, validate] = [s.calibrate.join('..'), s.validate.join('..')];
    throw new SettingError(
      (n) =>
        `${n('calibrate')} ${calibrate} and ${n('validate')} ${validate} overlap; ` +
        'a split-sample test needs separate periods',
    );
  }
  const cal = s.calibrate ?? [usableFrom, usableTo];
  const from = s.validate && s.validate[0] < cal[0] ? s.validate[0] : cal[0];
  const to = s.validate && s.validate[1] > cal[1] ? s.validate[1] : cal[1];
  const wLast = s.weather.dates[s.weather.dates.length - 1];
  if (to > wLast) {
    throw new TilefluxError(`the periods end ${to}, after the weather record's last day ${wLast}`);
  }
  const period = preparePeriod(s.weather, s.base.site, { from, to, warmupYears });
  const dates = period.forcing.dates;
  const n = dates.length;
  const offset = (dayNumber(obs.dates[0]) ?? 0) - (dayNumber(dates[0]) ?? 0);
  const align = (a: Float64Array | undefined) => {
    if (!a) return undefined;
    const out = new Float64Array(n).fill(NaN);
    for (let i = 0; i < a.length; i++) {
      const k = i + offset;
      if (k >= 0 && k < n) out[k] = a[i];
    }
    return out;
  };
  const observed: AlignedObservations = {};
  for (const key of ['drainflowMm', 'waterTableDepthM', 'no3MgL'] as const) {
    const a = align(obs[key]);
    if (a) observed[key] = a;
  }
  const inside = (d: string, p: [string, string] | undefined) =>
    p !== undefined && d >= p[0] && d <= p[1];
  const calibration = new Uint8Array(n);
  const validation = new Uint8Array(n);
  for (let i = period.reportStart; i < n; i++) {
    if (inside(dates[i], s.validate)) validation[i] = 1;
    else if (inside(dates[i], cal)) calibration[i] = 1;
  }
  const problem: FitProblem = {
    period,
    base: s.base,
    paths,
    bounds,
    objective: s.objective,
    weights: {
      flow: s.base.fit?.weights?.flow ?? 1,
      waterTable: s.base.fit?.weights?.waterTable ?? 1,
    },
    observed,
    calibration,
    validation,
  };
  requireSpan(problem, calibration, 'calibration');
  if (s.validate) requireSpan(problem, validation, 'validation');
  return problem;
}

/** Refuse a period whose observed days span fewer than MIN_OBSERVED_SPAN_DAYS. */
function requireSpan(p: FitProblem, mask: Uint8Array, name: string): void {
  const { drainflowMm: q, waterTableDepthM: w } = p.observed;
  let first = -1;
  let last = -1;
  let count = 0;
  for (let i = 0; i < mask.length; i++) {
    if (!mask[i]) continue;
    if (!(Number.isFinite(q?.[i] ?? NaN) || Number.isFinite(w?.[i] ?? NaN))) continue;
    if (first < 0) first = i;
    last = i;
    count++;
  }
  const span = first < 0 ? 0 : last - first + 1;
  if (span < MIN_OBSERVED_SPAN_DAYS) {
    const dates = p.period.forcing.dates;
    throw new TilefluxError(
      `the ${name} period has observations on ${count} day${count === 1 ? '' : 's'}` +
        (first >= 0 ? `, spanning ${span} days (${dates[first]} to ${dates[last]})` : '') +
        `; a fit needs observations spanning at least ${MIN_OBSERVED_SPAN_DAYS} days, so that ` +
        'wet spells and recessions both constrain the parameters: give a longer record or period',
    );
  }
}
