/**
 * What the whole-period charts (cumulative, monthly, concentration, duration) read from one
 * scenario's daily series, computed in one pass: thinned cumulative sums, monthly sums and the
 * points of the growing-season duration curve. A long record's report keeps these instead of
 * every scenario's daily columns. Pure.
 */
import { inWindow } from '../scenarios/annual.js';
import type { ScenarioDailySeries, ScenarioPeriodSeries } from './types.js';

/** Cumulative points: weekly or coarser, at most about this many per scenario (and the last day). */
const CUMULATIVE_POINTS = 520;
/** Points of a duration curve: at most this many per scenario. */
const DURATION_POINTS = 200;

/** Month index 0-11 of an ISO date. */
export function monthOf(iso: string): number {
  return (iso.charCodeAt(5) - 48) * 10 + (iso.charCodeAt(6) - 48) - 1;
}

/**
 * Indices of the days of `dates` inside the growing season (MM-DD window), for `periodSeriesOf`.
 * @example seasonDays(['2001-03-31', '2001-04-01'], { from: '04-01', to: '10-31' }) // [1]
 */
export function seasonDays(
  dates: readonly string[],
  season: { from: string; to: string },
): number[] {
  const inSeason: number[] = [];
  for (let i = 0; i < dates.length; i++)
    if (inWindow(dates[i].slice(5, 10), season)) inSeason.push(i);
  return inSeason;
}

/**
 * The whole-period series of one scenario: cumulative drain flow and load at every `step`-th day
 * (step = max(7, ceil(days / 520))) and the last; drain flow and load summed by calendar month
 * with the number of (year, month) pairs; and the empirical distribution of the water-table
 * depth over the growing-season days (`inSeason`, from `seasonDays`) thinned to about 200 points,
 * each at the last of equal depths so its count is exactly the days no deeper than it.
 *
 * @example periodSeriesOf('a', dates, series, seasonDays(dates, season)).monthly.count.length // 12
 */
export function periodSeriesOf(
  scenario: string,
  dates: readonly string[],
  s: Pick<ScenarioDailySeries, 'drainflowMm' | 'no3LoadKgHa' | 'waterTableDepthM'>,
  inSeason: readonly number[],
): ScenarioPeriodSeries {
  const n = dates.length;
  const step = Math.max(7, Math.ceil(n / CUMULATIVE_POINTS));
  const cumulative = { dates: [] as string[], flowMm: [] as number[], loadKgHa: [] as number[] };
  const flowByMonth = new Float64Array(12);
  const loadByMonth = new Float64Array(12);
  const count = new Array<number>(12).fill(0);
  let flow = 0;
  let load = 0;
  let previous = -1;
  for (let i = 0; i < n; i++) {
    flow += s.drainflowMm[i];
    load += s.no3LoadKgHa[i];
    if (i % step === 0 || i === n - 1) {
      cumulative.dates.push(dates[i]);
      cumulative.flowMm.push(flow);
      cumulative.loadKgHa.push(load);
    }
    const m = monthOf(dates[i]);
    flowByMonth[m] += s.drainflowMm[i];
    loadByMonth[m] += s.no3LoadKgHa[i];
    // Dates are consecutive: a new (year, month) pair starts whenever the month changes.
    if (m !== previous) count[m]++;
    previous = m;
  }
  const seasonDaysCount = inSeason.length;
  const sorted = Float64Array.from(inSeason, (i) => s.waterTableDepthM[i]).sort();
  const duration = { depthM: [] as number[], days: [] as number[], seasonDays: seasonDaysCount };
  let last = -1;
  for (let k = 1; k <= DURATION_POINTS && seasonDaysCount > 0; k++) {
    let idx = Math.ceil((k / DURATION_POINTS) * seasonDaysCount) - 1;
    while (idx + 1 < seasonDaysCount && sorted[idx + 1] === sorted[idx]) idx++;
    if (idx === last) continue;
    last = idx;
    duration.depthM.push(sorted[idx]);
    duration.days.push(idx + 1);
  }
  return {
    scenario,
    days: n,
    cumulative,
    monthly: { flow: flowByMonth, load: loadByMonth, count },
    duration,
  };
}
