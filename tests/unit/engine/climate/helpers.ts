import {
  generateSyntheticYear,
  syntheticYearToEpw,
  type SyntheticYear,
} from "@/lib/engine/climate/synthetic";

/** A generated year and its EPW text, cached per seed/leap so the suites stay fast. */
const cache = new Map<string, { year: SyntheticYear; epw: string; lines: string[] }>();
export function syntheticEpw(seed = 7, leapYear = false) {
  const key = `${seed}:${leapYear}`;
  let v = cache.get(key);
  if (!v) {
    const year = generateSyntheticYear({ seed, leapYear });
    const epw = syntheticYearToEpw(year);
    v = { year, epw, lines: epw.split("\n") };
    cache.set(key, v);
  }
  return v;
}

/** 1-based file line of data hour i (0-based) in an hourly EPW. */
export const epwLineOfHour = (i: number) => 9 + i;

/** Replace 0-based field `field` of the data row of hour i. */
export function withField(lines: string[], i: number, field: number, value: string): string[] {
  const out = lines.slice();
  const idx = epwLineOfHour(i) - 1;
  const f = out[idx]!.split(",");
  f[field] = value;
  out[idx] = f.join(",");
  return out;
}

export function unwrap<T>(r: { ok: true; value: T } | { ok: false; errors: unknown[] }): T {
  if (!r.ok) throw new Error(`expected ok, got ${JSON.stringify(r.errors.slice(0, 3))}`);
  return r.value;
}
