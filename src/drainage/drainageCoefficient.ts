/**
 * Drainage coefficients: the depth of water a subsurface drainage system is designed to remove
 * in 24 hours, from the soil, the crop and how surface water enters the system. The trade
 * tabulates them for humid areas as follows (inches per 24 hours; the drainage-coefficient
 * tables of drainage handbooks and design guides for humid areas, common practice, from memory):
 *
 * | soil    | crop  | no surface inlets | blind inlets | open inlets |
 * |---------|-------|-------------------|--------------|-------------|
 * | mineral | field | 3/8 - 1/2         | 1/2 - 3/4    | 1/2 - 1     |
 * | mineral | truck | 1/2 - 3/4         | 3/4 - 1      | 1 - 1 1/2   |
 * | organic | field | 1/2 - 3/4         | 3/4 - 1      | 1 - 1 1/2   |
 * | organic | truck | 3/4 - 1 1/2       | 1 - 2        | 1 1/2 - 4   |
 *
 * "Field" crops are row and small-grain crops (corn, soybean, wheat); "truck" crops are
 * vegetables and other high-value crops that tolerate little waterlogging. Blind inlets are
 * gravel- or sand-filled trenches that take surface water into the drains through the soil;
 * open inlets are risers with a grate. The design value used by tileflux is the middle of the
 * tabulated range (a choice: designers move within the range with the crop's value and the
 * soil's permeability), and the range is returned beside it.
 */
import { TilefluxError } from '../errors.js';
import { US } from '../units/usCustomary.js';

export const COEFFICIENT_SOILS = ['mineral', 'organic'] as const;
export const COEFFICIENT_CROPS = ['field', 'truck'] as const;
export const COEFFICIENT_INLETS = ['none', 'blind', 'open'] as const;
export type CoefficientSoil = (typeof COEFFICIENT_SOILS)[number];
export type CoefficientCrop = (typeof COEFFICIENT_CROPS)[number];
export type CoefficientInlets = (typeof COEFFICIENT_INLETS)[number];

/** The situation a drainage coefficient is looked up for. */
export interface CoefficientPreset {
  soil: CoefficientSoil;
  crop: CoefficientCrop;
  inlets: CoefficientInlets;
}

/** A tabulated drainage coefficient: its range and the design value (middle of the range). */
export interface DrainageCoefficient {
  preset: CoefficientPreset;
  /** Design 24-hour removal, mm/d (middle of the tabulated range). */
  mmPerDay: number;
  lowMmPerDay: number;
  highMmPerDay: number;
  /** Design value in inches per day. */
  inPerDay: number;
  lowInPerDay: number;
  highInPerDay: number;
  /** Where the numbers come from. */
  source: string;
}

/** The table of the module comment, in inches per 24 hours: [low, high]. */
const TABLE_IN_PER_DAY: Record<
  CoefficientSoil,
  Record<CoefficientCrop, Record<CoefficientInlets, readonly [number, number]>>
> = {
  mineral: {
    field: { none: [3 / 8, 1 / 2], blind: [1 / 2, 3 / 4], open: [1 / 2, 1] },
    truck: { none: [1 / 2, 3 / 4], blind: [3 / 4, 1], open: [1, 3 / 2] },
  },
  organic: {
    field: { none: [1 / 2, 3 / 4], blind: [3 / 4, 1], open: [1, 3 / 2] },
    truck: { none: [3 / 4, 3 / 2], blind: [1, 2], open: [3 / 2, 4] },
  },
};

export const DRAINAGE_COEFFICIENT_SOURCE =
  'drainage-coefficient tables for humid areas (common practice, from memory); design value = middle of the range';

/** The default preset: field crops on a mineral soil without surface inlets. */
export const DEFAULT_COEFFICIENT_PRESET: CoefficientPreset = {
  soil: 'mineral',
  crop: 'field',
  inlets: 'none',
};

/**
 * The tabulated drainage coefficient for a soil, crop and inlet type (see the module comment).
 *
 * @example drainageCoefficient({ soil: 'mineral', crop: 'field', inlets: 'none' }).inPerDay // 0.4375 (3/8 to 1/2 in/d)
 */
export function drainageCoefficient(preset: CoefficientPreset): DrainageCoefficient {
  const row = TABLE_IN_PER_DAY[preset.soil]?.[preset.crop]?.[preset.inlets];
  if (row === undefined) {
    throw new TilefluxError(
      `unknown drainage-coefficient preset ${JSON.stringify(preset)}; accepted: soil ${COEFFICIENT_SOILS.join('|')}, crop ${COEFFICIENT_CROPS.join('|')}, inlets ${COEFFICIENT_INLETS.join('|')}`,
    );
  }
  const [lo, hi] = row;
  const mid = (lo + hi) / 2;
  return {
    preset: { ...preset },
    mmPerDay: mid * US.mmPerIn,
    lowMmPerDay: lo * US.mmPerIn,
    highMmPerDay: hi * US.mmPerIn,
    inPerDay: mid,
    lowInPerDay: lo,
    highInPerDay: hi,
    source: DRAINAGE_COEFFICIENT_SOURCE,
  };
}

/**
 * Reads a preset from words such as "organic truck open" or "mineral,field,blind" (any order,
 * separated by spaces, commas, slashes or hyphens); a missing word takes the default (mineral,
 * field, none). `where` names the option or key in the error message.
 *
 * @example parseCoefficientPreset('organic, open', '--coefficient') // { soil: 'organic', crop: 'field', inlets: 'open' }
 */
export function parseCoefficientPreset(text: string, where: string): CoefficientPreset {
  const words = text
    .trim()
    .toLowerCase()
    .split(/[\s,/+-]+/)
    .filter((w) => w.length > 0);
  const accepted = `words from soil ${COEFFICIENT_SOILS.join('|')}, crop ${COEFFICIENT_CROPS.join('|')}, inlets ${COEFFICIENT_INLETS.join('|')} (e.g. "mineral field none")`;
  if (words.length === 0) throw new TilefluxError(`expects ${accepted}; got "${text}"`, where);
  const out: Partial<CoefficientPreset> = {};
  const put = <K extends keyof CoefficientPreset>(key: K, value: CoefficientPreset[K]) => {
    if (out[key] !== undefined) {
      throw new TilefluxError(`gives the ${key} twice (${out[key]}, ${value}); ${accepted}`, where);
    }
    out[key] = value;
  };
  for (const w of words) {
    if ((COEFFICIENT_SOILS as readonly string[]).includes(w)) put('soil', w as CoefficientSoil);
    else if ((COEFFICIENT_CROPS as readonly string[]).includes(w))
      put('crop', w as CoefficientCrop);
    else if ((COEFFICIENT_INLETS as readonly string[]).includes(w))
      put('inlets', w as CoefficientInlets);
    else throw new TilefluxError(`does not know "${w}"; ${accepted}`, where);
  }
  return { ...DEFAULT_COEFFICIENT_PRESET, ...out };
}
