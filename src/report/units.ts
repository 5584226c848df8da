/**
 * Display units of the report: the core's SI figures, or US customary ones (`--units us`).
 * Conversion happens here, once, at the edge; the data handed to the report stays SI.
 */
import { US, type UnitSystem } from '../units/quantity.js';

/** How one kind of figure is shown: multiply the SI value by `factor`, print `label`. */
export interface DisplayUnit {
  factor: number;
  label: string;
  /** Decimals for annual figures in tables. */
  decimals: number;
}

/** Display units of every kind of figure the report shows. */
export interface DisplayUnits {
  /** Depths of water (flow, runoff, ET), from mm. */
  water: DisplayUnit;
  /** Nitrate-N load, from kg N/ha. */
  load: DisplayUnit;
  /** Depths and lengths in the field (water table, drains, spacing), from m. */
  length: DisplayUnit;
  /** Lateral pipe length per area, from m/ha. */
  pipe: DisplayUnit;
  /** Concentration, mg/L in both systems. */
  conc: DisplayUnit;
}

/**
 * Display units for a unit system. US factors use the exact definitions of the inch (25.4 mm),
 * foot (0.3048 m), acre (0.40468564224 ha) and pound (0.45359237 kg) (NIST Handbook 44, App. C).
 *
 * @example displayUnits('us').water // { factor: 1 / 25.4, label: 'in', decimals: 2 }
 */
export function displayUnits(system: UnitSystem): DisplayUnits {
  if (system === 'us') {
    return {
      water: { factor: 1 / US.mmPerIn, label: 'in', decimals: 2 },
      load: { factor: US.lbAcPerKgHa, label: 'lb N/ac', decimals: 1 },
      length: { factor: 1 / US.mPerFt, label: 'ft', decimals: 1 },
      pipe: { factor: US.haPerAc / US.mPerFt, label: 'ft/ac', decimals: 0 },
      conc: { factor: 1, label: 'mg/L', decimals: 1 },
    };
  }
  return {
    water: { factor: 1, label: 'mm', decimals: 0 },
    load: { factor: 1, label: 'kg N/ha', decimals: 1 },
    length: { factor: 1, label: 'm', decimals: 2 },
    pipe: { factor: 1, label: 'm/ha', decimals: 0 },
    conc: { factor: 1, label: 'mg/L', decimals: 1 },
  };
}
