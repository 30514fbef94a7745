import type { ClimateSourceKind } from "@/lib/climate/build";

export const SOURCE_LABELS: Record<ClimateSourceKind, string> = {
  epw: "EPW weather file",
  csv: "Hourly CSV",
  wetBulbBins: "Wet-bulb bin table",
  dryBulbBins: "Dry-bulb bin table",
};

/** A date as YYYY-MM-DD (UTC): the same text on the server and in every browser. */
export function isoDate(d: Date | string): string {
  return new Date(d).toISOString().slice(0, 10);
}
