/**
 * Input checks shared by the drain design equations. Each failure is a TilefluxError naming the
 * parameter, the value received and what is accepted, so a wrong layout never turns into a
 * silent NaN deep inside a sweep.
 */
import { TilefluxError } from '../errors.js';

/** Throws unless `value` is a finite number greater than zero. */
export function requirePositive(value: number, name: string, unit: string): void {
  if (!(Number.isFinite(value) && value > 0)) {
    throw new TilefluxError(`${name} must be a number greater than 0 ${unit}; got ${value}`);
  }
}

/** Throws unless `value` is a finite number of at least zero. */
export function requireNonNegative(value: number, name: string, unit: string): void {
  if (!(Number.isFinite(value) && value >= 0)) {
    throw new TilefluxError(`${name} must be a number of at least 0 ${unit}; got ${value}`);
  }
}

/** Throws unless the drain radius is smaller than the layer between the drains and the barrier. */
export function requireRadiusBelowLayer(layerBelowDrainsM: number, drainRadiusM: number): void {
  requirePositive(drainRadiusM, 'drainRadiusM', 'm');
  if (!(Number.isFinite(layerBelowDrainsM) && layerBelowDrainsM > drainRadiusM)) {
    throw new TilefluxError(
      `layerBelowDrainsM (barrier depth minus drain depth, ${layerBelowDrainsM} m) must be ` +
        `larger than the drain radius (${drainRadiusM} m): the restrictive layer must lie below ` +
        `the drain pipe`,
    );
  }
}
