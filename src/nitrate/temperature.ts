/**
 * Temperature response of soil N processes as a Q10 factor: the rate at `tC` relative to the
 * rate at 20 degC is Q10^((tC - 20) / 10) (van 't Hoff; e.g. Stanford, Frere & Schwaninger 1973,
 * Soil Science 115: 321-323, for N mineralization (from memory)). The daily mean air temperature
 * stands in for soil temperature, and at or below 0 degC (frozen soil) the processes stop
 * (assumption).
 */

/** Reference temperature of the rates, degC. */
export const REFERENCE_TEMPERATURE_C = 20;

/**
 * Rate factor at `tC` relative to 20 degC; 0 at or below 0 degC.
 *
 * @example q10Factor(10, 2) // 0.5
 * @example q10Factor(-3, 2) // 0
 */
export function q10Factor(tC: number, q10: number): number {
  if (!(tC > 0)) return 0;
  return Math.pow(q10, (tC - REFERENCE_TEMPERATURE_C) / 10);
}

/** Temperature below which denitrification follows its cold-range Q10, degC (NEMIS). */
export const DENITRIFICATION_BREAK_C = 11;

/**
 * Temperature factor of denitrification relative to 20 degC in two ranges, as in the NEMIS
 * denitrification model (Henault & Germon 2000, Eur. J. Soil Sci. 51: 257-270; from memory):
 * q10^((T - 20)/10) at and above 11 degC, and below it q10^(-0.9) x coldQ10^((T - 11)/10), with
 * coldQ10 = 89 measured on cold soils: denitrifiers are much slower in cold soil than a single
 * Q10 of about 2 says. 0 at or below 0 degC (frozen soil; assumption, as `q10Factor`).
 *
 * @example denitrificationTemperatureFactor(20, 2.1, 89) // 1
 * @example denitrificationTemperatureFactor(5, 2.1, 89) // 0.0347
 */
export function denitrificationTemperatureFactor(tC: number, q10: number, coldQ10: number): number {
  if (!(tC > 0)) return 0;
  if (tC >= DENITRIFICATION_BREAK_C) return Math.pow(q10, (tC - REFERENCE_TEMPERATURE_C) / 10);
  return (
    Math.pow(q10, (DENITRIFICATION_BREAK_C - REFERENCE_TEMPERATURE_C) / 10) *
    Math.pow(coldQ10, (tC - DENITRIFICATION_BREAK_C) / 10)
  );
}
