/**
 * Performance ratings of daily drain flow at field scale: the words hydrologists attach to NSE,
 * PBIAS and R^2, from the criteria of Moriasi et al. (2015), "Hydrologic and water quality
 * models: performance measures and evaluation criteria", Trans. ASABE 58(6), which gives
 * separate bands for field-scale flow. The bands below were recalled without the paper at hand
 * (from memory): check them against its table of recommended criteria before quoting a rating.
 * KGE has no such bands there; it is judged against the mean-flow benchmark of Knoben et al.
 * (2019): KGE above 1 - sqrt(2) (about -0.41) improves on predicting every day with the mean
 * observed flow.
 *
 * Ratings apply to drain flow only; water-table depth has no published bands and is not rated.
 */

export type Rating = 'very good' | 'good' | 'satisfactory' | 'not satisfactory';

/** Lower bounds (exclusive) of very good, good and satisfactory, in that order. */
interface Bands {
  statistic: string;
  /** Rated on the value itself (higher is better) or on its absolute value (lower is better). */
  better: 'higher' | 'closer to 0';
  limits: readonly [number, number, number];
  text: string;
}

/** The bands used (Moriasi et al. 2015, field-scale flow; from memory). */
export const RATING_BANDS: readonly Bands[] = [
  {
    statistic: 'nse',
    better: 'higher',
    limits: [0.7, 0.6, 0.5],
    text: 'very good > 0.70; good 0.60 to 0.70; satisfactory 0.50 to 0.60; not satisfactory <= 0.50',
  },
  {
    statistic: 'r2',
    better: 'higher',
    limits: [0.85, 0.75, 0.6],
    text: 'very good > 0.85; good 0.75 to 0.85; satisfactory 0.60 to 0.75; not satisfactory <= 0.60',
  },
  {
    statistic: 'pbiasPercent',
    better: 'closer to 0',
    limits: [10, 15, 25],
    text: 'very good < +-10 %; good +-10 to +-15 %; satisfactory +-15 to +-25 %; not satisfactory >= +-25 %',
  },
];

/** Source of the bands, as shown in reports. */
export const RATING_SOURCE =
  'Moriasi et al. (2015), Trans. ASABE 58(6), criteria for field-scale flow (bands recalled from memory); ' +
  'KGE against the mean-flow benchmark of Knoben et al. (2019), Hydrol. Earth Syst. Sci. 23';

/** KGE of a simulation that predicts the mean observed flow every day (Knoben et al. 2019). */
export const KGE_MEAN_BENCHMARK = 1 - Math.SQRT2;

/**
 * The rating of a statistic, or null when it has no bands or no value.
 * @example rate('nse', 0.66) // 'good'
 */
export function rate(statistic: string, value: number | null): Rating | null {
  const b = RATING_BANDS.find((x) => x.statistic === statistic);
  if (!b || value === null || !Number.isFinite(value)) return null;
  const [vg, g, s] = b.limits;
  if (b.better === 'higher') {
    return value > vg
      ? 'very good'
      : value > g
        ? 'good'
        : value > s
          ? 'satisfactory'
          : 'not satisfactory';
  }
  const a = Math.abs(value);
  return a < vg ? 'very good' : a < g ? 'good' : a < s ? 'satisfactory' : 'not satisfactory';
}

/**
 * Whether KGE improves on the mean-flow benchmark (Knoben et al. 2019); null without a value.
 * @example kgeVerdict(0.2) // 'better than the mean-flow benchmark'
 */
export function kgeVerdict(value: number | null): string | null {
  if (value === null || !Number.isFinite(value)) return null;
  return value > KGE_MEAN_BENCHMARK
    ? 'better than the mean-flow benchmark'
    : 'no better than the mean-flow benchmark';
}
