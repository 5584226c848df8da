/**
 * Nitrate-N load carried by a depth of water at a concentration.
 *
 * 1 mm of water over 1 ha is 10 m3 = 10 000 L; at 1 mg/L it carries 10 000 mg = 0.01 kg, so
 * load (kg N/ha) = flow (mm) x concentration (mg N/L) / 100 (README, Nitrate models; unit
 * arithmetic). The inverse gives the concentration of a pool mixed into a depth of water:
 * 1 kg N/ha in 1 mm is 100 mg N/L.
 */

/**
 * Load (kg N/ha) of `flowMm` of water at `concMgL`.
 *
 * @example loadKgHa(250, 12) // 30
 */
export function loadKgHa(flowMm: number, concMgL: number): number {
  return (flowMm * concMgL) / 100;
}

/**
 * Concentration (mg N/L) of `massKgHa` of nitrate-N dissolved in `waterMm` of water.
 *
 * @example concentrationMgL(30, 300) // 10
 */
export function concentrationMgL(massKgHa: number, waterMm: number): number {
  return (massKgHa / waterMm) * 100;
}
