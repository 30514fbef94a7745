import type { EngineWarning } from "../types";
import type { ClimateInput, ClimateYear } from "./types";

/** Hours in a common and in a leap year. */
export const HOURS_PER_YEAR = 8760;
export const HOURS_PER_LEAP_YEAR = 8784;

/**
 * Turn the scenario's validated `climate` input into the engine's ClimateYear.
 * Hourly arrays are copied as they are (they already carry wet-bulb at the site's pressure, resolved
 * when the file was imported). Dry-bulb bins become bins keyed on their mean coincident wet-bulb,
 * which is what the heat-rejection physics needs; `binnedOn` records where they came from.
 */
export function toClimateYear(input: ClimateInput): ClimateYear {
  switch (input.source) {
    case "hourly":
      return {
        kind: "hourly",
        label: input.label,
        month: input.month.slice(),
        day: input.day.slice(),
        hour: input.hour.slice(),
        dryBulbC: input.dryBulbC.slice(),
        wetBulbC: input.wetBulbC.slice(),
      };
    case "wetBulbBins":
      return {
        kind: "bins",
        ...(input.label !== undefined ? { label: input.label } : {}),
        binnedOn: "wetBulb",
        bins: input.bins.map((b) => ({
          wetBulbC: b.wetBulbC,
          meanCoincidentDryBulbC: b.meanCoincidentDryBulbC,
          hours: b.hours,
          ...(b.month !== undefined ? { month: b.month } : {}),
        })),
      };
    case "dryBulbBins":
      return {
        kind: "bins",
        ...(input.label !== undefined ? { label: input.label } : {}),
        binnedOn: "dryBulb",
        bins: input.bins.map((b) => ({
          wetBulbC: b.meanCoincidentWetBulbC,
          meanCoincidentDryBulbC: b.dryBulbC,
          hours: b.hours,
          ...(b.month !== undefined ? { month: b.month } : {}),
        })),
      };
  }
}

/** Total hours a ClimateYear represents. */
export function climateYearHours(year: ClimateYear): number {
  if (year.kind === "hourly") return year.dryBulbC.length;
  let sum = 0;
  for (const b of year.bins) sum += b.hours;
  return sum;
}

/**
 * Plausibility warnings on a ClimateYear that the schema cannot reject outright: a bin table whose hours
 * do not sum to a year (annual quantities then cover a part year), and wet-bulbs above their dry-bulb
 * (impossible for unsaturated air; tolerated up to 0.05 K of rounding).
 */
export function climateYearWarnings(year: ClimateYear): EngineWarning[] {
  const warnings: EngineWarning[] = [];
  const hours = climateYearHours(year);
  if (Math.abs(hours - HOURS_PER_YEAR) > 0.5 && Math.abs(hours - HOURS_PER_LEAP_YEAR) > 0.5) {
    warnings.push({
      code: "climate.hoursNotAYear",
      severity: "warning",
      message: `The climate covers ${round1(hours)} h, not a year (8760 h or 8784 h): yearly quantities cover only those hours.`,
      path: year.kind === "bins" ? "climate.bins" : "climate.dryBulbC",
    });
  }
  let above = 0;
  if (year.kind === "hourly") {
    for (let i = 0; i < year.wetBulbC.length; i++) {
      if ((year.wetBulbC[i] ?? 0) > (year.dryBulbC[i] ?? 0) + 0.05) above++;
    }
  } else {
    for (const b of year.bins) if (b.wetBulbC > b.meanCoincidentDryBulbC + 0.05) above++;
  }
  if (above > 0) {
    warnings.push({
      code: "climate.wetBulbAboveDryBulb",
      severity: "warning",
      message: `${above} ${year.kind === "hourly" ? "hours have" : "bins have"} a wet-bulb above the dry-bulb; those values are physically impossible and were used as entered.`,
      path: year.kind === "bins" ? "climate.bins" : "climate.wetBulbC",
    });
  }
  return warnings;
}

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}
