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
