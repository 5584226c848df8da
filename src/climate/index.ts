/**
 * Public climate API: the weather record type, calendar helpers, extraterrestrial radiation,
 * reference ET (Hargreaves, FAO Penman-Monteith), the degree-day snow model, the Richardson
 * weather generator and the record summary. Pure: no Node imports.
 */
export * from './weatherSeries.js';
export * from './calendar.js';
export * from './extraterrestrialRadiation.js';
export * from './hargreaves.js';
export * from './penmanMonteith.js';
export * from './referenceEt.js';
export * from './snow.js';
export * from './random.js';
export * from './weatherGenerator.js';
export * from './weatherSummary.js';
export * from './generatorFit.js';
export * from './weatherStatistics.js';
