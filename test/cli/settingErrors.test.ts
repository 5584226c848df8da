/**
 * Core errors name the library's settings; the CLI calls them by its flags.
 */
import { describe, expect, it } from 'vitest';
import { cliMessage } from '../../src/cli/common.js';
import { SettingError, TilefluxError } from '../../src/errors.js';
import { tileflux, FIELD, WEATHER } from './cli.js';

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
