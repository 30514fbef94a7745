/** Climate: hourly or binned typical years, weather-file parsers, binning and summaries. */
export * from "./types";
export {
  toClimateYear,
  climateYearHours,
  climateYearWarnings,
  HOURS_PER_YEAR,
  HOURS_PER_LEAP_YEAR,
} from "./input";
export { parseEpw, parseDesignConditions, EPW_FIELDS_PER_ROW, EPW_HEADER_LINES, type EpwOptions } from "./epw";
export { parseTmy3, looksLikeTmy3, parseTmy3StationLine, tmy3Mapping, type Tmy3Station } from "./tmy3";
export {
  parseHourlyCsv,
  type HourlyCsvMapping,
  type ColumnRef,
  type CsvHumidityMapping,
  type CsvTimeMapping,
} from "./csv";
export { DEFAULT_MAX_GAP_HOURS } from "./assemble";
export {
  binHourly,
  binnedClimateFromHourly,
  designWetBulbPercentilesC,
  exceedanceValue,
  histogram,
  monthHourMeanC,
  wetBulbHistogram,
  DESIGN_EXCEEDANCE_PERCENTS,
  type BinBasis,
  type BinOptions,
  type BinRow,
  type BinTable,
  type DesignWetBulb,
  type HistogramBar,
} from "./binning";
export { mulberry32 } from "../random";
export { summarizeClimate, type ClimateSummary, type TemperatureStats } from "./summary";
export {
  generateSyntheticYear,
  syntheticYearToEpw,
  syntheticYearToCsv,
  formatEpw,
  HARROWGATE_FLATS,
  DEFAULT_SYNTHETIC_MODEL,
  type SyntheticSite,
  type SyntheticYear,
  type SyntheticHour,
  type SyntheticWeatherOptions,
  type SyntheticWeatherModel,
  type SyntheticCsvOptions,
  type EpwRow,
} from "./synthetic";
