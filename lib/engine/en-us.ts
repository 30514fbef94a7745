/**
 * Numbers in the engine's English texts (warnings, explanations, report lines) with thousands separators,
 * as `toLocaleString("en-US")` writes them, through one shared formatter: `toLocaleString` builds a new
 * ICU formatter on every call, which a warning per option per analysis made visible in profiles.
 */
const EN_US = new Intl.NumberFormat("en-US");

/** `x.toLocaleString("en-US")`, the same text. */
export function enUsNumber(x: number): string {
  return EN_US.format(x);
}
