/**
 * From a validated field to the scenarios the engine runs: SI engine parameters, the crop
 * calendar inputs, the outlet schedule and the nitrate model of each scenario. When the field
 * file names no scenarios, the three standard alternatives are derived from the base field.
 */
import { proseUnits, type Prose } from '../units/prose.js';
import type { UnitSystem } from '../units/quantity.js';
import { equivalentDepth } from '../drainage/equivalentDepth.js';
import { hooghoudtSpacing } from '../drainage/hooghoudt.js';
import { manningFullCapacity } from '../drainage/manning.js';
import { drainageCoefficient } from '../drainage/drainageCoefficient.js';
import { CROPS, type CropParams } from '../engine/crops.js';
import type { RootOptions } from '../engine/cropCalendar.js';
import {
  SEEPAGE_SETTINGS,
  seepageParamsOf,
  type SeepageBand,
  type SeepageSetting,
} from '../engine/seepage.js';
import type { OutletSchedule } from '../engine/outletSchedule.js';
import type { EngineParams } from '../engine/types.js';
import type { NitrateConfig } from '../nitrate/types.js';
import type { Field } from './fieldSchema.js';

/** Everything needed to run one scenario. */
export interface ScenarioSpec {
  name: string;
  description: string;
  field: Field;
  params: EngineParams;
  rotation: string[];
  /** A calendar year in which the rotation grows its first crop. */
  rotationFirstYear: number;
  /** How the calendar sets the daily rooting depth. */
  roots: RootOptions;
  /** The seepage assumed: a named setting or "custom", and its terms. */
  seepage: { name: string; setting: SeepageSetting };
  /** Where the pipe capacity comes from, e.g. "drainage coefficient mineral field none". */
  capacitySource: string;
  crops: Record<string, CropParams>;
  outlet: OutletSchedule;
  /** Human description of the outlet management, e.g. "free" or "held at 0.30 m 11-01 to 04-01". */
  outletLabel: string;
  nitrate: NitrateConfig;
}

/** Depth of the shallow alternative's drains, m (common practice: 0.6 to 0.9 m). */
export const SHALLOW_DEPTH_M = 0.75;
/** Standard controlled-drainage schedule: raise after harvest, lower before planting. */
export const STANDARD_CONTROL = { raise: '11-01', depthM: 0.3, lower: '04-01' } as const;

/**
 * Hooghoudt drainage intensity (m/d): the rate with the midpoint water table at the surface.
 * @example drainageIntensityOf(field) // e.g. 0.025 for 1.2 m drains 20 m apart in 1 m/d soil
 */
export function drainageIntensityOf(f: Field): number {
  const below = f.soil.restrictiveLayerDepth - f.drains.depth;
  const kBelow = f.soil.conductivityBelowDrains ?? f.soil.conductivity;
  const d = equivalentDepth(f.drains.spacing, below, f.drains.radius, f.drains.equivalentDepth);
  const h = f.drains.depth;
  return (
    (8 * kBelow * d * h + 4 * f.soil.conductivity * h * h) / (f.drains.spacing * f.drains.spacing)
  );
}

/** The outlet schedule of a field, in engine form, and its label in the given units. */
function outletOf(f: Field, say: Prose): { outlet: OutletSchedule; label: string } {
  const o = f.outlet;
  if (o === 'free') return { outlet: { steps: [] }, label: 'free outlet' };
  const list = 'schedule' in o ? o.schedule : o.dates;
  const steps = list.map((s) => ({ from: s.from, depthM: s.depth === 'free' ? null : s.depth }));
  const label = steps
    .map((s) => `${s.depthM === null ? 'free' : say.length(s.depthM, 2)} from ${s.from}`)
    .join(', ');
  return { outlet: { steps }, label: `controlled: ${label}` };
}

/**
 * Drain capacity in mm/d and where it comes from: `drains.capacity` if given, else the lateral
 * pipe's full flow (Manning) over the area it serves, else the drainage coefficient (a rate, or
 * the table's value for a soil, crop and inlets; by default field crops on mineral soil without
 * surface inlets). A system is designed to carry its drainage coefficient, so flow beyond it is
 * held back in the field.
 */
export function capacityWithSource(f: Field): { mmPerDay: number; source: string } {
  if (f.drains.capacity !== undefined) {
    return { mmPerDay: f.drains.capacity, source: 'drains.capacity' };
  }
  const pipe = f.drains.pipe;
  if (pipe) {
    // The field file gives the pipe's diameter in mm and lengths in m (fieldSchema.ts).
    const diameterM = pipe.diameter / 1000;
    const q = manningFullCapacity(diameterM, pipe.grade, pipe.roughness);
    const areaM2 = pipe.length * f.drains.spacing;
    return { mmPerDay: ((q * 86400) / areaM2) * 1000, source: 'drains.pipe (Manning, full flow)' };
  }
  const c = f.drains.coefficient;
  if (typeof c === 'number') return { mmPerDay: c, source: 'drains.coefficient' };
  const preset = c ?? { soil: 'mineral', crop: 'field', inlets: 'none' };
  return {
    mmPerDay: drainageCoefficient(preset).mmPerDay,
    source:
      `drainage coefficient for ${preset.soil} soil, ${preset.crop} crops, inlets ${preset.inlets}` +
      (c === undefined ? ' (default)' : ''),
  };
}

/** Drain capacity in mm/d (see `capacityWithSource`). */
export function capacityOf(f: Field): number {
  return capacityWithSource(f).mmPerDay;
}

/** The seepage setting of a field: a named one, or the field's own terms ("custom"). */
export function seepageOf(f: Field): { name: string; setting: SeepageSetting } {
  const s = f.seepage;
  if (typeof s === 'string') return { name: s, setting: SEEPAGE_SETTINGS[s] };
  return { name: 'custom', setting: s };
}

/** The field with one of the documented seepage settings in place of its own. */
export function withSeepage(f: Field, band: SeepageBand): Field {
  return { ...f, seepage: band };
}

/** Engine parameters of a field (all SI). */
export function engineParamsOf(f: Field): EngineParams {
  const por = f.soil.drainablePorosity;
  const porosity =
    typeof por === 'number'
      ? { depthsM: [f.soil.restrictiveLayerDepth], values: [por] }
      : { depthsM: por.map((l) => l.depth), values: por.map((l) => l.value) };
  return {
    drainDepthM: f.drains.depth,
    spacingM: f.drains.spacing,
    drainRadiusM: f.drains.radius,
    barrierDepthM: f.soil.restrictiveLayerDepth,
    kAboveMPerDay: f.soil.conductivity,
    kBelowMPerDay: f.soil.conductivityBelowDrains ?? f.soil.conductivity,
    porosity,
    // Used only where a calendar has no daily rooting depth.
    rootZoneDepthM: Math.min(
      f.soil.rootZoneDepth ?? CROPS.corn.maxRootDepth,
      f.soil.restrictiveLayerDepth,
    ),
    fieldCapacity: f.soil.fieldCapacity,
    wiltingPoint: f.soil.wiltingPoint,
    surfaceStorageMm: f.soil.surfaceStorage,
    seepageMmPerDay: f.soil.seepage,
    seepageConductanceMmPerDayPerM: f.soil.seepageConductance,
    seepage: seepageParamsOf(seepageOf(f).setting, f.soil.conductivity),
    capacityMmPerDay: capacityOf(f),
    capillaryDecayM: f.soil.capillaryDecay,
    initialWaterTableDepthM: f.initial.waterTableDepth,
    substepsPerDay: f.simulation.substepsPerDay,
    equivalentDepthMethod: f.drains.equivalentDepth,
  };
}

/** Crop parameters with the field's overrides applied. */
function cropsOf(f: Field): Record<string, CropParams> {
  const out: Record<string, CropParams> = {};
  for (const name of Object.keys(CROPS)) {
    const over = (f.crops as Record<string, Partial<CropParams> | undefined>)[name] ?? {};
    const merged = { ...CROPS[name] };
    for (const [k, v] of Object.entries(over))
      if (v !== undefined && k in merged) (merged as Record<string, unknown>)[k] = v;
    out[name] = merged;
  }
  return out;
}

/**
 * Resolve one full field into a runnable scenario; its outlet label is written in `units`
 * (SI by default).
 */
export function scenarioOf(
  name: string,
  description: string,
  f: Field,
  units: UnitSystem = 'si',
): ScenarioSpec {
  const { outlet, label } = outletOf(f, proseUnits(units));
  return {
    name,
    description,
    field: f,
    params: engineParamsOf(f),
    rotation: [...f.crops.rotation],
    rotationFirstYear: f.crops.firstYear,
    roots: {
      ...(f.soil.rootZoneDepth !== undefined && { fixedM: f.soil.rootZoneDepth }),
      capM: f.soil.restrictiveLayerDepth,
    },
    seepage: seepageOf(f),
    capacitySource: capacityWithSource(f).source,
    crops: cropsOf(f),
    outlet,
    outletLabel: label,
    nitrate: f.nitrate as NitrateConfig,
  };
}

/**
 * The three standard alternatives derived from a base field:
 * - conventional: the base as given;
 * - shallow: drains at 0.75 m (or three quarters of the base depth if that is shallower) with the
 *   spacing that keeps the base's Hooghoudt drainage intensity (water table at the surface);
 * - controlled: the base layout with the outlet held 0.30 m below the surface from 1 November to
 *   1 April (after harvest to before planting; common practice for winter water management).
 */
export function standardScenarios(base: Field, units: UnitSystem = 'si'): ScenarioSpec[] {
  const say = proseUnits(units);
  const intensity = drainageIntensityOf(base);
  const depth = Math.min(SHALLOW_DEPTH_M, 0.75 * base.drains.depth);
  const kBelow = base.soil.conductivityBelowDrains ?? base.soil.conductivity;
  const sol = hooghoudtSpacing({
    kAboveMPerDay: base.soil.conductivity,
    kBelowMPerDay: kBelow,
    layerBelowDrainsM: base.soil.restrictiveLayerDepth - depth,
    drainRadiusM: base.drains.radius,
    headM: depth,
    rateMPerDay: intensity,
    method: base.drains.equivalentDepth,
  });
  const spacing = Math.round(sol.spacingM * 10) / 10;
  const shallow: Field = { ...base, drains: { ...base.drains, depth, spacing } };
  const { raise, depthM, lower } = STANDARD_CONTROL;
  const controlled: Field = {
    ...base,
    outlet: {
      schedule: [
        { from: raise, depth: depthM },
        { from: lower, depth: 'free' },
      ],
    },
  };
  return [
    scenarioOf(
      'conventional',
      `drains as given: ${say.length(base.drains.depth)} deep, ${say.length(base.drains.spacing)} apart, free outlet`,
      base,
      units,
    ),
    scenarioOf(
      'shallow',
      `drains ${say.length(depth, 2)} deep, ${say.length(spacing)} apart: same drainage intensity (${say.rate(intensity * 1000)}) as conventional`,
      shallow,
      units,
    ),
    scenarioOf(
      'controlled',
      `conventional layout, outlet held ${say.length(depthM)} below the surface ${raise} to ${lower}`,
      controlled,
      units,
    ),
  ];
}
