/**
 * The report's assumptions table and running header: a money row has its currency in the Unit column once, not "$185,000 USD"
 * (the value column is a bare number). The labour rate is the schema's default of 85 per hour
 * ([practice] loaded technician rate, lib/scenarios/schema-economics.ts), written with two decimals.
 */
import { describe, expect, it } from "vitest";
import { buildAssumptions } from "@/lib/reports/assumptions";
import type { ReportSource } from "@/lib/reports/types";
import { syntheticResult } from "./fixture";

describe("assumptions: money rows", () => {
  it("state the currency once, in the unit column", () => {
    const s = syntheticResult();
    const groups = buildAssumptions(s.input as unknown as ReportSource["input"], s.result as unknown as ReportSource["result"], "IP", "USD");
    const rows = groups.flatMap((g) => g.rows);
    const money = rows.filter((r) => r.unit === "USD" || r.unit === "USD/h");
    expect(money.length).toBeGreaterThan(0);
    for (const r of money) expect(r.value, r.label).toMatch(/^−?[\d,]+(\.\d+)?$/);
    const labour = rows.find((r) => r.label === "Maintenance labour rate");
    expect(labour).toMatchObject({ value: "85.00", unit: "USD/h" });
  });
});

describe("the PDF's running header", () => {
  it("shortens a long scenario name at a word so it cannot run into the firm's name", async () => {
    const { headerScenarioText, HEADER_NAME_MAX_CHARS } = await import("@/lib/reports/pdf/document");
    // The demo's 94-character name, cut by hand: its 64th character is the space after "closed-circuit", so the header keeps 63 and adds "…".
    const long = "Condenser heat rejection: tower, isolated tower, closed-circuit cooler or evaporative condenser";
    expect(HEADER_NAME_MAX_CHARS).toBe(64);
    expect(headerScenarioText(long, "Version 1")).toBe("Condenser heat rejection: tower, isolated tower, closed-circuit…  ·  Version 1");
    expect(headerScenarioText("Base case, 2026 tariffs", "Draft")).toBe("Base case, 2026 tariffs  ·  Draft");
  });
});
