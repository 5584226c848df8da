/**
 * Conversion factors between the core's units and US customary units, in a module of their own
 * (no unit parser behind them), so code that only converts, such as the prose of a scenario in
 * a sweep's worker thread, does not load js-quantities. `units/quantity.ts` re-exports them.
 */

/** Unit systems for printed and written figures (`--units`). */
export type UnitSystem = 'si' | 'us';

/** Conversion factors from core units to US customary units (exact definitions). */
export const US = {
  mmPerIn: 25.4,
  mPerFt: 0.3048,
  haPerAc: 0.40468564224,
  /** kg/ha -> lb/ac: 1 kg/ha = 0.892179 lb/ac (0.45359237 kg per lb, 0.40468564224 ha per ac). */
  lbAcPerKgHa: 0.40468564224 / 0.45359237,
  cfsPerM3s: 1 / 0.028316846592,
  /** Litres in a US liquid gallon. */
  lPerGal: 3.785411784,
} as const;
