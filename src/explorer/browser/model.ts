/**
 * The explorer's model, without a page: what the HTML file carries (the field, its weather as
 * columns, the two designs to start from), the settings a person changes, and the run of both
 * designs over every year on a prepared field. Browser-safe (no Node, no DOM), so the page, its
 * worker and the tests share it.
 *
 * Design A is the field file's baseline; design B its controlled variant (the field's first
 * scenario with an outlet schedule, or A with the standard winter hold). The soil and the
 * nitrate setting belong to the field and apply to both; depth, spacing and the outlet schedule
 * belong to each design.
 *
 * @example
 * const prepared = prepareField(data.fields.a, weatherOf(data.weather));
 * runBoth(prepared, data, settingsOf(data)).rows[1].drainflow_change_percent // e.g. -18.3
 */
import type { WeatherSeries } from '../../climate/weatherSeries.js';
import type { OutletStep } from '../../engine/outletSchedule.js';
import type { NitrateConfig } from '../../nitrate/types.js';
import { compareScenarios, type ComparisonRow } from '../../scenarios/compare.js';
import type { Field } from '../../scenarios/fieldSchema.js';
import {
  prepareField,
  runDesign,
  type DesignRun,
  type PeriodOptions,
  type PreparedField,
} from '../../scenarios/prepared.js';
import { scenarioOf } from '../../scenarios/resolve.js';
import type { AnnualRow } from '../../scenarios/types.js';
import type { UnitSystem } from '../../units/quantity.js';

/** The weather record as JSON columns (numbers as the reader gave them, NaN-free). */
export interface WeatherColumns {
  dates: string[];
  precipMm: number[];
  tmaxC: number[];
  tminC: number[];
  refEtMm?: number[];
  solarMJm2?: number[];
  rhMeanPct?: number[];
  wind2mMs?: number[];
}

/** One design as the field file gives it: name, description, validated field and raw overrides. */
export interface DesignSource {
  name: string;
  description: string;
  /** The validated field of this design (SI, defaults filled). */
  field: Field;
  /**
   * The keys this design sets in the field file's `scenarios:` list (raw, as written), or {}
   * for the base field; the saved file starts from them.
   */
  overrides: Record<string, unknown>;
}

/** Everything the HTML file carries besides the code. */
export interface ExplorerData {
  title: string;
  generatedBy: string;
  fieldName: string;
  weatherFile: string;
  units: UnitSystem;
  /** The reported period and warm-up (as the run it goes with: default whole years). */
  period: PeriodOptions;
  weather: WeatherColumns;
  a: DesignSource;
  b: DesignSource;
  /** The field file as written (raw YAML values), with file references resolved; no scenarios. */
  baseRaw: Record<string, unknown>;
}

/** One outlet step as the editor holds it: a month-day and a level (m) or free (null). */
export type OutletRow = OutletStep;

/** The settings of one design. */
export interface DesignSettings {
  depthM: number;
  spacingM: number;
  /** Yearly outlet schedule; empty = a free outlet all year. */
  outlet: OutletRow[];
}

/** What a person changes: the field's soil and nitrate setting, and each design. */
export interface ExplorerSettings {
  kMPerDay: number;
  /** Drainable porosity of each layer, top down (one value when the profile is uniform). */
  porosity: number[];
  /** The nitrate model's main parameter in core units (see `nitrateParameterOf`), or null. */
  nitrate: number | null;
  a: DesignSettings;
  b: DesignSettings;
}

/** The nitrate model's main parameter: which one, its unit kind, its value. */
export interface NitrateParameter {
  label: string;
  kind: 'concentration' | 'load';
  value: number;
}

/**
 * The main parameter of a field's nitrate model: the concentration of the fixed model, the
 * rating's concentration at 1 mm/d (a), the pool model's fertilizer N per application (the
 * first event; changing it scales every event); none for the seasonal model.
 */
export function nitrateParameterOf(n: NitrateConfig): NitrateParameter | null {
  if (n.model === 'fixed') {
    return {
      label: 'Nitrate-N concentration of drain water',
      kind: 'concentration',
      value: n.concentrationMgL,
    };
  }
  if (n.model === 'rating') {
    return {
      label: 'Rating concentration at 1 mm/d of drain flow (a)',
      kind: 'concentration',
      value: n.a,
    };
  }
  if (n.model === 'pool' && n.fertilizer.length > 0) {
    return {
      label: 'Fertilizer N per application',
      kind: 'load',
      value: n.fertilizer[0].amountKgHa,
    };
  }
  return null;
}

/** The nitrate section with its main parameter set to `value` (core form). */
export function withNitrateParameter(n: NitrateConfig, value: number | null): NitrateConfig {
  if (value === null) return n;
  if (n.model === 'fixed') return { ...n, concentrationMgL: value };
  if (n.model === 'rating') return { ...n, a: value };
  if (n.model === 'pool' && n.fertilizer.length > 0) {
    const first = n.fertilizer[0].amountKgHa;
    const scale = (x: number) => (first > 0 ? (x * value) / first : value);
    return {
      ...n,
      fertilizer: n.fertilizer.map((e) => ({ ...e, amountKgHa: scale(e.amountKgHa) })),
    };
  }
  return n;
}

function porosityOf(f: Field): number[] {
  const p = f.soil.drainablePorosity;
  return typeof p === 'number' ? [p] : p.map((l) => l.value);
}

function outletRowsOf(f: Field): OutletRow[] {
  const o = f.outlet;
  if (o === 'free') return [];
  // A one-off dated list cannot be edited as a yearly schedule: start from a free outlet.
  if (!('schedule' in o)) return [];
  return o.schedule.map((s) => ({ from: s.from, depthM: s.depth === 'free' ? null : s.depth }));
}

/** The settings the field file gives (what the page shows before anything is changed). */
export function settingsOf(data: Pick<ExplorerData, 'a' | 'b'>): ExplorerSettings {
  const design = (f: Field): DesignSettings => ({
    depthM: f.drains.depth,
    spacingM: f.drains.spacing,
    outlet: outletRowsOf(f),
  });
  return {
    kMPerDay: data.a.field.soil.conductivity,
    porosity: porosityOf(data.a.field),
    nitrate: nitrateParameterOf(data.a.field.nitrate as NitrateConfig)?.value ?? null,
    a: design(data.a.field),
    b: design(data.b.field),
  };
}

/** Whether a design's outlet rows describe the field file's own outlet (kept as written then). */
function sameOutlet(f: Field, rows: readonly OutletRow[]): boolean {
  return JSON.stringify(outletRowsOf(f)) === JSON.stringify(rows);
}

/** The validated field of a design with the settings applied (SI, core form). */
export function designField(source: DesignSource, s: ExplorerSettings, d: DesignSettings): Field {
  const f = source.field;
  const por = f.soil.drainablePorosity;
  const porosity: Field['soil']['drainablePorosity'] =
    typeof por === 'number' ? s.porosity[0] : por.map((l, i) => ({ ...l, value: s.porosity[i] }));
  const outlet: Field['outlet'] = sameOutlet(f, d.outlet)
    ? f.outlet
    : d.outlet.length === 0
      ? 'free'
      : {
          schedule: d.outlet.map((r) => ({
            from: r.from,
            depth: r.depthM === null ? 'free' : r.depthM,
          })),
        };
  return {
    ...f,
    soil: { ...f.soil, conductivity: s.kMPerDay, drainablePorosity: porosity },
    drains: { ...f.drains, depth: d.depthM, spacing: d.spacingM },
    outlet,
    nitrate: withNitrateParameter(f.nitrate as NitrateConfig, s.nitrate) as Field['nitrate'],
  };
}

/** A WeatherSeries from the JSON columns. */
export function weatherOf(w: WeatherColumns): WeatherSeries {
  return {
    dates: w.dates,
    precipMm: Float64Array.from(w.precipMm),
    tmaxC: Float64Array.from(w.tmaxC),
    tminC: Float64Array.from(w.tminC),
    ...(w.refEtMm && { refEtMm: Float64Array.from(w.refEtMm) }),
    ...(w.solarMJm2 && { solarMJm2: Float64Array.from(w.solarMJm2) }),
    ...(w.rhMeanPct && { rhMeanPct: Float64Array.from(w.rhMeanPct) }),
    ...(w.wind2mMs && { wind2mMs: Float64Array.from(w.wind2mMs) }),
  };
}

/** The prepared field both designs run on (the same site and weather for A and B). */
export function prepareExplorer(data: ExplorerData): PreparedField {
  return prepareField(data.a.field, weatherOf(data.weather), data.period);
}

/** Why the settings cannot run, one line per problem (empty when they can). */
export function settingsProblems(data: ExplorerData, s: ExplorerSettings): string[] {
  const out: string[] = [];
  const f = data.a.field;
  const num = (x: number) => Number.isFinite(x);
  if (!(num(s.kMPerDay) && s.kMPerDay > 0 && s.kMPerDay <= 100)) {
    out.push('Soil conductivity must be above 0 and at most 100 m/d.');
  }
  s.porosity.forEach((p, i) => {
    if (!(num(p) && p > 0 && p <= 0.5)) {
      out.push(
        `Drainable porosity${s.porosity.length > 1 ? ` of layer ${i + 1}` : ''} must be above 0 and at most 0.5.`,
      );
    }
  });
  if (s.nitrate !== null && !(num(s.nitrate) && s.nitrate >= 0 && s.nitrate <= 1000)) {
    out.push('The nitrate setting must be from 0 to 1000.');
  }
  for (const [key, label] of [
    ['a', 'Design A'],
    ['b', 'Design B'],
  ] as const) {
    const d = s[key];
    const deepest = f.soil.restrictiveLayerDepth - f.drains.radius;
    if (!(num(d.depthM) && d.depthM >= 0.2 && d.depthM < deepest)) {
      out.push(
        `${label}: drain depth must be at least 0.2 m and above the restrictive layer (less than ${deepest.toFixed(2)} m).`,
      );
    }
    if (!(
      num(d.spacingM) &&
      d.spacingM >= 1 &&
      d.spacingM <= 500 &&
      d.spacingM > 4 * f.drains.radius
    )) {
      out.push(`${label}: drain spacing must be from 1 to 500 m.`);
    }
    const seen = new Set<string>();
    d.outlet.forEach((r, i) => {
      if (!MONTH_DAY.test(r.from)) {
        out.push(`${label}: outlet row ${i + 1} needs a date MM-DD such as 10-25.`);
      } else if (seen.has(r.from)) {
        out.push(`${label}: outlet row ${i + 1} repeats the date ${r.from}.`);
      }
      seen.add(r.from);
      if (r.depthM !== null && !(num(r.depthM) && r.depthM >= 0 && r.depthM <= 5)) {
        out.push(
          `${label}: outlet row ${i + 1} needs a level from 0 to 5 m below the surface, or free.`,
        );
      }
    });
  }
  return out;
}

/** A month-day "MM-DD" as the field file accepts it. */
export const MONTH_DAY = /^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;

/** Both designs' results: the comparison rows (A first, the baseline) and the annual rows. */
export interface BothRuns {
  rows: ComparisonRow[];
  annual: AnnualRow[];
  /** Each design's full run (daily columns over the simulated period), A then B. */
  runs: [DesignRun, DesignRun];
}

/**
 * Run designs A and B over every year of the prepared field and compare them, as `tileflux
 * run` does for the saved field file (same prepared period, same engine, same comparison).
 */
export function runBoth(
  prepared: PreparedField,
  data: ExplorerData,
  s: ExplorerSettings,
): BothRuns {
  const a = scenarioOf(data.a.name, data.a.description, designField(data.a, s, s.a));
  const b = scenarioOf(data.b.name, data.b.description, designField(data.b, s, s.b));
  const runs: [DesignRun, DesignRun] = [runDesign(prepared, a), runDesign(prepared, b)];
  const annual = [...runs[0].annual, ...runs[1].annual];
  const rows = compareScenarios(annual, {
    baseline: a.name,
    scenarios: [
      { name: a.name, spacingM: a.params.spacingM },
      { name: b.name, spacingM: b.params.spacingM },
    ],
  });
  return { rows, annual, runs };
}
