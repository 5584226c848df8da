/**
 * The `seasonal` concentration model: one flow-weighted nitrate-N concentration per calendar
 * month (README, Nitrate models), e.g. from monthly means of drain-water samples.
 */

/**
 * Concentration of each day's drain water from twelve monthly values (January first).
 *
 * @param dates      ISO dates YYYY-MM-DD
 * @param monthlyMgL twelve concentrations, mg N/L, January to December
 * @example seasonalConcentration(['2024-01-31', '2024-02-01'], [10, 11, 12, 13, 14, 15, 16, 15, 14, 13, 12, 11])
 * // Float64Array [10, 11]
 */
export function seasonalConcentration(dates: readonly string[], monthlyMgL: readonly number[]) {
  if (monthlyMgL.length !== 12) {
    throw new RangeError(
      `monthlyMgL needs 12 values (January to December); got ${monthlyMgL.length}`,
    );
  }
  const out = new Float64Array(dates.length);
  for (let i = 0; i < dates.length; i++) {
    // Characters 5-6 of YYYY-MM-DD are the month.
    const month = (dates[i].charCodeAt(5) - 48) * 10 + (dates[i].charCodeAt(6) - 48);
    out[i] = monthlyMgL[month - 1];
  }
  return out;
}
