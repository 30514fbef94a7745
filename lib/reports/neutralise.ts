/**
 * Formula-injection defence for exported text (OWASP "CSV Injection"): a spreadsheet treats a cell that
 * starts with `=`, `+`, `-` or `@` (and, in some programs, a leading tab or carriage return) as a formula.
 * Some programs skip leading spaces before deciding, and some read the full-width forms (＝ ＋ － ＠,
 * U+FF1D, U+FF0B, U+FF0D, U+FF20) as their ASCII twins, so those count too.
 * Text that came from a user is prefixed with an apostrophe so every program shows it as plain text.
 * Numbers are never passed through here: they are written as numbers.
 */
const FORMULA_LEAD = /^(?:[\t\r\n]|[\s\u00a0\u3000]*[=+\-@\uff1d\uff0b\uff0d\uff20])/;

export function startsLikeFormula(text: string): boolean {
  return FORMULA_LEAD.test(text);
}

/** User text made safe for a spreadsheet cell or a CSV field. */
export function neutraliseText(text: string): string {
  return startsLikeFormula(text) ? `'${text}` : text;
}
