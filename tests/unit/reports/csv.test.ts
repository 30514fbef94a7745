/**
 * CSV exports: RFC 4180 quoting, a header row whose columns carry their units, numbers as plain numbers
 * in the viewer's units, and user text neutralised against formula injection (OWASP "CSV Injection").
 */
import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { cashFlowsCsv, climateBinsCsv, csvField, waterEnergyCsv } from "@/lib/reports/csv";
import { neutraliseText } from "@/lib/reports/neutralise";
import { reportSource } from "./fixture";

function parse(csv: string): string[][] {
  // papaparse is the registry's reference CSV parser; it must read our output back field for field.
  const r = Papa.parse<string[]>(csv.trim(), { skipEmptyLines: true });
  expect(r.errors).toEqual([]);
  return r.data;
}

describe("formula-injection neutralising", () => {
  it("prefixes text that starts with = + - @ tab or CR (also after spaces, also full-width ＝ ＋ － ＠), and nothing else", () => {
    // OWASP "CSV Injection": = + - @ tab CR; some programs skip leading blanks and read the full-width forms
    // U+FF1D ＝, U+FF0B ＋, U+FF0D －, U+FF20 ＠ as formula starters too.
    for (const s of ["=1+1", "+1+1", "-2", "@SUM(A1)", "\tx", "\rx", '=HYPERLINK("http://x","y")', " =x", "   +1", "\u00a0=x", "＝1+1", " ＝SUM(A1)", "＋1", "－2", "＠SUM(A1)"])
      expect(neutraliseText(s)).toBe(`'${s}`);
    for (const s of ["Open tower", "1+1", "x =y", "", "'already", "  text", "Ｘ＝1"]) expect(neutraliseText(s)).toBe(s);
    expect(csvField('=HYPERLINK("http://x","y")')).toBe(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(csvField(-1234.5)).toBe("-1234.5");
  });
});

describe("CSV exports", () => {
  it("yearly cash flows: units in the header, one row per option and year, totals that add up", async () => {
    const src = await reportSource({ unitSystem: "IP" });
    src.result.economics.options[0]!.label = "=cmd|' /C calc'!A0";
    const rows = parse(cashFlowsCsv(src));
    const header = rows[0]!;
    expect(header).toContain("Electric energy (constant 2026 USD)");
    expect(header.some((h) => /^Present value \(USD at 1 January \d{4}\)$/.test(h))).toBe(true);
    const eco = src.result.economics;
    expect(rows.length - 1).toBe(eco.options.reduce((n, o) => n + o.cashFlows.length, 0));
    expect(rows[1]![0]).toBe("'=cmd|' /C calc'!A0");
    const pvCol = header.findIndex((h) => h.startsWith("Present value"));
    for (const o of eco.options) {
      const mine = rows.slice(1).filter((r) => r[0] === (o.label.startsWith("=") ? `'${o.label}` : o.label));
      const sum = mine.reduce((s, r) => s + Number(r[pvCol]), 0);
      // Sum of the rounded yearly present values: within a cent per row of the engine's LCC.
      expect(Math.abs(sum - o.lcc)).toBeLessThan(0.01 * mine.length);
    }
  });

  it("cash flows say which 2026 is year 0 (first cost) and which year 1 (first operating year), in a column of their own", async () => {
    // The fixture's base year is 2026: year 0 is 1 January 2026 (first costs) and year 1, the first operating
    // year, is also 2026 (NIST Handbook 135's base date and study years). The wording is the workbook's.
    const src = await reportSource({ unitSystem: "SI" });
    expect(src.result.economics.baseYear).toBe(2026);
    const rows = parse(cashFlowsCsv(src));
    const header = rows[0]!;
    // The numeric columns stay where they were and stay numbers; the label is the last column.
    expect(header.slice(0, 3)).toEqual(["Option", "Study year t", "Calendar year"]);
    expect(header.at(-2)).toBe("First cost");
    expect(header.at(-1)).toBe("Calendar year (labelled)");
    const label = header.length - 1;
    const first = src.result.economics.options[0]!.label;
    const mine = rows.slice(1).filter((r) => r[0] === first);
    expect(mine[0]!.slice(1, 3)).toEqual(["0", "2026"]);
    expect(mine[0]![label]).toBe("2026 (year 0, first cost)");
    expect(mine[1]!.slice(1, 3)).toEqual(["1", "2026"]);
    expect(mine[1]![label]).toBe("2026 (year 1, first operating year)");
    expect(mine[2]!.slice(1, 3)).toEqual(["2", "2027"]);
    expect(mine[2]![label]).toBe("2027");
  });

  it("water and energy: makeup = evaporation + drift + blowdown per row, volumes in kgal for IP", async () => {
    const src = await reportSource({ unitSystem: "IP" });
    const rows = parse(waterEnergyCsv(src));
    const h = rows[0]!;
    expect(h).toContain("Makeup (kgal)");
    expect(h).toContain("Total electric energy (kWh)");
    const [e, d, b, m] = ["Evaporation (kgal)", "Drift (kgal)", "Blowdown (kgal)", "Makeup (kgal)"].map((x) =>
      h.indexOf(x),
    );
    for (const r of rows.slice(1)) {
      // M = E + B + D exactly in the engine; here within the CSV's rounding (3 decimals).
      expect(Math.abs(Number(r[m!]) - Number(r[e!]) - Number(r[d!]) - Number(r[b!]))).toBeLessThan(0.002);
    }
    const year = rows.find((r) => r[1] === "Year")!;
    const phys = src.result.physics[0]!;
    // 1 kgal = 3.785411784 m³ (Methods §8).
    expect(Number(year[m!])).toBeCloseTo(phys.waterM3.makeup / 3.785411784, 2);
  });

  it("water and energy in SI carry m³", async () => {
    const src = await reportSource({ unitSystem: "SI" });
    const h = parse(waterEnergyCsv(src))[0]!;
    expect(h).toContain("Makeup (m³)");
  });

  it("climate bins: temperatures in the viewer's unit and hours that sum to the year", async () => {
    const src = await reportSource({ unitSystem: "IP" });
    const rows = parse(climateBinsCsv(src));
    expect(rows[0]!.some((x) => x.includes("(°F)"))).toBe(true);
    const hoursCol = rows[0]!.indexOf("Hours (h)");
    const total = rows.slice(1).reduce((s, r) => s + Number(r[hoursCol]), 0);
    // A typical year has 8760 hours (8784 with 29 February): common practice, no source.
    expect([8760, 8784]).toContain(Math.round(total));
  });
});
