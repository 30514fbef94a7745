/**
 * The report's quantities in the viewer's unit system. Conversions are lib/units' (the one place where
 * IP ⇄ SI happens); this file only adds what the report needs on top: a value and its label together.
 */
import type { UnitSystem } from "@/lib/auth/roles";
import { fromSI, unitLabel, type QuantityKind } from "@/lib/units";

export type { QuantityKind };

export function convert(kind: QuantityKind, valueSI: number, system: UnitSystem): number {
  return fromSI(kind, valueSI, system);
}

/** The unit's label; money kinds get the currency code ("USD/kgal"). */
export function unitOf(kind: QuantityKind, system: UnitSystem, currency = "USD"): string {
  return unitLabel(kind, system, currency);
}
