/**
 * An input box's text for a value converted into the project's units (IP) reads rounded, while the stored
 * SI value is untouched. Conversion factors: 1 hp (550 ft·lbf/s) = 745.6999 W (NIST SP 811 (2008) App.
 * B.8); 1 US gal = 3.785411784 L exactly (SP 811 B.8), so 1 gpm = 0.0630901964 L/s; t°F = 1.8·t°C + 32.
 * Expected texts are hand calculations written beside each check.
 */
import { describe, expect, it } from "vitest";
import { convertedInputText, quantityInputText, toSI } from "@/lib/units";

describe("input text of converted values", () => {
  it("22 kW of fan input reads 29.5 hp in IP, not 29.5025 (22 000 W / 745.6999 W = 29.50248 → 4 figures 29.50)", () => {
    expect(quantityInputText("powerKW", 22, "IP")).toBe("29.5");
  });

  it("SI shows the stored value as it is (no conversion, 6 figures)", () => {
    expect(quantityInputText("powerKW", 22, "SI")).toBe("22");
    expect(quantityInputText("powerKW", 22.12345, "SI")).toBe("22.1234"); // 22.12345 → 6 figures (binary 22.123449…)
  });

  it("a unit shown as stored in IP too (money per kWh) keeps 6 figures", () => {
    expect(quantityInputText("pricePerKWh", 0.123456, "IP")).toBe("0.123456");
  });

  it("a value a person typed in IP reads back as typed", () => {
    // 29.5 hp → 29.5 × 0.7456999 = 21.998 kW stored; shown again: 29.5.
    expect(quantityInputText("powerKW", toSI("powerKW", 29.5, "IP"), "IP")).toBe("29.5");
    // 1234.5 gpm → 1234.5 × 0.0630901964 = 77.8848 L/s stored; five figures typed, five shown.
    expect(quantityInputText("waterFlowLPerS", toSI("waterFlowLPerS", 1234.5, "IP"), "IP")).toBe("1234.5");
    // 85 °F → (85 − 32)/1.8 = 29.4444 °C stored; shown again: 85.
    expect(quantityInputText("temperatureC", toSI("temperatureC", 85, "IP"), "IP")).toBe("85");
  });

  it("rounds to 4 figures but never rounds the whole-number part", () => {
    expect(convertedInputText(29.502486)).toBe("29.5"); // 29.50 → "29.5"
    expect(convertedInputText(0.00123456)).toBe("0.001235");
    expect(convertedInputText(1234.56)).toBe("1235"); // 6 figures → 4
    expect(convertedInputText(264172.3)).toBe("264172"); // 6 whole digits kept
    expect(convertedInputText(-18.88889)).toBe("-18.89");
    expect(convertedInputText(undefined)).toBe("");
    expect(convertedInputText(NaN)).toBe("");
  });
});
