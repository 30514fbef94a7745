/**
 * Reads a bin table pasted from a spreadsheet: rows separated by line breaks, cells by tabs (what a
 * spreadsheet puts on the clipboard), semicolons or commas. Decimal commas are read when the cells are not
 * comma-separated. Header and blank rows are skipped. Client-safe, pure.
 */
import { parseNumberInput } from "@/lib/units";

export interface PastedBinRow {
  /** The bin's temperature, the coincident temperature, hours, optional month — as typed (display units). */
  bin: number;
  coincident: number;
  hours: number;
  month?: number;
  /** 1-based line in the pasted text. */
  line: number;
}

export interface PasteResult {
  rows: PastedBinRow[];
  problems: { line: number; message: string }[];
  delimiter: "\t" | ";" | ",";
}

function cellNumber(raw: string, decimalComma: boolean): number {
  const s = raw.trim();
  if (decimalComma && /^[-+\u2212]?\d*,\d+$/.test(s)) return Number(s.replace(",", ".").replace("\u2212", "-"));
  const n = parseNumberInput(s);
  return n === null ? NaN : n;
}

export function parsePastedBins(text: string): PasteResult {
  const lines = text.replace(/\r\n?/g, "\n").split("\n");
  const delimiter: PasteResult["delimiter"] = text.includes("\t") ? "\t" : text.includes(";") ? ";" : ",";
  const decimalComma = delimiter !== ",";
  const rows: PastedBinRow[] = [];
  const problems: PasteResult["problems"] = [];
  lines.forEach((raw, i) => {
    const line = i + 1;
    if (raw.trim() === "") return;
    const cells = raw.split(delimiter).map((c) => c.trim());
    while (cells.length > 0 && cells[cells.length - 1] === "") cells.pop();
    const numbers = cells.map((c) => cellNumber(c, decimalComma));
    // A first row without any number is a header.
    if (rows.length === 0 && problems.length === 0 && numbers.every((n) => Number.isNaN(n))) return;
    if (cells.length < 3 || cells.length > 4) {
      problems.push({ line, message: `expected 3 or 4 cells (bin, coincident, hours[, month]); found ${cells.length}` });
      return;
    }
    const bad = numbers.findIndex((n) => Number.isNaN(n));
    if (bad >= 0) {
      problems.push({ line, message: `cell ${bad + 1} "${cells[bad]}" is not a number` });
      return;
    }
    const [bin, coincident, hours, month] = numbers as [number, number, number, number | undefined];
    rows.push({ bin, coincident, hours, ...(month !== undefined ? { month } : {}), line });
  });
  return { rows, problems, delimiter };
}
