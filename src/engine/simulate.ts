/**
 * The daily water-balance engine: water table midway between drains, drain outflow, surface
 * runoff, crop ET and deep seepage for one field, layout and outlet schedule.
 *
 * Method: the water balance of a drained profile, with published equations for each flux
 * (README "Methods"):
 * - The profile above the restrictive layer holds (i) a root-zone depletion below field capacity,
 *   made by ET and refilled first by infiltration, and (ii) a drained air volume above the water
 *   table, tied to the water-table depth by the drainable porosity (see porosityProfile.ts).
 *   The water table is taken as flat for storage, so stored water gives the midpoint depth.
 * - Drain outflow is Hooghoudt's steady-state equation applied quasi-steadily each sub-step,
 *   q = (8 K2 d h + 4 K1 h^2) / L^2, with h the midpoint head above the effective outlet level
 *   (the drain, or the control-structure level when that is shallower) and d the equivalent depth
 *   of the layer below that level (Hooghoudt 1940; van der Molen & Wesseling 1991). When the
 *   surface is ponded and the profile saturated, Kirkham's (1957) ponded-surface rate applies if
 *   it is larger.
 *   Outflow never exceeds the pipe capacity.
 * - Crop ET is Kc x ET0 (FAO-56 single crop coefficient), taken first from ponded water, then
 *   from the water table in proportion to exp(-(depth below the root zone) / decay length), the
 *   rest from the root zone reduced by the FAO-56 water-stress coefficient Ks (Eq. 84). No ET
 *   is drawn while snow covers the ground.
 * - Surface water beyond the depression storage runs off. Infiltration is limited by what the
 *   profile can take (depletion + air) and by the saturated conductivity.
 * - Seepage leaves the saturated zone by vertical leakage to a regional head and laterally to
 *   the field edge (seepage.ts), plus an optional constant rate and a conductance times the head
 *   above the restrictive layer.
 * - The root zone of the day comes from the crop calendar (it grows with the crop).
 * Every day the water balance P = ET + runoff + drain flow + seepage + change in storage (soil,
 * surface, snow) is computed from the states and its residual returned; a residual above
 * 1e-6 mm in any year is a defect and throws.
 *
 * Longer than most files: the engine is one daily loop with its sub-step, kept in one place so
 * that every flux of the water balance, and the balance check that closes them, reads in order.
 */
import { dayIndexOf } from '../climate/calendar.js';
import { TilefluxError } from '../errors.js';
import { equivalentDepth } from '../drainage/equivalentDepth.js';
import { kirkhamFlux, kirkhamGeometryFactor } from '../drainage/kirkham.js';
import {
  airAbove,
  depthForAir,
  porosityAt,
  porosityTable,
  type PorosityTable,
} from './porosityProfile.js';
import { lateralSeepageMmPerDay, verticalSeepageMmPerDay } from './seepage.js';
import type {
  CropCalendar,
  EngineColumns,
  EngineForcing,
  EngineParams,
  EngineResult,
} from './types.js';

/** Largest change of the drain head, as a fraction of itself, allowed in one sub-step. */
const MAX_RELATIVE_STEP = 0.5;
/**
 * Depth of the biologically active upper profile whose saturated share drives denitrification,
 * m. Most soil denitrification happens in the carbon-rich top metre (assumption; a fixed depth
 * lets scenarios with different drain depths be compared on the same soil volume).
 */
export const ACTIVE_ZONE_M = 1.0;
/**
 * Fewest internal sub-steps per day on days with rain, melt or ponded water. Halving the step
 * from 8 changes annual drain flow by under 1 % in every year on the demo field and on the
 * vega-datasets New York record, for all three standard alternatives; with 4 a year moves by
 * up to 1.1 %, and with 1-2 runoff is off by a factor of several on fast-draining layouts (the
 * step-halving checks in test/engine and test/scenarios).
 */
export const MIN_SUBSTEPS_PER_DAY = 8;
/**
 * Most internal sub-steps a day. Beyond this the drains empty the profile in minutes of model
 * time (very high conductivity, very close spacing or a near-zero drainable porosity): a daily
 * engine is the wrong tool, and the run would take minutes per simulated year.
 */
export const MAX_SUBSTEPS_PER_DAY = 20000;
/** Largest annual water-balance residual tolerated (README, A short tour: 1e-6 mm a year), mm. */
export const BALANCE_TOLERANCE_MM = 1e-6;

/** An outlet level's coefficients (see `outletLevels`). */
export interface OutletLevel {
  depthM: number;
  /** Air volume above the outlet level, mm: the drains do not lower the water table below it. */
  outletAir: number;
  /** Hooghoudt coefficients: q (m/d) = a h + b h^2. */
  a: number;
  b: number;
  /** Kirkham's ponded rate is linear in the pond depth t (m): q (m/d) = k0 + k1 t. */
  kirkham0: number;
  kirkham1: number;
  /**
   * Without recharge the roots and the decay factor of a drain step depend only on the step
   * length and the porosity: the last pair's values, reused while they repeat (dry spells).
   */
  dryDt: number;
  dryMu: number;
  dryH1: number;
  dryH2: number;
  dryE: number;
}

/**
 * Drain outflow (mm) over one sub-step of length `dt` days, from a water table with air volume
 * `air` above it, receiving `recharge` mm spread evenly over the step.
 *
 * Hooghoudt's flux q(h) = a h + b h^2 with a constant recharge r makes the midpoint head obey the
 * Riccati equation mu dh/dt = r - a h - b h^2, which is solved exactly over the step:
 * with roots h1 >= 0 > h2 of b h^2 + a h - r = 0,
 *   (h - h1) / (h - h2) = C exp(-b (h1 - h2) t / mu).
 * Steady states (h = h1) and the exponential recession of the linear term are therefore reproduced
 * whatever the step, and outflow follows from the change in stored water. The drainable porosity
 * is taken at the starting depth for the step (layers are thick compared with one step's change).
 */
function drainStep(
  table: PorosityTable,
  lv: OutletLevel,
  air: number,
  outletAir: number,
  recharge: number,
  dt: number,
): number {
  const depth = depthForAir(table, air);
  const h0 = Math.max(0, lv.depthM - depth);
  const mu = porosityAt(table, depth) * 1000; // mm of water per m of head
  const A = lv.a * 1000; // mm/d per m
  const B = lv.b * 1000; // mm/d per m^2
  const r = recharge / dt; // mm/d
  let hEnd: number;
  if (B <= 0) {
    // Linear case: mu dh/dt = r - A h.
    const hEq = A > 0 ? r / A : Infinity;
    hEnd = A > 0 ? hEq + (h0 - hEq) * Math.exp((-A * dt) / mu) : h0 + (r * dt) / mu;
  } else {
    let h1: number;
    let h2: number;
    let e: number;
    if (r === 0 && dt === lv.dryDt && mu === lv.dryMu) {
      h1 = lv.dryH1;
      h2 = lv.dryH2;
      e = lv.dryE;
    } else {
      const root = Math.sqrt(A * A + 4 * B * r);
      h1 = (-A + root) / (2 * B);
      h2 = (-A - root) / (2 * B);
      e = Math.exp((-B * (h1 - h2) * dt) / mu);
      if (r === 0) {
        lv.dryDt = dt;
        lv.dryMu = mu;
        lv.dryH1 = h1;
        lv.dryH2 = h2;
        lv.dryE = e;
      }
    }
    const c = (h0 - h1) / (h0 - h2);
    hEnd = (h1 - c * h2 * e) / (1 - c * e);
  }
  if (hEnd > lv.depthM) hEnd = lv.depthM;
  if (hEnd < 0) hEnd = 0;
  const airEnd = airAbove(table, lv.depthM - hEnd);
  // Outflow = what left the saturated zone: the air gained plus the recharge received.
  const dq = airEnd - air + recharge;
  return Math.min(dq, outletAir - air + recharge);
}

/**
 * The outlet levels of a layout, each computed on first use and kept: for an outlet depth (the
 * drain depth when free), the Hooghoudt coefficients of the layer below it and Kirkham's ponded
 * rate. Exported for the engine benchmark's C yardstick, which runs on the same coefficients.
 *
 * @example outletLevels(params, porosityTable(params.porosity, params.barrierDepthM))(1.1).a
 */
export function outletLevels(
  p: EngineParams,
  table: PorosityTable,
): (depthM: number) => OutletLevel {
  const L2 = p.spacingM * p.spacingM;
  // Kirkham's geometry factor depends on the pipe layout only: one series for the whole run.
  const kirkhamG = kirkhamGeometryFactor({
    drainDepthM: p.drainDepthM,
    layerBelowDrainsM: p.barrierDepthM - p.drainDepthM,
    drainRadiusM: p.drainRadiusM,
    spacingM: p.spacingM,
  });
  // The drains stay at their depth; a raised outlet sets the head in the pipe (kirkham.ts).
  const kirkhamAt = (outletDepthM: number, pondM: number) =>
    kirkhamFlux({
      kMPerDay: p.kAboveMPerDay,
      pondedDepthM: pondM,
      drainDepthM: p.drainDepthM,
      drainRadiusM: p.drainRadiusM,
      spacingM: p.spacingM,
      geometryFactor: kirkhamG,
      outletDepthM,
    });

  const levels = new Map<number, OutletLevel>();
  return (depth: number): OutletLevel => {
    let lv = levels.get(depth);
    if (!lv) {
      const below = p.barrierDepthM - depth;
      const d =
        below > p.drainRadiusM
          ? equivalentDepth(p.spacingM, below, p.drainRadiusM, p.equivalentDepthMethod)
          : 0;
      lv = {
        depthM: depth,
        outletAir: airAbove(table, depth),
        a: (8 * p.kBelowMPerDay * d) / L2,
        b: (4 * p.kAboveMPerDay) / L2,
        kirkham0: kirkhamAt(depth, 0),
        kirkham1: kirkhamAt(depth, 1) - kirkhamAt(depth, 0),
        dryDt: NaN,
        dryMu: NaN,
        dryH1: 0,
        dryH2: 0,
        dryE: 0,
      };
      levels.set(depth, lv);
    }
    return lv;
  };
}

/**
 * Run the engine over the whole forcing period.
 *
 * @param forcing   daily weather terms shared by all scenarios
 * @param calendar  daily Kc and depletion fraction for this scenario's rotation
 * @param outletDepthM  daily control-structure level, m below the surface; NaN = free outlet
 * @param p         field and layout parameters (SI)
 * @param reuse     the columns of an earlier result over as many days, to be overwritten (every
 *   column is written every day); the earlier result then shows this run. Without it the
 *   columns are allocated.
 * @example
 * const r = simulate(forcing, calendar, new Float64Array(forcing.dates.length).fill(NaN), params);
 * r.drainflowMm; // daily drain outflow, mm
 */
export function simulate(
  forcing: EngineForcing,
  calendar: CropCalendar,
  outletDepthM: Float64Array,
  p: EngineParams,
  reuse?: EngineColumns,
): EngineResult {
  const n = forcing.dates.length;
  const table = porosityTable(p.porosity, p.barrierDepthM);
  const L2 = p.spacingM * p.spacingM;

  const levelFor = outletLevels(p, table);
  const free = levelFor(p.drainDepthM);

  // Sub-steps: enough that the drains change the head by at most MAX_RELATIVE_STEP per step
  // (the linearised rate dq/dh / mu at the largest head), at least what the caller asks and
  // never fewer than MIN_SUBSTEPS_PER_DAY.
  const kMax = (free.a + 2 * free.b * p.drainDepthM) / table.minValue;
  const needed = Math.ceil(kMax / MAX_RELATIVE_STEP);
  if (!(needed <= MAX_SUBSTEPS_PER_DAY)) {
    const shown = Number.isFinite(needed) ? `${needed}` : 'unboundedly many';
    throw new TilefluxError(
      `the drains react too fast for a daily water balance: ${shown} sub-steps a day would be ` +
        `needed (at most ${MAX_SUBSTEPS_PER_DAY}), from conductivity ${p.kAboveMPerDay} m/d above ` +
        `and ${p.kBelowMPerDay} m/d below the drains, spacing ${p.spacingM} m and drainable ` +
        `porosity ${table.minValue}; widen the spacing or check the conductivity and porosity`,
    );
  }
  const steps = Math.max(MIN_SUBSTEPS_PER_DAY, p.substepsPerDay, needed);
  // Days without rain, melt or ponded water need no splitting of infiltration against drainage:
  // drainage is integrated exactly and FAO-56 ET is itself a daily method, so they take fewer.
  const dryDaySteps = Math.max(1, Math.ceil(steps / 8));

  // Total available water per metre of roots, mm/m; the root depth of the day scales it.
  const tawPerM = Math.max(0, (p.fieldCapacity - p.wiltingPoint) * 1000);
  const rootDepth = calendar.rootDepthM;
  const sp = p.seepage;
  const hasSeepage =
    p.seepageMmPerDay > 0 ||
    p.seepageConductanceMmPerDayPerM > 0 ||
    (sp !== undefined && (sp.leakancePerDay > 0 || sp.lateralKMPerDay > 0));

  const out: EngineColumns =
    reuse?.etMm.length === n
      ? reuse
      : {
          etMm: new Float64Array(n),
          cropEtMm: new Float64Array(n),
          runoffMm: new Float64Array(n),
          infiltrationMm: new Float64Array(n),
          drainflowMm: new Float64Array(n),
          seepageMm: new Float64Array(n),
          lateralSeepageMm: new Float64Array(n),
          waterTableDepthM: new Float64Array(n),
          outletDepthM: new Float64Array(n),
          pondedMm: new Float64Array(n),
          rootZoneDepletionMm: new Float64Array(n),
          ks: new Float64Array(n),
          soilStorageMm: new Float64Array(n),
          saturatedFraction: new Float64Array(n),
          balanceErrorMm: new Float64Array(n),
          capacityLimited: new Uint8Array(n),
        };

  let air = airAbove(table, Math.min(Math.max(p.initialWaterTableDepthM, 0), p.barrierDepthM));
  let depletion = 0;
  let surface = 0;
  let swePrev = forcing.sweMm[0] - forcing.snowfallMm[0] + forcing.snowmeltMm[0];

  let yearError = 0;
  const years = (forcing.days ?? dayIndexOf(forcing.dates)).year;
  let year = years[0];

  // The inner loops read constants and columns from locals, not from the parameter objects.
  const { rainMm, snowmeltMm, sweMm, precipMm, refEtMm } = forcing;
  const { kc, depletionFraction } = calendar;
  const { capillaryDecayM, surfaceStorageMm, barrierDepthM, seepageMmPerDay } = p;
  const { kAboveMPerDay, capacityMmPerDay, drainDepthM } = p;
  const seepageConductance = p.seepageConductanceMmPerDayPerM;
  const maxAirMm = table.maxAirMm;
  let heldDepth = NaN;
  let heldLevel = free;

  for (let i = 0; i < n; i++) {
    const waterIn = rainMm[i] + snowmeltMm[i];
    const snowCovered = sweMm[i] > 0;
    const cropEt = snowCovered ? 0 : kc[i] * refEtMm[i];
    const pDepl = depletionFraction[i];
    const ctrl = outletDepthM[i];
    // A held outlet keeps its level for weeks: its coefficients are looked up once a change.
    // (NaN, the free outlet, never equals itself and takes the plain test.)
    if (ctrl !== heldDepth) {
      heldLevel = Number.isNaN(ctrl) || ctrl >= drainDepthM ? free : levelFor(Math.max(0, ctrl));
      heldDepth = ctrl;
    }
    const lv = heldLevel;
    const outletAir = lv.outletAir;

    const rootZoneDepthM = rootDepth ? rootDepth[i] : p.rootZoneDepthM;
    const taw = tawPerM * rootZoneDepthM;
    let limited = 0;
    let lateral = 0;
    const storeStart = -(air + depletion) + surface;
    let et = 0;
    let runoff = 0;
    let infil = 0;
    let drain = 0;
    let seep = 0;
    let ksSum = 0;

    const nSteps = waterIn > 0 || surface > 0 ? steps : dryDaySteps;
    const dt = 1 / nSteps;
    const infiltrationCapMm = kAboveMPerDay * 1000 * dt;
    const capacityMm = capacityMmPerDay * dt;
    for (let s = 0; s < nSteps; s++) {
      // Rain and melt reach the surface; the profile takes what it has room for, refilling the
      // root zone first; the rest recharges the saturated zone over this sub-step.
      surface += waterIn * dt;
      let inf = Math.min(surface, depletion + air, infiltrationCapMm);
      if (inf < 0) inf = 0;
      surface -= inf;
      infil += inf;
      const refill = Math.min(inf, depletion);
      depletion -= refill;
      let recharge = inf - refill;

      // ET: ponded water first, then the water table, then the root zone under stress.
      let demand = cropEt * dt;
      const evap = Math.min(surface, demand);
      surface -= evap;
      demand -= evap;
      const wtd = depthForAir(table, air);
      const below = wtd - rootZoneDepthM;
      // (Without demand left the share does not matter: its exponential is skipped.)
      const share = below <= 0 || !(demand > 0) ? 1 : Math.exp(-below / capillaryDecayM);
      const fromTable = Math.min(demand * share, maxAirMm - air);
      air += fromTable;
      demand -= fromTable;
      let ks = 1;
      if (taw > 0) {
        const raw = pDepl * taw;
        ks = depletion <= raw ? 1 : Math.max(0, (taw - depletion) / ((1 - pDepl) * taw));
      } else ks = 0;
      const fromRoots = Math.max(0, Math.min(demand * ks, taw - depletion));
      depletion += fromRoots;
      et += evap + fromTable + fromRoots;
      ksSum += ks;

      // Recharge below the outlet level raises the water table without drainage.
      if (air > outletAir) {
        const fill = Math.min(recharge, air - outletAir);
        air -= fill;
        recharge -= fill;
      }
      if (recharge > 0 || air < outletAir) {
        let dq: number;
        if (air - recharge <= 0 && surface > 0) {
          // Saturated to the surface and ponded: Hooghoudt at full head or Kirkham, if larger.
          const h = lv.depthM;
          let q = lv.a * h + lv.b * h * h;
          const qk = lv.kirkham0 + (lv.kirkham1 * surface) / 1000;
          if (qk > q) q = qk;
          air -= recharge;
          dq = Math.min(q * 1000 * dt, outletAir - air);
        } else {
          dq = drainStep(table, lv, air, outletAir, recharge, dt);
          air -= recharge;
        }
        if (dq > capacityMm) {
          dq = capacityMm;
          limited = 1;
        }
        if (dq < 0) dq = 0;
        air += dq;
        if (air < 0) air = 0;
        drain += dq;
      }

      // Seepage while there is saturated soil above the restrictive layer: the constant and
      // head-proportional deep terms, vertical leakage to the regional head and lateral
      // seepage to the field edge (seepage.ts).
      if (air < maxAirMm && hasSeepage) {
        const wt = depthForAir(table, air);
        const headAboveBarrier = barrierDepthM - wt;
        let rate = seepageMmPerDay + seepageConductance * headAboveBarrier;
        let side = 0;
        if (sp !== undefined) {
          rate += verticalSeepageMmPerDay(wt, barrierDepthM, sp);
          side = lateralSeepageMmPerDay(wt, barrierDepthM, sp);
          rate += side;
        }
        const ds = Math.min(rate * dt, maxAirMm - air);
        air += ds;
        seep += ds;
        if (side > 0) lateral += (ds * side) / rate;
      }

      // Water still on the surface enters the room the drains and seepage made during this
      // sub-step before anything runs off (without this second pass the room would open one
      // sub-step late and runoff would carry an error proportional to the step).
      if (surface > 0 && infil < infiltrationCapMm * (s + 1)) {
        let late = Math.min(surface, depletion + air, infiltrationCapMm - inf);
        if (late > 0) {
          surface -= late;
          infil += late;
          const refillLate = Math.min(late, depletion);
          depletion -= refillLate;
          late -= refillLate;
          air -= late;
        }
      }

      // Surface water above the depression storage runs off.
      if (surface > surfaceStorageMm) {
        runoff += surface - surfaceStorageMm;
        surface = surfaceStorageMm;
      }
    }

    const wtd = depthForAir(table, air);
    const storeEnd = -(air + depletion) + surface;
    const swe = sweMm[i];
    const err =
      precipMm[i] - et - runoff - drain - seep - (storeEnd - storeStart) - (swe - swePrev);
    swePrev = swe;

    out.etMm[i] = et;
    out.cropEtMm[i] = cropEt;
    out.runoffMm[i] = runoff;
    out.infiltrationMm[i] = infil;
    out.drainflowMm[i] = drain;
    out.seepageMm[i] = seep;
    out.lateralSeepageMm[i] = lateral;
    out.capacityLimited[i] = limited;
    out.waterTableDepthM[i] = wtd;
    out.outletDepthM[i] = lv.depthM;
    out.pondedMm[i] = surface;
    out.rootZoneDepletionMm[i] = depletion;
    out.ks[i] = ksSum / nSteps;
    out.soilStorageMm[i] = -(air + depletion);
    const sat = (ACTIVE_ZONE_M - wtd) / ACTIVE_ZONE_M;
    out.saturatedFraction[i] = sat < 0 ? 0 : sat > 1 ? 1 : sat;
    out.balanceErrorMm[i] = err;

    const y = years[i];
    if (y !== year) {
      yearError = 0;
      year = y;
    }
    yearError += err;
    if (Math.abs(yearError) > BALANCE_TOLERANCE_MM) {
      throw new Error(
        `water balance not closed in ${y}: residual ${yearError} mm (engine defect, please report)`,
      );
    }
  }

  return {
    dates: forcing.dates,
    ...out,
    substepsPerDay: steps,
    equivalentDepthM: free.a > 0 ? (free.a * L2) / (8 * p.kBelowMPerDay) : 0,
  };
}
