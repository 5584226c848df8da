/**
 * The daily weather record the rest of tileflux consumes: one typed array per variable, one
 * entry per day, in SI-like units (mm/d, degC, MJ m-2 d-1, %, m/s). Readers (io/weather.ts) and the
 * weather generator produce it; reference ET, snow and the engine read it.
 */

/** A daily weather record. Dates are consecutive, ascending ISO days without gaps. */
export interface WeatherSeries {
  /** ISO `YYYY-MM-DD`, consecutive days, no gaps, ascending. */
  dates: string[];
  /** Precipitation, mm/d. */
  precipMm: Float64Array;
  /** Daily maximum air temperature, degC. */
  tmaxC: Float64Array;
  /** Daily minimum air temperature, degC. */
  tminC: Float64Array;
  /** Reference ET given in the file, mm/d; when present it overrides every ET method. */
  refEtMm?: Float64Array;
  /** Incoming solar (shortwave) radiation, MJ m-2 d-1. */
  solarMJm2?: Float64Array;
  /** Daily mean relative humidity, %. */
  rhMeanPct?: Float64Array;
  /** Mean wind speed at 2 m above the ground, m/s. */
  wind2mMs?: Float64Array;
}

/** The optional variables of a series, in the order tileflux writes them. */
export const OPTIONAL_WEATHER_FIELDS = ['refEtMm', 'solarMJm2', 'rhMeanPct', 'wind2mMs'] as const;

/** Name of an optional variable of a WeatherSeries. */
export type OptionalWeatherField = (typeof OPTIONAL_WEATHER_FIELDS)[number];
