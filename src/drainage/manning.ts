/**
 * Manning's equation for a circular pipe flowing full (Manning 1891; Chow 1959, Open-Channel
 * Hydraulics), SI form:
 *
 *   Q = (1/n) A R^(2/3) S^(1/2),   A = pi D^2 / 4,   R = D / 4
 *
 * Q flow (m3/s), n Manning roughness, D inside diameter (m), S hydraulic grade (m/m), taken equal
 * to the pipe grade for a drain flowing just full. In US units the coefficient is 1.486, and the
 * drain-design form solved for the diameter is D = 16 (q n / S^0.5)^(3/8) with D in inches and
 * q in ft3/s (the 16 is 12 (4^(5/3) / (1.486 pi))^(3/8) = 16.01, rounded).
 */
import { US } from '../units/usCustomary.js';
import { requirePositive } from './checks.js';

/**
 * Full-flow velocity that keeps fine sediment moving in a drain, 1.4 ft/s (0.427 m/s): the figure
 * US conservation practice standards for subsurface drains give where sediment can settle in the
 * line (from memory; 0.5 ft/s is quoted where it cannot). The default target of the minimum grade.
 */
export const SEDIMENT_VELOCITY_MS = 1.4 * US.mPerFt;

/** 4^(5/3) / pi: Q = D^(8/3) S^(1/2) / (n 4^(5/3) / pi). */
const K_CIRCLE = Math.pow(4, 5 / 3) / Math.PI;

function checkPipe(diameterM: number, slope: number, roughness: number): void {
  requirePositive(diameterM, 'diameterM', 'm');
  requirePositive(slope, 'slope (pipe grade)', 'm/m');
  requirePositive(roughness, 'roughness (Manning n)', '');
}

/**
 * Full-pipe capacity (m3/s) of a circular pipe by Manning's equation.
 *
 * Source: Manning's equation, SI form (Chow 1959).
 * @example manningFullCapacity(0.1016, 0.002, 0.015) // 0.00209 m3/s (4 in at 0.2 %)
 */
export function manningFullCapacity(diameterM: number, slope: number, roughness: number): number {
  checkPipe(diameterM, slope, roughness);
  return (Math.pow(diameterM, 8 / 3) * Math.sqrt(slope)) / (roughness * K_CIRCLE);
}

/**
 * Inside diameter (m) a full circular pipe needs to carry `flowM3s` by Manning's equation,
 * D = (4^(5/3) n Q / (pi S^(1/2)))^(3/8).
 *
 * Source: Manning's equation, SI form (Chow 1959), solved for D.
 * @example manningDiameter(0.00209, 0.002, 0.015) // 0.1016 m
 */
export function manningDiameter(flowM3s: number, slope: number, roughness: number): number {
  requirePositive(flowM3s, 'flowM3s', 'm3/s');
  checkPipe(1, slope, roughness);
  return Math.pow((K_CIRCLE * roughness * flowM3s) / Math.sqrt(slope), 3 / 8);
}

/**
 * The drain-design form of Manning's equation in inch-pound units: D = 16 (q n / S^0.5)^(3/8),
 * D in inches, q in ft3/s. Agrees with `manningDiameter` to the rounding of its coefficient
 * (16 for 16.01, about 0.1 %).
 *
 * Source: Manning's equation in US units solved for the diameter (as in US drainage guides).
 * @example manningDiameterInches(0.0738, 0.002, 0.015) // 4.0 in
 */
export function manningDiameterInches(flowCfs: number, slope: number, roughness: number): number {
  requirePositive(flowCfs, 'flowCfs', 'ft3/s');
  checkPipe(1, slope, roughness);
  return 16 * Math.pow((flowCfs * roughness) / Math.sqrt(slope), 3 / 8);
}

/**
 * Mean velocity (m/s) of a circular pipe flowing full, V = (1/n) (D/4)^(2/3) S^(1/2).
 *
 * Source: Manning's equation (Chow 1959).
 * @example fullFlowVelocity(0.1016, 0.002, 0.015) // 0.258 m/s
 */
export function fullFlowVelocity(diameterM: number, slope: number, roughness: number): number {
  checkPipe(diameterM, slope, roughness);
  return (Math.pow(diameterM / 4, 2 / 3) * Math.sqrt(slope)) / roughness;
}

/**
 * Grade (m/m) at which a circular pipe flowing full reaches `velocityMs`,
 * S = (V n / (D/4)^(2/3))^2: the minimum grade for a self-cleaning velocity target.
 *
 * Source: Manning's equation solved for the slope (Chow 1959).
 * @example minimumGrade(0.1016, 0.427, 0.015) // 0.0055 m/m
 */
export function minimumGrade(diameterM: number, velocityMs: number, roughness: number): number {
  checkPipe(diameterM, 1, roughness);
  requirePositive(velocityMs, 'velocityMs', 'm/s');
  const s = (velocityMs * roughness) / Math.pow(diameterM / 4, 2 / 3);
  return s * s;
}
