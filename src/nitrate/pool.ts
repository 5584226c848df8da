/**
 * The `pool` model: a daily nitrate-N mass balance (kg N/ha) of the drained profile
 * (README, Nitrate models), in the spirit of the lumped soil-N balances of field-scale drainage and
 * nitrate models (e.g. the reviews of Dinnes et al. 2002, Agronomy Journal 94: 153-171
 * (from memory), for the processes). Each day:
 *
 * 1. inputs: fertilizer events and net mineralization, M = M20 / 365.25 x Q10m^((T - 20)/10);
 * 2. crop uptake: the demand, the day's step of a logistic curve over the season times the
 *    crop's seasonal demand, scaled by the supply P / (P + K) (Michaelis-Menten: roots take
 *    nitrate more slowly as it runs short, and part of the profile's nitrate lies beyond them;
 *    e.g. Barber 1995, Soil Nutrient Bioavailability, 2nd ed., Wiley (from memory)), never more
 *    than the pool holds;
 * 3. first-order losses acting together over the day on what remains, P:
 *    denitrification kd = kmax x f(saturation) x Q10d^((T - 20)/10), and washout with the water
 *    leaving the profile, kw = (drain + seepage + r x runoff) / W, where W is the mobile water the
 *    pool mixes into (its concentration is P / W x 100 mg/L) and r the runoff extraction ratio.
 *    The exact solution over one day removes P (1 - exp(-(kd + kw))), shared in proportion to
 *    the rates, so the pool never goes negative whatever the flow.
 *
 * The drain-water concentration of the day is drain load / drain flow x 100, the mean
 * concentration of the water that left; on a day without drain flow it is the profile
 * concentration at the start of the loss step (the limit of that mean as the flow goes to 0).
 * The balance start + fertilizer + mineralization = uptake + denitrification + drain, runoff and
 * seepage losses + end is computed and returned each day.
 */
import { TilefluxError } from '../errors.js';
import { saturationFactor } from './denitrification.js';
import { dailyFertilizer } from './fertilizer.js';
import {
  denitrificationTemperatureFactor as denitrificationTemperatureFactorAt,
  q10Factor,
} from './temperature.js';
import type { NitrateInput, NitrateResult, PoolParams } from './types.js';
import { cumulativeUptakeFraction } from './uptake.js';

/** Days per year used to spread the annual mineralization rate (mean Gregorian year). */
const DAYS_PER_YEAR = 365.25;

/** Seasonal uptake of each crop code of the calendar (index 0: bare soil). */
function uptakeByCode(crops: readonly string[], uptakeKgHa: Record<string, number>): number[] {
  const byName = new Map<string, number>();
  for (const [name, v] of Object.entries(uptakeKgHa)) byName.set(name.trim().toLowerCase(), v);
  return [
    0,
    ...crops.map((name) => {
      const v = byName.get(name.trim().toLowerCase());
      if (v === undefined) {
        throw new TilefluxError(
          `no seasonal N uptake given for crop "${name}"; add it (kg N/ha per season), e.g. ` +
            `uptake: { ${name}: 150 }; crops with a value: ${[...byName.keys()].join(', ') || 'none'}`,
          'nitrate.uptake',
        );
      }
      return v;
    }),
  ];
}

/**
 * The terms of the pool model that depend only on the weather, the crop calendar and the
 * parameters, not on the water regime: fertilizer, mineralization and uptake demand per day and
 * the temperature factor of denitrification. Computed once, they serve every design run over the
 * same forcing and calendar (a sweep, a fit); `simulatePool` computes them when not given.
 * Every array is read only once handed out (results share them).
 */
export interface PoolForcing {
  /** Fertilizer and manure N applied, kg N/ha per day. */
  fertilizerKgHa: Float64Array;
  /** Net mineralization, M20 / 365.25 x Q10m^((T - 20)/10), kg N/ha per day. */
  mineralizationKgHa: Float64Array;
  /** Crop demand on the pool before the supply limit P / (P + K), kg N/ha per day. */
  uptakeDemandKgHa: Float64Array;
  /** Temperature factor of denitrification, two-range Q10 (temperature.ts; 0 in frozen soil). */
  denitrificationTemperatureFactor: Float64Array;
}

/**
 * The weather- and calendar-only terms of the pool model for a run.
 *
 * @example const f = poolForcingOf(input, DEFAULT_POOL_PARAMS); simulatePool(input, DEFAULT_POOL_PARAMS, f)
 */
export function poolForcingOf(
  input: Pick<NitrateInput, 'dates' | 'tmeanC' | 'calendar' | 'days'>,
  p: PoolParams,
): PoolForcing {
  const n = input.dates.length;
  const { tmeanC, calendar } = input;
  const uptakeOf = uptakeByCode(calendar.crops, p.uptakeKgHa);
  const mineralizationKgHa = new Float64Array(n);
  const uptakeDemandKgHa = new Float64Array(n);
  const denitrificationTemperatureFactor = new Float64Array(n);
  const m20PerDay = p.mineralizationKgHaPerYear / DAYS_PER_YEAR;
  for (let i = 0; i < n; i++) {
    const t = tmeanC[i];
    mineralizationKgHa[i] = m20PerDay * q10Factor(t, p.mineralizationQ10);
    denitrificationTemperatureFactor[i] = denitrificationTemperatureFactorAt(
      t,
      p.denitrificationQ10,
      p.denitrificationColdQ10 ?? p.denitrificationQ10,
    );
    // Uptake: this day's step along the crop's logistic curve (none on the first day of a run
    // that starts mid-season: that part of the season lies before the run).
    let demand = 0;
    const code = calendar.crop[i];
    const s = calendar.seasonFraction[i];
    if (code !== 0 && s >= 0) {
      const sameSeason =
        i > 0 && calendar.crop[i - 1] === code && calendar.seasonFraction[i - 1] >= 0;
      const sPrev = sameSeason ? calendar.seasonFraction[i - 1] : i === 0 ? s : 0;
      demand =
        uptakeOf[code] *
        (cumulativeUptakeFraction(s, p.uptakeMidpoint, p.uptakeSteepness) -
          cumulativeUptakeFraction(sPrev, p.uptakeMidpoint, p.uptakeSteepness));
      if (demand < 0) demand = 0;
    }
    uptakeDemandKgHa[i] = demand;
  }
  return {
    fertilizerKgHa: dailyFertilizer(input.dates, p.fertilizer, calendar, input.days),
    mineralizationKgHa,
    uptakeDemandKgHa,
    denitrificationTemperatureFactor,
  };
}

/**
 * Run the pool model over the daily series.
 *
 * @param forcing the weather- and calendar-only terms (`poolForcingOf`), when already computed
 * @param reuse an earlier pool result over as many days whose columns are overwritten (every
 *   column is written every day; the forcing columns are shared, not written), as a sweep does
 *   design after design; without it the columns are allocated
 * @example
 * const r = simulatePool(input, DEFAULT_POOL_PARAMS);
 * r.pool.balanceErrorKgHa // ~1e-15 each day
 */
export function simulatePool(
  input: NitrateInput,
  p: PoolParams,
  forcing: PoolForcing = poolForcingOf(input, p),
  reuse?: NitrateResult,
): NitrateResult & { pool: NonNullable<NitrateResult['pool']> } {
  const n = input.dates.length;
  const { drainflowMm, runoffMm, seepageMm, saturatedFraction } = input;
  const W = p.mobileWaterMm;
  const r = p.runoffExtractionRatio;
  const K = p.uptakeHalfSaturationKgHa;
  const { fertilizerKgHa, mineralizationKgHa, uptakeDemandKgHa } = forcing;
  const tempFactor = forcing.denitrificationTemperatureFactor;

  const old = reuse?.pool && reuse.concMgL.length === n ? reuse : undefined;
  const column = (a: Float64Array | undefined) => a ?? new Float64Array(n);
  const concMgL = column(old?.concMgL);
  const loadKgHa = column(old?.loadKgHa);
  const runoffLoadKgHa = column(old?.runoffLoadKgHa);
  const seepageLoadKgHa = column(old?.seepageLoadKgHa);
  const poolKgHa = column(old?.pool?.poolKgHa);
  const profileConcMgL = column(old?.pool?.profileConcMgL);
  const uptakeKgHa = column(old?.pool?.uptakeKgHa);
  const denitrificationKgHa = column(old?.pool?.denitrificationKgHa);
  const balanceErrorKgHa = column(old?.pool?.balanceErrorKgHa);

  let pool = p.initialPoolKgHa;
  for (let i = 0; i < n; i++) {
    const start = pool;
    const mineral = mineralizationKgHa[i];
    pool += fertilizerKgHa[i] + mineral;

    const demand = uptakeDemandKgHa[i];
    const supplied = K > 0 ? (demand * pool) / (pool + K) : demand;
    const uptake = supplied < pool ? supplied : pool;
    pool -= uptake;

    // First-order losses together, exact over the day.
    const kd =
      p.denitrificationMaxPerDay *
      saturationFactor(saturatedFraction[i], p.saturationThreshold, p.saturationExponent) *
      tempFactor[i];
    const qd = drainflowMm[i] > 0 ? drainflowMm[i] : 0;
    const qs = seepageMm[i] > 0 ? seepageMm[i] : 0;
    const qr = runoffMm[i] > 0 ? r * runoffMm[i] : 0;
    const kw = (qd + qs + qr) / W;
    const k = kd + kw;
    const lost = k > 0 ? -pool * Math.expm1(-k) : 0;
    const perK = k > 0 ? lost / k : 0;
    const denit = perK * kd;
    const drainLoss = (perK * qd) / W;
    const seepLoss = (perK * qs) / W;
    const runoffLoss = (perK * qr) / W;
    const startConc = (pool / W) * 100;
    pool -= lost;

    concMgL[i] = qd > 0 ? (drainLoss / qd) * 100 : startConc;
    loadKgHa[i] = drainLoss;
    runoffLoadKgHa[i] = runoffLoss;
    seepageLoadKgHa[i] = seepLoss;
    poolKgHa[i] = pool;
    profileConcMgL[i] = (pool / W) * 100;
    uptakeKgHa[i] = uptake;
    denitrificationKgHa[i] = denit;
    balanceErrorKgHa[i] =
      start +
      fertilizerKgHa[i] +
      mineral -
      (uptake + denit + drainLoss + seepLoss + runoffLoss) -
      pool;
  }
  return {
    concMgL,
    loadKgHa,
    runoffLoadKgHa,
    seepageLoadKgHa,
    outOfRangeDays: 0,
    pool: {
      poolKgHa,
      profileConcMgL,
      fertilizerKgHa,
      mineralizationKgHa,
      uptakeKgHa,
      denitrificationKgHa,
      balanceErrorKgHa,
    },
  };
}
