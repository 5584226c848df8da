import { describe, expect, it } from 'vitest';
import {
  BAND_COLUMNS,
  COMPARISON_COLUMNS,
  compareScenarios,
  pipeLengthPerHectare,
  withSeepageBand,
} from '../../src/scenarios/compare.js';
import type { AnnualRow } from '../../src/scenarios/types.js';
import { TilefluxError } from '../../src/errors.js';

/** A hand-made annual row; fields a test does not care about are fixed. */
function row(scenario: string, year: number, v: Partial<AnnualRow>): AnnualRow {
  return {
    scenario,
    year,
    days: 365,
    precip_mm: 0,
    snowmelt_mm: 0,
    ref_et_mm: 700,
    et_mm: 0,
    runoff_mm: 0,
    drainflow_mm: 0,
    seepage_mm: 0,
    storage_change_mm: 0,
    balance_error_mm: 0,
    wt_mean_depth_m: 0,
    wt_shallowest_depth_m: 0.2,
    wet_days: 0,
    aeration_stress_days: 0,
    aeration_deficit_days: 0,
    spring_fieldwork_days: 0,
    spring_window_days: 47,
    fall_fieldwork_days: 0,
    fall_window_days: 57,
    stress_days: 0,
    no3n_load_kg_ha: 0,
    fwmc_mg_l: 0,
    runoff_n_kg_ha: 0,
    seepage_n_kg_ha: 0,
    n_balance_error_kg_ha: 0,
    ...v,
  };
}

// Three invented years for two scenarios, deliberately listed out of order and mixed. The annual
// fwmc_mg_l values are deliberately wrong (99) so that a mean of annual concentrations instead of
// the period flow-weighted one would be caught.
const annual: AnnualRow[] = [
  row('controlled', 2002, {
    precip_mm: 800,
    drainflow_mm: 150,
    no3n_load_kg_ha: 3.0,
    fwmc_mg_l: 99,
    runoff_mm: 16,
    et_mm: 570,
    seepage_mm: 15,
    wet_days: 6,
    aeration_deficit_days: 10,
    spring_fieldwork_days: 31,
    fall_fieldwork_days: 41,
    stress_days: 4,
    wt_mean_depth_m: 1.0,
    runoff_n_kg_ha: 0.4,
    seepage_n_kg_ha: 0.2,
  }),
  row('conventional', 2001, {
    precip_mm: 900,
    drainflow_mm: 300,
    no3n_load_kg_ha: 9.0,
    fwmc_mg_l: 99,
    runoff_mm: 20,
    et_mm: 550,
    seepage_mm: 10,
    wet_days: 5,
    aeration_deficit_days: 12,
    spring_fieldwork_days: 30,
    fall_fieldwork_days: 40,
    stress_days: 3,
    wt_mean_depth_m: 1.1,
    runoff_n_kg_ha: 0.5,
    seepage_n_kg_ha: 0.1,
  }),
  row('conventional', 2003, {
    precip_mm: 850,
    drainflow_mm: 250,
    no3n_load_kg_ha: 8.0,
    fwmc_mg_l: 99,
    runoff_mm: 30,
    et_mm: 540,
    seepage_mm: 8,
    wet_days: 7,
    aeration_deficit_days: 15,
    spring_fieldwork_days: 28,
    fall_fieldwork_days: 38,
    stress_days: 1,
    wt_mean_depth_m: 1.0,
    runoff_n_kg_ha: 0.6,
    seepage_n_kg_ha: 0.1,
  }),
  row('controlled', 2001, {
    precip_mm: 900,
    drainflow_mm: 210,
    no3n_load_kg_ha: 6.3,
    fwmc_mg_l: 99,
    runoff_mm: 30,
    et_mm: 560,
    seepage_mm: 14,
    wet_days: 8,
    aeration_deficit_days: 20,
    spring_fieldwork_days: 27,
    fall_fieldwork_days: 38,
    stress_days: 2,
    wt_mean_depth_m: 0.9,
    runoff_n_kg_ha: 0.7,
    seepage_n_kg_ha: 0.2,
  }),
  row('conventional', 2002, {
    precip_mm: 800,
    drainflow_mm: 200,
    no3n_load_kg_ha: 5.0,
    fwmc_mg_l: 99,
    runoff_mm: 10,
    et_mm: 560,
    seepage_mm: 12,
    wet_days: 3,
    aeration_deficit_days: 6,
    spring_fieldwork_days: 34,
    fall_fieldwork_days: 42,
    stress_days: 5,
    wt_mean_depth_m: 1.2,
    runoff_n_kg_ha: 0.4,
    seepage_n_kg_ha: 0.1,
  }),
  row('controlled', 2003, {
    precip_mm: 850,
    drainflow_mm: 165,
    no3n_load_kg_ha: 5.7,
    fwmc_mg_l: 99,
    runoff_mm: 44,
    et_mm: 548,
    seepage_mm: 13,
    wet_days: 10,
    aeration_deficit_days: 24,
    spring_fieldwork_days: 26,
    fall_fieldwork_days: 35,
    stress_days: 0,
    wt_mean_depth_m: 0.8,
    runoff_n_kg_ha: 0.5,
    seepage_n_kg_ha: 0.2,
  }),
  // A scenario that is not asked for: ignored.
  row('other', 2001, { drainflow_mm: 1e6 }),
];

const opts = {
  baseline: 'conventional',
  scenarios: [
    { name: 'conventional', spacingM: 20 },
    { name: 'controlled', spacingM: 12.5 },
  ],
};

describe('compareScenarios', () => {
  // Compared inside each test: a comparison made in the describe body would run before any test,
  // and mutation testing could then tell no test from another.
  const compared = () => compareScenarios(annual, opts);

  it('keeps the order of the scenarios and marks the baseline', () => {
    const [conv, ctrl] = compared();
    expect(conv.scenario).toBe('conventional');
    expect(conv.is_baseline).toBe(true);
    expect(ctrl.scenario).toBe('controlled');
    expect(ctrl.is_baseline).toBe(false);
    expect(conv.years).toBe(3);
  });

  // Expected values are the arithmetic means of the table above, worked by hand.
  it('averages every measure over the years', () => {
    const [conv, ctrl] = compared();
    const tol = 9; // decimal places
    expect(conv.precip_mm).toBeCloseTo(850, tol); // (900+800+850)/3
    expect(conv.drainflow_mm).toBeCloseTo(250, tol); // (300+200+250)/3
    expect(conv.no3n_load_kg_ha).toBeCloseTo(22 / 3, tol); // (9+5+8)/3
    expect(conv.runoff_mm).toBeCloseTo(20, tol);
    expect(conv.et_mm).toBeCloseTo(550, tol);
    expect(conv.seepage_mm).toBeCloseTo(10, tol);
    expect(conv.wet_days).toBeCloseTo(5, tol);
    expect(conv.aeration_deficit_days).toBeCloseTo(11, tol); // (12+6+15)/3
    expect(conv.spring_fieldwork_days).toBeCloseTo(92 / 3, tol);
    expect(conv.fall_fieldwork_days).toBeCloseTo(40, tol);
    expect(conv.stress_days).toBeCloseTo(3, tol);
    expect(conv.spring_window_days).toBe(47); // the same window every year
    expect(conv.fall_window_days).toBe(57);
    expect(conv.wt_mean_depth_m).toBeCloseTo(1.1, tol);
    expect(conv.runoff_n_kg_ha).toBeCloseTo(0.5, tol);
    expect(conv.seepage_n_kg_ha).toBeCloseTo(0.1, tol);

    expect(ctrl.drainflow_mm).toBeCloseTo(175, tol); // (210+150+165)/3
    expect(ctrl.no3n_load_kg_ha).toBeCloseTo(5, tol); // (6.3+3.0+5.7)/3
    expect(ctrl.runoff_mm).toBeCloseTo(30, tol); // (30+16+44)/3
    expect(ctrl.et_mm).toBeCloseTo(1678 / 3, tol);
    expect(ctrl.seepage_mm).toBeCloseTo(14, tol);
    expect(ctrl.wet_days).toBeCloseTo(8, tol);
    expect(ctrl.aeration_deficit_days).toBeCloseTo(18, tol);
    expect(ctrl.spring_fieldwork_days).toBeCloseTo(28, tol);
    expect(ctrl.fall_fieldwork_days).toBeCloseTo(38, tol);
    expect(ctrl.stress_days).toBeCloseTo(2, tol);
    expect(ctrl.wt_mean_depth_m).toBeCloseTo(0.9, tol);
  });

  // Flow-weighted mean concentration over the period: C = 100 * sum(load) / sum(flow), from
  // load (kg/ha) = flow (mm) x C (mg/L) / 100 (1 mm over 1 ha = 10 m3; 10 m3 x 1 g/m3 = 0.01 kg).
  it('weights the concentration by flow over the whole period', () => {
    const [conv, ctrl] = compared();
    expect(conv.fwmc_mg_l).toBeCloseTo((100 * 22) / 750, 9); // 2.9333
    expect(ctrl.fwmc_mg_l).toBeCloseTo((100 * 15) / 525, 9); // 2.8571
  });

  it('gives lateral pipe length per hectare from the spacing', () => {
    const [conv, ctrl] = compared();
    // 1 ha = 10 000 m2 drained by strips 20 m wide: 500 m of lateral (plain geometry).
    expect(conv.pipe_length_m_ha).toBeCloseTo(500, 9);
    expect(ctrl.pipe_length_m_ha).toBeCloseTo(800, 9);
    expect(pipeLengthPerHectare(25)).toBeCloseTo(400, 9);
    expect(ctrl.pipe_length_change_m_ha).toBeCloseTo(300, 9);
    expect(ctrl.pipe_length_change_percent).toBeCloseTo(60, 9);
  });

  it('gives the change against the baseline, absolute and percent', () => {
    const [conv, ctrl] = compared();
    expect(ctrl.drainflow_change_mm).toBeCloseTo(-75, 9);
    expect(ctrl.drainflow_change_percent).toBeCloseTo(-30, 9);
    expect(ctrl.no3n_load_change_kg_ha).toBeCloseTo(5 - 22 / 3, 9);
    expect(ctrl.no3n_load_change_percent).toBeCloseTo(-31.818181818, 6); // -7/22
    expect(ctrl.runoff_change_mm).toBeCloseTo(10, 9);
    expect(ctrl.runoff_change_percent).toBeCloseTo(50, 9);
    expect(ctrl.wet_change_days).toBeCloseTo(3, 9);
    expect(ctrl.wet_change_percent).toBeCloseTo(60, 9);
    expect(ctrl.fwmc_change_mg_l).toBeCloseTo(1500 / 525 - 2200 / 750, 9);
    expect(ctrl.fwmc_change_percent).toBeCloseTo(-2.5974026, 6); // (2.857143/2.933333 - 1) x 100
    expect(ctrl.aeration_deficit_change_days).toBeCloseTo(7, 9);
    expect(ctrl.spring_fieldwork_change_days).toBeCloseTo(28 - 92 / 3, 9);
    expect(ctrl.wt_mean_depth_change_m).toBeCloseTo(-0.2, 9);
    expect(conv.drainflow_change_mm).toBe(0);
    expect(conv.drainflow_change_percent).toBe(0);
  });

  it('gives the spread of annual flow and load across years', () => {
    const [conv, ctrl] = compared();
    expect(ctrl.drainflow_min_mm).toBe(150);
    expect(ctrl.drainflow_median_mm).toBe(165);
    expect(ctrl.drainflow_max_mm).toBe(210);
    expect(ctrl.no3n_load_min_kg_ha).toBe(3.0);
    expect(ctrl.no3n_load_median_kg_ha).toBe(5.7);
    expect(ctrl.no3n_load_max_kg_ha).toBe(6.3);
    expect(conv.drainflow_median_mm).toBe(250);
  });

  it('splits the load change into flow and concentration parts that add up to it', () => {
    const [conv, ctrl] = compared();
    // L = Q C / 100; symmetric split: flow part dQ (C0 + C1) / 200, concentration part
    // dC (Q0 + Q1) / 200 (a standard identity for the change of a product).
    const dQ = ctrl.drainflow_mm - conv.drainflow_mm;
    const c0 = conv.fwmc_mg_l!;
    const c1 = ctrl.fwmc_mg_l!;
    const flow = (dQ * (c0 + c1)) / 200;
    const conc = ((c1 - c0) * (conv.drainflow_mm + ctrl.drainflow_mm)) / 200;
    expect(ctrl.no3n_load_change_flow_part_kg_ha).toBeCloseTo(flow, 12);
    expect(ctrl.no3n_load_change_conc_part_kg_ha).toBeCloseTo(conc, 12);
    expect(flow + conc).toBeCloseTo(ctrl.no3n_load_change_kg_ha, 10);
    expect(
      ctrl.no3n_load_change_flow_part_percent! + ctrl.no3n_load_change_conc_part_percent!,
    ).toBeCloseTo(ctrl.no3n_load_change_percent!, 10);
    expect(conv.no3n_load_change_flow_part_kg_ha).toBe(0);
  });

  it('puts the low and high seepage changes beside every change column', () => {
    const [conv, ctrl] = compared();
    const lower = annual.map((r) =>
      r.scenario === 'controlled' ? { ...r, drainflow_mm: r.drainflow_mm * 0.9 } : r,
    );
    const band = withSeepageBand([conv, ctrl], compareScenarios(lower, opts), [conv, ctrl]);
    const lowRow = compareScenarios(lower, opts)[1];
    expect(band[1].drainflow_change_percent_low).toBe(lowRow.drainflow_change_percent);
    expect(band[1].drainflow_change_percent_high).toBe(ctrl.drainflow_change_percent);
    for (const c of BAND_COLUMNS) expect(c in band[1]).toBe(true);
    expect(BAND_COLUMNS).toContain('no3n_load_change_conc_part_percent_low');
    expect(BAND_COLUMNS.some((c) => c.startsWith('pipe_length'))).toBe(false);
  });

  it('has exactly the documented columns, in order, and is deterministic', () => {
    const [conv, ctrl] = compared();
    expect(Object.keys(conv)).toEqual(COMPARISON_COLUMNS);
    expect(new Set(COMPARISON_COLUMNS).size).toBe(COMPARISON_COLUMNS.length);
    for (const c of COMPARISON_COLUMNS) {
      if (c === 'scenario' || c === 'is_baseline') continue;
      expect(c, 'numeric columns end with a unit').toMatch(
        /_(mm|kg_ha|mg_l|days|m|m_ha|percent)$|^years$/,
      );
    }
    const again = compareScenarios([...annual].reverse(), opts);
    expect(JSON.stringify(again)).toBe(JSON.stringify([conv, ctrl]));
  });

  it('gives null percentages where the baseline is zero', () => {
    const dry = [row('a', 2001, { drainflow_mm: 0 }), row('b', 2001, { drainflow_mm: 10 })];
    const [a, b] = compareScenarios(dry, {
      baseline: 'a',
      scenarios: [
        { name: 'a', spacingM: 20 },
        { name: 'b', spacingM: 20 },
      ],
    });
    expect(a.fwmc_mg_l).toBeNull();
    expect(b.drainflow_change_mm).toBe(10);
    expect(b.drainflow_change_percent).toBeNull();
    expect(b.wet_change_percent).toBeNull();
    expect(b.fwmc_change_mg_l).toBeNull();
  });

  it('rejects an unknown baseline, missing or mismatched years and bad spacing', () => {
    expect(() => compareScenarios(annual, { ...opts, baseline: 'nope' })).toThrow(TilefluxError);
    expect(() => compareScenarios(annual, { ...opts, baseline: 'nope' })).toThrow(
      /baseline "nope"/,
    );
    const short = annual.filter((r) => !(r.scenario === 'controlled' && r.year === 2003));
    expect(() => compareScenarios(short, opts)).toThrow(/same weather/);
    expect(() =>
      compareScenarios(annual, {
        ...opts,
        scenarios: [...opts.scenarios, { name: 'x', spacingM: 9 }],
      }),
    ).toThrow(/no rows/);
    expect(() =>
      compareScenarios(annual, {
        ...opts,
        scenarios: [{ name: 'conventional', spacingM: 0 }],
      }),
    ).toThrow(/positive length/);
    expect(() => compareScenarios([...annual, annual[1]], opts)).toThrow(/year twice/);
  });

  it('says exactly what is wrong with the scenarios it is given', () => {
    const two = (a: string, b: string) => ({
      baseline: a,
      scenarios: [
        { name: a, spacingM: 20 },
        { name: b, spacingM: 20 },
      ],
    });
    expect(() => compareScenarios(annual, { baseline: 'a', scenarios: [] })).toThrow(
      'comparison: no scenarios to compare',
    );
    expect(() => compareScenarios(annual, two('conventional', 'conventional'))).toThrow(
      'comparison: scenario names must be unique (got conventional, conventional)',
    );
    expect(() => compareScenarios(annual, { ...opts, baseline: 'nope' })).toThrow(
      'comparison: baseline "nope" is not one of the scenarios (conventional, controlled)',
    );
    const short = annual.filter((r) => !(r.scenario === 'controlled' && r.year === 2003));
    expect(() => compareScenarios(short, opts)).toThrow(
      'comparison: scenario "controlled" covers years 2001-2002 (2), unlike "conventional"; ' +
        'every scenario must run over the same weather',
    );
    expect(() => compareScenarios(annual, two('conventional', 'x'))).toThrow(
      'comparison: scenario "x" has no rows in the annual table',
    );
    expect(() => compareScenarios([...annual, annual[1]], opts)).toThrow(
      'comparison: scenario "conventional" has a year twice in the annual table',
    );
    for (const bad of [NaN, -5, Infinity]) {
      expect(() =>
        compareScenarios(annual, { ...opts, scenarios: [{ name: 'conventional', spacingM: bad }] }),
      ).toThrow(
        `comparison: spacing of scenario "conventional" must be a positive length in m (got ${bad})`,
      );
    }
  });

  it('load parts: null without baseline flow, null percentages without baseline load', () => {
    const scen = {
      baseline: 'a',
      scenarios: [
        { name: 'a', spacingM: 20 },
        { name: 'b', spacingM: 20 },
      ],
    };
    const dry = [row('a', 2001, {}), row('b', 2001, { drainflow_mm: 10, no3n_load_kg_ha: 1 })];
    const [, b] = compareScenarios(dry, scen);
    expect(b.no3n_load_change_flow_part_kg_ha).toBeNull();
    expect(b.no3n_load_change_conc_part_percent).toBeNull();
    // Baseline with flow but no load: C0 = 0, so the parts exist but have no percentage.
    const clean = [
      row('a', 2001, { drainflow_mm: 10 }),
      row('b', 2001, { drainflow_mm: 20, no3n_load_kg_ha: 2 }),
    ];
    const [, c] = compareScenarios(clean, scen);
    // Q0 = 10, Q1 = 20, C0 = 0, C1 = 100 x 2 / 20 = 10: flow part 10 x 10 / 200 = 0.5,
    // concentration part 10 x 30 / 200 = 1.5, together the 2 kg/ha change.
    expect(c.no3n_load_change_flow_part_kg_ha).toBeCloseTo(0.5, 12);
    expect(c.no3n_load_change_conc_part_kg_ha).toBeCloseTo(1.5, 12);
    expect(c.no3n_load_change_flow_part_percent).toBeNull();
    expect(c.no3n_load_change_conc_part_percent).toBeNull();
    expect(c.no3n_load_change_percent).toBeNull();
  });

  it('a scenario missing from a seepage run gets null band values', () => {
    const [conv, ctrl] = compared();
    const band = withSeepageBand([conv, ctrl], [conv], []);
    expect(band[0].drainflow_change_percent_low).toBe(0);
    expect(band[1].drainflow_change_percent_low).toBeNull();
    expect(band[1].drainflow_change_percent_high).toBeNull();
    expect(band[1].drainflow_change_percent).toBe(ctrl.drainflow_change_percent);
  });
});
