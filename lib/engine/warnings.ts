/**
 * Warnings with numbers: the engine states a warning as a template with `{name}` placeholders and the
 * numbers as SI values with their quantity; `message` is the same text rendered in SI. Viewers render the
 * template in their own unit system (lib/units/warnings.ts), so an IP project reads °F, gpm and kgal.
 */
import type { EngineWarning, WarningQuantity, WarningValue } from "./types";
import { enUsNumber } from "./en-us";

const SI_SYMBOL: Record<WarningQuantity, string> = {
  temperatureC: "°C",
  temperatureDifferenceK: "K",
  powerKW: "kW",
  heatDutyKW: "kW",
  energyKWh: "kWh",
  waterVolumeM3: "m³",
  massKg: "kg",
  foulingM2KPerW: "m²·K/W",
  hours: "h",
  months: "months",
  percent: "%",
  ratio: "",
  count: "",
};

/** Significant figures a warning shows for each quantity (also used by the unit-aware renderer). */
export const WARNING_SIGNIFICANT_FIGURES: Record<WarningQuantity, number> = {
  temperatureC: 3,
  temperatureDifferenceK: 2,
  powerKW: 3,
  heatDutyKW: 3,
  energyKWh: 3,
  waterVolumeM3: 3,
  massKg: 3,
  foulingM2KPerW: 3,
  hours: 4,
  months: 3,
  percent: 3,
  ratio: 3,
  count: 6,
};

/** A number rendered in SI with its symbol: "35.5 °C", "1,500 kW", "1.76e-4 m²·K/W". */
export function siText(v: WarningValue): string {
  const sig = WARNING_SIGNIFICANT_FIGURES[v.quantity];
  let text: string;
  if (!Number.isFinite(v.value)) text = "—";
  else if (v.quantity === "foulingM2KPerW") text = v.value.toExponential(2);
  else if (v.quantity === "hours" || v.quantity === "count") text = enUsNumber(Math.round(v.value));
  else {
    const r = v.value === 0 ? 0 : Number(v.value.toPrecision(sig));
    text = Math.abs(r) >= 1000 ? enUsNumber(Math.round(r)) : String(r);
  }
  const sym = SI_SYMBOL[v.quantity];
  return sym ? `${text} ${sym}` : text;
}

/** Fill `{name}` placeholders of a template; `render` turns each value into text. Unknown names stay. */
export function fillTemplate(template: string, values: Record<string, WarningValue>, render: (v: WarningValue) => string): string {
  return template.replace(/\{(\w+)\}/g, (whole, name: string) => {
    const v = values[name];
    return v ? render(v) : whole;
  });
}

/** Build a warning from a template and its numbers; `message` is the SI rendering. */
export function numericWarning(
  w: { code: string; severity: EngineWarning["severity"]; template: string; values: Record<string, WarningValue>; path?: string; optionId?: string },
): EngineWarning {
  const out: EngineWarning = { code: w.code, severity: w.severity, message: fillTemplate(w.template, w.values, siText), template: w.template, values: w.values };
  if (w.path !== undefined) out.path = w.path;
  if (w.optionId !== undefined) out.optionId = w.optionId;
  return out;
}

/** Shorthands for warning values. */
export const wv = {
  tempC: (value: number): WarningValue => ({ value, quantity: "temperatureC" }),
  dK: (value: number): WarningValue => ({ value, quantity: "temperatureDifferenceK" }),
  kW: (value: number): WarningValue => ({ value, quantity: "powerKW" }),
  dutyKW: (value: number): WarningValue => ({ value, quantity: "heatDutyKW" }),
  kWh: (value: number): WarningValue => ({ value, quantity: "energyKWh" }),
  m3: (value: number): WarningValue => ({ value, quantity: "waterVolumeM3" }),
  kg: (value: number): WarningValue => ({ value, quantity: "massKg" }),
  fouling: (value: number): WarningValue => ({ value, quantity: "foulingM2KPerW" }),
  hours: (value: number): WarningValue => ({ value, quantity: "hours" }),
  months: (value: number): WarningValue => ({ value, quantity: "months" }),
  percent: (value: number): WarningValue => ({ value, quantity: "percent" }),
  ratio: (value: number): WarningValue => ({ value, quantity: "ratio" }),
  count: (value: number): WarningValue => ({ value, quantity: "count" }),
};
