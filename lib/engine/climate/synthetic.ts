/**
 * Seeded generator of an INVENTED typical weather year, for demos, fixtures and tests. It is not
 * measured data and imitates no station. Default site: "Harrowgate Flats", a fictional inland valley at
 * 240 m (country code ZZ, reserved for user assignment, marks it as invented).
 *
 * Model (t = hour of year 0…8759, d = day of year 1…365 at the hour's middle, h = hour of day 0…23,
 * all trigonometric arguments in radians):
 *   seasonal mean      Tm(d) = T̄ + As·cos(2π(d − dPeak)/365)              (T̄ = 11 °C, As = 13 K, dPeak = 200)
 *   diurnal half-range Ad(d) = Ad0 + Ad1·cos(2π(d − dPeak)/365)           (Ad0 = 5 K, Ad1 = 1.5 K)
 *   diurnal shape      D(h)  = cos(2π(h + 0.5 − hPeak)/24)                (hPeak = 15, warmest at 15:00)
 *   weather anomaly    x(t)  = φT·x(t−1) + σT·√(1 − φT²)·ε(t)             (φT = 0.97 per hour, σT = 3 K)
 *   dry-bulb           T(t)  = Tm(d) + Ad(d)·D(h) + x(t)
 *   dew point          Td(t) = T̄d + Ads·cos(2π(d − dPeakDew)/365) + k·x(t) + y(t) − Dd(h)
 *                      (T̄d = 5.5 °C, Ads = 10.5 K, dPeakDew = 205, k = 0.4, Dd(h) = 0.6·D(h) K: air dries a
 *                      little in the afternoon mixing; y is AR(1) with φ = 0.95, σ = 2.2 K), then
 *                      Td ≤ T − 0.1 K (air is at most just saturated)
 *   station pressure   p(t) = 101325·(1 − 2.25577e−5·z)^5.2559 + 650 Pa·s(t), s AR(1) with φ = 0.985, σ = 1
 *   relative humidity  RH = 100·pws(Td)/pws(T), pws by Hyland–Wexler (ASHRAE 2017 ch.1 eq. 6)
 *   wind speed         |2.5 + 1.4·w(t)| m/s, w AR(1) with φ = 0.9, σ = 1; direction 200° ± 60° noise
 * ε ~ N(0, 1) by Box–Muller from a mulberry32 stream seeded with `seed`, so a seed gives the same year
 * on every machine. Solar and sky fields are written as the EPW format's missing-value sentinels.
 */
import { pressureFromElevationPa, saturationVaporPressurePa } from "../psychrometrics";
import { mulberry32 } from "../random";
import { calendarOfYear } from "./calendar";

export interface SyntheticSite {
  name: string;
  region: string;
  country: string;
  latitudeDeg: number;
  longitudeDeg: number;
  timeZoneH: number;
  elevationM: number;
}

/** The invented demo site. */
export const HARROWGATE_FLATS: SyntheticSite = {
  name: "Harrowgate Flats",
  region: "Invented inland valley",
  country: "ZZ",
  latitudeDeg: 41.8,
  longitudeDeg: -96.4,
  timeZoneH: -6,
  elevationM: 240,
};

export interface SyntheticWeatherModel {
  annualMeanC: number;
  seasonalAmplitudeK: number;
  peakDayOfYear: number;
  diurnalHalfRangeK: number;
  diurnalHalfRangeSeasonalK: number;
  peakHour: number;
  anomalyStdK: number;
  anomalyPersistencePerHour: number;
  dewPointMeanC: number;
  dewPointSeasonalAmplitudeK: number;
  dewPointPeakDayOfYear: number;
  dewPointAnomalyStdK: number;
  dewPointAnomalyPersistencePerHour: number;
  dewPointCouplingToAnomaly: number;
  dewPointAfternoonDropK: number;
}

export const DEFAULT_SYNTHETIC_MODEL: SyntheticWeatherModel = {
  annualMeanC: 11,
  seasonalAmplitudeK: 13,
  peakDayOfYear: 200,
  diurnalHalfRangeK: 5,
  diurnalHalfRangeSeasonalK: 1.5,
  peakHour: 15,
  anomalyStdK: 3,
  anomalyPersistencePerHour: 0.97,
  dewPointMeanC: 5.5,
  dewPointSeasonalAmplitudeK: 10.5,
  dewPointPeakDayOfYear: 205,
  dewPointAnomalyStdK: 2.2,
  dewPointAnomalyPersistencePerHour: 0.95,
  dewPointCouplingToAnomaly: 0.4,
  dewPointAfternoonDropK: 0.6,
};

export interface SyntheticWeatherOptions {
  seed?: number;
  site?: SyntheticSite;
  /** Include 29 February (8784 h). */
  leapYear?: boolean;
  model?: Partial<SyntheticWeatherModel>;
}

/** One generated hour; `hour` 0…23 is the hour starting. */
export interface SyntheticHour {
  month: number;
  day: number;
  hour: number;
  dryBulbC: number;
  dewPointC: number;
  relativeHumidityPercent: number;
  pressurePa: number;
  windSpeedMPerS: number;
  windDirectionDeg: number;
}

export interface SyntheticYear {
  site: SyntheticSite;
  seed: number;
  leapYear: boolean;
  hours: SyntheticHour[];
}

function normalStream(uniform: () => number): () => number {
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const u = 1 - uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}

/** AR(1) with stationary standard deviation `std`: x ← φ·x + std·√(1 − φ²)·ε. */
function ar1(phi: number, std: number, normal: () => number, start: number) {
  let x = start;
  const k = std * Math.sqrt(1 - phi * phi);
  return () => {
    x = phi * x + k * normal();
    return x;
  };
}

const round1 = (x: number) => Math.round(x * 10) / 10;

/** Generate an invented typical year (model and formulas in this file's header). */
export function generateSyntheticYear(options: SyntheticWeatherOptions = {}): SyntheticYear {
  const seed = options.seed ?? 20240611;
  const site = options.site ?? HARROWGATE_FLATS;
  const leap = options.leapYear ?? false;
  const m: SyntheticWeatherModel = { ...DEFAULT_SYNTHETIC_MODEL, ...options.model };
  const normal = normalStream(mulberry32(seed));
  const x = ar1(m.anomalyPersistencePerHour, m.anomalyStdK, normal, 0);
  const y = ar1(m.dewPointAnomalyPersistencePerHour, m.dewPointAnomalyStdK, normal, 0);
  const s = ar1(0.985, 1, normal, 0);
  const w = ar1(0.9, 1, normal, 0);
  const pSite = pressureFromElevationPa(site.elevationM);
  const cal = calendarOfYear(leap);
  const daysInYear = leap ? 366 : 365;
  const hours: SyntheticHour[] = [];
  for (let i = 0; i < cal.month.length; i++) {
    const hourOfDay = cal.hour[i]!;
    const dayOfYear = Math.floor(i / 24) + 1 + (hourOfDay + 0.5) / 24 - 0.5;
    const season = Math.cos((2 * Math.PI * (dayOfYear - m.peakDayOfYear)) / daysInYear);
    const dewSeason = Math.cos((2 * Math.PI * (dayOfYear - m.dewPointPeakDayOfYear)) / daysInYear);
    const diurnal = Math.cos((2 * Math.PI * (hourOfDay + 0.5 - m.peakHour)) / 24);
    const anomaly = x();
    const t =
      m.annualMeanC +
      m.seasonalAmplitudeK * season +
      (m.diurnalHalfRangeK + m.diurnalHalfRangeSeasonalK * season) * diurnal +
      anomaly;
    let td =
      m.dewPointMeanC +
      m.dewPointSeasonalAmplitudeK * dewSeason +
      m.dewPointCouplingToAnomaly * anomaly +
      y() -
      m.dewPointAfternoonDropK * diurnal;
    const tR = round1(t);
    td = round1(Math.min(td, tR - 0.1));
    const rh = Math.min(
      100,
      Math.round((100 * saturationVaporPressurePa(td)) / saturationVaporPressurePa(tR)),
    );
    hours.push({
      month: cal.month[i]!,
      day: cal.day[i]!,
      hour: hourOfDay,
      dryBulbC: tR,
      dewPointC: td,
      relativeHumidityPercent: rh,
      pressurePa: Math.round(pSite + 650 * s()),
      windSpeedMPerS: round1(Math.abs(2.5 + 1.4 * w())),
      windDirectionDeg: Math.round((((200 + 60 * normal()) % 360) + 360) % 360),
    });
  }
  return { site, seed, leapYear: leap, hours };
}

/** One EPW data row before formatting; `hourEnding` is 1…24 as the format wants. */
export interface EpwRow {
  year: number;
  month: number;
  day: number;
  hourEnding: number;
  minute: number;
  dryBulbC: number;
  dewPointC: number;
  relativeHumidityPercent: number;
  pressurePa: number;
  windDirectionDeg?: number;
  windSpeedMPerS?: number;
}

/**
 * Format rows as an EPW file (EnergyPlus Auxiliary Programs, EPW data dictionary): 8 header lines and
 * 35 fields per row. Fields the generator does not model carry the dictionary's missing sentinels.
 */
export function formatEpw(
  site: SyntheticSite,
  rows: EpwRow[],
  meta: { recordsPerHour?: number; leapYear?: boolean; comment?: string } = {},
): string {
  const head = [
    `LOCATION,${site.name},${site.region},${site.country},LoopLedger synthetic weather,000000,${site.latitudeDeg.toFixed(2)},${site.longitudeDeg.toFixed(2)},${site.timeZoneH.toFixed(1)},${site.elevationM.toFixed(1)}`,
    "DESIGN CONDITIONS,0",
    "TYPICAL/EXTREME PERIODS,0",
    "GROUND TEMPERATURES,0",
    `HOLIDAYS/DAYLIGHT SAVINGS,${meta.leapYear ? "Yes" : "No"},0,0,0`,
    `COMMENTS 1,${meta.comment ?? "Invented weather for demonstration; not measured data"}`,
    "COMMENTS 2,Generated by lib/engine/climate/synthetic.ts: seasonal and diurnal sinusoids with AR(1) anomalies",
    `DATA PERIODS,1,${meta.recordsPerHour ?? 1},Data,Sunday,1/1,12/31`,
  ];
  // Fields 11–35: radiation, illuminance, sky, visibility, weather codes, water, snow, albedo, rain.
  const tailBefore = "9999,9999,9999,9999,9999,9999,999999,999999,999999,9999";
  const tailAfter = "99,99,9999,99999,9,999999999,999,.999,999,99,999,999,99";
  const body = rows.map((r) =>
    [
      r.year,
      r.month,
      r.day,
      r.hourEnding,
      r.minute,
      "*",
      r.dryBulbC.toFixed(1),
      r.dewPointC.toFixed(1),
      Math.round(r.relativeHumidityPercent),
      Math.round(r.pressurePa),
      tailBefore,
      r.windDirectionDeg ?? 999,
      r.windSpeedMPerS !== undefined ? r.windSpeedMPerS.toFixed(1) : 999,
      tailAfter,
    ].join(","),
  );
  return [...head, ...body].join("\n") + "\n";
}

/** EPW text of a synthetic year (hourly, one record per hour, year column fixed to a non-data year). */
export function syntheticYearToEpw(year: SyntheticYear): string {
  const rows: EpwRow[] = year.hours.map((h) => ({
    year: year.leapYear ? 2004 : 2001,
    month: h.month,
    day: h.day,
    hourEnding: h.hour + 1,
    minute: 0,
    dryBulbC: h.dryBulbC,
    dewPointC: h.dewPointC,
    relativeHumidityPercent: h.relativeHumidityPercent,
    pressurePa: h.pressurePa,
    windDirectionDeg: h.windDirectionDeg,
    windSpeedMPerS: h.windSpeedMPerS,
  }));
  return formatEpw(year.site, rows, {
    leapYear: year.leapYear,
    comment: `Invented typical year for ${year.site.name} (seed ${year.seed}); not measured data`,
  });
}

export interface SyntheticCsvOptions {
  delimiter?: "," | ";";
  decimalComma?: boolean;
  temperatureUnit?: "C" | "F";
  humidity?: "relativeHumidity" | "dewPoint";
  time?: "timestamp" | "monthDayHour";
  /** Only the first n hours (a smaller fixture); the default is the whole year. */
  hours?: number;
}

/**
 * CSV text of a synthetic year. Columns: `timestamp` (ISO, hour starting) or `month;day;hour` (0…23),
 * then `dry_bulb_C|F` and `rh_percent` or `dew_point_C|F`.
 */
export function syntheticYearToCsv(year: SyntheticYear, options: SyntheticCsvOptions = {}): string {
  const sep = options.delimiter ?? ",";
  const unit = options.temperatureUnit ?? "C";
  const hum = options.humidity ?? "relativeHumidity";
  const time = options.time ?? "timestamp";
  const yr = year.leapYear ? 2004 : 2001;
  const fmt = (v: number, digits: number) => {
    const s = v.toFixed(digits);
    return options.decimalComma ? s.replace(".", ",") : s;
  };
  const temp = (c: number) => (unit === "F" ? (c * 9) / 5 + 32 : c);
  const header = [
    ...(time === "timestamp" ? ["timestamp"] : ["month", "day", "hour"]),
    `dry_bulb_${unit}`,
    hum === "relativeHumidity" ? "rh_percent" : `dew_point_${unit}`,
  ].join(sep);
  const n = Math.min(options.hours ?? year.hours.length, year.hours.length);
  const lines = [header];
  for (let i = 0; i < n; i++) {
    const h = year.hours[i]!;
    const stamp = `${yr}-${String(h.month).padStart(2, "0")}-${String(h.day).padStart(2, "0")} ${String(h.hour).padStart(2, "0")}:00`;
    lines.push(
      [
        ...(time === "timestamp" ? [stamp] : [String(h.month), String(h.day), String(h.hour)]),
        fmt(temp(h.dryBulbC), unit === "F" ? 2 : 1),
        hum === "relativeHumidity"
          ? fmt(h.relativeHumidityPercent, 0)
          : fmt(temp(h.dewPointC), unit === "F" ? 2 : 1),
      ].join(sep),
    );
  }
  return lines.join("\n") + "\n";
}
