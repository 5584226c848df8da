// Twin-experiment fixtures on real weather: the vega-datasets package's New York record
// (2012-2015, precipitation in mm, temperatures in degC). "Observations" are the model's own
// output for known parameters with 10 % multiplicative Gaussian noise (seeded), so the right
// answer of a fit is known.
import { normalSampler, sfc32 } from '../../src/climate/random.js';
import { parseField } from '../../src/io/field.js';
import { readWeatherFile } from '../../src/io/weather.js';
import { scenarioOf } from '../../src/scenarios/resolve.js';
import { preparePeriod, prepareScenario, runEngine } from '../../src/scenarios/run.js';

export const newYork = () =>
  readWeatherFile('node_modules/vega-datasets/data/weather.csv', {
    columns: { date: 'date', precip: 'precipitation', tmax: 'temp_max', tmin: 'temp_min' },
    where: { column: 'location', value: 'New York' },
  }).series;

/** An invented field on the New York record with the four default fit parameters set. */
export const twinFieldText = (k: number, porosity: number, sc: number, capacity: number) =>
  `# A monitored field (invented)
name: Monitored field
site: { latitude: 40.7 }
soil:
  conductivity: ${k} m/d # first guess
  restrictiveLayerDepth: 2.5 m
  drainablePorosity: ${porosity}
  rootZoneDepth: 0.9 m
  seepageConductance: ${sc}
drains: { depth: 1.2 m, spacing: 20 m, capacity: ${capacity} mm/d }
`;

/** Known parameters, and the values of the field file a fit starts from. */
export const TRUTH = { k: 0.5, porosity: 0.04, seepageConductance: 0.5, capacity: 9 };
export const START = { k: 1, porosity: 0.05, seepageConductance: 0, capacity: 12 };

/** The truth's daily flow and water-table depth, 2012-2015, each with 10 % noise (seed 2024). */
export function twinObservations(weather = newYork()) {
  const t = TRUTH;
  const truth = parseField(
    twinFieldText(t.k, t.porosity, t.seepageConductance, t.capacity),
    'truth.yaml',
  ).base;
  const period = preparePeriod(weather, truth.site, {
    from: '2012-01-01',
    to: '2015-12-31',
    warmupYears: 0,
  });
  const run = runEngine(period, prepareScenario(period, scenarioOf('truth', '', truth)));
  const z = normalSampler(sfc32(2024));
  const noisy = (x: number) => x * Math.max(0, 1 + 0.1 * z());
  // Flow and depth noise alternate day by day from one stream.
  const drainflowMm = new Float64Array(run.dates.length);
  const waterTableDepthM = new Float64Array(run.dates.length);
  for (let i = 0; i < run.dates.length; i++) {
    drainflowMm[i] = noisy(run.drainflowMm[i]);
    waterTableDepthM[i] = noisy(run.waterTableDepthM[i]);
  }
  return { dates: period.forcing.dates, drainflowMm, waterTableDepthM };
}
