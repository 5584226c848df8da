/**
 * Quantity options of the commands ("1.2 m", "0.5 in/d"): parsed with the unit parser, which
 * the commands load only when their action runs (kept out of cli/common.ts for that reason).
 */
import { TilefluxError } from '../errors.js';
import { parseQuantity, type QuantityKind } from '../units/quantity.js';

/** Parse a quantity option value; undefined stays undefined. */
export function quantityOption(
  value: string | undefined,
  kind: QuantityKind,
  option: string,
): number | undefined {
  return value === undefined ? undefined : parseQuantity(value, kind, option);
}

/** Parse a required quantity option, with a clear error when it is missing. */
export function requiredQuantity(
  value: string | undefined,
  kind: QuantityKind,
  option: string,
): number {
  if (value === undefined) throw new TilefluxError(`${option} is required`);
  return parseQuantity(value, kind, option);
}
