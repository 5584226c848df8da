/**
 * Seepage out of a drained field other than through its drains, by two published forms:
 *
 * - Vertical leakage through the restrictive layer to a regional groundwater head (a leaky
 *   aquitard, Darcy's law across it): q = (K' / b') x (z_r - z_w), with K'/b' the leakance of
 *   the layers between the water table and the regional aquifer (1/d), z_w the water-table depth
 *   and z_r the depth of the regional head (both below the surface). The water table lies above
 *   the regional head in a recharge area, so the flow is downward; an upward gradient (a
 *   discharge area) is not modelled and gives no seepage.
 * - Lateral seepage to the field edge, where a boundary ditch or an undrained neighbour holds
 *   the water at depth z_e: Dupuit-Forchheimer flow over the restrictive layer. For a strip of
 *   width 2x between two edges at head H_e, uniform outflow q per unit area keeps the midpoint
 *   head H with H^2 - H_e^2 = q x^2 / K (the Dupuit ellipse, the same relation as the h^2 term of
 *   Hooghoudt's equation with spacing 2x), so q = K (H^2 - H_e^2) / x^2, heads above the
 *   restrictive layer, x the distance from the middle of the field to its edge. The field's
 *   water table stands for H (it lies between the drains' midpoint head and the drain level).
 *
 * Both stop when the water table reaches the restrictive layer (no saturated soil left above
 * it). Settings are in `SEEPAGE_SETTINGS`; the README's seepage section gives the reasoning.
 */

/** Seepage parameters of the engine, SI. */
export interface SeepageParams {
  /** Leakance K'/b' toward the regional head, 1/d (0: no vertical leakage). */
  leakancePerDay: number;
  /** Depth of the regional head below the surface, m. */
  regionalHeadDepthM: number;
  /** Conductivity of the lateral path, m/d (0: no lateral seepage). */
  lateralKMPerDay: number;
  /** Distance from the middle of the field to the edge, m. */
  edgeDistanceM: number;
  /** Water level at the edge below the surface, m. */
  edgeLevelDepthM: number;
}

/**
 * A seepage setting in field-file terms (lateral conductivity: the soil's, unless given). The
 * field file's own terms pass through as the schema parsed them, where an absent key may read
 * as undefined.
 */
export interface SeepageSetting {
  vertical?: { to: number; conductance: number } | undefined;
  lateral?: { distance: number; level: number; conductivity?: number | undefined } | undefined;
}

/**
 * Leakance of b' = 5 m of clay-loam glacial till (a typical thickness between the drained
 * profile and a regional sand or bedrock aquifer; assumption) for a vertical conductivity K':
 * K' / b' in 1/d with K' in m/s.
 */
const tillLeakance = (kMPerS: number) => (kMPerS * 86400) / 5;

/**
 * The three documented seepage settings of a typical pattern-drained till field, and none.
 *
 * - Vertical: weathered, fractured clay-loam tills have vertical conductivities of about 1e-9 to
 *   1e-7 m/s, unweathered till less (Freeze & Cherry 1979, Groundwater, Table 2.2; reviews of
 *   till hydrogeology, from memory). Medium takes 1e-8 m/s, low and high half a decade either
 *   side (3e-9 and 3e-8 m/s), each over 5 m of till, with the regional head 3 m below the
 *   surface (a water table in the regional aquifer below the drained profile; assumption).
 * - Lateral: an edge (road ditch, outlet ditch or undrained neighbour) with water 1.5 m below the
 *   surface, 200 m from the middle of the field (a 16-40 ha field; medium), 400 m (a large field
 *   or a wet neighbour; low) or 100 m (a narrow field between ditches; high) (assumption, common
 *   field sizes and ditch depths of drained farmland).
 */
export const SEEPAGE_SETTINGS: Readonly<
  Record<'none' | 'low' | 'medium' | 'high', SeepageSetting>
> = {
  none: {},
  low: {
    vertical: { to: 3, conductance: tillLeakance(3e-9) },
    lateral: { distance: 400, level: 1.5 },
  },
  medium: {
    vertical: { to: 3, conductance: tillLeakance(1e-8) },
    lateral: { distance: 200, level: 1.5 },
  },
  high: {
    vertical: { to: 3, conductance: tillLeakance(3e-8) },
    lateral: { distance: 100, level: 1.5 },
  },
};

/** The named settings the seepage band runs under, in order. */
export const SEEPAGE_BAND = ['low', 'medium', 'high'] as const;
export type SeepageBand = (typeof SEEPAGE_BAND)[number];

/** Engine parameters of a setting; `soilKMPerDay` is the lateral conductivity by default. */
export function seepageParamsOf(s: SeepageSetting, soilKMPerDay: number): SeepageParams {
  return {
    leakancePerDay: s.vertical?.conductance ?? 0,
    regionalHeadDepthM: s.vertical?.to ?? 0,
    lateralKMPerDay: s.lateral ? (s.lateral.conductivity ?? soilKMPerDay) : 0,
    edgeDistanceM: s.lateral?.distance ?? Infinity,
    edgeLevelDepthM: s.lateral?.level ?? 0,
  };
}

/**
 * Vertical leakage rate, mm/d, for a water table at `wtdM` (below the surface).
 * @example verticalSeepageMmPerDay(1, 2.2, { leakancePerDay: 1.728e-4, regionalHeadDepthM: 3 } as SeepageParams) // 0.3456
 */
export function verticalSeepageMmPerDay(
  wtdM: number,
  barrierDepthM: number,
  s: SeepageParams,
): number {
  if (!(s.leakancePerDay > 0) || wtdM >= barrierDepthM) return 0;
  const dh = s.regionalHeadDepthM - wtdM;
  return dh > 0 ? s.leakancePerDay * dh * 1000 : 0;
}

/**
 * Lateral seepage rate to the field edge, mm/d: K (H^2 - He^2) / x^2, heads above the
 * restrictive layer; 0 when the edge water stands as high as the field's.
 * @example lateralSeepageMmPerDay(0.8, 2.2, { lateralKMPerDay: 0.9, edgeDistanceM: 200, edgeLevelDepthM: 1.5 } as SeepageParams) // 0.0331
 */
export function lateralSeepageMmPerDay(
  wtdM: number,
  barrierDepthM: number,
  s: SeepageParams,
): number {
  if (!(s.lateralKMPerDay > 0) || !Number.isFinite(s.edgeDistanceM)) return 0;
  const H = barrierDepthM - wtdM;
  const He = Math.max(0, barrierDepthM - s.edgeLevelDepthM);
  if (!(H > He)) return 0;
  return ((s.lateralKMPerDay * (H * H - He * He)) / (s.edgeDistanceM * s.edgeDistanceM)) * 1000;
}
