// The lists the commands' --help names without loading the library (src/cli/helpFacts.ts) must
// equal the library's own, so that the help cannot drift from what the commands accept.
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_FIT_PATHS,
  FIT_OBJECTIVES,
  FIT_PARAMETER_BOUNDS,
  SCENARIO_SEPARATOR,
  WEATHER_FORMAT_HELP,
  WEATHER_FORMATS,
} from '../../src/cli/helpFacts.js';
import * as manifest from '../../src/io/batchManifest.js';
import * as weather from '../../src/io/weather.js';
import * as fit from '../../src/scenarios/fit.js';
import * as fitParams from '../../src/scenarios/fitParams.js';

describe('facts of the help texts', () => {
  it('name the parameters, default bounds and units that fit searches', () => {
    expect(FIT_PARAMETER_BOUNDS).toEqual(
      fitParams.FIT_PARAMETERS.map((p) => [p.path, p.bounds[0], p.bounds[1], p.unit]),
    );
    expect(DEFAULT_FIT_PATHS).toEqual([...fitParams.DEFAULT_FIT_PATHS]);
  });

  it('name the objectives of fit and the scenario separator of a batch manifest', () => {
    expect(FIT_OBJECTIVES).toEqual([...fit.FIT_OBJECTIVES]);
    expect(SCENARIO_SEPARATOR).toBe(manifest.SCENARIO_SEPARATOR);
  });

  it('name the weather formats the readers take', () => {
    expect(WEATHER_FORMATS).toEqual([...weather.WEATHER_FORMATS]);
    expect(WEATHER_FORMAT_HELP).toEqual(weather.WEATHER_FORMAT_HELP);
  });
});
