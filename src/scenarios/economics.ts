/**
 * Costs of a drain design: installed cost per hectare (laterals, mains, control structures)
 * and its equivalent uniform annual cost by the capital recovery factor,
 * CRF(i, n) = i (1 + i)^n / ((1 + i)^n - 1), the (A/P, i, n) factor of engineering economics
 * (e.g. Newnan, Eschenbach & Lavelle, Engineering Economic Analysis, chapter on equivalent
 * annual worth (from memory)). With i = 0 the cost is spread evenly: CRF = 1 / n.
 */
import { pipeLengthPerHectare } from './compare.js';
import type { CostsSection } from './sweepSchema.js';

/**
 * Capital recovery factor (A/P, i, n): the uniform end-of-year payment over n years that repays
 * a present sum of 1 at interest rate i per year.
 *
 * @example capitalRecoveryFactor(0.1, 10) // 0.16275 (tabulated 0.1627)
 */
export function capitalRecoveryFactor(rate: number, years: number): number {
  if (!(years > 0)) throw new RangeError(`years must be positive; got ${years}`);
  if (rate === 0) return 1 / years;
  const g = Math.pow(1 + rate, years);
  return (rate * g) / (g - 1);
}

/** Cost of one design per hectare of field, in the currency of the costs section. */
export interface DesignCost {
  /** Lateral length per hectare, m/ha (10 000 / spacing). */
  lateralMPerHa: number;
  /** Installed cost per hectare: laterals, mains, control structure. */
  capitalPerHa: number;
  /** Equivalent uniform annual cost per hectare: capital x CRF(discount rate, life). */
  annualPerHa: number;
}

/**
 * Cost of a design with laterals `spacingM` apart, with a control structure when `managed`.
 *
 * @example designCost(20, false, costs).lateralMPerHa // 500
 */
export function designCost(spacingM: number, managed: boolean, c: CostsSection): DesignCost {
  const lateralMPerHa = pipeLengthPerHectare(spacingM);
  const lateral = lateralMPerHa * c.lateral;
  const main = c.main.perHa ?? (c.main.ofLateral ?? 0) * lateral;
  const structure = managed ? c.controlStructure.each / c.controlStructure.drainsArea : 0;
  const capitalPerHa = lateral + main + structure;
  return {
    lateralMPerHa,
    capitalPerHa,
    annualPerHa: capitalPerHa * capitalRecoveryFactor(c.discountRate, c.lifeYears),
  };
}
