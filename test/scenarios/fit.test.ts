import { describe, expect, it } from 'vitest';
import { parseField } from '../../src/io/field.js';
import { calibrationLoss, fitField, type FitResult } from '../../src/scenarios/fit.js';
import { buildFitProblem, parsePeriod } from '../../src/scenarios/fitProblem.js';
import { fitStatistics, pairsOf } from '../../src/scenarios/fitStatistics.js';
import { localRunner } from '../../src/scenarios/optimise.js';
import { newYork, START, TRUTH, twinFieldText, twinObservations } from './twin.js';

// Twin experiments on the New York record (see twin.ts): the known parameters are TRUTH, the
// field file the fit starts from has the values START.
const weather = newYork();
const fieldText = twinFieldText;
const start = parseField(
  fieldText(START.k, START.porosity, START.seepageConductance, START.capacity),
  'start.yaml',
).base;
const twin = twinObservations(weather);

async function fit(
  observed: Parameters<typeof buildFitProblem>[0]['observed'],
  extra: Partial<Parameters<typeof buildFitProblem>[0]> = {},
): Promise<FitResult> {
  const problem = buildFitProblem({ base: start, weather, observed, objective: 'kge', ...extra });
  return fitField(problem, localRunner(calibrationLoss(problem)), {
    seed: 1,
    behaviouralTolerance: 0.05,
  });
}

const within = (x: number, target: number, fraction: number) =>
  expect(Math.abs(x / target - 1)).toBeLessThan(fraction);

describe('twin experiment on the New York record', () => {
  const obs = twin;

  it('daily flow alone: the four drain-side parameters within 10 %, calibration NSE > 0.9', async () => {
    const r = await fit({ dates: obs.dates, drainflowMm: obs.drainflowMm });
    const best = Object.fromEntries(r.parameters.map((p) => [p.path, p.best]));
    within(best['soil.conductivity'], TRUTH.k, 0.1);
    within(best['soil.drainablePorosity'], TRUTH.porosity, 0.1);
    within(best['soil.seepageConductance'], TRUTH.seepageConductance, 0.1);
    within(best['drains.capacity'], TRUTH.capacity, 0.1);
    expect(r.calibration.drainflow!.nse).toBeGreaterThan(0.9);
    // The default calibration period: the observations after the one-year warm-up (2012).
    expect([r.calibration.from, r.calibration.to]).toEqual(['2013-01-01', '2015-12-31']);
    expect(r.calibration.drainflow!.n).toBe(1095);
    expect(r.validation).toBeNull();
    // The search improved on the start; the best set lies in its own behavioural range.
    expect(r.bestLoss).toBeLessThan(r.startLoss);
    for (const p of r.parameters) {
      expect(p.behavioural[0]).toBeLessThanOrEqual(p.best);
      expect(p.behavioural[1]).toBeGreaterThanOrEqual(p.best);
    }
    expect(r.fitted.soil.conductivity).toBe(best['soil.conductivity']);
  });

  it('water-table depths alone: the drainable porosity within 10 %', async () => {
    const r = await fit({ dates: obs.dates, waterTableDepthM: obs.waterTableDepthM });
    const porosity = r.parameters.find((p) => p.path === 'soil.drainablePorosity')!;
    within(porosity.best, TRUTH.porosity, 0.1);
    expect(r.calibration.waterTable!.nse).toBeGreaterThan(0.9);
    expect(r.calibration.drainflow).toBeUndefined();
  });

  it('the same seed gives the same fit', async () => {
    const a = await fit(
      { dates: obs.dates, drainflowMm: obs.drainflowMm },
      {
        paths: ['soil.conductivity', 'drains.capacity'],
      },
    );
    const b = await fit(
      { dates: obs.dates, drainflowMm: obs.drainflowMm },
      {
        paths: ['soil.conductivity', 'drains.capacity'],
      },
    );
    expect(b.parameters).toEqual(a.parameters);
    expect(b.modelRuns).toBe(a.modelRuns);
  });
});

describe('split-sample test', () => {
  const obs = twin;

  it('validation statistics come from the validation period alone', async () => {
    const paths = ['soil.conductivity', 'soil.seepageConductance'];
    const calibrate = parsePeriod('2013-01-01..2014-12-31', 'calibrate');
    const validate = parsePeriod('2015-01-01..2015-12-31', 'validate');
    const r = await fit(
      { dates: obs.dates, drainflowMm: obs.drainflowMm },
      {
        paths,
        calibrate,
        validate,
      },
    );
    expect([r.calibration.from, r.calibration.to]).toEqual(['2013-01-01', '2014-12-31']);
    expect([r.validation!.from, r.validation!.to]).toEqual(['2015-01-01', '2015-12-31']);
    expect(r.calibration.drainflow!.n).toBe(730);
    expect(r.validation!.drainflow!.n).toBe(365);
    // Recomputed here from the 2015 days of the observations and the best run.
    const dates = r.bestRun.dates;
    const i0 = dates.indexOf('2015-01-01');
    const j0 = obs.dates.indexOf('2015-01-01');
    const own = fitStatistics(
      pairsOf(obs.drainflowMm.slice(j0, j0 + 365), r.bestRun.drainflowMm.slice(i0, i0 + 365)),
    );
    expect(r.validation!.drainflow).toEqual(own);
    // Spoiling every observation outside 2015 changes nothing in the validation statistics of
    // the same parameter set.
    const spoiled = obs.drainflowMm.map((q, i) => (obs.dates[i] < '2015-01-01' ? q * 3 : q));
    const problem = buildFitProblem({
      base: start,
      weather,
      observed: { dates: obs.dates, drainflowMm: spoiled },
      objective: 'kge',
      paths,
      calibrate,
      validate,
    });
    const again = fitStatistics(
      pairsOf(problem.observed.drainflowMm!, r.bestRun.drainflowMm, problem.validation),
    );
    expect(again).toEqual(r.validation!.drainflow);
  });

  it('overlapping periods and periods in the warm-up are refused', () => {
    const base = { base: start, weather, observed: obs, objective: 'kge' as const };
    expect(() =>
      buildFitProblem({
        ...base,
        calibrate: ['2013-01-01', '2014-06-30'],
        validate: ['2014-01-01', '2015-12-31'],
      }),
    ).toThrow(/overlap; a split-sample test needs separate periods/);
    expect(() => buildFitProblem({ ...base, calibrate: ['2012-03-01', '2013-12-31'] })).toThrow(
      /calibrate starts 2012-03-01, but the model first runs 1 warm-up year on the weather from 2012-01-01: start on 2013-01-01 or later/,
    );
    expect(() => parsePeriod('2015-01-01..2014-01-01', 'validate')).toThrow(
      /^validate expects FROM..TO/,
    );
  });
});

describe('refusals', () => {
  const obs = twin;
  const base = { base: start, weather, objective: 'kge' as const };

  it('an observation period shorter than 90 days is refused with the reason', () => {
    const short = obs.drainflowMm.map((q, i) =>
      obs.dates[i] >= '2013-04-01' && obs.dates[i] <= '2013-06-28' ? q : NaN,
    );
    // 2013-04-01 to 2013-06-28 is 89 days (30 + 31 + 28).
    expect(() =>
      buildFitProblem({ ...base, observed: { dates: obs.dates, drainflowMm: short } }),
    ).toThrow(
      'the calibration period has observations on 89 days, spanning 89 days (2013-04-01 to 2013-06-28); ' +
        'a fit needs observations spanning at least 90 days',
    );
    const ninety = obs.drainflowMm.map((q, i) =>
      obs.dates[i] >= '2013-04-01' && obs.dates[i] <= '2013-06-29' ? q : NaN,
    );
    expect(() =>
      buildFitProblem({ ...base, observed: { dates: obs.dates, drainflowMm: ninety } }),
    ).not.toThrow();
  });

  it('unknown and layered parameters, and inverted bounds, are refused', () => {
    const observed = { dates: obs.dates, drainflowMm: obs.drainflowMm };
    expect(() => buildFitProblem({ ...base, observed, paths: ['soil.conductivty'] })).toThrow(
      /params: unknown parameter "soil.conductivty"; accepted: soil.conductivity, /,
    );
    const layered = parseField(
      fieldText(1, 0.05, 0, 12).replace(
        'drainablePorosity: 0.05',
        'drainablePorosity: [{ depth: 0.5 m, value: 0.08 }, { depth: 2.5 m, value: 0.04 }]',
      ),
      'f.yaml',
    ).base;
    expect(() => buildFitProblem({ ...base, base: layered, observed })).toThrow(
      /soil.drainablePorosity is given as layers/,
    );
    const inverted = parseField(
      fieldText(1, 0.05, 0, 12) + 'fit: { bounds: { soil.conductivity: [2 m/d, 0.5 m/d] } }\n',
      'f.yaml',
    ).base;
    expect(() => buildFitProblem({ ...base, base: inverted, observed })).toThrow(
      'fit.bounds.soil.conductivity: the lower bound 2 must be below the upper 0.5 m/d',
    );
  });
});
