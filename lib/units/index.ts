/**
 * The one place where IP ⇄ SI happens. Values are stored and computed in SI (the unit each quantity
 * kind is named after); forms, tables and reports show them in the project's unit system.
 * Client-safe: no server imports.
 */
import { QUANTITIES, type DisplayUnit, type QuantityDef, type QuantityKind, type UnitSystem } from "./quantities";

export { QUANTITIES, QUANTITY_KINDS, isQuantityKind, type DisplayUnit, type QuantityDef, type QuantityKind, type UnitSystem } from "./quantities";
export * from "./format";
import { convertedInputText, inputText } from "./format";
export { WATER_DENSITY_KG_PER_M3, WATER_KG_PER_L, waterKgPerSFromLPerS, waterLPerSFromKgPerS } from "./factors";

export function quantity(kind: QuantityKind): QuantityDef {
  return QUANTITIES[kind];
}

export function displayUnit(kind: QuantityKind, system: UnitSystem): DisplayUnit {
  return (QUANTITIES[kind] as QuantityDef)[system];
}

/** A value shown in `system`'s unit → the stored SI value: (v − offset) × factor. */
export function toSI(kind: QuantityKind, value: number, system: UnitSystem): number {
  const u = displayUnit(kind, system);
  return (value - (u.offset ?? 0)) * u.factor;
}

/** A stored SI value → the value shown in `system`'s unit: stored / factor + offset. */
export function fromSI(kind: QuantityKind, valueSI: number, system: UnitSystem): number {
  const u = displayUnit(kind, system);
  return valueSI / u.factor + (u.offset ?? 0);
}

/** Convert a displayed value from one system's unit to the other's (via SI). */
export function convertBetween(kind: QuantityKind, value: number, from: UnitSystem, to: UnitSystem): number {
  return from === to ? value : fromSI(kind, toSI(kind, value, from), to);
}

/** The unit's short label in `system`, with `{cur}` replaced by the ISO currency code (e.g. "USD/kgal"). */
export function unitLabel(kind: QuantityKind, system: UnitSystem, currency = "USD"): string {
  return displayUnit(kind, system).symbol.replace("{cur}", currency);
}

/** The unit's long name, for screen readers and hover text. */
export function unitName(kind: QuantityKind, system: UnitSystem, currency = "USD"): string {
  const u = displayUnit(kind, system);
  return u.symbol.startsWith("{cur}") ? `${currency} ${u.name}` : u.name;
}

/** Where a kind's conversion factor comes from, in `system`. */
export function unitSource(kind: QuantityKind, system: UnitSystem): string {
  return displayUnit(kind, system).source;
}

/**
 * An input box's text for a stored SI value in `system`'s unit: where the shown unit is the stored one
 * (every SI unit, money, kWh), `sig` significant figures as stored; where it is converted (IP), rounded by
 * `convertedInputText`.
 */
export function quantityInputText(kind: QuantityKind, valueSI: number | null | undefined, system: UnitSystem, sig = 6): string {
  if (valueSI === null || valueSI === undefined || !Number.isFinite(valueSI)) return "";
  const u = displayUnit(kind, system);
  const shown = fromSI(kind, valueSI, system);
  return u.factor === 1 && !u.offset ? inputText(shown, sig) : convertedInputText(shown);
}
