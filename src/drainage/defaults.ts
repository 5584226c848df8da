/**
 * Defaults shared by the design commands and the field file, so that `tileflux spacing` and
 * `tileflux run` assume the same drain when nothing is said.
 */

/**
 * Effective drain radius, m, when none is given: the outer radius of a 100 mm (4 in) corrugated
 * lateral, the most common lateral size (common practice). A gravel or synthetic envelope makes
 * the effective radius larger; perforations without one, smaller.
 */
export const DEFAULT_DRAIN_RADIUS_M = 0.05;
