/**
 * Value schemas the `nitrate:` section's models share: masses of N per area (kg N/ha or lb/ac),
 * fractions, concentrations, flow rates, application dates and fertilizer events. Each names
 * its unit and accepted forms in its description, which `tileflux describe` prints.
 */
import { z } from 'zod';
import { dayNumber } from '../climate/calendar.js';
import { DECIMAL_NUMBER } from '../units/decimal.js';
import { US } from '../units/quantity.js';
import { zQuantity } from '../units/zodQuantity.js';
import { DEFAULT_RUNOFF_EXTRACTION_RATIO } from './defaults.js';

const KG_HA = new RegExp(
  String.raw`^\s*(${DECIMAL_NUMBER})\s*kg\s*(?:N\s*)?/\s*(?:ha|hectare)\s*$`,
  'i',
);
const LB_AC = new RegExp(
  String.raw`^\s*(${DECIMAL_NUMBER})\s*lbs?\s*(?:N\s*)?/\s*(?:ac|acre)\s*$`,
  'i',
);
const BARE = new RegExp(String.raw`^\s*(${DECIMAL_NUMBER})\s*$`);

/**
 * A mass of N per area: a number in kg N/ha, or "150 kg/ha", "150 kg N/ha", "134 lb/ac".
 *
 * @example zKgHa('Fertilizer N').parse('100 lb/ac') // 112.085...
 */
export function zKgHa(description: string, perYear = false) {
  const unit = perYear ? 'kg N/ha per year' : 'kg N/ha';
  return z
    .union([z.number(), z.string()])
    .transform((value, ctx) => {
      let v: number;
      let m: RegExpExecArray | null;
      if (typeof value === 'number') v = value;
      else if ((m = BARE.exec(value) ?? KG_HA.exec(value))) v = Number(m[1]);
      else if ((m = LB_AC.exec(value))) v = Number(m[1]) / US.lbAcPerKgHa;
      else v = NaN;
      if (!Number.isFinite(v) || v < 0) {
        ctx.addIssue({
          code: 'custom',
          message: `expects a mass of N per area of at least 0 such as 150, 150 kg/ha or 134 lb/ac; got ${value}`,
        });
        return z.NEVER;
      }
      return v;
    })
    .describe(`${description} [${unit}; e.g. 150, 150 kg/ha or 134 lb/ac]`);
}

export const fraction = (description: string, max = 1) =>
  zQuantity('fraction', description, { min: 0, max });

export const runoffExtractionRatio = fraction(
  'Nitrate concentration of surface runoff relative to the drain (profile) water: runoff meets only a thin surface layer (assumption)',
)
  .default(DEFAULT_RUNOFF_EXTRACTION_RATIO)
  .describe(
    `Nitrate concentration of surface runoff relative to the drain (profile) water [fraction; default ${DEFAULT_RUNOFF_EXTRACTION_RATIO} (assumption)]`,
  );

export const concentration = (description: string) =>
  zQuantity('concentration', description, { min: 0, max: 1000 });

export const positiveRate = (description: string) =>
  zQuantity('rate', description, { min: 0, exclusiveMin: true });

/** "MM-DD" (every year) or "YYYY-MM-DD" (once), a real calendar day. */
export const eventDate = z
  .string()
  .refine(
    (s) =>
      (/^\d{2}-\d{2}$/.test(s) && dayNumber(`2000-${s}`) !== undefined) ||
      (/^\d{4}-\d{2}-\d{2}$/.test(s) && dayNumber(s) !== undefined),
    { message: 'expects a month-day such as "04-25" (every year) or a date such as "2024-04-25"' },
  )
  .describe('Application date: "MM-DD" every year, or "YYYY-MM-DD" once');

export const fertilizerEvent = z.strictObject({
  date: eventDate,
  amount: zKgHa('N applied (fertilizer or manure N that turns to nitrate)'),
  crops: z
    .array(z.string().min(1))
    .min(1)
    .optional()
    .describe('Apply only in years in which one of these crops is grown, e.g. [corn]'),
});
