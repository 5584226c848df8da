/**
 * Run a field's scenarios over one weather record: climate forcing once, then for each scenario
 * the crop calendar, the outlet schedule, the daily water-balance engine, the nitrate model and
 * the annual table. Pure: the caller reads files and writes outputs.
 */
import { TilefluxError } from '../errors.js';
import { referenceEt, type EtMethod } from '../climate/referenceEt.js';
import { snowModel } from '../climate/snow.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { cropCalendar } from '../engine/cropCalendar.js';
import { outletSeries } from '../engine/outletSchedule.js';
import { simulate } from '../engine/simulate.js';
import type { CropCalendar, EngineForcing, EngineParams, EngineResult } from '../engine/types.js';
import { simulateNitrate } from '../nitrate/index.js';
import type { NitrateResult } from '../nitrate/types.js';
import { annualRows } from './annual.js';
import type { Field } from './fieldSchema.js';
import { scenarioOf, standardScenarios, type ScenarioSpec } from './resolve.js';
import type { AnnualRow } from './types.js';

export interface RunOptions {
  /** First and last reported day (ISO); default: the first and last complete years after warm-up. */
  from?: string;
  to?: string;
  /** Years simulated before `from` and not reported, so the start state does not matter. */
  warmupYears?: number;
  /** Run only these scenarios (by name). */
  only?: string[];
  /** Called before each scenario starts. */
  onScenario?: (index: number, count: number, name: string) => void;
}

/** One scenario's results over the reported period. */
export interface ScenarioOutput {
  spec: ScenarioSpec;
  calendar: CropCalendar;
  engine: EngineResult;
  nitrate: NitrateResult;
  annual: AnnualRow[];
}

export interface RunOutput {
  /** Forcing over the reported period. */
  forcing: EngineForcing;
  refEtMethod: EtMethod;
  from: string;
  to: string;
  warmupYears: number;
  /** Simulation start (first warm-up day). */
  simulatedFrom: string;
  baseline: string;
  scenarios: ScenarioOutput[];
}

/** A field with its explicit scenarios (as produced by the field-file reader). */
export interface FieldWithScenarios {
  base: Field;
  scenarios: Array<{ name: string; description?: string; field: Field }>;
}

/** The scenarios a field defines, or the three standard alternatives when it defines none. */
export function scenariosOf(f: FieldWithScenarios): ScenarioSpec[] {
  if (f.scenarios.length === 0) return standardScenarios(f.base);
  return f.scenarios.map((s) => scenarioOf(s.name, s.description ?? '', s.field));
}

function sliceForcing(f: EngineForcing, a: number, b: number): EngineForcing {
  return {
    dates: f.dates.slice(a, b),
    precipMm: f.precipMm.slice(a, b),
    rainMm: f.rainMm.slice(a, b),
    snowfallMm: f.snowfallMm.slice(a, b),
    snowmeltMm: f.snowmeltMm.slice(a, b),
    sweMm: f.sweMm.slice(a, b),
    refEtMm: f.refEtMm.slice(a, b),
    tmeanC: f.tmeanC.slice(a, b),
  };
}

/** Slice every typed-array column of a result object to [a, b). */
function sliceColumns<T extends object>(obj: T, a: number, b: number): T {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(obj)) {
    if (ArrayBuffer.isView(v)) out[k] = (v as Float64Array).slice(a, b);
    else if (Array.isArray(v) && k === 'dates') out[k] = v.slice(a, b);
    else if (v && typeof v === 'object' && !Array.isArray(v)) out[k] = sliceColumns(v, a, b);
    else out[k] = v;
  }
  return out as T;
}

/** Daily forcing for a weather record: snow, reference ET and mean temperature. */
export function forcingOf(
  w: WeatherSeries,
  latitudeDeg: number,
  elevationM: number,
): { forcing: EngineForcing; method: EtMethod } {
  const snow = snowModel(w.precipMm, w.tmaxC, w.tminC);
  const et = referenceEt(w, latitudeDeg, elevationM);
  const tmean = new Float64Array(w.dates.length);
  for (let i = 0; i < tmean.length; i++) tmean[i] = (w.tmaxC[i] + w.tminC[i]) / 2;
  return {
    forcing: {
      dates: w.dates,
      precipMm: w.precipMm,
      rainMm: snow.rainMm,
      snowfallMm: snow.snowfallMm,
      snowmeltMm: snow.meltMm,
      sweMm: snow.sweMm,
      refEtMm: et.etMm,
      tmeanC: tmean,
    },
    method: et.method,
  };
}

/** Index of the first date >= iso (binary search on ISO strings). */
function indexOf(dates: string[], iso: string): number {
  let lo = 0;
  let hi = dates.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (dates[mid] < iso) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** The reported period: explicit dates, or whole calendar years after the warm-up. */
export function reportPeriod(
  dates: string[],
  o: RunOptions,
): { from: string; to: string; warmupYears: number } {
  if (dates.length === 0) throw new TilefluxError('the weather record has no days');
  const first = dates[0];
  const last = dates[dates.length - 1];
  const firstFull =
    first.slice(5) === '01-01' ? Number(first.slice(0, 4)) : Number(first.slice(0, 4)) + 1;
  const lastFull =
    last.slice(5) === '12-31' ? Number(last.slice(0, 4)) : Number(last.slice(0, 4)) - 1;
  const fullYears = lastFull - firstFull + 1;
  const warmupYears = o.warmupYears ?? (fullYears >= 3 ? 1 : 0);
  let from = o.from ?? `${firstFull + warmupYears}-01-01`;
  let to = o.to ?? `${lastFull}-12-31`;
  if (!o.from && !o.to && fullYears - warmupYears < 1) {
    from = first;
    to = last;
  }
  if (from < first || from > last) {
    throw new TilefluxError(`--from ${from} lies outside the weather record (${first} to ${last})`);
  }
  if (to < from || to > last) {
    throw new TilefluxError(
      `--to ${to} must lie between --from ${from} and the record's last day ${last}`,
    );
  }
  return { from, to, warmupYears };
}

/**
 * The forcing of one weather record over one simulated period, computed once (snow, reference
 * ET, mean temperature) and shared by every engine run on it: the scenarios of a run, or the
 * candidate parameter sets of a fit or a sweep.
 */
export interface PreparedPeriod {
  /** Forcing over the whole simulated period (warm-up included). */
  forcing: EngineForcing;
  refEtMethod: EtMethod;
  from: string;
  to: string;
  warmupYears: number;
  /** Index of `from` in `forcing.dates` (the first reported day). */
  reportStart: number;
}

/** A scenario on a prepared period: its crop calendar and outlet series, computed once. */
export interface PreparedScenario {
  spec: ScenarioSpec;
  calendar: CropCalendar;
  outlet: Float64Array;
}

/**
 * Prepare once: cut the weather to the simulated period (warm-up years before `from`) and
 * compute its forcing.
 * @example const period = preparePeriod(weather, field.base.site, { warmupYears: 1 });
 */
export function preparePeriod(
  weather: WeatherSeries,
  site: { latitude: number; elevation: number },
  o: Pick<RunOptions, 'from' | 'to' | 'warmupYears'> = {},
): PreparedPeriod {
  const { from, to, warmupYears } = reportPeriod(weather.dates, o);
  const simFrom = `${Number(from.slice(0, 4)) - warmupYears}${from.slice(4)}`;
  const a0 = indexOf(weather.dates, simFrom);
  const b0 = indexOf(weather.dates, to) + 1;
  const sim = {
    ...weather,
    dates: weather.dates.slice(a0, b0),
    precipMm: weather.precipMm.slice(a0, b0),
    tmaxC: weather.tmaxC.slice(a0, b0),
    tminC: weather.tminC.slice(a0, b0),
    petMm: weather.petMm?.slice(a0, b0),
    solarMJm2: weather.solarMJm2?.slice(a0, b0),
    rhMeanPct: weather.rhMeanPct?.slice(a0, b0),
    wind2mMs: weather.wind2mMs?.slice(a0, b0),
  };
  const { forcing, method } = forcingOf(sim, site.latitude, site.elevation);
  return {
    forcing,
    refEtMethod: method,
    from,
    to,
    warmupYears,
    reportStart: indexOf(forcing.dates, from),
  };
}

/** The crop calendar and outlet series of a scenario on a prepared period. */
export function prepareScenario(period: PreparedPeriod, spec: ScenarioSpec): PreparedScenario {
  const dates = period.forcing.dates;
  return {
    spec,
    calendar: cropCalendar(dates, spec.rotation, spec.crops),
    outlet: outletSeries(dates, spec.outlet),
  };
}

/**
 * Run many: the engine alone over the whole simulated period (warm-up included), with the
 * scenario's parameters or changed ones.
 * @example runEngine(period, prepared, { ...prepared.spec.params, kAboveMPerDay: 0.8 }).drainflowMm
 */
export function runEngine(
  period: PreparedPeriod,
  prepared: PreparedScenario,
  params: EngineParams = prepared.spec.params,
): EngineResult {
  return simulate(period.forcing, prepared.calendar, prepared.outlet, params);
}

/** A scenario's full output over the reported period: engine, nitrate model and annual table. */
export function runPreparedScenario(
  period: PreparedPeriod,
  prepared: PreparedScenario,
): ScenarioOutput {
  const { forcing, reportStart: a } = period;
  const { spec, calendar } = prepared;
  const b = forcing.dates.length;
  const engine = runEngine(period, prepared);
  const nitrate = simulateNitrate(
    {
      dates: forcing.dates,
      drainflowMm: engine.drainflowMm,
      runoffMm: engine.runoffMm,
      seepageMm: engine.seepageMm,
      tmeanC: forcing.tmeanC,
      saturatedFraction: engine.saturatedFraction,
      waterTableDepthM: engine.waterTableDepthM,
      calendar,
    },
    spec.nitrate,
  );
  const e = sliceColumns(engine, a, b);
  const n = sliceColumns(nitrate, a, b);
  const c = sliceColumns(calendar, a, b);
  const annual = annualRows(
    spec.name,
    sliceForcing(forcing, a, b),
    e,
    n,
    spec.field.wetness,
    0,
    b - a,
  );
  return { spec, calendar: c, engine: e, nitrate: n, annual };
}

/**
 * Run every scenario of a field over a weather record.
 * @example const out = runField(readFieldFile('field.yaml'), readWeatherFile('w.csv').series, {});
 */
export function runField(
  field: FieldWithScenarios,
  weather: WeatherSeries,
  o: RunOptions = {},
): RunOutput {
  let specs = scenariosOf(field);
  if (o.only && o.only.length) {
    for (const name of o.only) {
      if (!specs.some((s) => s.name === name)) {
        throw new TilefluxError(
          `--scenario ${name} is not defined; the field has ${specs.map((s) => s.name).join(', ')}`,
        );
      }
    }
    specs = specs.filter((s) => o.only!.includes(s.name));
  }
  const period = preparePeriod(weather, field.base.site, o);
  const { forcing, reportStart } = period;
  const scenarios: ScenarioOutput[] = specs.map((spec, k) => {
    o.onScenario?.(k, specs.length, spec.name);
    return runPreparedScenario(period, prepareScenario(period, spec));
  });

  return {
    forcing: sliceForcing(forcing, reportStart, forcing.dates.length),
    refEtMethod: period.refEtMethod,
    from: period.from,
    to: period.to,
    warmupYears: period.warmupYears,
    simulatedFrom: forcing.dates[0],
    baseline: specs[0]?.name ?? '',
    scenarios,
  };
}
