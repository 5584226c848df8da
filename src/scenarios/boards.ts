/**
 * The outlet schedule as an owner works it: dates and levels, and, when the control structure's
 * board height is known, how many stop-log boards stand in the structure and how many to add or
 * take out on each date.
 *
 * Boards stack up from the invert of the outlet pipe, which sits at drain depth, so a free outlet
 * is no boards and a level `d` below the surface needs (drain depth - d) / board height boards
 * (common practice for inline water-control structures). Levels that are not a whole number of
 * boards are rounded to the nearest board, and the level those boards give is stated beside it.
 */
import { stepKey, type OutletStep } from '../engine/outletSchedule.js';

/** One row of the board table: a schedule step and what it means in the structure. */
export interface BoardRow {
  /** "MM-DD" (every year) or "YYYY-MM-DD" (once). */
  from: string;
  /** Outlet level asked for, m below the surface; null = free. */
  levelM: number | null;
  /** Boards standing from this date (null without a board height). */
  boards: number | null;
  /** Boards to add (positive) or take out (negative) on this date (null without a board height). */
  change: number | null;
  /** The level the boards give, m below the surface (the drain depth when there are none). */
  boardLevelM: number | null;
}

/**
 * The board table of a schedule, in the order the steps are given. The change of a step is
 * against the step in force just before its date: for a yearly schedule the previous step of
 * the year, wrapping round to the last one; for a dated list the previous date, and a free
 * outlet before the first.
 *
 * @example boardTable([{ from: '10-25', depthM: 0.3 }, { from: '04-05', depthM: null }], 1.2, 0.15)
 *   // [{ from: '10-25', levelM: 0.3, boards: 6, change: 6, boardLevelM: 0.3 },
 *   //  { from: '04-05', levelM: null, boards: 0, change: -6, boardLevelM: 1.2 }]
 */
export function boardTable(
  steps: readonly OutletStep[],
  drainDepthM: number,
  boardHeightM?: number,
): BoardRow[] {
  const boardsOf = (levelM: number | null): number | null => {
    if (boardHeightM === undefined) return null;
    if (levelM === null || levelM >= drainDepthM) return 0;
    return Math.round((drainDepthM - levelM) / boardHeightM);
  };
  const sorted = [...steps].sort((a, b) => stepKey(a.from) - stepKey(b.from));
  const yearly = steps[0]?.from.length === 5;
  return steps.map((s) => {
    const at = sorted.indexOf(s);
    const before = at > 0 ? sorted[at - 1] : yearly ? sorted[sorted.length - 1] : undefined;
    const boards = boardsOf(s.depthM);
    const previous = before === undefined ? 0 : boardsOf(before.depthM);
    return {
      from: s.from,
      levelM: s.depthM,
      boards,
      change: boards === null || previous === null ? null : boards - previous,
      boardLevelM: boards === null ? null : drainDepthM - boards * boardHeightM!,
    };
  });
}
