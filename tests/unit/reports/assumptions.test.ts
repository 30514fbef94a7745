/**
 * The report's assumptions table: a money row has its currency in the Unit column once, not "$185,000 USD"
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
