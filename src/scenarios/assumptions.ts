/**
 * What a run assumed, in words, in the chosen units: seepage, rooting depth and pipe capacity.
 * The same sentences go into summary.json, the printed summary and the report's methods table.
 */
import { MIN_ROOT_DEPTH_M } from '../engine/crops.js';
import { proseUnits } from '../units/prose.js';
import { US, type UnitSystem } from '../units/quantity.js';
import type { RunResult } from './run.js';

/** What a run assumed about seepage, in words (the first scenario's setting), in `units`. */
export function seepageText(run: RunResult, units: UnitSystem = 'si'): string {
  const s = run.scenarios[0]?.spec;
  if (!s) return '';
  const say = proseUnits(units);
  const { name, setting } = s.seepage;
  const parts: string[] = [];
  if (setting.vertical) {
    parts.push(
      `vertical leakage to a regional head ${say.length(setting.vertical.to)} below the surface with leakance ${setting.vertical.conductance.toExponential(2)} /d`,
    );
  }
  if (setting.lateral) {
    const k = setting.lateral.conductivity ?? s.params.kAboveMPerDay;
    parts.push(
      `lateral seepage to an edge ${say.length(setting.lateral.distance, units === 'us' ? 0 : undefined)} from the field's middle with water ${say.length(setting.lateral.level)} deep (K ${say.conductivity(k)})`,
    );
  }
  const perHead = units === 'us' ? 'in/d per ft' : 'mm/d per m';
  const headScale = units === 'us' ? US.mPerFt / US.mmPerIn : 1;
  const extra =
    s.params.seepageMmPerDay > 0 || s.params.seepageConductanceMmPerDayPerM > 0
      ? `; plus ${say.rate(s.params.seepageMmPerDay)} and ${+(s.params.seepageConductanceMmPerDayPerM * headScale).toPrecision(3)} ${perHead} of head above the restrictive layer (soil.seepage, soil.seepageConductance)`
      : '';
  return `Seepage setting "${name}": ${parts.length ? parts.join('; ') : 'no seepage'}${extra}.`;
}

/** The rooting depth a run assumed, in words, in `units`. */
export function rootText(run: RunResult, units: UnitSystem = 'si'): string {
  const s = run.scenarios[0]?.spec;
  if (!s) return '';
  const say = proseUnits(units);
  if (s.roots.fixedM !== undefined)
    return `Root zone ${say.length(s.roots.fixedM)} all year (soil.rootZoneDepth).`;
  const crops = [...new Set(s.rotation)]
    .map((c) => `${c} ${say.length(Math.min(s.crops[c].maxRootDepth, s.roots.capM ?? Infinity))}`)
    .join(', ');
  return `Roots grow from ${say.length(MIN_ROOT_DEPTH_M)} at planting to the crop's maximum at the start of mid-season (${crops}; capped by the restrictive layer).`;
}

/** The pipe capacity a run assumed, in words, in `units`. */
export function capacityText(run: RunResult, units: UnitSystem = 'si'): string {
  const s = run.scenarios[0]?.spec;
  if (!s) return '';
  const c = s.params.capacityMmPerDay;
  return Number.isFinite(c) ? `${proseUnits(units).rate(c)} (${s.capacitySource})` : 'no limit';
}
