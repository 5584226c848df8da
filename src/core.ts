/**
 * The browser-safe core of tileflux: units, climate forcing, drain design equations, the daily
 * engine, nitrate models, scenario runs and comparison, and the Vega-Lite chart specs. Nothing
 * here imports Node, so it runs in a browser, a worker thread or a notebook kernel.
 *
 * Every export is listed by name, so the public API is this list (hence its length);
 * test/api/api-report.md shows each with its type (`npm run api` rewrites it, a test checks it).
 */

// Errors a user can cause, and the package version
export { check, clip, TilefluxError, type SettingNamer, SettingError } from './errors.js';
export { VERSION } from './version.js';

// Quantity strings ("1.2 m", "3 in/d") to SI numbers, and their zod schema
export {
  tryParseQuantity,
  parseQuantity,
  type QuantityKind,
  type UnitSystem,
  US,
} from './units/quantity.js';
export { zQuantity } from './units/zodQuantity.js';

// Climate: the daily weather record
export {
  type WeatherSeries,
  OPTIONAL_WEATHER_FIELDS,
  type OptionalWeatherField,
} from './climate/index.js';
// Climate: calendar of ISO dates and day numbers
export {
  dayNumber,
  dayNumberOf,
  isoDate,
  isLeapYear,
  daysInMonth,
  dayOfYear,
  consecutiveDates,
  dayOfYearSeries,
  dayIndexOf,
  monthDayKey,
  type DayIndex,
} from './climate/index.js';
// Climate: extraterrestrial radiation and day length (FAO-56)
export {
  inverseRelativeDistance,
  solarDeclination,
  sunsetHourAngle,
  extraterrestrialRadiation,
  daylightHours,
  SOLAR_CONSTANT_MJ_M2_MIN,
  MM_PER_MJ_M2,
} from './climate/index.js';
// Climate: reference ET by Hargreaves, FAO-56 Penman-Monteith, and the choice between them
export { hargreavesRefEt } from './climate/index.js';
export {
  atmosphericPressure,
  psychrometricConstant,
  saturationVapourPressure,
  vapourPressureSlope,
  meanSaturationVapourPressure,
  vapourPressureFromRhMean,
  clearSkyRadiation,
  netLongwaveRadiation,
  penmanMonteithRefEt,
  STEFAN_BOLTZMANN_MJ_K4_M2_D,
  type PenmanMonteithDay,
} from './climate/index.js';
export { referenceEt, type EtMethod, ET_METHOD_SOURCE, HARGREAVES_BIAS } from './climate/index.js';
// Climate: the degree-day snow model
export { snowModel, type SnowParams, DEFAULT_SNOW, type SnowResult } from './climate/index.js';
// Climate: seeded random numbers, the Richardson weather generator, its fit, record statistics
export { sfc32, normalSampler, gammaVariate, type Uniform } from './climate/index.js';
export {
  stationaryWetProbability,
  forHemisphere,
  generateWeather,
  checkGeneratorParams,
  type TemperatureHarmonics,
  type GeneratorParams,
  DEFAULT_GENERATOR,
  type GenerateOptions,
} from './climate/index.js';
export {
  monthIndexSeries,
  fitGenerator,
  changeClimate,
  WET_DAY_MM,
  type ClimateChange,
} from './climate/index.js';
export { recordStatistics, MEAN_MONTH_DAYS, type RecordStatistics } from './climate/index.js';
// Climate: yearly totals of a weather record
export { summarizeWeather, type YearTotal, type WeatherSummary } from './climate/index.js';

// Drainage: equivalent depth, Hooghoudt flux and spacing, drainage intensity
export {
  equivalentDepth,
  equivalentDepthAndSlope,
  checkEquivalentDepthInputs,
  minimumSpacingM,
  EQUIVALENT_DEPTH_METHODS,
  type EquivalentDepthMethod,
} from './drainage/index.js';
export {
  hooghoudtFlux,
  hooghoudtSpacing,
  drainageIntensity,
  type HooghoudtFluxInput,
  type HooghoudtSpacingInput,
  type DrainageIntensityInput,
} from './drainage/index.js';
// Drainage: Kirkham's ponded-surface rate and Glover-Dumm drawdown and spacing
export {
  kirkhamGeometryFactor,
  kirkhamFlux,
  kirkhamHeadM,
  type KirkhamGeometryInput,
  type KirkhamFluxInput,
} from './drainage/index.js';
export {
  gloverHeadRatio,
  gloverSpacing,
  gloverRatioOfTime,
  gloverTimeOfRatio,
  type GloverInput,
  type GloverSpacingInput,
} from './drainage/index.js';
// Drainage: the spacing root finder every spacing method shares
export { solveSpacing, type SpacingRoot } from './drainage/index.js';
// Drainage: Manning pipe capacity and commercial pipe sizes
export {
  manningFullCapacity,
  manningDiameter,
  manningDiameterInches,
  fullFlowVelocity,
  minimumGrade,
  SEDIMENT_VELOCITY_MS,
} from './drainage/index.js';
export {
  selectPipeSize,
  pipeSizeList,
  pipeDiameterM,
  INCH_SIZES,
  METRIC_SIZES,
  ROUGHNESS,
  type PipeSizeList,
  type PipeMaterial,
  type SelectedPipe,
} from './drainage/index.js';
// Drainage: drainage coefficients by soil, crop and surface inlets
export {
  drainageCoefficient,
  parseCoefficientPreset,
  DEFAULT_COEFFICIENT_PRESET,
  DRAINAGE_COEFFICIENT_SOURCE,
  COEFFICIENT_SOILS,
  COEFFICIENT_CROPS,
  COEFFICIENT_INLETS,
  type CoefficientPreset,
  type CoefficientSoil,
  type CoefficientCrop,
  type CoefficientInlets,
  type DrainageCoefficient,
} from './drainage/index.js';

// Engine: its inputs and outputs
export type {
  EngineForcing,
  CropCalendar,
  PorosityProfile,
  EngineParams,
  EngineResult,
  EngineColumns,
} from './engine/types.js';
// Engine: the crop table and the daily crop calendar (Kc, roots)
export {
  type CropParams,
  CROPS,
  BARE_SOIL_KC,
  BARE_SOIL_DEPLETION,
  MIN_ROOT_DEPTH_M,
} from './engine/crops.js';
export {
  monthDayOfYear,
  kcOnDay,
  rotationCrop,
  rootDepthOnDay,
  cropCalendar,
  DEFAULT_ROTATION_FIRST_YEAR,
  type RootOptions,
} from './engine/cropCalendar.js';
// Engine: outlet board schedules and the layered drainable porosity
export {
  stepKey,
  outletSeries,
  type OutletStep,
  type OutletSchedule,
} from './engine/outletSchedule.js';
export {
  porosityTable,
  airAbove,
  depthForAir,
  porosityAt,
  type PorosityTable,
} from './engine/porosityProfile.js';
// Engine: the daily water balance
export {
  outletLevels,
  simulate,
  ACTIVE_ZONE_M,
  MIN_SUBSTEPS_PER_DAY,
  MAX_SUBSTEPS_PER_DAY,
  BALANCE_TOLERANCE_MM,
  type OutletLevel,
} from './engine/simulate.js';

// Nitrate: its inputs and outputs, and the run of a concentration model
export type {
  FertilizerEvent,
  NitrateConfig,
  NitrateInput,
  NitrateResult,
  PoolParams,
  PoolSeries,
  RatingFit,
  RatingPairs,
} from './nitrate/index.js';
export { simulateNitrate } from './nitrate/index.js';
// Nitrate: the concentration models (soil pool, rating curve and its fit, seasonal)
export { simulatePool, poolForcingOf, type PoolForcing } from './nitrate/index.js';
export { fitRating } from './nitrate/index.js';
export { readRatingPairsCsv } from './nitrate/index.js';
export { ratingConcentration } from './nitrate/index.js';
export { seasonalConcentration } from './nitrate/index.js';
// Nitrate: loads, concentrations and yearly sums
export { loadKgHa, concentrationMgL } from './nitrate/index.js';
export { annualNitrate, flowWeightedMeanMgL, type AnnualNitrate } from './nitrate/index.js';
// Nitrate: defaults and the field file's nitrate section
export {
  DEFAULT_POOL_PARAMS,
  DEFAULT_RATING_RANGE_MM,
  DEFAULT_RUNOFF_EXTRACTION_RATIO,
} from './nitrate/index.js';
export {
  nitrateSchema,
  DEFAULT_NITRATE,
  ratingFromObservations,
  zKgHa,
  type NitrateSection,
  type RatingObservationsSection,
} from './nitrate/index.js';

// Scenarios: the field file's schema
export {
  siteSchema,
  soilSchema,
  drainsSchema,
  outletSchema,
  CROP_NAMES,
  cropsSchema,
  seepageSchema,
  weatherSchema,
  initialSchema,
  wetnessSchema,
  simulationSchema,
  scenarioSchema,
  fieldSchema,
  type FieldInput,
  type Field,
} from './scenarios/fieldSchema.js';
// Scenarios: from a field to engine parameters, and the standard scenarios
export {
  drainageIntensityOf,
  capacityWithSource,
  capacityOf,
  seepageOf,
  withSeepage,
  engineParamsOf,
  scenarioOf,
  standardScenarios,
  type ScenarioSpec,
  SHALLOW_DEPTH_M,
  STANDARD_CONTROL,
} from './scenarios/resolve.js';
// Scenarios: running a field's scenarios, and one design on a prepared field
export {
  scenariosOf,
  preparePeriod,
  prepareScenario,
  runEngine,
  runPreparedScenario,
  runField,
  planRun,
  digestOf,
  capacityLimitedDaysOf,
  lateralSeepageMmOf,
  type RunPlan,
  type ScenarioDigest,
  type ScenarioResult,
  type RunResult,
  type RunOptions,
  type ScenarioOutput,
  type RunOutput,
  type FieldWithScenarios,
  type PreparedPeriod,
  type PreparedScenario,
  forcingOf,
  reportPeriod,
  type PeriodOptions,
} from './scenarios/run.js';
export {
  prepareField,
  runDesign,
  type PreparedField,
  type DesignSpec,
  type DesignRun,
} from './scenarios/prepared.js';
// Scenarios: the annual table and the comparison of scenarios
export { type AnnualRow, type AnnualMeasure, ANNUAL_COLUMNS } from './scenarios/types.js';
export {
  inWindow,
  annualRows,
  isPartialYear,
  withPartialYear,
  type WetnessSettings,
} from './scenarios/annual.js';
export {
  withSeepageBand,
  pipeLengthPerHectare,
  compareScenarios,
  type ComparisonRow,
  LOAD_PART_COLUMNS,
  type LoadParts,
  COMPARISON_COLUMNS,
  BANDED_COLUMNS,
  BAND_COLUMNS,
  type BandedComparisonRow,
  type ComparedScenario,
} from './scenarios/compare.js';
// Scenarios: the starter field file of `tileflux init`
export { starterFieldFile, STARTER_EXAMPLE } from './scenarios/starter.js';
// Scenarios: sweeps of designs under uncertain parameters and climates, costs, the frontier
export {
  checkSweep,
  uncertainSchema,
  sweepSchema,
  managementName,
  COST_DEFAULTS,
  costsSchema,
  type SweepSection,
  type CostsSection,
} from './scenarios/sweepSchema.js';
export {
  splitUnit,
  measureColumn,
  planSweep,
  sampledField,
  runSweepJobs,
  summariseSweep,
  jobCount,
  sweepField,
  yearsOf,
  recommendationLines,
  WETNESS_MEASURE,
  LOAD_MEASURE,
  type SweepDesign,
  type UncertainParam,
  type SweepPlan,
  type SweepOptions,
  type JobResults,
  type DesignRow,
  type SweepResult,
} from './scenarios/sweep.js';
export {
  climateSlug,
  checkClimateNames,
  climateFigures,
  climateFiguresOf,
  studyOf,
  sweepClimates,
  climateSweepOf,
  studyRows,
  frontierUnion,
  climateLines,
  robustnessLines,
  type ClimateInput,
  type ClimateFigures,
  type ClimateSweep,
  type ClimateStudy,
  CLIMATE_NAME,
  MAX_CLIMATES,
} from './scenarios/sweepClimates.js';
export { capitalRecoveryFactor, designCost, type DesignCost } from './scenarios/economics.js';
export { latinHypercube, scaledValue } from './scenarios/sampling.js';
export { nonDominated } from './scenarios/frontier.js';

// Report: the run report's chart specs, their names and captions, one builder per chart
export {
  buildChartSpecs,
  CHART_NAMES,
  type ChartName,
  CHART_CAPTIONS,
  annualChart,
  concentrationChart,
  cumulativeChart,
  durationChart,
  hydrographChart,
  monthlyChart,
  niceCeil,
  placeLabels,
  tradeoffChart,
  waterTableChart,
} from './report/charts.js';
// Report: the charts' look (palette, config) and temporal axis, for charts of one's own
export { CHART_WIDTH, CONFIG, PALETTE, VEGA_LITE_SCHEMA, roundTo } from './report/chartTheme.js';
export { temporalX } from './report/chartSeries.js';
// Report: the report's data and number formatting
export type { ScenarioDailySeries, ScenarioPeriodSeries, ReportData } from './report/types.js';
export { fixed, signed } from './report/format.js';
