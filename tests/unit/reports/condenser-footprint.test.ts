/**
 * The condenser-plan and footprint tables the comparison, the PDF and the workbook share: inventories in
 * kg and lb, water per year and per MWh in the viewer's units, CO₂e in tonnes, the carbon cost only when
 * priced, and the process-safety cautions. Expected values are written out by hand from the inputs below
 * with the conversion factors of NIST SP 811 (1 lb = 0.45359237 kg exactly; 1 US gal = 3.785411784 L).
 */
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import type { CondenserPlan } from "@/lib/engine/condenser-plan";
import type { ScenarioFootprint } from "@/lib/engine/footprint";
import { condenserPlanTable, footprintTable, inventoryCautionTexts, type CondenserFootprintResult } from "@/lib/reports/condenser-footprint";
import { buildWorkbook } from "@/lib/reports/workbook";
import { reportSource } from "./fixture";

function plan(optionId: string, over: Partial<CondenserPlan>): CondenserPlan {
  return {
    optionId,
    construction: "shellAndTube",
    constructionLabel: "Shell-and-tube",
    description: "",
    waterSide: "openTower",
    material: "carbonSteel",
    materialLabel: "Carbon steel tubes",
    cleanUWPerM2K: 1000,
    foulingGrowthMultiplier: 1,
    specificChargeKgPerKW: 0.08,
    specificChargeSource: "",
    inventoryKg: 80,
    cleaning: { method: "mechanicalTubeBrushing", methodLabel: "Mechanical tube brushing (water heads off)", costPerEvent: 3000, costSource: "", surface: "condenser" },
    inspection: { method: "eddyCurrentTesting", methodLabel: "Eddy-current testing of the tube walls", intervalYears: 3, costPerEvent: 4000, source: "" },
    wearPart: { name: "tube bundle", lifeYears: 20, replacementCost: null },
    firstCostItems: [],
    warnings: [],
    ...over,
  };
}

const footprintOption = (optionId: string, kgCO2eLeak: number) => ({
  optionId,
  // 10,000 m³ withdrawn and 8,000 m³ consumed over 5,000 MWh rejected: 2 and 1.6 m³/MWh.
  water: { withdrawnM3: 10_000, consumedM3: 8_000, withdrawnM3PerMWh: 2, consumedM3PerMWh: 1.6 },
  electricityKWh: 500_000,
  inventoryKg: 80,
  emissions: {
    electricityKgCO2e: 185_000, // 500,000 kWh × 0.37 kg/kWh
    leakageKgCO2e: kgCO2eLeak,
    totalKgCO2e: 185_000 + kgCO2eLeak,
    leakedRefrigerantKg: 4,
    totalKgCO2ePerMWh: (185_000 + kgCO2eLeak) / 5_000,
  },
});

function result(carbonPv: number): CondenserFootprintResult {
  const fp: ScenarioFootprint = {
    refrigerant: "R717",
    refrigerantLabel: "R-717 (ammonia)",
    gwp100: 0,
    gwpReport: "AR5",
    gwpReportLabel: "IPCC Fifth Assessment Report (2013), 100-year GWP",
    gridFactorKgCO2ePerKWh: 0.37,
    gridFactorYear: 2022,
    gridFactorSource: "test factor",
    annualLeakFraction: 0.05,
    options: [footprintOption("a", 0), footprintOption("b", 0)],
  };
  return {
    economics: {
      options: [
        { optionId: "a", label: "Tower, direct", pvByCategory: { carbon: carbonPv } },
        { optionId: "b", label: "Evaporative condenser", pvByCategory: { carbon: carbonPv } },
      ],
    },
    condensers: [
      plan("a", {}),
      plan("b", {
        construction: "evaporativeCondenserCoil",
        constructionLabel: "Evaporative condenser coil",
        waterSide: "sprayWater",
        cleanUWPerM2K: null,
        inventoryKg: 160,
        inspection: { method: "none", methodLabel: "No routine internal inspection (pressure and leak tests only)", intervalYears: 0, costPerEvent: 0, source: "" },
      }),
    ],
    footprint: fp,
  };
}

const cell = (t: ReturnType<typeof footprintTable>, key: string, i: number) => t!.rows.find((r) => r.key === key)!.cells[i]!;

describe("condenser plan table", () => {
  it("gives each option's refrigerant in kg and in lb (1 lb = 0.45359237 kg, NIST SP 811)", () => {
    const t = condenserPlanTable(result(0), "SI", "USD")!;
    expect(t.columns.map((c) => c.label)).toEqual(["Tower, direct", "Evaporative condenser"]);
    expect(cell(t, "inventoryKg", 0).value).toBe(80);
    // 80 / 0.45359237 = 176.3698 lb; 160 kg = 352.7396 lb.
    expect(cell(t, "inventoryLb", 0).value).toBeCloseTo(176.3698, 3);
    expect(cell(t, "inventoryLb", 1).value).toBeCloseTo(352.7396, 3);
    expect(cell(t, "inventoryLb", 0).text).toBe("180 lb");
  });

  it("shows eddy-current testing with its interval for tubes and no inspection interval for the coil", () => {
    const t = condenserPlanTable(result(0), "SI", "USD")!;
    expect(cell(t, "inspection", 0).text).toMatch(/eddy-current/i);
    expect(cell(t, "inspectionEvery", 0).value).toBe(3);
    expect(cell(t, "inspectionEvery", 1).text).toBe("—");
    expect(cell(t, "cleanU", 1).value).toBeNull();
  });

  it("gives the clean U in W/(m²·K) in SI and in Btu/(h·ft²·°F) in IP (1 Btu/(h·ft²·°F) = 5.678263 W/(m²·K), NIST SP 811 B.8)", () => {
    const si = condenserPlanTable(result(0), "SI", "USD")!;
    expect(si.rows.find((r) => r.key === "cleanU")!.unit).toBe("W/(m²·K)");
    expect(cell(si, "cleanU", 0).value).toBe(1000);
    expect(cell(si, "cleanU", 0).text).toBe("1,000 W/(m²·K)");
    const ip = condenserPlanTable(result(0), "IP", "USD")!;
    expect(ip.rows.find((r) => r.key === "cleanU")!.unit).toBe("Btu/(h·ft²·°F)");
    // By hand: 1000 / 5.678263 = 176.11 Btu/(h·ft²·°F), shown to 3 figures.
    expect(cell(ip, "cleanU", 0).value).toBeCloseTo(176.11, 2);
    expect(cell(ip, "cleanU", 0).text).toBe("176 Btu/(h·ft²·°F)");
    expect(cell(ip, "cleanU", 1).text).toBe("— (rated capacity)");
  });

  it("is absent for a result stored before condenser plans existed", () => {
    expect(condenserPlanTable({ economics: { options: [] } }, "SI", "USD")).toBeNull();
    expect(footprintTable({ economics: { options: [] } }, "SI", "USD")).toBeNull();
  });

  it("names the process-safety rules for ammonia and defers to the plant's programme and local codes", () => {
    const text = inventoryCautionTexts(result(0)).join(" ");
    expect(text).toContain("29 CFR 1910.119");
    expect(text).toContain("40 CFR Part 68");
    expect(text).toMatch(/process-safety management, local codes/);
  });
});

describe("footprint table", () => {
  it("reports water per year and per MWh in SI and in IP (1 US gal = 3.785411784 L, NIST SP 811)", () => {
    const si = footprintTable(result(0), "SI", "USD")!;
    expect(cell(si, "withdrawn", 0).value).toBe(10_000);
    expect(cell(si, "consumedPerMWh", 0).value).toBeCloseTo(1.6, 12);
    const ip = footprintTable(result(0), "IP", "USD")!;
    // 10,000 m³ = 10,000 / 3.785411784 kgal = 2641.72 kgal; 2 m³/MWh = 2000 / 3.785411784 gal = 528.344 gal/MWh.
    expect(cell(ip, "withdrawn", 0).value).toBeCloseTo(2641.72, 1);
    expect(cell(ip, "withdrawnPerMWh", 0).value).toBeCloseTo(528.344, 2);
    expect(ip.rows.find((r) => r.key === "withdrawnPerMWh")!.unit).toBe("gal/MWh");
  });

  it("gives CO₂e in tonnes and adds the carbon cost only when a carbon price is on", () => {
    const off = footprintTable(result(0), "SI", "USD")!;
    // 500,000 kWh × 0.37 kg/kWh = 185,000 kg = 185 t.
    expect(cell(off, "co2eElectricity", 0).value).toBe(185);
    expect(off.rows.some((r) => r.key === "carbonCostPv")).toBe(false);
    expect(off.notes.join(" ")).toMatch(/not priced/);
    const on = footprintTable(result(12_345), "SI", "USD")!;
    expect(cell(on, "carbonCostPv", 1).value).toBe(12_345);
  });
});

describe("workbook sheet", () => {
  it("holds the condenser and footprint rows as numbers, the same as the table", async () => {
    const src = await reportSource({ unitSystem: "SI" });
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await buildWorkbook(src)) as unknown as ArrayBuffer);
    const ws = wb.getWorksheet("Condensers")!;
    const rows: unknown[][] = [];
    ws.eachRow((r) => rows.push((r.values as unknown[]).slice(1)));
    const lbRow = rows.find((r) => r[0] === "Refrigerant in the condenser (lb)")!;
    const kgRow = rows.find((r) => r[0] === "Refrigerant in the condenser (kg)")!;
    const n = src.result.economics.options.length;
    for (let i = 0; i < n; i++) expect(Number(lbRow[2 + i])).toBeCloseTo(Number(kgRow[2 + i]) / 0.45359237, 6);
    const withdrawn = rows.find((r) => r[0] === "Water withdrawn (makeup) per year")!;
    src.result.footprint!.options.forEach((f, i) => expect(withdrawn[2 + i]).toBeCloseTo(f.water.withdrawnM3, 6));
  });
});
