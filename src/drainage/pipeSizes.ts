/**
 * Commercial drain pipe sizes and Manning roughness by pipe material.
 *
 * Sizes are nominal and are used as the inside diameter. That matches US corrugated tubing,
 * which is sold by (approximate) inside diameter; metric drain pipe is usually sold by outside
 * diameter, so the metric list overstates the bore by roughly a tenth. Where that matters,
 * give the makers' inside diameters as a custom list.
 */
import { TilefluxError } from '../errors.js';
import { isDecimalNumber } from '../units/decimal.js';
import { tryParseQuantity, US } from '../units/quantity.js';

/** A list of available pipe sizes, ascending, in one unit. */
export interface PipeSizeList {
  /** Short name shown in output ("in", "mm" or "custom"). */
  name: string;
  unit: 'in' | 'mm';
  nominal: readonly number[];
  /** Where the list comes from. */
  source: string;
}

/** Corrugated plastic drainage tubing sizes, inches (common practice in US drainage). */
export const INCH_SIZES: PipeSizeList = {
  name: 'in',
  unit: 'in',
  nominal: [3, 4, 5, 6, 8, 10, 12, 15, 18, 24],
  source: 'corrugated tubing, US drainage practice (common practice)',
};

/**
 * Metric drain pipe sizes, mm: corrugated drain pipe 50-200 mm and twin-wall pipe 250-630 mm
 * (common practice in European field drainage, from memory; nominal outside diameters).
 */
export const METRIC_SIZES: PipeSizeList = {
  name: 'mm',
  unit: 'mm',
  nominal: [50, 65, 80, 100, 125, 160, 200, 250, 315, 400, 500, 630],
  source: 'corrugated and twin-wall drain pipe, European practice (common practice)',
};

const MM_PER_UNIT = { in: US.mmPerIn, mm: 1 } as const;

/** Pipe materials with a default Manning n. */
export type PipeMaterial = 'corrugated' | 'smooth';

/**
 * Default Manning roughness by material. Corrugated plastic tubing of field-drain sizes: 0.015
 * (US drainage guides quote 0.015-0.016 for 3-8 in tubing, rougher, up to about 0.02, for the
 * larger sizes; from memory). Smooth bore (clay or concrete tile, smooth-wall plastic): 0.012
 * (textbook range 0.011-0.013; common practice). Override with a measured or maker's value.
 */
export const ROUGHNESS: Readonly<Record<PipeMaterial, { n: number; source: string }>> = {
  corrugated: {
    n: 0.015,
    source: 'corrugated plastic tubing (US drainage guides)',
  },
  smooth: {
    n: 0.012,
    source: 'smooth bore: clay, concrete or smooth-wall plastic (common practice)',
  },
};

/** A selected pipe size. */
export interface SelectedPipe {
  nominal: number;
  unit: 'in' | 'mm';
  diameterM: number;
}

/** Inside diameter (m) of a nominal size in a list. */
export function pipeDiameterM(nominal: number, unit: 'in' | 'mm'): number {
  return (nominal * MM_PER_UNIT[unit]) / 1000;
}

/**
 * The smallest size in `sizes` whose diameter is at least `requiredDiameterM` (round up to the
 * next commercial size, common practice). A requirement larger than the largest size is an error.
 *
 * @param option  name of the setting that chose the list, used in the error message
 * @example selectPipeSize(0.085, INCH_SIZES) // { nominal: 4, unit: 'in', diameterM: 0.1016 }
 */
export function selectPipeSize(
  requiredDiameterM: number,
  sizes: PipeSizeList = INCH_SIZES,
  option = 'the size list',
): SelectedPipe {
  // A hair of tolerance so that a flow computed from a size's own capacity selects that size.
  const need = requiredDiameterM * (1 - 1e-12);
  for (const nominal of sizes.nominal) {
    const diameterM = pipeDiameterM(nominal, sizes.unit);
    if (diameterM >= need) return { nominal, unit: sizes.unit, diameterM };
  }
  const largest = sizes.nominal[sizes.nominal.length - 1];
  const mm = requiredDiameterM * 1000;
  throw new TilefluxError(
    `the flow needs a pipe of at least ${mm.toFixed(0)} mm (${(mm / US.mmPerIn).toFixed(1)} in), ` +
      `larger than the largest size in ${option} (${largest} ${sizes.unit}); give larger sizes, ` +
      `a steeper grade or a smaller drained area (split it between outlets)`,
  );
}

/**
 * Size list from a setting: "in" (default list), "mm" (metric list) or a comma-separated list
 * of diameters such as "4,6,8 in", "100 mm,150 mm" or "100,150,200" (bare numbers are mm; a unit
 * on the last entry applies to bare entries before it).
 *
 * @example pipeSizeList('4,6,8 in') // { name: 'custom', unit: 'in', nominal: [4, 6, 8], ... }
 */
export function pipeSizeList(spec: string, option = 'sizes'): PipeSizeList {
  const text = spec.trim();
  if (text === 'in') return INCH_SIZES;
  if (text === 'mm') return METRIC_SIZES;
  const parts = text.split(',').map((s) => s.trim());
  const accepted = `${option} accepts in, mm or a comma-separated list of diameters such as "4,6,8 in" or "100,150 mm"`;
  if (parts.some((s) => s === '')) throw new TilefluxError(`${accepted}; got "${spec}"`);
  const unitMatch = /^[-+.\d eE]+\s*(in|mm)$/.exec(parts[parts.length - 1]);
  const unit: 'in' | 'mm' = unitMatch ? (unitMatch[1] as 'in' | 'mm') : 'mm';
  const nominal: number[] = [];
  for (const part of parts) {
    const bare = isDecimalNumber(part);
    const r = tryParseQuantity(bare ? `${part} ${unit}` : part, 'diameter');
    if (!r.ok || !(r.value > 0)) {
      throw new TilefluxError(`${accepted}; "${part}" is not a positive diameter`);
    }
    nominal.push(r.value / MM_PER_UNIT[unit]);
  }
  for (let i = 1; i < nominal.length; i++) {
    if (!(nominal[i] > nominal[i - 1])) {
      throw new TilefluxError(`${accepted}, in increasing order; got "${spec}"`);
    }
  }
  return {
    name: 'custom',
    unit,
    nominal: nominal.map((x) => Number(x.toPrecision(12))),
    source: 'custom list',
  };
}
