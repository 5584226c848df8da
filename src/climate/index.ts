/**
 * Public climate API: the weather record type, calendar helpers, extraterrestrial radiation,
 * reference ET (Hargreaves, FAO Penman-Monteith), the degree-day snow model, the Richardson
 * weather generator and the record summary. Pure: no Node imports.
 */

// The daily weather record
export {
  type WeatherSeries,
  OPTIONAL_WEATHER_FIELDS,
  type OptionalWeatherField,
} from './weatherSeries.js';
// Calendar of ISO dates and day numbers
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
} from './calendar.js';
// Extraterrestrial radiation and day length (FAO-56)
export {
  inverseRelativeDistance,
  solarDeclination,
  sunsetHourAngle,
  extraterrestrialRadiation,
  daylightHours,
  SOLAR_CONSTANT_MJ_M2_MIN,
  MM_PER_MJ_M2,
} from './extraterrestrialRadiation.js';
// Reference ET by Hargreaves, FAO-56 Penman-Monteith, and the choice between them
export { hargreavesRefEt } from './hargreaves.js';
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
} from './penmanMonteith.js';
export { referenceEt, type EtMethod, ET_METHOD_SOURCE, HARGREAVES_BIAS } from './referenceEt.js';
// The degree-day snow model
export { snowModel, type SnowParams, DEFAULT_SNOW, type SnowResult } from './snow.js';
// Seeded random numbers, the Richardson weather generator, its fit, record statistics
export { sfc32, normalSampler, gammaVariate, type Uniform } from './random.js';
export {
  stationaryWetProbability,
  forHemisphere,
  generateWeather,
  checkGeneratorParams,
  type TemperatureHarmonics,
  type GeneratorParams,
  DEFAULT_GENERATOR,
  type GenerateOptions,
} from './weatherGenerator.js';
export {
  monthIndexSeries,
  fitGenerator,
  changeClimate,
  WET_DAY_MM,
  type ClimateChange,
} from './generatorFit.js';
export { recordStatistics, MEAN_MONTH_DAYS, type RecordStatistics } from './weatherStatistics.js';
// Yearly totals of a weather record
export { summarizeWeather, type YearTotal, type WeatherSummary } from './weatherSummary.js';
