/**
 * What the explorer page carries, from a loaded field file and its weather: the two designs (A
 * the baseline, B its controlled variant), the field as written with its file references
 * resolved (so the saved file stands alone), and the weather as JSON columns.
 */
import { parse } from 'yaml';
import type { WeatherSeries } from '../climate/weatherSeries.js';
import type { LoadedField } from '../io/field.js';
import type { NitrateConfig } from '../nitrate/types.js';
import type { Field } from '../scenarios/fieldSchema.js';
import type { PeriodOptions } from '../scenarios/prepared.js';
import { standardScenarios, STANDARD_CONTROL } from '../scenarios/resolve.js';
import { US, type UnitSystem } from '../units/quantity.js';
import type { DesignSource, ExplorerData, WeatherColumns } from './browser/model.js';

type Raw = Record<string, unknown>;

const isObj = (x: unknown): x is Raw => typeof x === 'object' && x !== null && !Array.isArray(x);

/**
 * Replace what points at other files with the values read from them: a rating fitted to an
 * observations file becomes its a, b and flow range; a drain-system file becomes the capacity
 * its sizes deliver.
 */
function resolved(raw: Raw, f: Field): Raw {
  const out: Raw = { ...raw };
  const n = f.nitrate as NitrateConfig;
  if (isObj(raw.nitrate) && typeof raw.nitrate.observations === 'string' && n.model === 'rating') {
    const { observations: _o, ...rest } = raw.nitrate;
    out.nitrate = { ...rest, a: n.a, b: n.b, flowRange: [...n.fitFlowRangeMm] };
  }
  if (
    isObj(raw.drains) &&
    typeof raw.drains.system === 'string' &&
    f.drains.capacity !== undefined
  ) {
    const { system: _s, ...rest } = raw.drains;
    out.drains = { ...rest, capacity: `${f.drains.capacity} mm/d` };
  }
  return out;
}

/** A field with the standard winter hold at its outlet. */
function winterHold(f: Field): Field {
  const { raise, depthM, lower } = STANDARD_CONTROL;
  return {
    ...f,
    outlet: {
      schedule: [
        { from: raise, depth: depthM },
        { from: lower, depth: 'free' },
      ],
    },
  };
}

function winterHoldRaw(): Raw {
  const { raise, depthM, lower } = STANDARD_CONTROL;
  return {
    outlet: {
      schedule: [
        { from: raise, depth: `${depthM} m` },
        { from: lower, depth: 'free' },
      ],
    },
  };
}

/**
 * Designs A and B of a field: without scenarios, conventional and controlled as `tileflux run`
 * derives them; with scenarios, the first (the baseline) and the first later one with an outlet
 * schedule, or else the first with the standard winter hold.
 */
export function designsOf(
  loaded: LoadedField,
  units: UnitSystem = 'si',
): { a: DesignSource; b: DesignSource; baseRaw: Raw } {
  const raw = parse(loaded.text.replace(/^\uFEFF/, '')) as Raw;
  const { scenarios: rawScenarios, ...rest } = raw;
  const baseRaw = resolved(rest, loaded.base);
  if (loaded.scenarios.length === 0) {
    const [conv, , ctrl] = standardScenarios(loaded.base, units);
    return {
      baseRaw,
      a: { name: conv.name, description: conv.description, field: conv.field, overrides: {} },
      b: {
        name: ctrl.name,
        description: ctrl.description,
        field: ctrl.field,
        overrides: winterHoldRaw(),
      },
    };
  }
  const list = (Array.isArray(rawScenarios) ? rawScenarios : []) as Raw[];
  const source = (i: number): DesignSource => {
    const s = loaded.scenarios[i];
    const { name: _n, description: _d, ...overrides } = list[i] ?? {};
    return {
      name: s.name,
      description: s.description ?? '',
      field: s.field,
      overrides: resolved(overrides, s.field),
    };
  };
  const a = source(0);
  const k = loaded.scenarios.findIndex(
    (s, i) => i > 0 && typeof s.field.outlet === 'object' && 'schedule' in s.field.outlet,
  );
  if (k > 0) return { baseRaw, a, b: source(k) };
  const taken = new Set(loaded.scenarios.map((s) => s.name));
  const held =
    units === 'us'
      ? `${(STANDARD_CONTROL.depthM / US.mPerFt).toFixed(2)} ft`
      : `${STANDARD_CONTROL.depthM.toFixed(2)} m`;
  let name = 'winter hold';
  while (taken.has(name)) name += ' (explorer)';
  return {
    baseRaw,
    a,
    b: {
      name,
      description: `${a.name} with the outlet held ${held} below the surface ${STANDARD_CONTROL.raise} to ${STANDARD_CONTROL.lower}`,
      field: winterHold(a.field),
      overrides: { ...a.overrides, ...winterHoldRaw() },
    },
  };
}

/** The weather record as JSON columns. */
export function weatherColumnsOf(w: WeatherSeries): WeatherColumns {
  return {
    dates: w.dates,
    precipMm: Array.from(w.precipMm),
    tmaxC: Array.from(w.tmaxC),
    tminC: Array.from(w.tminC),
    ...(w.refEtMm && { refEtMm: Array.from(w.refEtMm) }),
    ...(w.solarMJm2 && { solarMJm2: Array.from(w.solarMJm2) }),
    ...(w.rhMeanPct && { rhMeanPct: Array.from(w.rhMeanPct) }),
    ...(w.wind2mMs && { wind2mMs: Array.from(w.wind2mMs) }),
  };
}

/** Everything the page carries besides its code. */
export function explorerDataOf(
  loaded: LoadedField,
  weather: WeatherSeries,
  o: { weatherFile: string; units: UnitSystem; generatedBy: string; period?: PeriodOptions },
): ExplorerData {
  const { a, b, baseRaw } = designsOf(loaded, o.units);
  return {
    title: `Drainage explorer: ${loaded.base.name}`,
    generatedBy: o.generatedBy,
    fieldName: loaded.base.name,
    weatherFile: o.weatherFile,
    units: o.units,
    period: o.period ?? {},
    weather: weatherColumnsOf(weather),
    a,
    b,
    baseRaw,
  };
}
