/**
 * The cash-flow workbook read back with exceljs: formulas where finance expects them, cached results
 * equal to the engine's present values within a cent, user text neutralised, and — recalculated with
 * the test's own formula evaluator (./formula.ts; no spreadsheet program is installed here) — an NPV
 * that follows the discount-rate cell: it matches the engine's own re-evaluation at the new rate
 * (lib/engine/economics whatIf) and the `financial` package's npv (numpy-financial's convention).
 */
import ExcelJS from "exceljs";
import { npv } from "financial";
import { beforeAll, describe, expect, it } from "vitest";
import { whatIf } from "@/lib/engine/economics";
import { economicsOptionsOf } from "@/lib/engine/condenser-plan";
import type { ScenarioInput } from "@/lib/engine/input";
import type { ReportSource } from "@/lib/reports/types";
import { NAMES, buildWorkbook, cashFlowSheetName, lccName } from "@/lib/reports/workbook";
import { reportSource } from "./fixture";
import { WorkbookEvaluator } from "./formula";

const CENT = 0.01;

async function load(src: ReportSource): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load((await buildWorkbook(src)) as unknown as ArrayBuffer);
  return wb;
}

function formulaOf(cell: ExcelJS.Cell): string | undefined {
  const v = cell.value as { formula?: string } | null;
  return v && typeof v === "object" && "formula" in v ? v.formula : undefined;
}

/**
 * The cached result of a formula cell. exceljs writes a cached 0 as <v>0</v> but its reader drops it
 * (checked on the raw sheet XML), so a missing result reads as 0 here; every other value must be there.
 */
function resultOf(cell: ExcelJS.Cell): number {
  const r = (cell.value as { result?: unknown }).result;
  return r === undefined ? 0 : Number(r);
}

function headerIndex(ws: ExcelJS.Worksheet, startsWith: string): number {
  const row = ws.getRow(4);
  for (let c = 1; c <= row.cellCount; c++)
    if (String(row.getCell(c).value ?? "").startsWith(startsWith)) return c;
  throw new Error(`no column ${startsWith}`);
}

function storedEconomics(src: ReportSource) {
  const input = src.input as ScenarioInput;
  return {
    physics: src.result.physics,
    // The options as the engine priced them (condenser plans folded into their costs).
    options: economicsOptionsOf(input),
    tariffs: input.tariffs,
    upkeep: input.upkeep,
    economics: input.economics,
  };
}

describe("cash-flow workbook (end-of-year, real)", () => {
  let src: ReportSource;
  let wb: ExcelJS.Workbook;
  beforeAll(async () => {
    src = await reportSource({ scenarioName: '=HYPERLINK("http://x","y")' });
    // A user-entered option label that looks like a formula.
    src.result.economics.options[1]!.label = "+1+1";
    const t0 = performance.now();
    wb = await load(src);
    console.log(`[report] workbook built and re-read in ${(performance.now() - t0).toFixed(0)} ms`);
  });

  it("has an Inputs sheet of named cells, a summary, the condensers and footprint, and one cash-flow sheet per option", () => {
    expect(wb.worksheets.map((w) => w.name)).toEqual([
      "Inputs",
      "Summary",
      "Condensers",
      ...src.result.economics.options.map((_, i) => cashFlowSheetName(i)),
    ]);
    const ev = new WorkbookEvaluator(wb);
    expect(ev.nameValue(NAMES.realRate)).toBeCloseTo(src.result.economics.realDiscountRate, 12);
    expect(ev.nameValue(NAMES.inflation)).toBeCloseTo(src.result.economics.inflationRate, 12);
    expect(ev.nameValue(NAMES.period)).toBe(src.result.economics.studyPeriodYears);
    expect(ev.nameValue(NAMES.baseYear)).toBe(src.result.economics.baseYear);
    expect(ev.nameValue(NAMES.basis)).toBe(src.result.economics.analysis);
    for (const n of ["ElectricityPrice", "DemandCharge", "WaterPrice", "SewerPrice", "LabourRate"])
      expect(ev.nameRef(n)).toBeDefined();
  });

  it("spells out the water-management programme and says which 2026 is the base date and which the first operating year", () => {
    // The fixture's base year is 2026 (tests/fixtures/scenario-bins.json): year 0 is 1 January 2026 (first
    // costs), year 1 the first operating year, also 2026 (NIST Handbook 135's base date and study years).
    expect(src.result.economics.baseYear).toBe(2026);
    const ws = wb.getWorksheet(cashFlowSheetName(0))!;
    const header = (ws.getRow(4).values as unknown[]).map((v) => String(v ?? ""));
    expect(header).toContain("Chemicals & water-management programme (USD)");
    expect(header).toContain("PV Chemicals & water-management programme (USD)");
    expect(header.join(" ")).not.toMatch(/\bWMP\b/);
    expect(ws.getCell(5, 1).value).toBe(0);
    expect(ws.getCell(5, 2).value).toBe("2026 (year 0, first cost)");
    expect(ws.getCell(6, 1).value).toBe(1);
    expect(ws.getCell(6, 2).value).toBe("2026 (year 1, first operating year)");
    expect(ws.getCell(7, 2).value).toBe(2027);
  });

  it("writes discount factors, present values, totals and LCC as formulas with the engine's values cached", () => {
    src.result.economics.options.forEach((o, i) => {
      const ws = wb.getWorksheet(cashFlowSheetName(i))!;
      const df = headerIndex(ws, "Discount factor");
      const pvTotal = headerIndex(ws, "PV total");
      const pvEnergy = headerIndex(ws, "PV Electric energy");
      o.cashFlows.forEach((cf, k) => {
        const r = 5 + k;
        expect(formulaOf(ws.getCell(r, df))).toBe(`1/(1+${NAMES.rate})^A${r}`);
        // Handbook 135 single present value factor (1 + d)^-t.
        expect(resultOf(ws.getCell(r, df))).toBeCloseTo(
          Math.pow(1 + src.result.economics.discountRate, -cf.yearIndex),
          12,
        );
        expect(formulaOf(ws.getCell(r, pvEnergy))).toMatch(new RegExp(`^[A-Z]+${r}\\*\\$[A-Z]+${r}$`));
        expect(Math.abs(resultOf(ws.getCell(r, pvEnergy)) - cf.presentValueByCategory.energy)).toBeLessThan(
          CENT,
        );
        expect(Math.abs(resultOf(ws.getCell(r, pvTotal)) - cf.presentValue)).toBeLessThan(CENT);
        expect(typeof ws.getCell(r, 4).value).toBe("number");
      });
      const totalRow = 5 + o.cashFlows.length;
      expect(formulaOf(ws.getCell(totalRow, pvTotal))).toMatch(/^SUM\(/);
      expect(Math.abs(resultOf(ws.getCell(totalRow, pvTotal)) - o.lcc)).toBeLessThan(CENT);
    });
    const summary = wb.getWorksheet("Summary")!;
    src.result.economics.options.forEach((o, i) => {
      expect(formulaOf(summary.getCell(5 + i, 3))).toBe(lccName(i));
      expect(Math.abs(resultOf(summary.getCell(5 + i, 3)) - o.lcc)).toBeLessThan(CENT);
      expect(formulaOf(summary.getCell(5 + i, 5))).toMatch(/^LCC_\d+-LCC_\d+$/);
      expect(summary.getCell(5 + i, 3).numFmt).toContain("#,##0");
    });
  });

  it("recalculates to the cached values, and follows a changed discount rate like the engine does", () => {
    const ev = new WorkbookEvaluator(wb);
    const eco = src.result.economics;
    eco.options.forEach((o, i) => {
      expect(Math.abs(Number(ev.nameValue(lccName(i))) - o.lcc)).toBeLessThan(CENT);
      // financial.npv discounts values[0] at t = 0 (numpy-financial convention), i.e. exactly an LCC.
      expect(
        Math.abs(
          npv(
            eco.discountRate,
            o.cashFlows.map((c) => c.total),
          ) - o.lcc,
        ),
      ).toBeLessThan(CENT);
    });
    const newRate = 0.07;
    ev.setName(NAMES.realRate, newRate);
    const engineAtNewRate = whatIf(storedEconomics(src), { discountRate: newRate });
    eco.options.forEach((o, i) => {
      const sheetLcc = Number(ev.nameValue(lccName(i)));
      const engineLcc = engineAtNewRate.options.find((x) => x.optionId === o.optionId)!.lcc;
      expect(Math.abs(sheetLcc - engineLcc)).toBeLessThan(CENT);
      expect(
        Math.abs(
          sheetLcc -
            npv(
              newRate,
              o.cashFlows.map((c) => c.total),
            ),
        ),
      ).toBeLessThan(CENT);
      expect(sheetLcc).toBeLessThan(o.lcc);
    });
    // Net savings on the summary sheet follow too.
    const base = eco.options.findIndex((o) => o.optionId === eco.baseOptionId);
    const s = wb.getWorksheet("Summary")!;
    const ns = Number(ev.evaluate(formulaOf(s.getCell(5 + 1, 5))!, "Summary"));
    const expected = engineAtNewRate.options[base]!.lcc - engineAtNewRate.options[1]!.lcc;
    expect(Math.abs(ns - expected)).toBeLessThan(CENT);
    // Switching the basis to nominal uses (1 + d)(1 + I) - 1 (NIST Handbook 135).
    ev.setName(NAMES.basis, "nominal");
    expect(Number(ev.nameValue(NAMES.rate))).toBeCloseTo((1 + newRate) * (1 + eco.inflationRate) - 1, 12);
  });

  it("neutralises user text that looks like a formula", () => {
    const inputs = wb.getWorksheet("Inputs")!;
    const scenarioCell = inputs.getCell("B5");
    expect(inputs.getCell("A5").value).toBe("Scenario");
    expect(scenarioCell.value).toBe(`'=HYPERLINK("http://x","y")`);
    expect(scenarioCell.type).toBe(ExcelJS.ValueType.String);
    const summary = wb.getWorksheet("Summary")!;
    expect(summary.getCell(6, 1).value).toBe("'+1+1");
    expect(wb.getWorksheet(cashFlowSheetName(1))!.getCell("A1").value).toBe("'+1+1: yearly cash flows");
    // No formula anywhere carries the injected text.
    for (const ws of wb.worksheets)
      ws.eachRow((row) => row.eachCell((c) => expect(formulaOf(c) ?? "").not.toMatch(/HYPERLINK/i)));
  });
});

describe("cash-flow workbook (mid-year, nominal)", () => {
  it("splits upkeep into yearly and event parts so every present value still matches the engine", async () => {
    const src = await reportSource({ analysis: "nominal", discounting: "midYear" });
    const wb = await load(src);
    const ev = new WorkbookEvaluator(wb);
    const eco = src.result.economics;
    expect(eco.analysis).toBe("nominal");
    expect(Number(ev.nameValue(NAMES.rate))).toBeCloseTo(eco.nominalDiscountRate, 12);
    eco.options.forEach((o, i) => {
      const ws = wb.getWorksheet(cashFlowSheetName(i))!;
      const pvTotal = headerIndex(ws, "PV total");
      o.cashFlows.forEach((cf, k) => {
        expect(Math.abs(Number(ev.value(ws.name, 5 + k, pvTotal)) - cf.presentValue)).toBeLessThan(CENT);
      });
      expect(Math.abs(Number(ev.nameValue(lccName(i))) - o.lcc)).toBeLessThan(CENT);
    });
  });
});
