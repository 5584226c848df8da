import { describe, expect, it } from 'vitest';
import { boardTable } from '../../src/scenarios/boards.js';

// Boards stack up from the outlet pipe at drain depth (common practice for inline water-control
// structures); 6 in = 0.1524 m exactly. Counts below are worked by hand.
const SIX_IN = 0.1524;
const YEARLY = [
  { from: '10-25', depthM: 0.15 },
  { from: '04-05', depthM: null },
  { from: '06-01', depthM: 0.5 },
  { from: '09-10', depthM: null },
];

describe('the outlet schedule in boards', () => {
  it('a yearly schedule in 6 in boards under 1.1 m drains, the first step against the last', () => {
    const t = boardTable(YEARLY, 1.1, SIX_IN);
    // 10-25: (1.1 - 0.15) / 0.1524 = 6.23 -> 6 boards, outlet at 1.1 - 6 x 0.1524 = 0.1856 m;
    // the step before it in the year is 09-10 (free), so 6 are added.
    expect(t[0]).toMatchObject({ from: '10-25', boards: 6, change: 6 });
    expect(t[0].boardLevelM).toBeCloseTo(0.1856, 10);
    expect(t[1]).toMatchObject({ from: '04-05', boards: 0, change: -6, boardLevelM: 1.1 });
    // 06-01: (1.1 - 0.5) / 0.1524 = 3.94 -> 4 boards, outlet at 0.4904 m.
    expect(t[2]).toMatchObject({ from: '06-01', boards: 4, change: 4 });
    expect(t[2].boardLevelM).toBeCloseTo(0.4904, 10);
    expect(t[3]).toMatchObject({ from: '09-10', boards: 0, change: -4 });
  });

  it('the order given does not change the counts; changes follow the calendar', () => {
    const shuffled = [YEARLY[2], YEARLY[0], YEARLY[3], YEARLY[1]];
    const byDate = Object.fromEntries(boardTable(shuffled, 1.1, SIX_IN).map((r) => [r.from, r]));
    expect(byDate['06-01'].change).toBe(4); // after 04-05, free
    expect(byDate['10-25'].change).toBe(6); // after 09-10, free
  });

  it('a dated list starts from a free outlet; a level at or below the drains is no boards', () => {
    const t = boardTable(
      [
        { from: '2015-11-01', depthM: 0.3 },
        { from: '2016-04-01', depthM: 1.5 },
      ],
      1.2,
      0.15,
    );
    // (1.2 - 0.3) / 0.15 = 6 boards exactly, added to a free outlet.
    expect(t[0]).toMatchObject({ boards: 6, change: 6 });
    expect(t[0].boardLevelM).toBeCloseTo(0.3, 12);
    expect(t[1]).toMatchObject({ boards: 0, change: -6, boardLevelM: 1.2 });
  });

  it('without a board height: levels only', () => {
    for (const r of boardTable(YEARLY, 1.1)) {
      expect(r).toMatchObject({ boards: null, change: null, boardLevelM: null });
    }
  });
});
