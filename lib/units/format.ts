/**
 * Number formatting for engineering values: significant figures or fixed decimals, thousands
 * separators, a real minus sign. One locale (en-US digits, comma groups, point decimals) so the server
 * and the browser render the same text (no hydration mismatch) and reports match the screens.
 */
import { QUANTITIES, type QuantityDef, type QuantityKind, type UnitSystem } from "./quantities";

export interface FormatOptions {
  /** Significant figures (default 4) — ignored when `decimals` is given. */
  sig?: number;
  /** Fixed decimals instead of significant figures. */
  decimals?: number;
  /** Thousands separators (default true). */
  grouping?: boolean;
  /** Text for NaN/±Infinity/null (default "—"). */
  missing?: string;
}

const MINUS = "\u2212";

/** Round to `sig` significant figures (1…21). 0 and non-finite values are returned as they are. */
export function roundToSignificant(value: number, sig: number): number {
  if (!Number.isFinite(value) || value === 0) return value;
  // toPrecision rounds in decimal, so 0.15 → "0.15" stays 0.15 rather than drifting through binary scaling.
  return Number(value.toPrecision(Math.max(1, Math.min(21, Math.floor(sig)))));
}

/** Format a number with thousands separators and a true minus sign: "1,235", "0.0065", "−3.2" (sig 4). */
export function formatNumber(value: number | null | undefined, options: FormatOptions = {}): string {
  const missing = options.missing ?? "—";
  if (value === null || value === undefined || !Number.isFinite(value)) return missing;
  const grouping = options.grouping ?? true;
  let text: string;
  if (options.decimals !== undefined) {
    const d = Math.max(0, Math.min(20, Math.floor(options.decimals)));
    text = new Intl.NumberFormat("en-US", { minimumFractionDigits: d, maximumFractionDigits: d, useGrouping: grouping }).format(value);
  } else {
    const sig = Math.max(1, Math.min(21, Math.floor(options.sig ?? 4)));
    const rounded = roundToSignificant(value, sig);
    text = new Intl.NumberFormat("en-US", { maximumSignificantDigits: sig, useGrouping: grouping }).format(rounded);
  }
  // "-0" after rounding reads as a sign error; show 0.
  if (/^-0(\.0*)?$/.test(text)) text = text.slice(1);
  return text.replace(/^-/, MINUS);
}

/** The value of a stored SI quantity in `system`'s unit, formatted, with its unit ("85.0 °F", "1,200 gpm"). */
export function formatQuantity(
  kind: QuantityKind,
  valueSI: number | null | undefined,
  system: UnitSystem,
  options: FormatOptions & { currency?: string; withUnit?: boolean } = {},
): string {
  const def = QUANTITIES[kind] as QuantityDef;
  const u = def[system];
  const shown = valueSI === null || valueSI === undefined ? valueSI : valueSI / u.factor + (u.offset ?? 0);
  const text = formatNumber(shown, options);
  if (options.withUnit === false || text === (options.missing ?? "—")) return text;
  const symbol = u.symbol.replace("{cur}", options.currency ?? "USD");
  if (!symbol) return text;
  // Degree signs and % sit close to the number in engineering usage ("25 °C" keeps a space by SI rule; "%" too).
  return `${text}\u00a0${symbol}`;
}

/**
 * Parse a number typed by a person: accepts a leading "−" or "-", a decimal point, or a decimal comma
 * when the text has no point and the comma is not a thousands group ("1,5" → 1.5, "1,500" → 1500,
 * "1,234.5" → 1234.5), spaces and thin spaces as digit groups, and exponents ("1e-4").
 * Returns null for empty text and NaN for text that is not a number.
 */
export function parseNumberInput(text: string): number | null {
  let s = text.trim().replace(/[\u00a0\u2009\u202f ]/g, "").replace(/^\u2212/, "-");
  if (s === "") return null;
  if (/^[-+]?\d{1,3}(,\d{3})+(\.\d*)?$/.test(s)) s = s.replace(/,/g, "");
  else if (!s.includes(".") && /^[-+]?\d*,\d+$/.test(s)) s = s.replace(",", ".");
  if (!/^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(s)) return NaN;
  return Number(s);
}

/** A displayed value's text for an input box: enough digits to round-trip what the person sees, no grouping. */
export function inputText(value: number | null | undefined, sig = 6): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  const r = roundToSignificant(value, sig);
  // Number → string gives the shortest exact text ("0.0001", "85", "1e-7"), never grouped.
  return String(Object.is(r, -0) ? 0 : r);
}

/** Significant figures an input box shows for a value converted out of its stored unit (kW → hp, °C → °F). */
export const CONVERTED_INPUT_SIG = 4;

/** Significant digits written in a number's text ("29.5025" → 6, "0.0065" → 2, "264000" → 3). */
function significantDigitsOf(text: string): number {
  const mantissa = text.replace(/^[-+]/, "").replace(/e.*$/i, "");
  const digits = mantissa.replace(".", "").replace(/^0+/, "");
  return (mantissa.includes(".") ? digits : digits.replace(/0+$/, "")).length || 1;
}

/**
 * An input box's text for a value converted from its stored unit: 22 kW reads "29.5" hp, not "29.5025".
 * Four significant figures, more where the whole-number part needs them (264,172 gal stays 264172), and a
 * value that already reads in five significant figures or fewer is shown as it is, so a number a person
 * typed in these units reads back as typed (1234.5 gpm stays 1234.5). Only the text is rounded: the form
 * keeps the stored value, so a box nobody edits saves back exactly what was stored.
 */
export function convertedInputText(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return "";
  const six = inputText(value, 6);
  if (significantDigitsOf(six) <= 5) return six;
  const abs = Math.abs(value);
  const wholeDigits = abs >= 1 ? Math.floor(Math.log10(abs)) + 1 : 0;
  return inputText(value, Math.max(CONVERTED_INPUT_SIG, wholeDigits));
}
