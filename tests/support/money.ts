/**
 * Numbers as a reader writes them, by the tests' own rule (not the report's formatters, which are code
 * under test): whole US dollars with comma grouping and a leading minus, "$1,234,567", "-$12,000".
 */
export function usd(value: number): string {
  const whole = Math.round(Math.abs(value));
  const grouped = String(whole).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  return `${value < 0 && whole !== 0 ? "-" : ""}$${grouped}`;
}

/** A number with fixed decimals and comma grouping: fixed(1234.5, 1) = "1,234.5". */
export function fixed(value: number, decimals: number): string {
  const [int, frac] = Math.abs(value).toFixed(decimals).split(".");
  const grouped = int!.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const sign = value < 0 && Number(Math.abs(value).toFixed(decimals)) !== 0 ? "-" : "";
  return `${sign}${grouped}${frac ? `.${frac}` : ""}`;
}
