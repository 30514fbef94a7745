/**
 * Number formatting shared by the PDF, the page components and the tests (so a test can look for the
 * exact string the report prints). en-US grouping; a true minus sign would fall outside what some PDF
 * text extractors map, so negatives use the ASCII hyphen-minus Intl produces.
 */

const moneyFormatters = new Map<string, Intl.NumberFormat>();

function moneyFormatter(currency: string, decimals: number): Intl.NumberFormat {
  const key = `${currency}:${decimals}`;
  let f = moneyFormatters.get(key);
  if (!f) {
    try {
      f = new Intl.NumberFormat("en-US", {
        style: "currency",
        currency,
        minimumFractionDigits: decimals,
        maximumFractionDigits: decimals,
      });
    } catch {
      // An unknown ISO code: plain grouping with the code in front.
      const plain = new Intl.NumberFormat("en-US", {
        minimumFractionDigits: decimals,
        maximumFractionDigits: decimals,
      });
      f = { format: (v: number) => `${currency} ${plain.format(v)}` } as Intl.NumberFormat;
    }
    moneyFormatters.set(key, f);
  }
  return f;
}

/** Money in whole currency units by default: "$1,234,567", "-$12,000". */
export function fmtMoney(value: number, currency: string, decimals = 0): string {
  if (!Number.isFinite(value)) return "n/a";
  // Avoid "-$0" for values that round to zero.
  const v = Math.abs(value) < 0.5 * 10 ** -decimals ? 0 : value;
  return moneyFormatter(currency, decimals).format(v);
}

/** Money in thousands for chart axes: "$1.2M", "$350k". */
export function fmtMoneyShort(value: number, currency: string): string {
  const abs = Math.abs(value);
  const sign = value < 0 ? "-" : "";
  const symbol = moneyFormatter(currency, 0)
    .format(0)
    .replace(/[0.,\s]/g, "");
  if (abs >= 1e6) return `${sign}${symbol}${(abs / 1e6).toFixed(abs >= 1e7 ? 0 : 1)}M`;
  if (abs >= 1e3) return `${sign}${symbol}${(abs / 1e3).toFixed(0)}k`;
  return `${sign}${symbol}${abs.toFixed(0)}`;
}

const numberFormatters = new Map<number, Intl.NumberFormat>();
export function fmtNumber(value: number, decimals = 0): string {
  if (!Number.isFinite(value)) return "n/a";
  let f = numberFormatters.get(decimals);
  if (!f) {
    f = new Intl.NumberFormat("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
    numberFormatters.set(decimals, f);
  }
  const v = Math.abs(value) < 0.5 * 10 ** -decimals ? 0 : value;
  return f.format(v);
}

/** A value with about `digits` significant digits, grouped: 12,300 · 4.56 · 0.0123. */
export function fmtSignificant(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return "n/a";
  if (value === 0) return "0";
  const mag = Math.floor(Math.log10(Math.abs(value)));
  const decimals = Math.max(0, digits - 1 - mag);
  return fmtNumber(Number(value.toPrecision(digits)), Math.min(decimals, 6));
}

/** A fraction as a percentage: 0.03 → "3.0%". */
export function fmtPercent(fraction: number | null | undefined, decimals = 1): string {
  if (fraction === null || fraction === undefined || !Number.isFinite(fraction)) return "n/a";
  return `${fmtNumber(fraction * 100, decimals)}%`;
}

/** A rate as percent per year: "3.0%/yr". */
export function fmtRatePerYear(fraction: number): string {
  return `${fmtPercent(fraction)}/yr`;
}

export function fmtRatio(value: number | null | undefined, decimals = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "n/a";
  return fmtNumber(value, decimals);
}

export function fmtYears(value: number | null | undefined, decimals = 1): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "n/a";
  return `${fmtNumber(value, decimals)} yr`;
}

/** "1 December 2026" in UTC, for cover pages. */
export function fmtDate(d: Date): string {
  return new Intl.DateTimeFormat("en-GB", {
    day: "numeric",
    month: "long",
    year: "numeric",
    timeZone: "UTC",
  }).format(d);
}

/** "2026-12-01" for file names and tables. */
export function isoDate(d: Date): string {
  return d.toISOString().slice(0, 10);
}

/**
 * A study year's calendar year, saying which is which where two share one: the base date (year 0, 1 January
 * of the base year: first costs) and the first operating year fall in the same calendar year, so those two
 * read "2026 (year 0, first cost)" and "2026 (year 1, first operating year)"; later years are the plain year.
 * The one wording of the workbook, the PDF and the CSV.
 */
export function calendarYearLabel(yearIndex: number, calendarYear: number): string {
  if (yearIndex === 0) return `${calendarYear} (year 0, first cost)`;
  if (yearIndex === 1) return `${calendarYear} (year 1, first operating year)`;
  return String(calendarYear);
}
