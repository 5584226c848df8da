/**
 * Zod schemas for quantities in field files: accept a number (documented SI unit) or a unit
 * string, and yield the number in the core unit. The kind's unit and examples travel with the
 * schema as metadata, so `tileflux init` and error messages come from the same source.
 */
import { z } from 'zod';
import { clip } from '../errors.js';
import { KINDS, tryParseQuantity, type QuantityKind } from './quantity.js';

/** A quantity of `kind`, optionally bounded (bounds in the core unit, inclusive). */
export function zQuantity(
  kind: QuantityKind,
  description: string,
  bounds: { min?: number; max?: number; exclusiveMin?: boolean } = {},
) {
  const spec = KINDS[kind];
  return z
    .union([z.number(), z.string()])
    .transform((value, ctx) => {
      const r = tryParseQuantity(value, kind);
      if (!r.ok) {
        ctx.addIssue({ code: 'custom', message: r.reason });
        return z.NEVER;
      }
      const v = r.value;
      const { min, max, exclusiveMin } = bounds;
      if (min !== undefined && (exclusiveMin ? v <= min : v < min)) {
        ctx.addIssue({
          code: 'custom',
          message: `must be ${exclusiveMin ? 'greater than' : 'at least'} ${min} ${spec.unit}; got ${clip(String(value))}`,
        });
        return z.NEVER;
      }
      if (max !== undefined && v > max) {
        ctx.addIssue({
          code: 'custom',
          message: `must be at most ${max} ${spec.unit}; got ${clip(String(value))}`,
        });
        return z.NEVER;
      }
      return v;
    })
    .describe(`${description} [${spec.unit}; e.g. ${spec.examples}]`);
}
