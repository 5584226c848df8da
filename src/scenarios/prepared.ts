/**
 * A prepared field: everything about a field and a weather record that does not depend on the
 * drain layout or the soil values, computed once and reused for every design run over them
 * (a sweep of depths, spacings and outlet managements, a fit of soil values, the in-browser
 * page). That is the simulated period with its warm-up, the climate forcing (snow, reference ET,
 * mean temperature), the integer calendar fields of every day, and, cached on first use, the
 * crop calendar of each rotation, the daily outlet level of each schedule and the weather- and
 * calendar-only terms of the pool nitrate model (fertilizer, mineralization, uptake demand,
 * temperature factor). No daily loop of a design run touches a date string.
 *
 * @example
 * const prepared = prepareField(field.base, weather);
 * for (const spec of specs) runDesign(prepared, spec).annual; // one annual table per design
 */
import { SettingError, TilefluxError } from '../errors.js';
import { dayIndexOf, type DayIndex } from '../climate/calendar.js';
import { referenceEt, type EtMethod } from '../climate/referenceEt.js';
import { snowModel } from '../climate/snow.js';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { CropParams } from '../engine/crops.js';
import {
  cropCalendar,
  DEFAULT_ROTATION_FIRST_YEAR,
  type RootOptions,
} from '../engine/cropCalendar.js';
import { outletSeries, type OutletSchedule } from '../engine/outletSchedule.js';
import { simulate } from '../engine/simulate.js';
import type { CropCalendar, EngineForcing, EngineResult } from '../engine/types.js';
import { simulateNitrate } from '../nitrate/simulate.js';
import { poolForcingOf, type PoolForcing } from '../nitrate/pool.js';
import type { NitrateConfig, NitrateResult } from '../nitrate/types.js';
import { annualRows } from './annual.js';
import type { Field } from './fieldSchema.js';
import type { ScenarioSpec } from './resolve.js';
import type { AnnualRow } from './types.js';

/** Which part of a weather record is reported, and how much is simulated before it. */
export interface PeriodOptions {
  /** First and last reported day (ISO); default: the first and last complete years after warm-up. */
  from?: string | undefined;
  to?: string | undefined;
  /** Years simulated before `from` and not reported, so the start state does not matter. */
  warmupYears?: number | undefined;
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
      refEtMm: et.refEtMm,
      tmeanC: tmean,
    },
    method: et.method,
  };
}

/** The reported period: explicit dates, or whole calendar years after the warm-up. */
export function reportPeriod(
  dates: readonly string[],
  o: PeriodOptions,
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
    throw new SettingError(
      (n) => `${n('from')} ${from} lies outside the weather record (${first} to ${last})`,
    );
  }
  if (to < from || to > last) {
    throw new SettingError(
      (n) =>
        `${n('to')} ${to} must lie between ${n('from')} ${from} and the record's last day ${last}`,
    );
  }
  return { from, to, warmupYears };
}

/** The design-independent part of runs over one field and weather record. */
export interface PreparedField {
  /** Forcing over the simulated period (warm-up and reported), with its calendar fields. */
  forcing: EngineForcing & { days: DayIndex };
  refEtMethod: EtMethod;
  /** First and last reported day (ISO) and the warm-up years simulated before `from`. */
  from: string;
  to: string;
  warmupYears: number;
  /** Index of `from` in the forcing; the reported period runs to the end of the forcing. */
  reportStart: number;
  /** Daily crop calendar of a rotation (cached). */
  calendarOf(
    rotation: readonly string[],
    crops: Record<string, CropParams>,
    firstYear?: number,
    roots?: RootOptions,
  ): CropCalendar;
  /** Daily outlet level of a schedule, NaN where free (cached; read only). */
  outletOf(schedule: OutletSchedule): Float64Array;
  /** Weather- and calendar-only terms of the pool model (cached; read only). */
  poolForcingOf(calendar: CropCalendar, config: NitrateConfig): PoolForcing | undefined;
}

/** What one design needs beyond the prepared field (a `ScenarioSpec` has it all). */
export type DesignSpec = Pick<
  ScenarioSpec,
  'name' | 'params' | 'rotation' | 'crops' | 'outlet' | 'nitrate'
> &
  Partial<Pick<ScenarioSpec, 'rotationFirstYear' | 'roots'>> & { field: Pick<Field, 'wetness'> };

/** One design's results: daily columns over the simulated period, annual rows over the reported. */
export interface DesignRun {
  calendar: CropCalendar;
  engine: EngineResult;
  nitrate: NitrateResult;
  annual: AnnualRow[];
}

/**
 * The data of a prepared field, without its caches: plain values and typed arrays, so it can be
 * copied to a worker thread (structured clone) and made a prepared field there again with
 * `preparedFieldOf`.
 */
export type PreparedData = Omit<PreparedField, 'calendarOf' | 'outletOf' | 'poolForcingOf'>;

/**
 * Prepare a field and a weather record for design runs: cut the record to the simulated period
 * (the reported period of `o` plus the warm-up years before it) and compute its forcing once.
 * Site values (latitude, elevation) come from `field`.
 */
export function prepareField(
  field: Pick<Field, 'site'> & { weather?: { etFactor: number } },
  weather: WeatherSeries,
  o: PeriodOptions = {},
): PreparedField {
  return preparedFieldOf(preparedDataOf(field, weather, o));
}

/** The data of `prepareField(field, weather, o)`, without the caches. */
export function preparedDataOf(
  field: Pick<Field, 'site'> & { weather?: { etFactor: number } },
  weather: WeatherSeries,
  o: PeriodOptions = {},
): PreparedData {
  const { from, to, warmupYears } = reportPeriod(weather.dates, o);
  const simFrom = `${Number(from.slice(0, 4)) - warmupYears}${from.slice(4)}`;
  const a0 = indexOf(weather.dates, simFrom);
  const b0 = indexOf(weather.dates, to) + 1;
  const sim: WeatherSeries = {
    ...weather,
    dates: weather.dates.slice(a0, b0),
    precipMm: weather.precipMm.slice(a0, b0),
    tmaxC: weather.tmaxC.slice(a0, b0),
    tminC: weather.tminC.slice(a0, b0),
    ...(weather.refEtMm && { refEtMm: weather.refEtMm.slice(a0, b0) }),
    ...(weather.solarMJm2 && { solarMJm2: weather.solarMJm2.slice(a0, b0) }),
    ...(weather.rhMeanPct && { rhMeanPct: weather.rhMeanPct.slice(a0, b0) }),
    ...(weather.wind2mMs && { wind2mMs: weather.wind2mMs.slice(a0, b0) }),
  };
  const { forcing: f, method } = forcingOf(sim, field.site.latitude, field.site.elevation);
  // weather.etFactor: a calibration factor on reference ET (README, Assumptions and defaults).
  const etFactor = field.weather?.etFactor ?? 1;
  if (etFactor !== 1) for (let i = 0; i < f.refEtMm.length; i++) f.refEtMm[i] *= etFactor;
  return {
    forcing: { ...f, days: dayIndexOf(f.dates) },
    refEtMethod: method,
    from,
    to,
    warmupYears,
    reportStart: indexOf(f.dates, from),
  };
}

/** A prepared field from its data (`preparedDataOf`), with empty caches. */
export function preparedFieldOf(data: PreparedData): PreparedField {
  const { forcing } = data;
  const { dates, days } = forcing;
  const calendars = new Map<string, CropCalendar>();
  const outlets = new Map<string, Float64Array>();
  const pools = new Map<CropCalendar, Map<string, PoolForcing>>();
  return {
    ...data,
    calendarOf(rotation, crops, firstYear = DEFAULT_ROTATION_FIRST_YEAR, roots = {}) {
      const key = JSON.stringify([rotation, rotation.map((c) => crops[c]), firstYear, roots]);
      let c = calendars.get(key);
      if (!c) {
        calendars.set(key, (c = cropCalendar(dates, rotation, crops, days, firstYear, roots)));
      }
      return c;
    },
    outletOf(schedule) {
      const key = JSON.stringify(schedule);
      let s = outlets.get(key);
      if (!s) outlets.set(key, (s = outletSeries(dates, schedule, days)));
      return s;
    },
    poolForcingOf(calendar, config) {
      if (config.model !== 'pool') return undefined;
      let byConfig = pools.get(calendar);
      if (!byConfig) pools.set(calendar, (byConfig = new Map()));
      const key = JSON.stringify(config);
      let pf = byConfig.get(key);
      if (!pf) {
        pf = poolForcingOf({ dates, tmeanC: forcing.tmeanC, calendar, days }, config);
        byConfig.set(key, pf);
      }
      return pf;
    },
  };
}

/**
 * Run one design over a prepared field: the engine, the nitrate model and the annual table of
 * the reported period. Only the result columns are allocated, and not even those with `reuse`:
 * the run of an earlier design over the same field, whose daily columns this run overwrites (a
 * sweep keeps one per worker; the earlier run then shows this one).
 *
 * @example runDesign(prepareField(field.base, weather), scenarioOf('a', '', field.base)).annual
 */
export function runDesign(p: PreparedField, spec: DesignSpec, reuse?: DesignRun): DesignRun {
  const { forcing } = p;
  const calendar = p.calendarOf(spec.rotation, spec.crops, spec.rotationFirstYear, spec.roots);
  const engine = simulate(forcing, calendar, p.outletOf(spec.outlet), spec.params, reuse?.engine);
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
      days: forcing.days,
    },
    spec.nitrate,
    p.poolForcingOf(calendar, spec.nitrate),
    reuse?.nitrate,
  );
  const annual = annualRows(
    spec.name,
    forcing,
    engine,
    nitrate,
    spec.field.wetness,
    spec.params,
    p.reportStart,
    forcing.dates.length,
  );
  return { calendar, engine, nitrate, annual };
}

/** Index of the first date >= iso (binary search on ISO strings). */
function indexOf(dates: readonly string[], iso: string): number {
  let lo = 0;
  let hi = dates.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (dates[mid] < iso) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
