/**
 * Core errors name the library's settings; the CLI calls them by its flags.
 */
import { describe, expect, it } from 'vitest';
import { cliMessage } from '../../src/cli/common.js';
import { designSystem } from '../../src/drainage/systemDesign.js';
import { systemSchema } from '../../src/drainage/systemSchema.js';
import { buildSystemTree } from '../../src/drainage/systemTree.js';
import { INCH_SIZES } from '../../src/drainage/pipeSizes.js';
import { SettingError, TilefluxError } from '../../src/errors.js';
import { parseObservationsCsv } from '../../src/io/observations.js';
import { readWeather } from '../../src/io/weather/formats.js';
import { parsePeriod } from '../../src/scenarios/fitProblem.js';
import { tileflux, FIELD, WEATHER } from './cli.js';

/** The SettingError `fn` throws; fails the test when it throws none or another error. */
function caught(fn: () => unknown): SettingError {
  try {
    fn();
  } catch (err) {
    expect(err).toBeInstanceOf(SettingError);
    return err as SettingError;
  }
  throw new Error('expected an error');
}

describe('setting errors', () => {
  const err = new SettingError(
    (n) => `${n('to')} 2030-01-01 must lie between ${n('from')} 2020-01-01 and 2025-12-31`,
  );

  it('name the settings in the library and the flags on the command line', () => {
    expect(err).toBeInstanceOf(TilefluxError);
    expect(err.message).toBe('to 2030-01-01 must lie between from 2020-01-01 and 2025-12-31');
    expect(cliMessage(err)).toBe(
      '--to 2030-01-01 must lie between --from 2020-01-01 and 2025-12-31',
    );
  });

  it('other errors pass unchanged', () => {
    expect(cliMessage(new TilefluxError('x is wrong', 'field.yaml'))).toBe(
      'field.yaml: x is wrong',
    );
  });

  it('the fit periods and the ground profile are settings in the library, flags on the command line', () => {
    const period = caught(() => parsePeriod('2015-01-01..2014-01-01', 'validate'));
    expect(period.message).toMatch(/^validate expects FROM..TO/);
    expect(cliMessage(period)).toMatch(/^--validate expects FROM..TO/);

    // A reach without a grade needs a ground profile to lay it on.
    const file = systemSchema.parse({
      name: 'no grade',
      coefficient: '0.5 in/d',
      mains: [{ name: 'trunk', reaches: [{ length: '400 m', area: '4 ha' }] }],
    });
    const settings = {
      coefficientMmD: 12.7,
      sizes: INCH_SIZES,
      velocityMs: 0.43,
      round: 'up' as const,
      depthM: 1.1,
      minimumCoverM: 0.6,
      maximumDepthM: 2.5,
    };
    const profile = caught(() => designSystem(buildSystemTree(file), settings));
    expect(profile.message).toMatch(/has no grade; .*, or give a ground profile with profile$/);
    expect(cliMessage(profile)).toMatch(/, or give a ground profile with --profile$/);
  });

  it("the weather and observation readers' settings are flags on the command line", () => {
    const gap = caught(() => readWeather('date,precip_mm,tmax_c,tmin_c\n2024-05-01,,20,10\n'));
    expect(gap.message).toMatch(/use fill for up to 7 missing days in a row$/);
    expect(cliMessage(gap)).toMatch(/use --fill for up to 7 missing days in a row$/);
    const units = caught(() =>
      readWeather('date,precip_mm,tmax_c,tmin_c\n2024-05-01,1,20,10\n', { exportUnits: 'metric' }),
    );
    expect(units.message).toMatch(/exportUnits applies to GHCN-Daily files.*\(give format ghcn/);
    expect(cliMessage(units)).toMatch(
      /--export-units applies to GHCN-Daily files.*\(give --format ghcn/,
    );
    const area = caught(() => parseObservationsCsv('date,flow_l_s\n2024-04-01,1\n'));
    expect(area.message).toMatch(/comes from with areaHa \(such as 16 ha or 40 ac\)/);
    expect(cliMessage(area)).toMatch(/comes from with --area \(such as 16 ha or 40 ac\)/);
  });

  it('tileflux run says --from for a start outside the record', () => {
    const r = tileflux([
      'run',
      FIELD,
      '-w',
      WEATHER,
      '--from',
      '2051-01-01',
      '--out',
      '/tmp/x-never',
    ]);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/^tileflux: error: --from 2051-01-01 lies outside the weather record/);
  });
});
