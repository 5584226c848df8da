/**
 * Run a field's scenarios over one weather record: climate forcing once, then for each scenario
 * the crop calendar, the outlet schedule, the daily water-balance engine, the nitrate model and
 * the annual table. Pure: the caller reads files and writes outputs.
 */
import { TilefluxError } from '../errors.js';
import type { EtMethod } from '../climate/referenceEt.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { simulate } from '../engine/simulate.js';
import type { CropCalendar, EngineForcing, EngineParams, EngineResult } from '../engine/types.js';
import type { NitrateResult } from '../nitrate/types.js';
import type { Field } from './fieldSchema.js';
import { prepareField, runDesign, type PeriodOptions, type PreparedField } from './prepared.js';
import { scenarioOf, standardScenarios, type ScenarioSpec } from './resolve.js';
import type { AnnualRow } from './types.js';

export interface RunOptions extends PeriodOptions {
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

export { forcingOf, reportPeriod, type PeriodOptions } from './prepared.js';

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

/**
 * The forcing of one weather record over one simulated period, computed once and shared by every
 * engine run on it: the scenarios of a run, or the candidate parameter sets of a fit or a sweep
 * (a prepared field; see `prepareField`).
 */
export type PreparedPeriod = PreparedField;

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
  o: PeriodOptions = {},
): PreparedPeriod {
  return prepareField({ site }, weather, o);
}

/** The crop calendar and outlet series of a scenario on a prepared period. */
export function prepareScenario(period: PreparedPeriod, spec: ScenarioSpec): PreparedScenario {
  return {
    spec,
    calendar: period.calendarOf(spec.rotation, spec.crops, spec.rotationFirstYear),
    outlet: period.outletOf(spec.outlet),
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
  const a = period.reportStart;
  const b = period.forcing.dates.length;
  const { calendar, engine, nitrate, annual } = runDesign(period, prepared.spec);
  return {
    spec: prepared.spec,
    calendar: sliceColumns(calendar, a, b),
    engine: sliceColumns(engine, a, b),
    nitrate: sliceColumns(nitrate, a, b),
    annual,
  };
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
  const { forcing, from, to, warmupYears } = period;
  const reportedForcing = sliceForcing(forcing, period.reportStart, forcing.dates.length);
  const scenarios: ScenarioOutput[] = specs.map((spec, k) => {
    o.onScenario?.(k, specs.length, spec.name);
    return runPreparedScenario(period, prepareScenario(period, spec));
  });

  return {
    forcing: reportedForcing,
    refEtMethod: period.refEtMethod,
    from,
    to,
    warmupYears,
    simulatedFrom: forcing.dates[0],
    baseline: specs[0]?.name ?? '',
    scenarios,
  };
}
