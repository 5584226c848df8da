/**
 * Run a field's scenarios over one weather record: climate forcing once, then for each scenario
 * the crop calendar, the outlet schedule, the daily water-balance engine, the nitrate model and
 * the annual table. Pure: the caller reads files and writes outputs.
 *
 * Longer than most files: the whole run (`runField`, every scenario's daily columns kept) and
 * the planned run (`planRun`, one scenario at a time, each reduced to its digest, so a run folder
 * of a long record needs little memory) share the period, the scenario preparation and the
 * seepage band, and stay together so that both give the same numbers.
 */
import type { UnitSystem } from '../units/quantity.js';
import { SettingError } from '../errors.js';
import type { EtMethod } from '../climate/referenceEt.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import { simulate } from '../engine/simulate.js';
import type { CropCalendar, EngineForcing, EngineParams, EngineResult } from '../engine/types.js';
import type { NitrateResult } from '../nitrate/types.js';
import type { Field } from './fieldSchema.js';
import {
  prepareField,
  runDesign,
  type DesignRun,
  type PeriodOptions,
  type PreparedField,
} from './prepared.js';
import { scenarioOf, standardScenarios, withSeepage, type ScenarioSpec } from './resolve.js';
import { SEEPAGE_BAND, type SeepageBand } from '../engine/seepage.js';
import type { AnnualRow } from './types.js';

export interface RunOptions extends PeriodOptions {
  /** Run only these scenarios (by name). */
  only?: string[] | undefined;
  /** Called before each scenario starts. */
  onScenario?: (index: number, count: number, name: string) => void;
  /**
   * Also run every scenario under the low, medium and high seepage settings (default true): the
   * seepage band of the changes against the baseline. Cheap: the forcing is shared.
   */
  seepageBand?: boolean;
  /** Units of the scenario descriptions and outlet labels (text only; results stay SI). */
  units?: UnitSystem;
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
  /** Warm-up that ran (years, to 0.01): shorter than asked when the record starts too late. */
  warmupYears: number;
  /** Warm-up years asked for (or the default). */
  warmupYearsRequested: number;
  /** Simulation start (first warm-up day). */
  simulatedFrom: string;
  baseline: string;
  scenarios: ScenarioOutput[];
  /** Factor applied to reference ET (field file weather.etFactor). */
  etFactor: number;
  /**
   * Annual rows of every scenario under each documented seepage setting (the setting the field
   * itself uses points at `scenarios`' rows); absent when the band was not run.
   */
  seepageBand?: Record<SeepageBand, AnnualRow[]>;
}

/** A field with its explicit scenarios (as produced by the field-file reader). */
export interface FieldWithScenarios {
  base: Field;
  scenarios: Array<{ name: string; description?: string; field: Field }>;
}

/**
 * The scenarios a field defines, or the three standard alternatives when it defines none; with
 * `band`, every scenario under that documented seepage setting instead of the field's own.
 */
export function scenariosOf(
  f: FieldWithScenarios,
  band?: SeepageBand,
  units: UnitSystem = 'si',
): ScenarioSpec[] {
  const seep = (x: Field) => (band === undefined ? x : withSeepage(x, band));
  if (f.scenarios.length === 0) return standardScenarios(seep(f.base), units);
  return f.scenarios.map((s) => scenarioOf(s.name, s.description ?? '', seep(s.field), units));
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

/** Slice every typed-array column of a result object to [a, b): copies, or views with `views`. */
function sliceColumns<T extends object>(obj: T, a: number, b: number, views = false): T {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(obj)) {
    if (ArrayBuffer.isView(v)) {
      out[k] = views ? (v as Float64Array).subarray(a, b) : (v as Float64Array).slice(a, b);
    } else if (Array.isArray(v) && k === 'dates') out[k] = v.slice(a, b);
    else if (v && typeof v === 'object' && !Array.isArray(v)) {
      out[k] = sliceColumns(v, a, b, views);
    } else out[k] = v;
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
  site: { latitude: number; elevation: number; etFactor?: number },
  o: PeriodOptions = {},
): PreparedPeriod {
  return prepareField({ site, weather: { etFactor: site.etFactor ?? 1 } }, weather, o);
}

/** The crop calendar and outlet series of a scenario on a prepared period. */
export function prepareScenario(period: PreparedPeriod, spec: ScenarioSpec): PreparedScenario {
  return {
    spec,
    calendar: period.calendarOf(spec.rotation, spec.crops, spec.rotationFirstYear, spec.roots),
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
 * A run planned over its weather record: the scenarios resolved and the forcing computed, no
 * scenario simulated yet. `runField` runs it whole; a writer that wants memory independent of
 * days x scenarios runs one scenario at a time, writes its daily columns and keeps only its
 * digest (`digestOf`), then asks for the seepage band from the annual rows.
 */
export interface RunPlan {
  /** The scenarios in run order. */
  specs: ScenarioSpec[];
  /** The run's period and methods: everything of a RunOutput but its scenarios and band. */
  run: Omit<RunOutput, 'scenarios' | 'seepageBand'>;
  /**
   * Simulate scenario `k` (calls `onScenario` first): its full output over the reported period,
   * in columns of its own; with `views`, in views of the run's working columns instead, which
   * the next scenario (or the band) overwrites: read them (write them, digest them) before that.
   */
  scenario(k: number, o?: { views?: boolean }): ScenarioOutput;
  /**
   * The seepage band from every scenario's annual rows (in `specs` order), or undefined when
   * the run options switched it off.
   */
  seepageBand(annual: readonly AnnualRow[][]): Record<SeepageBand, AnnualRow[]> | undefined;
  /**
   * The same band one design run at a time: each step runs one scenario under one setting, so
   * a caller can let other work (a signal handler) in between; the generator returns the band.
   */
  seepageBandSteps(
    annual: readonly AnnualRow[][],
  ): Generator<void, Record<SeepageBand, AnnualRow[]> | undefined>;
}

/**
 * Plan a run of every scenario of a field over a weather record (see `RunPlan`).
 * @example const plan = planRun(field, weather, {}); const first = plan.scenario(0);
 */
export function planRun(
  field: FieldWithScenarios,
  weather: WeatherSeries,
  o: RunOptions = {},
): RunPlan {
  let specs = scenariosOf(field, undefined, o.units);
  if (o.only && o.only.length) {
    for (const name of o.only) {
      if (!specs.some((s) => s.name === name)) {
        throw new SettingError(
          (n) =>
            `${n('only')} ${name} is not defined; the field has ${specs.map((s) => s.name).join(', ')}`,
        );
      }
    }
    specs = specs.filter((s) => o.only!.includes(s.name));
  }
  const period = preparePeriod(
    weather,
    { ...field.base.site, etFactor: field.base.weather.etFactor },
    o,
  );
  const { forcing, from, to, warmupYears } = period;
  // Each design writes its daily columns over the previous design's (a scenario's output is cut
  // to the reported period as copies, or views), so a run allocates them once, not per scenario.
  let last: DesignRun | undefined;
  const run = (spec: ScenarioSpec): DesignRun => (last = runDesign(period, spec, last));
  const names = new Set(specs.map((s) => s.name));
  // The band needs only annual rows: each band scenario runs on the same prepared field (forcing,
  // calendars and outlet series shared), without cutting daily columns to the reported period.
  function* seepageBandSteps(annual: readonly AnnualRow[][]) {
    if (o.seepageBand === false) return undefined;
    const rows = {} as Record<SeepageBand, AnnualRow[]>;
    for (const band of SEEPAGE_BAND) {
      if (band === field.base.seepage) {
        rows[band] = annual.flat();
        continue;
      }
      rows[band] = [];
      for (const spec of scenariosOf(field, band, o.units)) {
        if (!names.has(spec.name)) continue;
        for (const r of run(spec).annual) rows[band].push(r);
        yield;
      }
    }
    return rows;
  }
  return {
    specs,
    run: {
      forcing: sliceForcing(forcing, period.reportStart, forcing.dates.length),
      refEtMethod: period.refEtMethod,
      from,
      to,
      warmupYears: Math.round((period.reportStart / 365.25) * 100) / 100,
      warmupYearsRequested: warmupYears,
      simulatedFrom: forcing.dates[0],
      baseline: specs[0]?.name ?? '',
      etFactor: field.base.weather.etFactor,
    },
    scenario(k, { views = false } = {}) {
      const spec = specs[k];
      o.onScenario?.(k, specs.length, spec.name);
      const a = period.reportStart;
      const b = forcing.dates.length;
      const { calendar, engine, nitrate, annual } = run(spec);
      return {
        spec,
        calendar: sliceColumns(calendar, a, b, views),
        engine: sliceColumns(engine, a, b, views),
        nitrate: sliceColumns(nitrate, a, b, views),
        annual,
      };
    },
    seepageBand(annual) {
      const steps = seepageBandSteps(annual);
      for (;;) {
        const step = steps.next();
        if (step.done) return step.value;
      }
    },
    seepageBandSteps,
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
  const plan = planRun(field, weather, o);
  const scenarios = plan.specs.map((_, k) => plan.scenario(k));
  const seepageBand = plan.seepageBand(scenarios.map((s) => s.annual));
  return { ...plan.run, scenarios, ...(seepageBand && { seepageBand }) };
}

/**
 * What the tables and summary of a run read from one scenario, without its daily columns: the
 * annual rows, the engine's settings and the sums of the daily columns they need. A run's writer
 * keeps this of each scenario (and the report's part of it) once its daily.csv rows are written.
 */
export interface ScenarioDigest {
  spec: ScenarioSpec;
  annual: AnnualRow[];
  engine: Pick<EngineResult, 'equivalentDepthM' | 'substepsPerDay'>;
  nitrate: Pick<NitrateResult, 'outOfRangeDays'>;
  /** Days over the reported period on which the pipe capacity limited drain flow. */
  capacityLimitedDays: number;
  /** Seepage that left laterally to the field edge over the reported period, mm. */
  lateralSeepageMm: number;
}

/** A scenario as the tables, summary and report read it: its full output or its digest. */
export type ScenarioResult = ScenarioOutput | ScenarioDigest;

/**
 * A run as the tables, summary and report read it: each scenario full or digested (the report
 * then takes each scenario's part, cut while its daily columns were at hand).
 */
export interface RunResult extends Omit<RunOutput, 'scenarios'> {
  scenarios: ScenarioResult[];
}

function sum(x: ArrayLike<number>): number {
  let total = 0;
  for (let i = 0; i < x.length; i++) total += x[i];
  return total;
}

/** Days over the reported period on which the pipe capacity limited drain flow. */
export function capacityLimitedDaysOf(s: ScenarioResult): number {
  return 'capacityLimitedDays' in s ? s.capacityLimitedDays : sum(s.engine.capacityLimited);
}

/** Lateral seepage over the reported period, mm. */
export function lateralSeepageMmOf(s: ScenarioResult): number {
  return 'lateralSeepageMm' in s ? s.lateralSeepageMm : sum(s.engine.lateralSeepageMm);
}

/**
 * A scenario's digest: what the tables and summary read, the daily columns they need summed.
 * @example digestOf(runField(field, weather).scenarios[0]).capacityLimitedDays // 0
 */
export function digestOf(s: ScenarioOutput): ScenarioDigest {
  return {
    spec: s.spec,
    annual: s.annual,
    engine: {
      equivalentDepthM: s.engine.equivalentDepthM,
      substepsPerDay: s.engine.substepsPerDay,
    },
    nitrate: { outOfRangeDays: s.nitrate.outOfRangeDays },
    capacityLimitedDays: capacityLimitedDaysOf(s),
    lateralSeepageMm: lateralSeepageMmOf(s),
  };
}
