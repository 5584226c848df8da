/**
 * Manning roughness of drain pipe by material, and the minimum (flushing) grade that follows.
 *
 * Method: Manning's n is a property of the pipe wall and, for corrugated tubing, of the size:
 * the corrugations of the larger sizes are deeper relative to the bore, so the larger tubing is
 * rougher. The minimum grade of a pipe is the grade at which it reaches a self-cleaning velocity
 * flowing full, S = (V n / (D/4)^(2/3))^2 (Manning's equation solved for the slope, Chow 1959).
 *
 * Sources of the table (all recalled without the documents in hand, so marked from memory):
 * - corrugated plastic tubing: n = 0.015 for 3-8 in, 0.017 for 10-12 in, 0.020 above 12 in
 *   (US drainage engineering handbooks and conservation practice standards for subsurface
 *   drains, from memory);
 * - smooth-wall (smooth interior) plastic pipe: n = 0.012, the design value makers quote
 *   (from memory; textbook range 0.009-0.012 for new pipe);
 * - clay drain tile: n = 0.012 (drainage texts quote 0.011-0.013 for clay and concrete tile,
 *   from memory);
 * - concrete drain tile and pipe: n = 0.013 (textbook range 0.012-0.014, from memory).
 * A measured or maker's value should replace these where known.
 */
import { TilefluxError } from '../errors.js';
import { minimumGrade } from './manning.js';
import { ROUGHNESS } from './pipeSizes.js';

/** Drain pipe materials a system may use. */
export const PIPE_MATERIALS = ['corrugated', 'smooth-wall', 'clay', 'concrete'] as const;
export type PipeMaterialName = (typeof PIPE_MATERIALS)[number];

/** One row of the roughness table: n applies to inside diameters up to `upToM`. */
interface RoughnessStep {
  upToM: number;
  n: number;
}

/** Roughness of one material: steps by size (ascending) and the source of the values. */
export interface MaterialRoughness {
  label: string;
  steps: readonly RoughnessStep[];
  source: string;
}

/** Largest inside diameter of a size step, with a hair of tolerance for 8 in = 0.2032 m. */
const IN = 0.0254 * (1 + 1e-9);

/**
 * The roughness table by material. Corrugated steps: up to 8 in, up to 12 in, larger; metric
 * sizes fall into the step of the inch size at or above them (200 mm into "up to 8 in").
 */
export const MATERIAL_ROUGHNESS: Readonly<Record<PipeMaterialName, MaterialRoughness>> = {
  corrugated: {
    label: 'corrugated plastic tubing',
    steps: [
      { upToM: 8 * IN, n: ROUGHNESS.corrugated.n },
      { upToM: 12 * IN, n: 0.017 },
      { upToM: Infinity, n: 0.02 },
    ],
    source:
      'US drainage engineering handbooks: 0.015 for 3-8 in, 0.017 for 10-12 in, 0.020 larger ' +
      '(from memory)',
  },
  'smooth-wall': {
    label: 'smooth-wall plastic pipe',
    steps: [{ upToM: Infinity, n: ROUGHNESS.smooth.n }],
    source: "makers' design value for smooth-interior plastic drain pipe (from memory)",
  },
  clay: {
    label: 'clay drain tile',
    steps: [{ upToM: Infinity, n: 0.012 }],
    source: 'drainage texts: 0.011-0.013 for clay and concrete tile (from memory)',
  },
  concrete: {
    label: 'concrete drain tile or pipe',
    steps: [{ upToM: Infinity, n: 0.013 }],
    source: 'hydraulics texts: 0.012-0.014 for concrete pipe (from memory)',
  },
};

/**
 * Manning n of a material at an inside diameter (m), from MATERIAL_ROUGHNESS.
 *
 * @example roughnessFor('corrugated', 0.1524) // 0.015 (6 in)
 * @example roughnessFor('corrugated', 0.381) // 0.02 (15 in)
 */
export function roughnessFor(material: PipeMaterialName, diameterM: number): number {
  const table = MATERIAL_ROUGHNESS[material];
  if (!table) {
    throw new TilefluxError(
      `pipe material must be one of ${PIPE_MATERIALS.join(', ')}; got ${String(material)}`,
    );
  }
  for (const step of table.steps) if (diameterM <= step.upToM) return step.n;
  return table.steps[table.steps.length - 1].n;
}

/**
 * Minimum grade (m/m) of a pipe of `material` and inside diameter `diameterM` for a full-flow
 * velocity target (default: the 1.4 ft/s that keeps fine sediment moving).
 *
 * Source: Manning's equation solved for the slope (Chow 1959) with n from MATERIAL_ROUGHNESS.
 * @example materialMinimumGrade('corrugated', 0.1016, 0.42672) // 0.0055 (4 in tubing, 0.55 %)
 */
export function materialMinimumGrade(
  material: PipeMaterialName,
  diameterM: number,
  velocityMs: number,
): number {
  return minimumGrade(diameterM, velocityMs, roughnessFor(material, diameterM));
}
