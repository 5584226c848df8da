/**
 * The trade-off frontier (Pareto set) of designs judged on several aims, each to be made as
 * small as possible: a design is dominated when another is no worse on every aim and better on
 * at least one; the rest are non-dominated. Designs tied on every aim do not dominate one
 * another, so duplicates share the frontier.
 */

/**
 * Which rows are non-dominated (all aims minimised). NaN aims never dominate and are never
 * on the frontier.
 *
 * @example nonDominated([[1, 2], [2, 1], [2, 2]]) // [true, true, false]
 */
export function nonDominated(rows: ReadonlyArray<ArrayLike<number>>): boolean[] {
  const valid = rows.map((r) => Array.prototype.every.call(r, (v: number) => !Number.isNaN(v)));
  return rows.map((a, i) => {
    if (!valid[i]) return false;
    for (let j = 0; j < rows.length; j++) {
      if (j === i || !valid[j]) continue;
      const b = rows[j];
      let noWorse = true;
      let better = false;
      for (let k = 0; k < a.length; k++) {
        if (b[k] > a[k]) {
          noWorse = false;
          break;
        }
        if (b[k] < a[k]) better = true;
      }
      if (noWorse && better) return false;
    }
    return true;
  });
}
