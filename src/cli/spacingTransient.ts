/**
 * `tileflux spacing --transient`: the spacing that lowers the water table midway between the
 * drains from one depth to another in a given time after a wetting, with no further recharge
 * (the Glover-Dumm solution).
 */
import { TilefluxError } from '../errors.js';
import { drainageIntensity, EQUIVALENT_DEPTH_METHODS, gloverSpacing } from '../drainage/index.js';
import type { UnitSystem } from '../units/quantity.js';
import { blocks, echo } from './echo.js';
import { CAUTION, emit } from './common.js';
import { requiredQuantity } from './quantityOptions.js';
import { layout, layoutRows, len, positive, rate, type SpacingFlags } from './spacingLayout.js';
import { fixedText } from '../units/decimal.js';

/** `tileflux spacing --transient`: the Glover-Dumm spacing for a drawdown time, printed. */
export function transientSpacing(o: SpacingFlags, units: UnitSystem): void {
  const l = layout(o);
  const porosity = requiredQuantity(o.drainablePorosity, 'fraction', '--drainable-porosity');
  if (!(porosity > 0 && porosity < 1)) {
    throw new TilefluxError(
      `--drainable-porosity must be a fraction between 0 and 1 (such as 0.05 or 5 %); got ${o.drainablePorosity}`,
    );
  }
  const fromM = requiredQuantity(o.from, 'length', '--from');
  const toM = requiredQuantity(o.to, 'length', '--to');
  const days = positive(requiredQuantity(o.days, 'duration', '--days'), '--days', 'd');
  if (fromM < 0) {
    throw new TilefluxError(
      `--from (${fixedText(fromM, 3)} m) puts the water table above the surface; give its depth below ` +
        `the surface (0 for a water table at the surface)`,
    );
  }
  if (!(toM > fromM)) {
    throw new TilefluxError(
      `--to (${fixedText(toM, 3)} m) must be deeper than --from (${fixedText(fromM, 3)} m): the water table falls`,
    );
  }
  if (!(toM < l.drainDepthM)) {
    throw new TilefluxError(
      `--to (${fixedText(toM, 3)} m) must be shallower than --drain-depth (${fixedText(l.drainDepthM, 3)} m): ` +
        `drains never lower the water table quite to their own level`,
    );
  }
  const sol = gloverSpacing({
    kMPerDay: l.kMPerDay,
    drainablePorosity: porosity,
    drainDepthM: l.drainDepthM,
    layerBelowDrainsM: l.layerBelowDrainsM,
    drainRadiusM: l.radiusM,
    fromDepthM: fromM,
    toDepthM: toM,
    days,
    method: l.method,
  });
  const intensity = drainageIntensity({
    kAboveMPerDay: l.kMPerDay,
    kBelowMPerDay: l.kMPerDay,
    equivalentDepthM: sol.equivalentDepthM,
    drainDepthM: l.drainDepthM,
    spacingM: sol.spacingM,
  });
  const data = {
    method: 'glover-dumm',
    equivalent_depth_method: l.method,
    spacing_m: sol.spacingM,
    equivalent_depth_m: sol.equivalentDepthM,
    average_flow_depth_m: sol.averageFlowDepthM,
    initial_head_m: l.drainDepthM - fromM,
    final_head_m: l.drainDepthM - toM,
    head_ratio: sol.headRatio,
    days,
    drainable_porosity: porosity,
    drainage_intensity_mm_d: intensity * 1000,
    k_m_d: l.kMPerDay,
    drain_depth_m: l.drainDepthM,
    barrier_depth_m: l.barrierDepthM,
    layer_below_drains_m: l.layerBelowDrainsM,
    from_depth_m: fromM,
    to_depth_m: toM,
    radius_m: l.radiusM,
  };
  emit(o.json, data, () =>
    [
      'Drain spacing for a falling water table (Glover-Dumm)',
      '',
      blocks([
        [
          'Inputs',
          [
            ['conductivity', echo(o.conductivity, l.kMPerDay, 'm/d', 3, units)],
            ['drainable porosity', echo(o.drainablePorosity, porosity, '', 3)],
            ...layoutRows(o, l, units),
            [
              'midpoint water table',
              `from ${echo(o.from, fromM, 'm', 3, units)} to ${echo(o.to, toM, 'm', 3, units)} below the surface`,
            ],
            ['time allowed', echo(o.days, days, 'd', 2)],
          ],
        ],
        [
          'Result',
          [
            ['spacing', len(sol.spacingM, units, 1)],
            ['equivalent depth d', len(sol.equivalentDepthM, units)],
            ['average flow depth', `${len(sol.averageFlowDepthM, units)} (d + h0/2)`],
            [
              'head midway',
              `${len(data.initial_head_m, units)} falling to ${len(data.final_head_m, units)} (ratio ${fixedText(sol.headRatio, 3)})`,
            ],
            [
              'drainage intensity',
              `${rate(intensity * 1000, units)} with the water table at the surface midway`,
            ],
          ],
        ],
      ]),
      '',
      'Method: Glover-Dumm solution of the linearized Boussinesq equation for an initially flat',
      'water table, series summed in full, flow depth D = d + h0/2; equivalent depth d by',
      `${EQUIVALENT_DEPTH_METHODS[l.method]}.`,
      CAUTION,
    ].join('\n'),
  );
}
