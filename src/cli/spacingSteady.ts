/**
 * `tileflux spacing` in steady state: the spacing at which drains remove the design drainage rate
 * with the water table midway held at a given depth (Hooghoudt's equation, solved for L), with
 * Kirkham's ponded rate and the drainage intensity beside it.
 */
import { TilefluxError } from '../errors.js';
import {
  drainageIntensity,
  EQUIVALENT_DEPTH_METHODS,
  hooghoudtSpacing,
  kirkhamFlux,
  kirkhamGeometryFactor,
} from '../drainage/index.js';
import type { UnitSystem } from '../units/quantity.js';
import { blocks, echo } from './echo.js';
import { CAUTION, emit } from './common.js';
import { quantityOption, requiredQuantity } from './quantityOptions.js';
import { layout, layoutRows, len, positive, rate, type SpacingFlags } from './spacingLayout.js';
import { fixedText } from '../units/decimal.js';

/** `tileflux spacing` in steady state: Hooghoudt's spacing for a drainage rate, printed. */
export function steadySpacing(o: SpacingFlags, units: UnitSystem): void {
  const l = layout(o);
  const kBelowMPerDay = positive(
    quantityOption(o.conductivityBelowDrains, 'conductivity', '--conductivity-below-drains') ??
      l.kMPerDay,
    '--conductivity-below-drains',
    'm/d',
  );
  const waterTableM = requiredQuantity(o.waterTable, 'length', '--water-table');
  if (waterTableM < 0) {
    throw new TilefluxError(
      `--water-table (${fixedText(waterTableM, 3)} m) puts the water table above the surface; give ` +
        `its depth below the surface, from 0 up to --drain-depth`,
    );
  }
  if (!(waterTableM < l.drainDepthM)) {
    throw new TilefluxError(
      `--water-table (${fixedText(waterTableM, 3)} m) must be shallower than --drain-depth ` +
        `(${fixedText(l.drainDepthM, 3)} m): the head midway is the height of the water table above ` +
        `the drains`,
    );
  }
  const rateMmPerDay = positive(
    requiredQuantity(o.coefficient, 'rate', '--coefficient'),
    '--coefficient',
    'mm/d',
  );
  const headM = l.drainDepthM - waterTableM;
  const sol = hooghoudtSpacing({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay,
    layerBelowDrainsM: l.layerBelowDrainsM,
    drainRadiusM: l.radiusM,
    headM,
    rateMPerDay: rateMmPerDay / 1000,
    method: l.method,
    drainDepthM: l.drainDepthM,
  });
  const intensity = drainageIntensity({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay,
    equivalentDepthM: sol.equivalentDepthM,
    drainDepthM: l.drainDepthM,
    spacingM: sol.spacingM,
  });
  // Kirkham's solution is for a uniform soil: given only when one conductivity applies.
  const uniform = kBelowMPerDay === l.kMPerDay;
  const ponded = uniform
    ? kirkhamFlux({
        kMPerDay: l.kMPerDay,
        pondedDepthM: 0,
        drainDepthM: l.drainDepthM,
        drainRadiusM: l.radiusM,
        spacingM: sol.spacingM,
        geometryFactor: kirkhamGeometryFactor({
          drainDepthM: l.drainDepthM,
          layerBelowDrainsM: l.layerBelowDrainsM,
          drainRadiusM: l.radiusM,
          spacingM: sol.spacingM,
        }),
      })
    : null;
  const data = {
    method: 'hooghoudt',
    equivalent_depth_method: l.method,
    spacing_m: sol.spacingM,
    equivalent_depth_m: sol.equivalentDepthM,
    head_m: headM,
    rate_mm_d: rateMmPerDay,
    drainage_intensity_mm_d: intensity * 1000,
    ponded_rate_mm_d: ponded === null ? null : ponded * 1000,
    k_m_d: l.kMPerDay,
    k_below_m_d: kBelowMPerDay,
    drain_depth_m: l.drainDepthM,
    barrier_depth_m: l.barrierDepthM,
    layer_below_drains_m: l.layerBelowDrainsM,
    water_table_depth_m: waterTableM,
    radius_m: l.radiusM,
    iterations: sol.iterations,
  };
  emit(o.json, data, () =>
    [
      'Drain spacing for a steady drainage rate (Hooghoudt equation)',
      '',
      blocks([
        [
          'Inputs',
          [
            ['conductivity above drains', echo(o.conductivity, l.kMPerDay, 'm/d', 3, units)],
            [
              'conductivity below drains',
              o.conductivityBelowDrains === undefined
                ? `${echo(undefined, kBelowMPerDay, 'm/d', 3, units).replace(' (default)', '')} (as --conductivity)`
                : echo(o.conductivityBelowDrains, kBelowMPerDay, 'm/d', 3, units),
            ],
            ...layoutRows(o, l, units),
            [
              'midpoint water table',
              `${echo(o.waterTable, waterTableM, 'm', 3, units)} below the surface`,
            ],
            ['drainage rate', echo(o.coefficient, rateMmPerDay, 'mm/d', 2, units)],
          ],
        ],
        [
          'Result',
          [
            ['spacing', len(sol.spacingM, units, 1)],
            ['equivalent depth d', len(sol.equivalentDepthM, units)],
            ['head midway', `${len(headM, units)} above the drains`],
            [
              'drainage intensity',
              `${rate(intensity * 1000, units)} with the water table at the surface midway`,
            ],
            [
              'ponded-surface rate',
              ponded === null
                ? 'not given: Kirkham (1957) assumes one conductivity (--conductivity-below-drains differs)'
                : `${rate(ponded * 1000, units)} with water just ponded on the surface (Kirkham 1957)`,
            ],
          ],
        ],
      ]),
      '',
      'Method: Hooghoudt (1940) steady-state equation q = (8 K2 d h + 4 K1 h^2) / L^2, solved',
      `for L in ${sol.iterations} Newton steps; equivalent depth d by`,
      `${EQUIVALENT_DEPTH_METHODS[l.method]}.`,
      CAUTION,
    ].join('\n'),
  );
}
