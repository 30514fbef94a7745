/**
 * Each option's condenser as built and kept (construction, material, upkeep plan, refrigerant inventory)
 * and its footprint (water withdrawn and consumed, CO₂e from electricity and leakage, carbon cost when
 * priced), as rows of a table with one column per option, in the viewer's units. Built from the stored
 * result's `condensers` and `footprint` (absent from results stored before engine 2.1: no rows then).
 * Shared by the comparison page, the PDF and the workbook, so all three say the same thing. Pure.
 * Nothing here is a cash flow: present values only, which every viewer of a result may see.
 */
import type { UnitSystem } from "@/lib/auth/roles";
import type { CondenserPlan } from "@/lib/engine/condenser-plan";
import type { CostCategory } from "@/lib/engine/economics/types";
import type { ScenarioFootprint } from "@/lib/engine/footprint";
import { inventoryCautions } from "@/lib/engine/refrigerant-inventory";
import { fromSI, unitLabel } from "@/lib/units";
import { fmtMoney, fmtNumber, fmtPercent, fmtSignificant } from "./format";

/** The parts of a result this reads (the comparison's ScenarioResult and the report's result both fit). */
export interface CondenserFootprintResult {
  economics: {
    options: { optionId: string; label: string; pvByCategory: Partial<Record<CostCategory, number>> }[];
  };
  condensers?: CondenserPlan[];
  footprint?: ScenarioFootprint;
}

/** A cell: its text as shown, and its number (in the row's unit) for the workbook; null for text cells. */
export interface PlanCell {
  text: string;
  value: number | null;
}

export interface PlanRow {
  key: string;
  label: string;
  /** The unit of the row's numbers ("" for text rows). */
  unit: string;
  cells: PlanCell[];
}

export interface OptionRowsTable {
  /** Option labels, in the economics' order. */
  columns: { optionId: string; label: string }[];
  rows: PlanRow[];
  notes: string[];
}

const text = (t: string): PlanCell => ({ text: t, value: null });
const num = (v: number, shown: string): PlanCell => ({ text: shown, value: v });

function byOption<T extends { optionId: string }>(items: T[] | undefined, ids: string[]): (T | undefined)[] {
  const m = new Map((items ?? []).map((x) => [x.optionId, x]));
  return ids.map((id) => m.get(id));
}

/**
 * Construction, material, clean U (in the viewer's units), inventory (kg and lb) and the upkeep plan of each
 * option's condenser; null without plans.
 */
export function condenserPlanTable(
  r: CondenserFootprintResult,
  system: UnitSystem,
  currency: string,
): OptionRowsTable | null {
  if (!r.condensers || r.condensers.length === 0) return null;
  const columns = r.economics.options.map((o) => ({ optionId: o.optionId, label: o.label }));
  const plans = byOption(
    r.condensers,
    columns.map((c) => c.optionId),
  );
  const row = (key: string, label: string, unit: string, cell: (p: CondenserPlan) => PlanCell): PlanRow => ({
    key,
    label,
    unit,
    cells: plans.map((p) => (p ? cell(p) : text("—"))),
  });
  const lb = (kg: number) => fromSI("massKg", kg, "IP");
  const uUnit = unitLabel("heatTransferCoefficientWPerM2K", system);
  const u = (wPerM2K: number) => fromSI("heatTransferCoefficientWPerM2K", wPerM2K, system);
  const rows: PlanRow[] = [
    row("construction", "Condenser", "", (p) => text(p.constructionLabel)),
    row("waterSide", "Wetted by", "", (p) =>
      text(
        p.waterSide === "openTower"
          ? "open-tower water"
          : p.waterSide === "closedLoop"
            ? "closed loop"
            : "recirculating spray water",
      ),
    ),
    row("material", "Material", "", (p) => text(p.materialLabel)),
    row("cleanU", "Clean U", uUnit, (p) =>
      p.cleanUWPerM2K === null
        ? text("— (rated capacity)")
        : num(u(p.cleanUWPerM2K), `${fmtSignificant(u(p.cleanUWPerM2K), 3)} ${uUnit}`),
    ),
    row("chargePerKW", "Refrigerant charge per kW", "kg/kW", (p) =>
      num(p.specificChargeKgPerKW, `${fmtSignificant(p.specificChargeKgPerKW, 2)} kg/kW`),
    ),
    row("inventoryKg", "Refrigerant in the condenser (kg)", "kg", (p) =>
      num(p.inventoryKg, `${fmtSignificant(p.inventoryKg, 2)} kg`),
    ),
    row("inventoryLb", "Refrigerant in the condenser (lb)", "lb", (p) =>
      num(lb(p.inventoryKg), `${fmtSignificant(lb(p.inventoryKg), 2)} lb`),
    ),
    row("cleaning", "Cleaning method", "", (p) =>
      text(
        p.cleaning.method === "coilExteriorDescaling"
          ? "Coil exterior descaled and cleaned"
          : p.cleaning.methodLabel,
      ),
    ),
    row("cleaningCost", "Cleaning, per event", currency, (p) =>
      p.cleaning.surface === "none"
        ? text("no scheduled cleaning (closed loop)")
        : p.cleaning.surface === "plateExchanger"
          ? p.cleaning.costPerEvent > 0
            ? num(
                p.cleaning.costPerEvent,
                `${fmtMoney(p.cleaning.costPerEvent, currency)} (the plate exchanger)`,
              )
            : text("the plate exchanger is cleaned instead (no cost entered)")
          : num(p.cleaning.costPerEvent, fmtMoney(p.cleaning.costPerEvent, currency)),
    ),
    row("inspection", "Inspection", "", (p) => text(p.inspection.methodLabel)),
    row("inspectionEvery", "Inspection every", "yr", (p) =>
      p.inspection.intervalYears > 0
        ? num(
            p.inspection.intervalYears,
            `${fmtNumber(p.inspection.intervalYears, p.inspection.intervalYears % 1 === 0 ? 0 : 1)} yr`,
          )
        : text("—"),
    ),
    row("inspectionCost", "Inspection, per event", currency, (p) =>
      p.inspection.intervalYears > 0
        ? num(p.inspection.costPerEvent, fmtMoney(p.inspection.costPerEvent, currency))
        : text("—"),
    ),
    row("wearPart", "Wear part and life", "", (p) =>
      text(
        p.wearPart
          ? `${p.wearPart.name}, ${fmtNumber(p.wearPart.lifeYears, p.wearPart.lifeYears % 1 === 0 ? 0 : 1)} yr`
          : "none",
      ),
    ),
    row("wearPartCost", "Wear-part replacement", currency, (p) =>
      p.wearPart?.replacementCost != null
        ? num(p.wearPart.replacementCost, fmtMoney(p.wearPart.replacementCost, currency))
        : text(p.wearPart ? "not entered" : "—"),
    ),
  ];
  const notes = [
    "Refrigerant held in each option's condenser (or evaporative condenser coil) is a screening estimate from the construction's typical charge per kW; the manufacturer's stated charge replaces it. Eddy-current testing applies to tubes only.",
  ];
  return { columns, rows, notes };
}

/**
 * The process-safety cautions that go with the inventories: the standing caution for the refrigerant and
 * each published threshold an option's condenser alone reaches (thresholds recalled from memory, as stated).
 */
export function inventoryCautionTexts(r: CondenserFootprintResult): string[] {
  if (!r.condensers || !r.footprint) return [];
  const fp = r.footprint;
  const out = new Set<string>();
  for (const p of r.condensers) {
    for (const w of inventoryCautions({
      refrigerant: fp.refrigerant,
      inventoryKg: p.inventoryKg,
      gwp: fp.gwp100,
    }))
      out.add(w.message);
  }
  if (out.size === 0)
    out.add(
      `${fp.refrigerantLabel}: refrigerant regulations (e.g. leak checks, records and recovery under 40 CFR Part 82 in the US or Regulation (EU) 2024/573 in the EU) apply by charge and GWP [memory]. Defer to the plant's process-safety management, local codes and a licensed engineer.`,
    );
  return [...out];
}

/** Water withdrawn and consumed, CO₂e from electricity and leakage, and the carbon cost when priced; null without a footprint. */
export function footprintTable(
  r: CondenserFootprintResult,
  system: UnitSystem,
  currency: string,
): OptionRowsTable | null {
  const fp = r.footprint;
  if (!fp) return null;
  const columns = r.economics.options.map((o) => ({ optionId: o.optionId, label: o.label }));
  const items = byOption(
    fp.options,
    columns.map((c) => c.optionId),
  );
  const volUnit = unitLabel("waterVolumeM3", system);
  const perMWhUnit = `${unitLabel("volumeM3", system)}/MWh`;
  const row = (
    key: string,
    label: string,
    unit: string,
    cell: (f: ScenarioFootprint["options"][number]) => PlanCell,
  ): PlanRow => ({
    key,
    label,
    unit,
    cells: items.map((f) => (f ? cell(f) : text("—"))),
  });
  const vol = (m3: number) => fromSI("waterVolumeM3", m3, system);
  const perMWh = (m3: number) => fromSI("volumeM3", m3, system);
  const t = (kg: number) => kg / 1000;
  const rows: PlanRow[] = [
    row("withdrawn", "Water withdrawn (makeup) per year", volUnit, (f) =>
      num(vol(f.water.withdrawnM3), `${fmtSignificant(vol(f.water.withdrawnM3), 3)} ${volUnit}`),
    ),
    row("consumed", "Water consumed (evaporation + drift) per year", volUnit, (f) =>
      num(vol(f.water.consumedM3), `${fmtSignificant(vol(f.water.consumedM3), 3)} ${volUnit}`),
    ),
    row("withdrawnPerMWh", "Water withdrawn per MWh rejected", perMWhUnit, (f) =>
      num(
        perMWh(f.water.withdrawnM3PerMWh),
        `${fmtSignificant(perMWh(f.water.withdrawnM3PerMWh), 3)} ${perMWhUnit}`,
      ),
    ),
    row("consumedPerMWh", "Water consumed per MWh rejected", perMWhUnit, (f) =>
      num(
        perMWh(f.water.consumedM3PerMWh),
        `${fmtSignificant(perMWh(f.water.consumedM3PerMWh), 3)} ${perMWhUnit}`,
      ),
    ),
    row("electricity", "Electricity per year", "kWh", (f) =>
      num(f.electricityKWh, `${fmtSignificant(f.electricityKWh, 3)} kWh`),
    ),
    row("co2eElectricity", "CO₂e from electricity per year", "t CO₂e", (f) =>
      num(t(f.emissions.electricityKgCO2e), `${fmtSignificant(t(f.emissions.electricityKgCO2e), 3)} t`),
    ),
    row("co2eLeakage", "CO₂e from refrigerant leakage per year", "t CO₂e", (f) =>
      num(t(f.emissions.leakageKgCO2e), `${fmtSignificant(t(f.emissions.leakageKgCO2e), 3)} t`),
    ),
    row("co2eTotal", "CO₂e in all per year", "t CO₂e", (f) =>
      num(t(f.emissions.totalKgCO2e), `${fmtSignificant(t(f.emissions.totalKgCO2e), 3)} t`),
    ),
    row("co2ePerMWh", "CO₂e per MWh rejected", "kg CO₂e/MWh", (f) =>
      num(f.emissions.totalKgCO2ePerMWh, `${fmtSignificant(f.emissions.totalKgCO2ePerMWh, 3)} kg`),
    ),
  ];
  const priced = r.economics.options.some((o) => (o.pvByCategory.carbon ?? 0) !== 0);
  if (priced) {
    rows.push({
      key: "carbonCostPv",
      label: "Carbon cost over the study, present value",
      unit: currency,
      cells: r.economics.options.map((o) =>
        num(o.pvByCategory.carbon ?? 0, fmtMoney(o.pvByCategory.carbon ?? 0, currency)),
      ),
    });
  }
  const notes = [
    `Water withdrawn is the makeup; water consumed is evaporation and drift (it does not return to a sewer or a river).`,
    `Emissions = electricity × ${fmtSignificant(fp.gridFactorKgCO2ePerKWh, 3)} kg CO₂e/kWh (grid factor, data year ${fp.gridFactorYear}: ${fp.gridFactorSource}) + ${fmtPercent(fp.annualLeakFraction, 1)} a year leaked × refrigerant in the condenser × GWP ${fmtNumber(fp.gwp100, 0)} for ${fp.refrigerantLabel} (${fp.gwpReportLabel}).`,
    priced
      ? "A carbon price is on: each option's emissions are priced per tonne CO₂e in its life-cycle cost, escalated on their own stream."
      : "Carbon is not priced in the life-cycle cost (off by default).",
  ];
  return { columns, rows, notes };
}
