/**
 * Engine warnings in the viewer's units: the engine states a warning as a template with `{name}`
 * placeholders and SI numbers with their quantity (lib/engine/warnings.ts); this renders each number in
 * the project's unit system. A warning without a template shows its message as it is.
 */
import { WARNING_SIGNIFICANT_FIGURES, fillTemplate } from "@/lib/engine/warnings";
import type { EngineWarning, WarningQuantity, WarningValue } from "@/lib/engine/types";
import { formatQuantity } from "./format";
import type { QuantityKind, UnitSystem } from "./quantities";

/** Each warning quantity is a unit kind of lib/units (checked here at compile time). */
const KIND: Record<WarningQuantity, QuantityKind> = {
  temperatureC: "temperatureC",
  temperatureDifferenceK: "temperatureDifferenceK",
  powerKW: "powerKW",
  heatDutyKW: "heatDutyKW",
  energyKWh: "energyKWh",
  waterVolumeM3: "waterVolumeM3",
  massKg: "massKg",
  foulingM2KPerW: "foulingM2KPerW",
  hours: "hours",
  months: "months",
  percent: "percent",
  ratio: "ratio",
  count: "count",
};

/** One warning number in `system`'s unit, with its symbol ("95.0 °F", "12 h"). */
export function warningValueText(v: WarningValue, system: UnitSystem): string {
  if (v.quantity === "hours" || v.quantity === "count") return formatQuantity(KIND[v.quantity], v.value, system, { decimals: 0 });
  return formatQuantity(KIND[v.quantity], v.value, system, { sig: WARNING_SIGNIFICANT_FIGURES[v.quantity] });
}

/** The warning's text in the viewer's unit system. */
export function warningText(w: EngineWarning, system: UnitSystem): string {
  if (!w.template || !w.values) return w.message;
  return fillTemplate(w.template, w.values, (v) => warningValueText(v, system));
}
