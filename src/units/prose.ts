/**
 * Quantities inside sentences (scenario descriptions, outlet labels, the assumptions a run
 * states), in the reader's unit system. SI keeps the numbers as given; US customary converts
 * with the exact definitions of the foot (0.3048 m) and the inch (25.4 mm).
 */
import { fixedText } from './decimal.js';
import { US, type UnitSystem } from './usCustomary.js';

/** How a unit system writes quantities in prose. */
export interface Prose {
  system: UnitSystem;
  /** A depth or distance in the field, from m: "0.75 m" or "2.46 ft". */
  length(m: number, decimals?: number): string;
  /** A rate of water per day, from mm/d: "11.1 mm/d" or "0.44 in/d". */
  rate(mmPerDay: number): string;
  /** A hydraulic conductivity, from m/d: "0.9 m/d" or "2.95 ft/d". */
  conductivity(mPerDay: number): string;
}

/**
 * Prose formatting for a unit system. In SI a length without `decimals` prints as given (the
 * field file's own number); US lengths default to 2 decimals of a foot.
 *
 * @example proseUnits('us').length(0.3048) // '1.00 ft'
 */
export function proseUnits(system: UnitSystem): Prose {
  if (system === 'us') {
    return {
      system,
      length: (m, decimals = 2) => `${fixedText(m / US.mPerFt, decimals)} ft`,
      rate: (mm) => `${fixedText(mm / US.mmPerIn, 2)} in/d`,
      conductivity: (k) => `${fixedText(k / US.mPerFt, 2)} ft/d`,
    };
  }
  return {
    system,
    length: (m, decimals) => `${decimals === undefined ? m : fixedText(m, decimals)} m`,
    rate: (mm) => `${fixedText(mm, 1)} mm/d`,
    conductivity: (k) => `${k} m/d`,
  };
}
