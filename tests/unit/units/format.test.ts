import { describe, expect, it } from "vitest";
import { formatNumber, formatQuantity, inputText, parseNumberInput, roundToSignificant, fromSI, toSI } from "@/lib/units";

// Expected strings follow the rounding and digit-grouping conventions of NIST SP 811 (2008) §7.9/§10.5.3
// (a comma group separator is the US convention, not SP 811's space — chosen for the product; common practice).
describe("formatting", () => {
  it("rounds to significant figures in decimal", () => {
    expect(roundToSignificant(1234.567, 4)).toBe(1235);
    expect(roundToSignificant(0.00654321, 3)).toBe(0.00654);
    expect(roundToSignificant(-98765, 2)).toBe(-99000);
    expect(roundToSignificant(0, 3)).toBe(0);
  });

  it("groups thousands, uses a true minus sign and never shows −0", () => {
    expect(formatNumber(1234567.8, { decimals: 0 })).toBe("1,234,568");
    expect(formatNumber(1234.567)).toBe("1,235");
    expect(formatNumber(-3.21, { sig: 2 })).toBe("\u22123.2");
    expect(formatNumber(-0.0001, { decimals: 2 })).toBe("0.00");
    expect(formatNumber(12345, { grouping: false, decimals: 0 })).toBe("12345");
    expect(formatNumber(NaN)).toBe("—");
    expect(formatNumber(null, { missing: "n/a" })).toBe("n/a");
  });

  it("formats a stored SI value in the project's units with its unit", () => {
    expect(formatQuantity("temperatureC", 29.444444, "IP", { decimals: 1 })).toBe("85.0\u00a0°F");
    expect(formatQuantity("temperatureC", 29.444444, "SI", { decimals: 1 })).toBe("29.4\u00a0°C");
    expect(formatQuantity("waterVolumeM3", 3785.411784, "IP", { decimals: 0 })).toBe("1,000\u00a0kgal");
    expect(formatQuantity("pricePerM3", 1, "IP", { currency: "EUR", decimals: 2 })).toBe("3.79\u00a0EUR/kgal");
    expect(formatQuantity("ratio", 0.6, "SI", { decimals: 2 })).toBe("0.60");
  });

  it("parses what people type: decimal comma, thousands groups, minus sign, exponent", () => {
    expect(parseNumberInput("1,5")).toBe(1.5);
    expect(parseNumberInput("1,500")).toBe(1500);
    expect(parseNumberInput("1,234.5")).toBe(1234.5);
    expect(parseNumberInput("\u22122.5")).toBe(-2.5);
    expect(parseNumberInput(" 1e-4 ")).toBe(0.0001);
    expect(parseNumberInput("")).toBeNull();
    expect(parseNumberInput("12 °C")).toBeNaN();
    expect(parseNumberInput("1.2.3")).toBeNaN();
  });

  it("an input box shows a value that survives the SI round trip unchanged", () => {
    // 85 °F stored as 29.444… °C must show 85 again, not 84.99999999999999.
    const stored = toSI("temperatureC", 85, "IP");
    expect(inputText(fromSI("temperatureC", stored, "IP"))).toBe("85");
    const flow = toSI("waterFlowLPerS", 1200, "IP");
    expect(inputText(fromSI("waterFlowLPerS", flow, "IP"))).toBe("1200");
    expect(inputText(null)).toBe("");
  });
});
