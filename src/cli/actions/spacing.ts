/**
 * What `tileflux spacing` does (registered in cli/commands/spacing.ts): check that the flags
 * belong to the chosen mode, then the steady (cli/spacingSteady.ts) or falling water-table
 * (cli/spacingTransient.ts) design.
 */
import { TilefluxError } from '../../errors.js';
import { parseUnits } from '../common.js';
import { renamedFlags, STEADY_ONLY, TRANSIENT_ONLY, type SpacingFlags } from '../spacingLayout.js';
import { steadySpacing } from '../spacingSteady.js';
import { transientSpacing } from '../spacingTransient.js';

/** Print the spacing the flags ask for. */
export function spacing(o: SpacingFlags): void {
  renamedFlags(o);
  const units = parseUnits(o.units);
  const [wrong, mode] = o.transient ? [STEADY_ONLY, 'without'] : [TRANSIENT_ONLY, 'with'];
  for (const [key, flag] of wrong) {
    if (o[key] !== undefined) {
      throw new TilefluxError(
        `${flag} applies only ${mode} --transient; leave it out or change mode`,
      );
    }
  }
  if (o.transient) transientSpacing(o, units);
  else steadySpacing(o, units);
}
