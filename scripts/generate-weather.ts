/**
 * Writes an INVENTED typical weather year for the fictional site "Harrowgate Flats" (an inland valley
 * at 240 m; country code ZZ) as an EPW file and a CSV file. The data is synthetic: it imitates no
 * station and must never be presented as measured.
 *
 *   npx tsx scripts/generate-weather.ts [--seed N] [--leap] [--epw PATH] [--csv PATH]
 *
 * Defaults: seed 20240611, tests/fixtures/weather/harrowgate-flats.epw and
 * tests/fixtures/weather/harrowgate-flats.csv (`;` delimited, decimal comma, °C, RH %).
 *
 * Model (implemented in lib/engine/climate/synthetic.ts; t = hour of year, d = day of year at the
 * hour's middle, h = hour of day 0…23, angles in radians):
 *   Tm(d)  = 11 + 13·cos(2π(d − 200)/365)                       seasonal mean dry-bulb, °C
 *   Ad(d)  = 5 + 1.5·cos(2π(d − 200)/365)                       diurnal half-range, K
 *   D(h)   = cos(2π(h + 0.5 − 15)/24)                           diurnal shape, warmest 15:00
 *   x(t)   = 0.97·x(t−1) + 3·√(1 − 0.97²)·ε                      weather anomaly (AR(1), σ = 3 K), K
 *   T(t)   = Tm(d) + Ad(d)·D(h) + x(t)                          dry-bulb, °C (rounded to 0.1)
 *   Td(t)  = 5.5 + 10.5·cos(2π(d − 205)/365) + 0.4·x(t) + y(t) − 0.6·D(h),  Td ≤ T − 0.1
 *            y(t) = 0.95·y(t−1) + 2.2·√(1 − 0.95²)·ε             dew point, °C
 *   p(t)   = 101325·(1 − 2.25577e−5·240)^5.2559 + 650·s(t)       station pressure, Pa (ASHRAE 2017 ch.1 eq. 3)
 *   RH     = 100·pws(Td)/pws(T)                                  pws by Hyland–Wexler (ASHRAE 2017 ch.1 eq. 6)
 * ε ~ N(0, 1) (Box–Muller on a mulberry32 stream seeded with --seed): the same seed gives the same
 * file on every machine.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { dirname, resolve } from "node:path";
import {
  generateSyntheticYear,
  syntheticYearToCsv,
  syntheticYearToEpw,
} from "../lib/engine/climate/synthetic";

function arg(name: string): string | undefined {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 ? process.argv[i + 1] : undefined;
}

const seed = Number(arg("seed") ?? 20240611);
if (!Number.isInteger(seed)) {
  console.error("--seed must be an integer");
  process.exit(2);
}
const leapYear = process.argv.includes("--leap");
const epwPath = resolve(arg("epw") ?? "tests/fixtures/weather/harrowgate-flats.epw");
const csvPath = resolve(arg("csv") ?? "tests/fixtures/weather/harrowgate-flats.csv");

const year = generateSyntheticYear({ seed, leapYear });
for (const [path, text] of [
  [epwPath, syntheticYearToEpw(year)],
  [csvPath, syntheticYearToCsv(year, { delimiter: ";", decimalComma: true, temperatureUnit: "C" })],
] as const) {
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  console.log(`wrote ${path} (${(text.length / 1024).toFixed(0)} KiB, ${year.hours.length} h, seed ${seed})`);
}
