/**
 * What `tileflux size` does (registered in cli/commands/size.ts): the drained area, the
 * drainage rate and the roughness from their options, each echoed with its source, then the
 * pipe by Manning's equation.
 *
 * Longer than most modules: each input comes from one of several options (or the coefficient
 * table).
 */
import { TilefluxError } from '../../errors.js';
import {
  fullFlowVelocity,
  manningDiameter,
  manningFullCapacity,
  minimumGrade,
  pipeSizeList,
  ROUGHNESS,
  selectPipeSize,
  drainageCoefficient,
  parseCoefficientPreset,
  type DrainageCoefficient,
  SEDIMENT_VELOCITY_MS,
  type PipeMaterial,
} from '../../drainage/index.js';
import { fixedText, isDecimalNumber } from '../../units/decimal.js';
import { parseQuantity, tryParseQuantity, US, type UnitSystem } from '../../units/quantity.js';
import { CAUTION, emit, warn, parseUnits } from '../common.js';
import { requiredQuantity } from '../quantityOptions.js';
import { blocks, echo } from '../echo.js';

/** Full-flow velocity target for the minimum grade when --velocity is not given (1.4 ft/s). */
export const DEFAULT_VELOCITY_MS = SEDIMENT_VELOCITY_MS;

/** The options of `tileflux size`, as commander hands them over. */
export interface SizeFlags {
  area?: string;
  length?: string;
  spacing?: string;
  rate?: string;
  coefficient?: string;
  slope?: string;
  roughness?: string;
  material?: string;
  sizes?: string;
  velocity?: string;
  units?: string;
  json?: boolean;
}

/** Grades above this are rare for drain lines and usually a unit slip (common practice). */
const STEEP_GRADE = 0.05;
/**
 * Full-flow velocity above which a drain line risks scouring the soil into the pipe unless the
 * joints and envelope are protected: 3.5 ft/s for sandy and sandy-loam soils, the lowest of the
 * soil-texture limits in US conservation practice standards for subsurface drains (silt loam
 * 5, silty clay loam 6, clay loam 7 ft/s; from memory). The limit is set by the soil around
 * the pipe, for corrugated and smooth pipe alike.
 */
const SCOUR_VELOCITY_MS = 3.5 * US.mPerFt;

/**
 * --slope: a grade with its unit. A bare number is refused, since "0.2" is read as m/m by
 * some and as percent by others, a factor of 100 apart.
 */
function slopeOption(value: string | undefined): number {
  if (value !== undefined && isDecimalNumber(value.trim())) {
    throw new TilefluxError(
      `--slope needs a unit: "${value.trim()} %", "${value.trim()} m/m" or "${value.trim()} ft/100ft" ` +
        `(a bare number could be either, a factor of 100 apart); got ${value.trim()}`,
    );
  }
  return requiredQuantity(value, 'slope', '--slope');
}

/** A velocity option: bare numbers are m/s, unit strings such as "1.4 ft/s" are converted. */
function velocityOption(value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const r = tryParseQuantity(value, 'velocity');
  if (!r.ok || !(r.value > 0)) {
    throw new TilefluxError(
      `--velocity expects a velocity greater than 0 such as 0.45 m/s or 1.4 ft/s; got ${value}`,
    );
  }
  return r.value;
}

function roughnessOf(o: SizeFlags): { n: number; label: string } {
  if (o.roughness !== undefined && o.material !== undefined) {
    throw new TilefluxError('give --roughness or --material, not both');
  }
  if (o.roughness !== undefined) {
    const n = parseQuantity(o.roughness, 'fraction', '--roughness');
    if (!(n > 0 && n < 0.1)) {
      throw new TilefluxError(
        `--roughness expects a Manning n between 0 and 0.1 (drain pipes 0.009-0.025); got ${o.roughness}`,
      );
    }
    return { n, label: `${o.roughness} (given)` };
  }
  const material = o.material ?? 'corrugated';
  if (material !== 'corrugated' && material !== 'smooth') {
    throw new TilefluxError(`--material expects corrugated or smooth; got ${material}`);
  }
  const r = ROUGHNESS[material as PipeMaterial];
  return { n: r.n, label: `${r.n}${o.material === undefined ? ' (default)' : ''}, ${r.source}` };
}

/** The drained area in m2 and how to describe it, from --area or --length x --spacing. */
function drainedArea(o: SizeFlags): {
  m2: number;
  text: string;
  lengthM?: number;
  spacingM?: number;
} {
  const lateral = o.length !== undefined || o.spacing !== undefined;
  if (o.area !== undefined && lateral) {
    throw new TilefluxError('give either --area, or --length with --spacing, not both');
  }
  if (o.area !== undefined) {
    const ha = requiredQuantity(o.area, 'area', '--area');
    if (!(ha > 0)) throw new TilefluxError(`--area must be greater than 0; got ${o.area}`);
    return { m2: ha * 10000, text: echo(o.area, ha, 'ha', 3) };
  }
  if (!lateral) {
    throw new TilefluxError(
      'give the drained area: --area, or --length with --spacing for a lateral',
    );
  }
  if (o.length === undefined)
    throw new TilefluxError('--spacing needs --length (the lateral’s length)');
  if (o.spacing === undefined)
    throw new TilefluxError('--length needs --spacing (the drain spacing)');
  const lengthM = parseQuantity(o.length, 'length', '--length');
  const spacingM = parseQuantity(o.spacing, 'length', '--spacing');
  if (!(lengthM > 0)) throw new TilefluxError(`--length must be greater than 0; got ${o.length}`);
  if (!(spacingM > 0))
    throw new TilefluxError(`--spacing must be greater than 0; got ${o.spacing}`);
  const m2 = lengthM * spacingM;
  return {
    m2,
    lengthM,
    spacingM,
    text: `${echo(o.length, lengthM, 'm', 1)} x ${echo(o.spacing, spacingM, 'm', 1)} = ${fixedText(m2 / 10000, 3)} ha`,
  };
}

/**
 * The design rate in mm/d from --coefficient: a rate ("12 mm/d", "0.5 in/d"), or the words of
 * the tabulated coefficient ("mineral field none"), as the field file's drains.coefficient.
 */
function designRate(o: SizeFlags): { mmPerDay: number; text: string; table?: DrainageCoefficient } {
  if (o.rate !== undefined) {
    if (o.coefficient !== undefined)
      throw new TilefluxError(
        '--rate is the former name of --coefficient; give only --coefficient',
      );
    warn("--rate is now --coefficient (the field file's word); the old name will go");
  }
  const given = o.coefficient ?? o.rate;
  if (given === undefined) {
    throw new TilefluxError(
      'give the drainage coefficient: --coefficient with a rate (e.g. "0.5 in/d") or the table\'s words (e.g. "mineral field none")',
    );
  }
  if (!/^\s*[-+.\d]/.test(given)) {
    const c = drainageCoefficient(parseCoefficientPreset(given, '--coefficient'));
    const p = c.preset;
    return {
      mmPerDay: c.mmPerDay,
      table: c,
      text:
        `${fixedText(c.inPerDay, 4)} in/d = ${fixedText(c.mmPerDay, 2)} mm/d (${p.soil} soil, ${p.crop} crops, ` +
        `inlets ${p.inlets}: tabulated ${fixedText(c.lowInPerDay, 3)}-${fixedText(c.highInPerDay, 3)} in/d, middle used)`,
    };
  }
  const mmPerDay = requiredQuantity(given, 'rate', '--coefficient');
  if (!(mmPerDay > 0))
    throw new TilefluxError(`--coefficient must be greater than 0; got ${given}`);
  return { mmPerDay, text: echo(given, mmPerDay, 'mm/d', 2) };
}

/** Print the pipe size the flags ask for. */
export function size(o: SizeFlags): void {
  const units: UnitSystem = parseUnits(o.units);
  const area = drainedArea(o);
  const rate = designRate(o);
  const rateMmPerDay = rate.mmPerDay;
  const slope = slopeOption(o.slope);
  if (!(slope > 0)) {
    throw new TilefluxError(
      `--slope must be greater than 0 (the pipe needs a fall toward its outlet, such as 0.2 %); got ${o.slope}`,
    );
  }
  const rough = roughnessOf(o);
  const sizes = pipeSizeList(o.sizes ?? 'in', '--sizes');
  const velocityMs = velocityOption(o.velocity) ?? DEFAULT_VELOCITY_MS;

  const flowM3s = (area.m2 * rateMmPerDay) / 1000 / 86400;
  const requiredM = manningDiameter(flowM3s, slope, rough.n);
  const pipe = selectPipeSize(requiredM, sizes, '--sizes');
  const capacity = manningFullCapacity(pipe.diameterM, slope, rough.n);
  const velocity = fullFlowVelocity(pipe.diameterM, slope, rough.n);
  const minGrade = minimumGrade(pipe.diameterM, velocityMs, rough.n);
  if (slope > STEEP_GRADE) {
    warn(
      `--slope ${o.slope} is ${fixedText(slope * 100, 3)} %, steeper than the 5 % drain lines rarely exceed (common practice); check the unit (0.2 % = 0.002 m/m)`,
    );
  }
  if (velocity > SCOUR_VELOCITY_MS) {
    warn(
      `full-flow velocity ${fixedText(velocity, 2)} m/s (${fixedText(velocity / US.mPerFt, 2)} ft/s) exceeds 3.5 ft/s, the usual limit for drains in sandy soils without protected joints or envelope (US conservation practice standards for subsurface drains, from memory; finer soils allow 5-7 ft/s)`,
    );
  }
  const selectedKey = pipe.unit === 'in' ? 'selected_diameter_in' : 'selected_diameter_mm';
  const data = {
    method: 'manning-full-pipe',
    area_ha: area.m2 / 10000,
    ...(area.lengthM !== undefined ? { length_m: area.lengthM, spacing_m: area.spacingM } : {}),
    rate_mm_d: rateMmPerDay,
    ...(rate.table !== undefined
      ? {
          coefficient: {
            ...rate.table.preset,
            low_mm_d: rate.table.lowMmPerDay,
            high_mm_d: rate.table.highMmPerDay,
            source: rate.table.source,
          },
        }
      : {}),
    slope_m_m: slope,
    roughness: rough.n,
    flow_m3_s: flowM3s,
    flow_l_s: flowM3s * 1000,
    flow_cfs: flowM3s * US.cfsPerM3s,
    required_diameter_mm: requiredM * 1000,
    required_diameter_in: (requiredM * 1000) / US.mmPerIn,
    size_list: sizes.name,
    [selectedKey]: pipe.nominal,
    selected_capacity_m3_s: capacity,
    capacity_used_percent: (100 * flowM3s) / capacity,
    full_flow_velocity_m_s: velocity,
    velocity_target_m_s: velocityMs,
    min_grade_percent: minGrade * 100,
    grade_meets_minimum: slope >= minGrade,
  };
  const us = units === 'us';
  const flow = (m3s: number) =>
    us ? `${fixedText(m3s * US.cfsPerM3s, 4)} cfs` : `${fixedText(m3s * 1000, 2)} L/s`;
  const speed = (ms: number) =>
    us ? `${fixedText(ms / US.mPerFt, 2)} ft/s` : `${fixedText(ms, 2)} m/s`;
  const needed = us
    ? `${fixedText((requiredM * 1000) / US.mmPerIn, 2)} in (${fixedText(requiredM * 1000, 0)} mm)`
    : `${fixedText(requiredM * 1000, 0)} mm (${fixedText((requiredM * 1000) / US.mmPerIn, 2)} in)`;
  emit(o.json, data, () =>
    [
      "Pipe size for a drain line (Manning's equation, circular pipe flowing full)",
      '',
      blocks([
        [
          'Inputs',
          [
            ['drained area', area.text],
            ['drainage rate', rate.text],
            ['grade', `${echo(o.slope, slope, 'm/m', 4)}`],
            ['roughness n', rough.label],
            ['sizes', `${sizes.nominal.join(', ')} ${sizes.unit}; ${sizes.source}`],
          ],
        ],
        [
          'Result',
          [
            ['design flow', `${flow(flowM3s)} (area x rate)`],
            ['required diameter', needed],
            [
              'selected size',
              `${pipe.nominal} ${pipe.unit}, the next size up: ${flow(capacity)} full, ` +
                `${fixedText(data.capacity_used_percent, 0)} % used`,
            ],
            ['full-flow velocity', `${speed(velocity)} at this grade`],
            [
              'minimum grade',
              `${fixedText(minGrade * 100, 3)} % for ${speed(velocityMs)} full-flow velocity (--velocity)`,
            ],
          ],
        ],
      ]),
      ...(slope >= minGrade
        ? []
        : [
            `  Note: the grade is flatter than that minimum; sediment may settle where the soil`,
            `  holds fine sand or silt (a lower target, e.g. --velocity "0.5 ft/s", where it does not).`,
          ]),
      '',
      'Method: Manning, Q = (1/n) A R^(2/3) S^(1/2) for a full circular pipe (in inch-pound units',
      'D = 16 (q n / S^0.5)^(3/8), D in, q ft3/s); round up to the next size (common practice).',
      CAUTION,
    ].join('\n'),
  );
}
