/**
 * Writes an invented weather year in the TMY3 CSV layout (NREL/TP-581-43156, "Users Manual for TMY3 Data
 * Sets", 2008, section 3 [memory: the 71 column names as listed there]): a station line, a header line and
 * 8760 hour-ending rows 01:00 … 24:00 in local standard time, each month from a different "typical" year.
 * Only dry-bulb, dew point, RH, pressure, wind are meaningful; the rest carry plausible placeholders.
 * Options make the broken variants the tests need.
 */
import type { SyntheticYear } from "@/lib/engine/climate/synthetic";

export const TMY3_HEADER = [
  "Date (MM/DD/YYYY)", "Time (HH:MM)", "ETR (W/m^2)", "ETRN (W/m^2)",
  "GHI (W/m^2)", "GHI source", "GHI uncert (%)", "DNI (W/m^2)", "DNI source", "DNI uncert (%)",
  "DHI (W/m^2)", "DHI source", "DHI uncert (%)", "GH illum (lx)", "GH illum source", "Global illum uncert (%)",
  "DN illum (lx)", "DN illum source", "DN illum uncert (%)", "DH illum (lx)", "DH illum source", "DH illum uncert (%)",
  "Zenith lum (cd/m^2)", "Zenith lum source", "Zenith lum uncert (%)", "TotCld (tenths)", "TotCld source", "TotCld uncert (code)",
  "OpqCld (tenths)", "OpqCld source", "OpqCld uncert (code)", "Dry-bulb (C)", "Dry-bulb source", "Dry-bulb uncert (code)",
  "Dew-point (C)", "Dew-point source", "Dew-point uncert (code)", "RHum (%)", "RHum source", "RHum uncert (code)",
  "Pressure (mbar)", "Pressure source", "Pressure uncert (code)", "Wdir (degrees)", "Wdir source", "Wdir uncert (code)",
  "Wspd (m/s)", "Wspd source", "Wspd uncert (code)", "Hvis (m)", "Hvis source", "Hvis uncert (code)",
  "CeilHgt (m)", "CeilHgt source", "CeilHgt uncert (code)", "Pwat (cm)", "Pwat source", "Pwat uncert (code)",
  "AOD (unitless)", "AOD source", "AOD uncert (code)", "Alb (unitless)", "Alb source", "Alb uncert (code)",
  "Lprecip depth (mm)", "Lprecip quantity (hr)", "Lprecip source", "Lprecip uncert (code)",
];

export interface Tmy3Options {
  /** Station line fields; the defaults name an invented station. */
  stationId?: string;
  name?: string;
  state?: string;
  timeZoneH?: number;
  latitudeDeg?: number;
  longitudeDeg?: number;
  elevationM?: number;
  /** 0-based hours of the year to leave out (missing rows). */
  dropHours?: number[];
  /** Write the pressure column in kPa under its usual "(mbar)" heading (a unit mistake), or under a "(kPa)" heading. */
  pressure?: "mbar" | "kPaMislabelled" | "kPaHeader";
  /** Write hour-starting times 00:00 … 23:00 instead of hour-ending 01:00 … 24:00. */
  hourStarting?: boolean;
  /** CRLF line ends, as files written on Windows have. */
  crlf?: boolean;
}

/** The year each month is taken from, as a typical year mixes years. */
const MONTH_YEARS = [1991, 1988, 2001, 1995, 1999, 1990, 2003, 1986, 1997, 2004, 1992, 1989];

/** The TMY3-layout text of a generated year. */
export function tmy3Text(year: SyntheticYear, o: Tmy3Options = {}): string {
  const drop = new Set(o.dropHours ?? []);
  const station = [
    o.stationId ?? "999123",
    `"${o.name ?? "HARROWGATE FLATS INVENTED"}"`,
    o.state ?? "ZZ",
    (o.timeZoneH ?? -6).toFixed(1),
    (o.latitudeDeg ?? 41.8).toFixed(3),
    (o.longitudeDeg ?? -96.4).toFixed(3),
    String(o.elevationM ?? 240),
  ].join(",");
  const header = TMY3_HEADER.map((h) => (o.pressure === "kPaHeader" && h === "Pressure (mbar)" ? "Pressure (kPa)" : h)).join(",");
  const lines = [station, header];
  year.hours.forEach((h, i) => {
    if (drop.has(i)) return;
    const y = MONTH_YEARS[h.month - 1]!;
    const date = `${String(h.month).padStart(2, "0")}/${String(h.day).padStart(2, "0")}/${y}`;
    const clock = o.hourStarting ? `${String(h.hour).padStart(2, "0")}:00` : `${String(h.hour + 1).padStart(2, "0")}:00`;
    const mbar = h.pressurePa / 100;
    const p = o.pressure === "kPaMislabelled" || o.pressure === "kPaHeader" ? (h.pressurePa / 1000).toFixed(2) : mbar.toFixed(0);
    const row = [
      date, clock, "0", "0",
      "0", "1", "0", "0", "1", "0",
      "0", "1", "0", "0", "1", "0",
      "0", "1", "0", "0", "1", "0",
      "0", "1", "0", "5", "E", "9",
      "3", "E", "9", h.dryBulbC.toFixed(1), "A", "7",
      h.dewPointC.toFixed(1), "A", "7", String(h.relativeHumidityPercent), "A", "7",
      p, "A", "7", String(h.windDirectionDeg), "A", "7",
      h.windSpeedMPerS.toFixed(1), "A", "7", "16000", "B", "7",
      "1200", "A", "7", "1.2", "E", "8",
      "0.08", "F", "8", "0.17", "F", "8",
      "0", "1", "D", "9",
    ];
    lines.push(row.join(","));
  });
  return lines.join(o.crlf ? "\r\n" : "\n") + (o.crlf ? "\r\n" : "\n");
}
