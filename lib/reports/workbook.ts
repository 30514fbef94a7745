/**
 * The cash-flow workbook (.xlsx, exceljs) for finance: an Inputs sheet of named cells, one cash-flow
 * sheet per option whose discount factors, present values, totals and LCC are LIVE formulas on the
 * Inputs sheet, and a Summary sheet of LCC and net savings by formula. Each formula cell also carries
 * the engine's value as its cached result, so a viewer that does not recalculate shows the issued numbers.
 *
 * The yearly amounts are the engine's (priced from the yearly physics and the tariffs); what finance can
 * change live is the discounting: the real discount rate, inflation and the analysis basis.
 */
import { condenserPlanTable, footprintTable, inventoryCautionTexts, type OptionRowsTable } from "./condenser-footprint";
import { firstCostsMissingLabels, firstCostsMissingText } from "@/lib/scenarios/first-costs";
import ExcelJS from "exceljs";
import {
  COST_CATEGORIES,
  COST_CATEGORY_LABELS,
  type CostCategory,
  type OptionEconomics,
} from "@/lib/engine/economics/types";
import type { ScenarioInput } from "@/lib/engine/input";
import { calendarYearLabel, isoDate } from "./format";
import { neutraliseText } from "./neutralise";
import type { ReportSource } from "./types";
import { convert, unitOf } from "./units";

const MONEY = "#,##0.00;[Red]-#,##0.00";
const MONEY0 = "#,##0;[Red]-#,##0";
const FACTOR = "0.000000";
const PCT = "0.00%";

const INK = "FF17222B";
const BASIN = "FF157277";
const BASIN_50 = "FFEAF6F6";
const COPPER_100 = "FFF7E6DA";

/** Column letter of a 1-based index. */
export function col(n: number): string {
  let s = "";
  for (let x = n; x > 0; x = Math.floor((x - 1) / 26)) s = String.fromCharCode(65 + ((x - 1) % 26)) + s;
  return s;
}

/** Sheet name of option i (plain, so formulas never need to escape user text). */
export function cashFlowSheetName(i: number): string {
  return `Cash flows ${i + 1}`;
}

const SHORT_LABELS: Record<CostCategory, string> = {
  ...COST_CATEGORY_LABELS,
  upkeep: "Upkeep",
};

/**
 * The calendar-year cell of a cash-flow row. The base date (year 0, 1 January of the base year: first
 * costs) and the first operating year share a calendar year, so those two say which is which (the wording
 * of `calendarYearLabel`, shared with the PDF and the CSV); later years are plain numbers.
 */
export function calendarYearCell(yearIndex: number, calendarYear: number): string | number {
  return yearIndex <= 1 ? calendarYearLabel(yearIndex, calendarYear) : calendarYear;
}

/** Names of the Inputs sheet's cells (workbook-level defined names). */
export const NAMES = {
  realRate: "RealDiscountRate",
  inflation: "InflationRate",
  basis: "AnalysisBasis",
  nominalRate: "NominalDiscountRate",
  rate: "DiscountRate",
  period: "StudyPeriodYears",
  baseYear: "BaseYear",
  discounting: "Discounting",
} as const;

interface Layout {
  sheet: string;
  firstDataRow: number;
  lastDataRow: number;
  totalRow: number;
  /** Column of each amount (upkeep may be split in two for mid-year discounting). */
  lccCell: string;
}

function headerStyle(row: ExcelJS.Row) {
  row.font = { bold: true, color: { argb: INK } };
  row.alignment = { vertical: "top", wrapText: true };
  row.eachCell((c) => {
    c.fill = { type: "pattern", pattern: "solid", fgColor: { argb: BASIN_50 } };
    c.border = { bottom: { style: "thin", color: { argb: INK } } };
  });
}

function titleCell(ws: ExcelJS.Worksheet, ref: string, text: string, size = 14) {
  const c = ws.getCell(ref);
  c.value = neutraliseText(text);
  c.font = { bold: true, size, color: { argb: BASIN } };
}

function addInputsSheet(wb: ExcelJS.Workbook, src: ReportSource): void {
  const ws = wb.addWorksheet("Inputs", { properties: { tabColor: { argb: BASIN } } });
  const eco = src.result.economics;
  const input = (src.input ?? {}) as Partial<ScenarioInput>;
  const cur = src.project.currency;
  const sys = src.unitSystem;
  ws.columns = [{ width: 46 }, { width: 18 }, { width: 16 }, { width: 70 }];
  titleCell(ws, "A1", "LoopLedger cash-flow workbook");
  const facts: [string, string][] = [
    ["Project", src.project.name],
    ["Client", src.project.clientName],
    ["Site", src.project.siteName],
    ["Scenario", src.scenarioName],
    ["Version", src.versionLabel],
    [
      "Prepared by",
      `${src.preparedBy.firmName}${src.preparedBy.consultantName ? `, ${src.preparedBy.consultantName}` : ""}`,
    ],
    ["Issued", src.issuedAt ? isoDate(src.issuedAt) : "not issued (working draft)"],
    ["Engine version", src.engineVersion],
  ];
  facts.forEach(([k, v], i) => {
    ws.getCell(`A${i + 2}`).value = k;
    ws.getCell(`A${i + 2}`).font = { color: { argb: "FF6B7A86" } };
    ws.getCell(`B${i + 2}`).value = neutraliseText(v);
  });
  let r = facts.length + 3;
  const note = ws.getCell(`A${r}`);
  note.value =
    "Change the real discount rate, the inflation rate or the analysis basis (real / nominal) below: discount factors, present values, " +
    "totals, life-cycle costs and net savings on the other sheets are formulas on these cells and recalculate. The yearly amounts are " +
    "LoopLedger's, priced at the tariffs listed here; changing a price below does not re-price them.";
  note.alignment = { wrapText: true, vertical: "top" };
  ws.mergeCells(`A${r}:D${r}`);
  ws.getRow(r).height = 42;
  r += 2;
  const hdr = ws.getRow(r);
  hdr.values = ["Input", "Value", "Unit", "Note"];
  headerStyle(hdr);
  r++;
  const put = (
    label: string,
    value: number | string | { formula: string; result: number },
    unit: string,
    notes: string,
    fmt?: string,
    name?: string,
    editable = false,
  ) => {
    ws.getCell(`A${r}`).value = label;
    const c = ws.getCell(`B${r}`);
    c.value = value as ExcelJS.CellValue;
    if (fmt) c.numFmt = fmt;
    if (editable) c.fill = { type: "pattern", pattern: "solid", fgColor: { argb: COPPER_100 } };
    if (name) wb.definedNames.add(`Inputs!$B$${r}`, name);
    ws.getCell(`C${r}`).value = unit;
    ws.getCell(`D${r}`).value = notes;
    r++;
  };
  put(
    "Real discount rate",
    eco.realDiscountRate,
    "per year",
    "Change me: the owner's own real rate",
    PCT,
    NAMES.realRate,
    true,
  );
  put(
    "General inflation",
    eco.inflationRate,
    "per year",
    "Change me: used by a nominal analysis",
    PCT,
    NAMES.inflation,
    true,
  );
  put(
    "Analysis basis",
    eco.analysis,
    "real | nominal",
    "Change me: real = constant dollars; nominal = then-current dollars (the yearly amounts stay as analysed)",
    undefined,
    NAMES.basis,
    true,
  );
  put(
    "Nominal discount rate",
    { formula: `(1+${NAMES.realRate})*(1+${NAMES.inflation})-1`, result: eco.nominalDiscountRate },
    "per year",
    "(1 + d)(1 + I) - 1, NIST Handbook 135",
    PCT,
    NAMES.nominalRate,
  );
  put(
    "Discount rate used",
    {
      formula: `IF(${NAMES.basis}="nominal",${NAMES.nominalRate},${NAMES.realRate})`,
      result: eco.discountRate,
    },
    "per year",
    "the rate every discount factor uses",
    PCT,
    NAMES.rate,
  );
  put(
    "Study period",
    eco.studyPeriodYears,
    "years",
    "fixed by the analysis (one row per year)",
    "0",
    NAMES.period,
  );
  put(
    "Base year (1 January = base date)",
    eco.baseYear,
    "",
    "year 0 of the cash-flow sheets",
    "0",
    NAMES.baseYear,
  );
  put(
    "Discounting",
    eco.discounting === "midYear" ? "mid-year" : "end of year",
    "",
    eco.discounting === "midYear"
      ? "recurring costs at t - 0.5, events at t"
      : "every amount at the end of its year",
    undefined,
    NAMES.discounting,
  );
  r++;
  ws.getCell(`A${r}`).value = "Tariffs and prices (as analysed)";
  ws.getCell(`A${r}`).font = { bold: true, color: { argb: BASIN } };
  r++;
  const t = input.tariffs;
  const e = t?.electricity;
  const namedPrice = (label: string, v: number | undefined, unit: string, name: string, fmt = "0.0000") => {
    if (v === undefined || !Number.isFinite(v)) return;
    put(label, v, unit, "", fmt, name);
  };
  namedPrice(
    "Electricity energy price (flat or mean)",
    e
      ? e.pricing === "monthHour" && e.energyPricePerKWhByMonthHour?.length
        ? e.energyPricePerKWhByMonthHour.reduce((a, b) => a + b, 0) / e.energyPricePerKWhByMonthHour.length
        : e.energyPricePerKWh
      : undefined,
    `${cur}/kWh`,
    "ElectricityPrice",
  );
  namedPrice("Demand charge", e?.demandChargePerKWMonth, `${cur}/kW per month`, "DemandCharge", "0.00");
  namedPrice(
    "Water price",
    t?.water ? convert("pricePerM3", t.water.pricePerM3, sys) : undefined,
    unitOf("pricePerM3", sys, cur),
    "WaterPrice",
    "0.00",
  );
  namedPrice(
    "Sewer price",
    t?.sewer ? convert("pricePerM3", t.sewer.pricePerM3, sys) : undefined,
    unitOf("pricePerM3", sys, cur),
    "SewerPrice",
    "0.00",
  );
  namedPrice(
    "Treatment chemicals per volume of blowdown + drift",
    t?.chemicals ? convert("pricePerM3", t.chemicals.costPerM3Outflow, sys) : undefined,
    unitOf("pricePerM3", sys, cur),
    "ChemicalsPrice",
    "0.00",
  );
  namedPrice(
    "Water-management programme per wet loop",
    t?.waterManagementProgrammeCostPerYear,
    `${cur}/yr`,
    "WaterManagementCost",
    MONEY0,
  );
  namedPrice("Maintenance labour rate", input.upkeep?.labourRatePerHour, `${cur}/h`, "LabourRate", "0.00");
  const esc = t?.escalation;
  if (esc) {
    for (const [k, label] of [
      ["energy", "Energy"],
      ["demand", "Demand"],
      ["water", "Water"],
      ["sewer", "Sewer"],
      ["chemicals", "Chemicals"],
      ["labour", "Labour"],
      ["replacements", "Replacements"],
    ] as const) {
      put(
        `Real escalation: ${label.toLowerCase()}`,
        esc[k],
        "per year",
        "above general inflation",
        PCT,
        `Escalation${label}`,
      );
    }
  }
  ws.views = [{ state: "frozen", ySplit: 1 }];
}

/** Split a mid-year upkeep amount A with present value P into its recurring (t − 0.5) and event (t) parts. */
export function splitMidYear(
  amount: number,
  pv: number,
  d: number,
  t: number,
): { recurring: number; events: number } {
  const fEnd = Math.pow(1 + d, -t);
  const fMid = Math.pow(1 + d, -(t - 0.5));
  const recurring = Math.abs(fMid - fEnd) > 1e-15 ? (pv - amount * fEnd) / (fMid - fEnd) : amount;
  return { recurring, events: amount - recurring };
}

interface AmountColumn {
  key: string;
  title: string;
  /** Discounted with the mid-year factor (recurring costs under mid-year discounting). */
  mid: boolean;
  amount: (o: OptionEconomics, row: number) => number;
  pv: (o: OptionEconomics, row: number) => number;
}

function amountColumns(src: ReportSource): AmountColumn[] {
  const eco = src.result.economics;
  const midYear = eco.discounting === "midYear";
  const recurring = new Set<CostCategory>(["energy", "demand", "water", "sewer", "chemicals", "carbon"]);
  const cols: AmountColumn[] = [];
  for (const c of COST_CATEGORIES) {
    const at = (o: OptionEconomics, i: number) => o.cashFlows[i];
    if (c === "upkeep" && midYear) {
      const split = (o: OptionEconomics, i: number) => {
        const r = at(o, i);
        return r && r.yearIndex > 0
          ? splitMidYear(r.byCategory.upkeep, r.presentValueByCategory.upkeep, eco.discountRate, r.yearIndex)
          : { recurring: 0, events: r?.byCategory.upkeep ?? 0 };
      };
      const fEnd = (o: OptionEconomics, i: number) =>
        Math.pow(1 + eco.discountRate, -(at(o, i)?.yearIndex ?? 0));
      const fMid = (o: OptionEconomics, i: number) => {
        const t = at(o, i)?.yearIndex ?? 0;
        return t === 0 ? 1 : Math.pow(1 + eco.discountRate, -(t - 0.5));
      };
      cols.push({
        key: "upkeepRecurring",
        title: "Upkeep, yearly",
        mid: true,
        amount: (o, i) => split(o, i).recurring,
        pv: (o, i) => split(o, i).recurring * fMid(o, i),
      });
      cols.push({
        key: "upkeepEvents",
        title: "Upkeep, periodic events",
        mid: false,
        amount: (o, i) => split(o, i).events,
        pv: (o, i) => split(o, i).events * fEnd(o, i),
      });
      continue;
    }
    cols.push({
      key: c,
      title: SHORT_LABELS[c],
      mid: midYear && recurring.has(c),
      amount: (o, i) => at(o, i)?.byCategory[c] ?? 0,
      pv: (o, i) => at(o, i)?.presentValueByCategory[c] ?? 0,
    });
  }
  return cols;
}

function addCashFlowSheet(
  wb: ExcelJS.Workbook,
  src: ReportSource,
  o: OptionEconomics,
  index: number,
): Layout {
  const eco = src.result.economics;
  const cur = src.project.currency;
  const midYear = eco.discounting === "midYear";
  const sheet = cashFlowSheetName(index);
  const ws = wb.addWorksheet(sheet, { properties: { tabColor: { argb: "FFBF6A2E" } } });
  const amounts = amountColumns(src);
  titleCell(ws, "A1", `${o.label}: yearly cash flows`);
  ws.getCell("A2").value =
    `Amounts in ${eco.analysis === "real" ? `constant ${eco.baseYear}` : "then-current"} ${cur} as analysed; discount factors and present values are formulas on the Inputs sheet (DiscountRate).`;
  ws.getCell("A2").font = { italic: true, color: { argb: "FF3D4B57" } };

  const headerRow = 4;
  const first = headerRow + 1;
  const n = o.cashFlows.length;
  const last = first + n - 1;
  const totalRow = last + 1;
  // Columns: A year, B calendar, amounts…, total, DF (end), [DF mid], PVs…, PV total, cumulative PV.
  const amountStart = 3;
  const totalCol = amountStart + amounts.length;
  const dfCol = totalCol + 1;
  const dfMidCol = midYear ? dfCol + 1 : dfCol;
  const pvStart = dfMidCol + 1;
  const pvTotalCol = pvStart + amounts.length;
  const cumCol = pvTotalCol + 1;

  const header: string[] = [
    "Study year t",
    "Calendar year",
    ...amounts.map((a) => `${a.title} (${cur})`),
    `Total (${cur})`,
    "Discount factor 1/(1+DiscountRate)^t",
  ];
  if (midYear) header.push("Discount factor, mid-year 1/(1+DiscountRate)^(t-0.5)");
  header.push(...amounts.map((a) => `PV ${a.title} (${cur})`), `PV total (${cur})`, `Cumulative PV (${cur})`);
  const hr = ws.getRow(headerRow);
  hr.values = header;
  // Four lines of 11 pt: the longest headers ("PV Chemicals & water-management programme (USD)") wrap to four.
  hr.height = 62;
  headerStyle(hr);

  const d = eco.discountRate;
  for (let i = 0; i < n; i++) {
    const cf = o.cashFlows[i]!;
    const r = first + i;
    const t = cf.yearIndex;
    ws.getCell(r, 1).value = t;
    ws.getCell(r, 2).value = calendarYearCell(t, cf.calendarYear);
    amounts.forEach((a, j) => {
      const c = ws.getCell(r, amountStart + j);
      c.value = a.amount(o, i);
      c.numFmt = MONEY;
    });
    const tot = ws.getCell(r, totalCol);
    tot.value = { formula: `SUM(${col(amountStart)}${r}:${col(totalCol - 1)}${r})`, result: cf.total };
    tot.numFmt = MONEY;
    const df = ws.getCell(r, dfCol);
    df.value = { formula: `1/(1+${NAMES.rate})^A${r}`, result: Math.pow(1 + d, -t) };
    df.numFmt = FACTOR;
    if (midYear) {
      const dm = ws.getCell(r, dfMidCol);
      dm.value = {
        formula: `IF(A${r}=0,1,1/(1+${NAMES.rate})^(A${r}-0.5))`,
        result: t === 0 ? 1 : Math.pow(1 + d, -(t - 0.5)),
      };
      dm.numFmt = FACTOR;
    }
    amounts.forEach((a, j) => {
      const c = ws.getCell(r, pvStart + j);
      const factorCol = a.mid ? dfMidCol : dfCol;
      c.value = { formula: `${col(amountStart + j)}${r}*$${col(factorCol)}${r}`, result: a.pv(o, i) };
      c.numFmt = MONEY;
    });
    const pvt = ws.getCell(r, pvTotalCol);
    pvt.value = { formula: `SUM(${col(pvStart)}${r}:${col(pvTotalCol - 1)}${r})`, result: cf.presentValue };
    pvt.numFmt = MONEY;
    const cum = ws.getCell(r, cumCol);
    cum.value = {
      formula: i === 0 ? `${col(pvTotalCol)}${r}` : `${col(cumCol)}${r - 1}+${col(pvTotalCol)}${r}`,
      result: cf.cumulativePresentValue,
    };
    cum.numFmt = MONEY;
  }
  // Totals: sums of every amount and present-value column; the PV total's sum is the option's LCC.
  const tr = ws.getRow(totalRow);
  ws.getCell(totalRow, 1).value = "Total";
  const sumOf = (c: number, result: number) => ({
    formula: `SUM(${col(c)}${first}:${col(c)}${last})`,
    result,
  });
  amounts.forEach((a, j) => {
    const c = ws.getCell(totalRow, amountStart + j);
    c.value = sumOf(
      amountStart + j,
      o.cashFlows.reduce((s, _, i) => s + a.amount(o, i), 0),
    );
    c.numFmt = MONEY;
    const p = ws.getCell(totalRow, pvStart + j);
    p.value = sumOf(
      pvStart + j,
      o.cashFlows.reduce((s, _, i) => s + a.pv(o, i), 0),
    );
    p.numFmt = MONEY;
  });
  ws.getCell(totalRow, totalCol).value = sumOf(
    totalCol,
    o.cashFlows.reduce((s, c) => s + c.total, 0),
  );
  ws.getCell(totalRow, totalCol).numFmt = MONEY;
  const lcc = ws.getCell(totalRow, pvTotalCol);
  lcc.value = sumOf(pvTotalCol, o.lcc);
  lcc.numFmt = MONEY;
  tr.font = { bold: true };
  tr.eachCell(
    (c) =>
      (c.border = {
        top: { style: "thin", color: { argb: INK } },
        bottom: { style: "double", color: { argb: INK } },
      }),
  );

  const lccRow = totalRow + 2;
  ws.getCell(lccRow, 1).value = o.firstCostMissing
    ? `Present value of the costs entered so far (${cur}): first cost missing, not a life-cycle cost`
    : `Life-cycle cost, present value (${cur})`;
  ws.getCell(lccRow, 1).font = { bold: true, color: { argb: BASIN } };
  const lccCell = ws.getCell(lccRow, pvTotalCol);
  lccCell.value = { formula: `${col(pvTotalCol)}${totalRow}`, result: o.lcc };
  lccCell.numFmt = MONEY;
  lccCell.font = { bold: true, color: { argb: BASIN } };
  const name = lccName(index);
  wb.definedNames.add(`'${sheet}'!$${col(pvTotalCol)}$${lccRow}`, name);

  ws.getColumn(1).width = 12;
  ws.getColumn(2).width = 30;
  for (let c = 3; c <= cumCol; c++) ws.getColumn(c).width = c === dfCol || c === dfMidCol ? 14 : 15;
  ws.views = [{ state: "frozen", xSplit: 2, ySplit: headerRow }];
  return { sheet, firstDataRow: first, lastDataRow: last, totalRow, lccCell: name };
}

/** Defined name of option i's LCC cell. */
/** What a life-cycle cell holds while an option's first cost is not entered. */
const MISSING = "first costs missing";

export function lccName(i: number): string {
  return `LCC_${i + 1}`;
}

function addSummarySheet(wb: ExcelJS.Workbook, src: ReportSource, lccNames: string[]): void {
  const eco = src.result.economics;
  const cur = src.project.currency;
  const ws = wb.addWorksheet("Summary", { properties: { tabColor: { argb: INK } } });
  titleCell(ws, "A1", "Life-cycle cost summary");
  ws.getCell("A2").value = neutraliseText(`${src.project.name} | ${src.scenarioName} | ${src.versionLabel}`);
  const baseIndex = Math.max(
    0,
    eco.options.findIndex((o) => o.optionId === eco.baseOptionId),
  );
  const baseName = lccNames[baseIndex] ?? lccName(0);
  const missingLabels = firstCostsMissingLabels(eco);
  const anyMissing = missingLabels.length > 0;
  if (anyMissing) {
    ws.getCell("A3").value = neutraliseText(firstCostsMissingText(missingLabels));
    ws.getCell("A3").font = { bold: true, color: { argb: "FF9A4A00" } };
  }
  const hr = ws.getRow(4);
  hr.values = [
    "Option",
    `First cost (${cur})`,
    `Life-cycle cost, PV (${cur})`,
    `Annualised cost (${cur}/yr)`,
    `Net savings vs base (${cur})`,
    `LCC as analysed (${cur})`,
    `Difference from analysed (${cur})`,
  ];
  hr.height = 32;
  headerStyle(hr);
  eco.options.forEach((o, i) => {
    const r = 5 + i;
    const name = lccNames[i] ?? lccName(i);
    const base = eco.options[baseIndex]!;
    ws.getCell(r, 1).value = neutraliseText(`${o.label}${i === baseIndex ? " (base)" : ""}`);
    ws.getCell(r, 2).value = o.firstCost;
    ws.getCell(r, 3).value = { formula: name, result: o.lcc };
    ws.getCell(r, 4).value = {
      formula: `C${r}*${NAMES.rate}/(1-(1+${NAMES.rate})^(-${NAMES.period}))`,
      result: o.annualisedCost,
    };
    ws.getCell(r, 5).value = { formula: `${baseName}-${name}`, result: base.lcc - o.lcc };
    ws.getCell(r, 6).value = o.lcc;
    ws.getCell(r, 7).value = { formula: `C${r}-F${r}`, result: 0 };
    for (let c = 2; c <= 7; c++) ws.getCell(r, c).numFmt = MONEY;
    // No life-cycle figures without the option's first cost, and no net savings while any is missing.
    if (o.firstCostMissing) for (const c of [2, 3, 4, 6, 7]) ws.getCell(r, c).value = MISSING;
    if (anyMissing) ws.getCell(r, 5).value = MISSING;
    if (o.optionId === eco.lowestLccOptionId && !anyMissing) ws.getRow(r).font = { bold: true, color: { argb: BASIN } };
  });
  const noteRow = 6 + eco.options.length;
  ws.getCell(`A${noteRow}`).value =
    "Net savings = LCC of the base option minus LCC of the option (positive: the option is cheaper over its life). Annualised cost = LCC x CRF(DiscountRate, StudyPeriodYears). " +
    "'LCC as analysed' is LoopLedger's value at the issued discount rate; the difference column is zero until an input on the Inputs sheet changes.";
  ws.getCell(`A${noteRow}`).alignment = { wrapText: true, vertical: "top" };
  ws.mergeCells(`A${noteRow}:G${noteRow}`);
  ws.getRow(noteRow).height = 44;
  let r = noteRow + 2;
  ws.getCell(`A${r}`).value = "Savings measures at the analysed discount rate (ASTM E964, E1057)";
  ws.getCell(`A${r}`).font = { bold: true, color: { argb: BASIN } };
  r++;
  const mh = ws.getRow(r);
  mh.values = [
    "Alternative vs base",
    `Net savings (${cur})`,
    "SIR",
    "AIRR",
    "Simple payback (years)",
    "Discounted payback (years)",
  ];
  headerStyle(mh);
  for (const c of eco.comparisons) {
    r++;
    const alt = eco.options.find((o) => o.optionId === c.alternativeOptionId);
    ws.getCell(r, 1).value = neutraliseText(alt?.label ?? c.alternativeOptionId);
    ws.getCell(r, 2).value = c.netSavings;
    ws.getCell(r, 2).numFmt = MONEY;
    ws.getCell(r, 3).value = c.sir ?? "n/a";
    ws.getCell(r, 3).numFmt = "0.00";
    ws.getCell(r, 4).value = c.airr ?? "n/a";
    ws.getCell(r, 4).numFmt = PCT;
    ws.getCell(r, 5).value = c.simplePaybackYears ?? "n/a";
    ws.getCell(r, 5).numFmt = "0.0";
    ws.getCell(r, 6).value = c.discountedPaybackYears ?? "n/a";
    ws.getCell(r, 6).numFmt = "0.0";
    if (anyMissing) for (let k = 2; k <= 6; k++) ws.getCell(r, k).value = MISSING;
  }
  r += 2;
  ws.getCell(`A${r}`).value = "Yearly electricity by option (first year; each option pays its own compressor energy)";
  ws.getCell(`A${r}`).font = { bold: true, color: { argb: BASIN } };
  r++;
  const eh = ws.getRow(r);
  eh.values = [
    "Option",
    "Fans (kWh/yr)",
    "Pumps (kWh/yr)",
    "Spray pump (kWh/yr)",
    "Basin heater (kWh/yr)",
    "Compressors (kWh/yr)",
    "Total, priced (kWh/yr)",
    "Compressors above a clean condenser on the same water, explanation, not priced (kWh/yr)",
    "Holds the set-point in the 0.4 % design hour",
  ];
  eh.height = 44;
  headerStyle(eh);
  for (const o of eco.options) {
    const p = src.result.physics.find((x) => x.optionId === o.optionId);
    if (!p) continue;
    r++;
    const e = p.energyKWh;
    const num = (v: number) => (Number.isFinite(v) ? v : "n/a");
    ws.getCell(r, 1).value = neutraliseText(o.label);
    ws.getCell(r, 2).value = num(e.fan);
    ws.getCell(r, 3).value = num(e.condenserPump + e.secondaryPump);
    ws.getCell(r, 4).value = num(e.sprayPump);
    ws.getCell(r, 5).value = num(e.basinHeater);
    ws.getCell(r, 6).value = num(e.compressor);
    ws.getCell(r, 7).value = num(e.total);
    ws.getCell(r, 8).value = num(p.compressorAboveCleanReferenceKWh);
    ws.getCell(r, 9).value = p.designDay ? (p.designDay.holdsSetPoint ? "yes" : "no") : "n/a";
    for (let c = 2; c <= 8; c++) ws.getCell(r, c).numFmt = "#,##0";
  }
  ws.columns.forEach((c, i) => (c.width = i === 0 ? 40 : 20));
}

/**
 * Each option's condenser and upkeep plan (refrigerant in kg and lb) and its water and carbon footprint,
 * the same rows as the comparison and the PDF; numbers as numbers with the row's unit. No cash flows.
 */
function addCondenserSheet(wb: ExcelJS.Workbook, src: ReportSource): void {
  const plans = condenserPlanTable(src.result, src.unitSystem, src.project.currency);
  const footprint = footprintTable(src.result, src.unitSystem, src.project.currency);
  if (!plans && !footprint) return;
  const ws = wb.addWorksheet("Condensers", { properties: { tabColor: { argb: "FF5B6B3A" } } });
  titleCell(ws, "A1", "Condensers, refrigerant and footprint");
  let r = 3;
  const block = (title: string, t: OptionRowsTable) => {
    titleCell(ws, `A${r}`, title, 12);
    r += 1;
    const head = ws.getRow(r);
    head.values = ["", "Unit", ...t.columns.map((c) => neutraliseText(c.label))];
    headerStyle(head);
    r += 1;
    for (const row of t.rows) {
      const x = ws.getRow(r);
      x.values = [row.label, row.unit, ...row.cells.map((c) => (c.value !== null ? c.value : neutraliseText(c.text)))];
      x.alignment = { vertical: "top", wrapText: true };
      r += 1;
    }
    for (const n of t.notes) {
      ws.getCell(`A${r}`).value = neutraliseText(n);
      ws.getCell(`A${r}`).font = { italic: true, size: 9 };
      r += 1;
    }
    r += 1;
  };
  if (plans) block("Condenser construction and upkeep plan", plans);
  for (const c of inventoryCautionTexts(src.result)) {
    ws.getCell(`A${r}`).value = neutraliseText(c);
    ws.getCell(`A${r}`).font = { size: 9, color: { argb: "FF8A4B1F" } };
    r += 1;
  }
  r += 1;
  if (footprint) block("Water and carbon footprint", footprint);
  ws.getColumn(1).width = 44;
  ws.getColumn(2).width = 12;
  for (let i = 0; i < (plans ?? footprint)!.columns.length; i++) ws.getColumn(3 + i).width = 30;
}

/** The workbook as .xlsx bytes. */
export async function buildWorkbook(src: ReportSource): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  wb.creator = "LoopLedger";
  wb.company = neutraliseText(src.preparedBy.firmName);
  wb.title = neutraliseText(`${src.project.name}: ${src.scenarioName}`);
  wb.created = src.issuedAt ?? new Date();
  // Recalculate on open so the cached results are only ever the starting point.
  wb.calcProperties = { fullCalcOnLoad: true };
  addInputsSheet(wb, src);
  // The summary refers to the cash-flow sheets by defined name only, so it can come before them.
  addSummarySheet(
    wb,
    src,
    src.result.economics.options.map((_, i) => lccName(i)),
  );
  addCondenserSheet(wb, src);
  src.result.economics.options.forEach((o, i) => addCashFlowSheet(wb, src, o, i));
  const out = await wb.xlsx.writeBuffer();
  return Buffer.from(out as ArrayBuffer);
}
