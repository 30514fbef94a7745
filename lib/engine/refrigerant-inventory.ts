/**
 * Refrigerant held in an option's condenser (or an evaporative condenser's coil): a screening
 * estimate from the construction's typical charge per kW of heat rejected, with the usual cautions.
 *
 * inventory = specific charge (kg/kW) × design heat rejection (kW). The specific charges are
 * [practice]/[memory] figures stated with each construction (condenser-construction.ts) and the
 * evaporative condenser (evaporative-condenser.ts); the manufacturer's stated charge replaces them.
 * The inventory is the condenser's share only: the receiver, piping and evaporators hold the rest of
 * the system's charge, which is the quantity the process-safety rules count.
 */
import {
  type Refrigerant,
  REGULATORY_THRESHOLDS,
  REFRIGERANT_LABELS,
  SAFETY_GROUP,
  isAmmonia,
} from "./refrigerants";
import type { EngineWarning } from "./types";

/** Condenser inventory, kg: specific charge (kg/kW) × design heat rejection (kW). */
export function condenserInventoryKg(designHeatRejectionKW: number, specificChargeKgPerKW: number): number {
  if (!(designHeatRejectionKW > 0) || !(specificChargeKgPerKW > 0)) return 0;
  return designHeatRejectionKW * specificChargeKgPerKW;
}

/**
 * Cautions that go with a refrigerant inventory: the standing ammonia caution (toxic, B2L; process-safety
 * management; deferral to the plant's programme and local codes) and, for each published rule, whether the
 * condenser alone already reaches its threshold. Thresholds are recalled from memory (stated in the text).
 */
export function inventoryCautions(args: {
  refrigerant: Refrigerant;
  inventoryKg: number;
  gwp: number;
  optionId?: string;
  path?: string;
}): EngineWarning[] {
  const out: EngineWarning[] = [];
  const id = args.optionId !== undefined ? { optionId: args.optionId } : {};
  const path = args.path !== undefined ? { path: args.path } : {};
  const ammonia = isAmmonia(args.refrigerant);
  const name = REFRIGERANT_LABELS[args.refrigerant];
  if (ammonia) {
    out.push({
      code: "caution.ammonia",
      severity: "warning",
      message: `Ammonia (safety group ${SAFETY_GROUP.R717}) is toxic and mildly flammable. Above threshold quantities set by regulation — e.g. the US OSHA Process Safety Management standard (29 CFR 1910.119) and the EPA Risk Management Program (40 CFR Part 68), 10,000 lb (4,536 kg) of anhydrous ammonia in a process [memory] — process-safety management and risk-management rules apply; the count is the whole process's inventory, not this condenser's. Machinery-room ventilation, detection and relief follow the applicable safety standards (e.g. IIAR 2, ASHRAE 15, EN 378 / ISO 5149). Defer to the plant's process-safety management, local codes, the authority having jurisdiction and a licensed engineer.`,
      ...path,
      ...id,
    });
  }
  for (const t of REGULATORY_THRESHOLDS) {
    if ((t.appliesTo === "ammonia") !== ammonia) continue;
    let reached = false;
    if (t.thresholdKg !== undefined && args.inventoryKg >= t.thresholdKg) reached = true;
    if (t.thresholdTonnesCO2e !== undefined && (args.inventoryKg * args.gwp) / 1000 >= t.thresholdTonnesCO2e) reached = true;
    if (!reached) continue;
    out.push({
      code: "caution.refrigerantThreshold",
      severity: "warning",
      message: `The ${name} in this condenser alone (${Math.round(args.inventoryKg).toLocaleString("en-US")} kg) reaches a threshold of ${t.rule}: ${t.thresholdText}. Confirm the plant's obligations with its process-safety and environmental advisers.`,
      ...path,
      ...id,
    });
  }
  return out;
}
