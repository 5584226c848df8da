// Synthetic forcing and parameters for engine tests: constant days, no snow, chosen rain and ET0.
import type { CropCalendar, EngineForcing, EngineParams } from '../../src/engine/types.js';

export function dates(n: number, first = '2001-01-01'): string[] {
  const t0 = Date.parse(first + 'T00:00:00Z');
  return Array.from({ length: n }, (_, i) =>
    new Date(t0 + i * 86400000).toISOString().slice(0, 10),
  );
}

export function constantForcing(n: number, rainMm: number, refEtMm: number): EngineForcing {
  const z = () => new Float64Array(n);
  return {
    dates: dates(n),
    precipMm: z().fill(rainMm),
    rainMm: z().fill(rainMm),
    snowfallMm: z(),
    snowmeltMm: z(),
    sweMm: z(),
    refEtMm: z().fill(refEtMm),
    tmeanC: z().fill(15),
  };
}

export function flatCalendar(n: number, kc = 1): CropCalendar {
  return {
    kc: new Float64Array(n).fill(kc),
    depletionFraction: new Float64Array(n).fill(0.5),
    crop: new Uint8Array(n),
    seasonFraction: new Float64Array(n).fill(-1),
    crops: [],
  };
}

export function params(over: Partial<EngineParams> = {}): EngineParams {
  return {
    drainDepthM: 1.2,
    spacingM: 20,
    drainRadiusM: 0.05,
    barrierDepthM: 2.5,
    kAboveMPerDay: 1,
    kBelowMPerDay: 1,
    porosity: { depthsM: [2.5], values: [0.05] },
    rootZoneDepthM: 0.6,
    fieldCapacity: 0.3,
    wiltingPoint: 0.14,
    surfaceStorageMm: 10,
    seepageMmPerDay: 0,
    seepageConductanceMmPerDayPerM: 0,
    capacityMmPerDay: Infinity,
    capillaryDecayM: 0.3,
    initialWaterTableDepthM: 0.8,
    substepsPerDay: 8,
    equivalentDepthMethod: 'vdmw',
    ...over,
  };
}

export const free = (n: number) => new Float64Array(n).fill(NaN);
