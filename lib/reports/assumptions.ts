/**
 * The report's assumptions tables: every input that drives the result, in the viewer's units, with
 * where its value came from (the schema's documented default and its source, or "entered").
 * Reads the stored input defensively: a report of an older input version still prints what it has.
 */
import type { UnitSystem } from "@/lib/auth/roles";
import type { ClimateSummary } from "@/lib/engine/climate/summary";
import { FIRST_COST_ITEMS, type FirstCostItem } from "@/lib/engine/economics/types";
import type { BasinHeaterInput, DutyInput, FoulingInput, OptionInput, ScenarioInput, WaterInput } from "@/lib/engine/input";
import type { SewerBasis } from "@/lib/engine/water";
import { OPTION_KIND_LABELS, type OptionKind, type RatingFitSummary } from "@/lib/engine/types";
import { economicsFieldDefaults } from "@/lib/scenarios/schema-economics";
import { fmtMoney, fmtNumber, fmtPercent } from "./format";
import type { ReportEngineResult } from "./types";
import { convert, unitOf, type QuantityKind } from "./units";
import { waterLPerSFromKgPerS } from "@/lib/units";

export interface AssumptionRow {
  label: string;
  value: string;
  unit: string;
  source: string;
}

export interface AssumptionGroup {
  title: string;
  /** Short note under the title (e.g. which option). */
  note?: string;
  rows: AssumptionRow[];
}

const ENTERED = "entered by the consultant";
const SELECTION = "manufacturer's selection, entered by the consultant";

type Defaults = Record<string, { default: unknown; source: string }>;
const DEFAULTS: Defaults = economicsFieldDefaults as unknown as Defaults;

function sameValue(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** The documented source when the value is the schema's default, otherwise "entered". */
function sourceOf(path: string, value: unknown, fallback = ENTERED): string {
  const d = DEFAULTS[path];
  if (d && sameValue(d.default, value)) return `default: ${d.source}`;
  return fallback;
}

export const FIRST_COST_LABELS: Record<FirstCostItem, string> = {
  equipment: "Equipment",
  installation: "Installation",
  structureAndCrane: "Structure and crane",
  electrical: "Electrical",
  controls: "Controls",
  plateExchanger: "Plate exchanger",
  waterTreatmentEquipment: "Water-treatment equipment",
  meters: "Meters",
  other: "Other",
};

const COMPONENT_LABELS: Record<string, string> = {
  fill: "fill",
  coil: "coil",
  fanMotor: "fan motor",
  gearbox: "gearbox",
  exchangerPlates: "exchanger plates",
  pumps: "pumps",
  sprayPump: "spray pump",
  variableSpeedDrive: "variable-speed drive",
  driftEliminators: "drift eliminators",
  other: "other component",
};

const PERIODIC_LABELS: Record<string, string> = {
  eddyCurrentTesting: "eddy-current testing",
  basinDisinfection: "basin disinfection",
  exchangerCleaning: "exchanger cleaning",
  coilExteriorDescaling: "coil exterior descaling",
  fillCleaning: "fill cleaning",
  other: "other upkeep",
};

class Rows {
  readonly rows: AssumptionRow[] = [];
  constructor(
    private readonly system: UnitSystem,
    private readonly currency: string,
  ) {}
  q(label: string, kind: QuantityKind, valueSI: number | undefined, decimals: number, source: string): this {
    if (valueSI === undefined || !Number.isFinite(valueSI)) return this;
    this.rows.push({
      label,
      value: fmtNumber(convert(kind, valueSI, this.system), decimals),
      unit: unitOf(kind, this.system, this.currency),
      source,
    });
    return this;
  }
  money(label: string, v: number | undefined, source: string, decimals = 0): this {
    if (v === undefined || !Number.isFinite(v)) return this;
    // The currency is the row's unit, so the value carries no symbol (not "$185,000 USD").
    this.rows.push({ label, value: fmtNumber(v, decimals), unit: this.currency, source });
    return this;
  }
  /** A price per SI unit shown per the viewer's unit (per kgal in IP). */
  price(label: string, kind: QuantityKind, v: number | undefined, source: string, decimals = 2): this {
    if (v === undefined || !Number.isFinite(v)) return this;
    this.rows.push({
      label,
      value: fmtNumber(convert(kind, v, this.system), decimals),
      unit: unitOf(kind, this.system, this.currency),
      source,
    });
    return this;
  }
  pct(label: string, fraction: number | undefined, source: string, unit = "%", decimals = 1): this {
    if (fraction === undefined || !Number.isFinite(fraction)) return this;
    this.rows.push({ label, value: fmtPercent(fraction, decimals).replace("%", ""), unit, source });
    return this;
  }
  text(label: string, value: string | undefined, source: string, unit = ""): this {
    if (value === undefined || value === "") return this;
    this.rows.push({ label, value, unit, source });
    return this;
  }
  n(label: string, v: number | undefined, decimals: number, unit: string, source: string): this {
    if (v === undefined || !Number.isFinite(v)) return this;
    this.rows.push({ label, value: fmtNumber(v, decimals), unit, source });
    return this;
  }
}

const CONTROL_WORDS: Record<string, string> = {
  variableSpeed: "variable speed",
  twoSpeed: "two-speed",
  cycling: "on/off cycling",
};
const GLYCOL_WORDS: Record<string, string> = {
  none: "water",
  ethyleneGlycol: "ethylene glycol",
  propyleneGlycol: "propylene glycol",
};

function climateGroup(
  input: Partial<ScenarioInput>,
  climate: ClimateSummary | undefined,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  r.text("Site", input.site?.locationLabel, ENTERED);
  r.q("Site elevation", "elevationM", input.site?.elevationM, 0, ENTERED);
  const c = input.climate;
  if (c) {
    const kind =
      c.source === "hourly"
        ? "hourly typical year"
        : c.source === "wetBulbBins"
          ? "wet-bulb bin table"
          : "dry-bulb bin table";
    r.text("Climate data", `${c.label ?? "climate"} (${kind})`, "imported climate dataset");
  }
  if (climate) {
    r.n("Hours represented", climate.hours, 0, "h", "climate dataset");
    r.q("Dry-bulb, minimum / mean", "temperatureC", climate.dryBulb.minC, 1, "climate dataset");
    r.rows[r.rows.length - 1]!.value +=
      ` / ${fmtNumber(convert("temperatureC", climate.dryBulb.meanC, system), 1)}`;
    r.q("Dry-bulb, maximum", "temperatureC", climate.dryBulb.maxC, 1, "climate dataset");
    r.q("Wet-bulb, mean", "temperatureC", climate.wetBulb.meanC, 1, "climate dataset");
    r.q("Wet-bulb, maximum", "temperatureC", climate.wetBulb.maxC, 1, "climate dataset");
    for (const d of climate.designWetBulbC) {
      r.q(
        `Design wet-bulb, ${fmtNumber(d.exceedancePercent, 1)}% exceedance`,
        "temperatureC",
        d.wetBulbC,
        1,
        "from the dataset's hours (ASHRAE Fundamentals ch. 14 convention)",
      );
    }
  }
  return { title: "Site and climate", rows: r.rows };
}

function dutyGroup(
  duty: Partial<DutyInput> | undefined,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  if (duty) {
    if (duty.designBasis === "refrigeration") {
      r.q("Design refrigeration load", "refrigerationTonsKW", duty.designRefrigerationLoadKW, 1, ENTERED);
      r.q("Design refrigeration load", "heatDutyKW", duty.designRefrigerationLoadKW, 0, ENTERED);
    } else {
      r.q("Design heat rejection", "coolingTowerTonsKW", duty.designHeatRejectionKW, 1, ENTERED);
      r.q("Design heat rejection", "heatDutyKW", duty.designHeatRejectionKW, 0, ENTERED);
    }
    r.n("Compressor COP at design", duty.designCop, 2, "", ENTERED);
    r.q("Evaporating temperature", "temperatureC", duty.evaporatingC, 1, ENTERED);
    r.q("Condensing set-point", "temperatureC", duty.condensingSetPointC, 1, ENTERED);
    r.q("Minimum condensing temperature", "temperatureC", duty.minimumCondensingC, 1, ENTERED);
    r.text(
      "Head-pressure control",
      duty.headPressureControl === "floating"
        ? "floating head pressure"
        : duty.headPressureControl
          ? "fixed set-point"
          : undefined,
      ENTERED,
    );
    const lp = duty.loadProfile;
    if (lp) {
      const words =
        lp.kind === "constant"
          ? `constant, ${fmtPercent(lp.fraction, 0)} of design`
          : lp.kind === "monthHour"
            ? "by month and hour"
            : lp.kind === "perBin"
              ? "by climate bin"
              : "linear in dry-bulb";
      r.text("Load profile", words, ENTERED);
    }
    const cm = duty.compressorModel;
    if (cm) {
      r.text(
        "Compressor model (each option pays its own compressor energy)",
        cm.kind === "carnotFraction"
          ? "Carnot fraction, the simplest model (about 1/(Tc - Te) per K)"
          : cm.kind === "percentPerK"
            ? `${fmtNumber(cm.percentPerK, 1)}% per K of condensing temperature, compounding, floor ${fmtPercent(cm.floorFraction ?? 0.4, 0)} of design power`
            : cm.kind === "refrigerantCycle"
              ? `single-stage saturated ${cm.refrigerant === "R134a" ? "R-134a" : cm.refrigerant === "R717" ? "ammonia (R-717)" : "plant refrigerant"} cycle, scaled to the design COP`
              : `manufacturer's data, ${cm.curves.map((c) => `${c.points.length} points at ${fmtNumber(c.evaporatingC, 1)} C suction`).join(" and ")}`,
        cm.kind === "refrigerantCycle" ? "fit of CoolProp reference-library cycle values" : ENTERED,
      );
    }
  }
  return { title: "Duty", rows: r.rows };
}

function optionGroup(
  o: Partial<OptionInput> & { kind?: OptionKind },
  physicsCycles: number | undefined,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  const kindLabel = o.kind ? OPTION_KIND_LABELS[o.kind] : "";
  if ("tower" in o && o.tower) {
    const t = o.tower;
    r.q("Tower water flow (at 998.2 kg/m³, Methods §8)", "waterFlowLPerS", waterLPerSFromKgPerS(t.waterFlowKgPerS), 1, SELECTION);
    r.q("Entering / leaving water", "temperatureC", t.enteringWaterC, 1, SELECTION);
    r.rows[r.rows.length - 1]!.value +=
      ` / ${fmtNumber(convert("temperatureC", t.leavingWaterC, system), 1)}`;
    r.q("Design wet-bulb of the selection", "temperatureC", t.designWetBulbC, 1, SELECTION);
    r.n("Design L/G", t.designLiquidToGasRatio, 2, "", SELECTION);
    r.n(
      "Tower characteristic exponent n",
      t.characteristicExponent,
      2,
      "",
      "default 0.6 [practice] unless entered",
    );
  }
  if ("cooler" in o && o.cooler) {
    const c = o.cooler;
    r.q("Process fluid flow (at 998.2 kg/m³, Methods §8)", "waterFlowLPerS", waterLPerSFromKgPerS(c.fluidFlowKgPerS), 1, SELECTION);
    r.q("Entering / leaving fluid", "temperatureC", c.enteringFluidC, 1, SELECTION);
    r.rows[r.rows.length - 1]!.value +=
      ` / ${fmtNumber(convert("temperatureC", c.leavingFluidC, system), 1)}`;
    r.q("Design wet-bulb of the selection", "temperatureC", c.designWetBulbC, 1, SELECTION);
    r.text(
      "Loop fluid",
      c.glycol
        ? `${GLYCOL_WORDS[c.glycol.kind] ?? c.glycol.kind}${c.glycol.kind !== "none" ? `, ${fmtPercent(c.glycol.massFraction, 0)} by mass` : ""}`
        : undefined,
      ENTERED,
    );
    r.text("Dry operation", c.allowDryMode ? "allowed (spray pump off)" : "not allowed", ENTERED);
    if (c.allowDryMode) r.q("Dry operation up to dry-bulb", "temperatureC", c.dryModeMaxDryBulbC, 1, ENTERED);
  }
  if ("evaporativeCondenser" in o && o.evaporativeCondenser) {
    const e = o.evaporativeCondenser;
    r.q("Rated heat rejection", "heatDutyKW", e.ratedHeatRejectionKW, 0, SELECTION);
    r.q("Rated condensing temperature", "temperatureC", e.ratedCondensingC, 1, SELECTION);
    r.q("Rated wet-bulb", "temperatureC", e.ratedWetBulbC, 1, SELECTION);
    if (e.airFlowKgPerS !== undefined) r.q("Rated airflow", "massFlowKgPerS", e.airFlowKgPerS, 1, SELECTION);
    else r.text("Rated airflow", "not entered: 0.03 kg/s of air per kW rejected assumed", "[practice] default");
    r.text("Dry operation", e.allowDryMode ? (e.dryRating ? "allowed, calibrated on the dry rating" : "allowed, dry capacity from the Lewis analogy") : "not allowed", ENTERED);
    if (e.coilScaling) {
      r.pct("Coil scale: capacity lost before each cleaning", e.coilScaling.derateBeforeCleaning, sourceOf("options[].evaporativeCondenser.coilScaling", e.coilScaling), "%", 0);
      r.n("Coil cleaning interval", e.coilScaling.cleaningIntervalMonths, 0, "months", sourceOf("options[].evaporativeCondenser.coilScaling", e.coilScaling));
    }
  }
  if ("plateExchanger" in o && o.plateExchanger) {
    r.q("Plate exchanger approach", "temperatureDifferenceK", o.plateExchanger.designApproachK, 1, SELECTION);
  }
  if (o.fan) {
    r.q("Fan motor power at full speed", "powerKW", o.fan.designPowerKW, 1, SELECTION);
    r.text(
      "Fan control",
      `${CONTROL_WORDS[o.fan.control] ?? o.fan.control}${o.fan.control === "variableSpeed" ? `, minimum ${fmtPercent(o.fan.minSpeedFraction, 0)} speed` : ""}`,
      ENTERED,
    );
  }
  if ("condenserPump" in o && o.condenserPump) {
    r.q("Condenser pump head", "headM", o.condenserPump.headM, 1, ENTERED);
    r.pct("Condenser pump wire-to-water efficiency", o.condenserPump.efficiency, ENTERED, "%", 0);
  }
  if ("towerPump" in o && o.towerPump) r.q("Tower-side pump head", "headM", o.towerPump.headM, 1, ENTERED);
  if ("sprayPump" in o && o.sprayPump) {
    if (o.sprayPump.powerKW !== undefined)
      r.q("Spray pump power", "powerKW", o.sprayPump.powerKW, 2, SELECTION);
    else r.q("Spray pump head", "headM", o.sprayPump.headM, 1, ENTERED);
  }
  if ("condenser" in o && o.condenser)
    r.q("Design condensing temperature", "temperatureC", o.condenser.designCondensingC, 1, SELECTION);
  r.pct("Drift, share of circulating flow", o.driftFractionOfFlow, ENTERED, "%", 3);
  if (o.basinHeater && o.basinHeater.powerKW > 0) {
    // Inputs stored before the heat-loss basis carry `belowDryBulbC` (the set-point) only.
    const bh = o.basinHeater as Partial<BasinHeaterInput> & { belowDryBulbC?: number };
    r.q("Basin heater rating", "powerKW", o.basinHeater.powerKW, 1, ENTERED);
    r.q("Basin heater thermostat set-point", "temperatureC", bh.setPointC ?? bh.belowDryBulbC, 1, ENTERED);
    if (bh.heatLossKWPerK !== undefined)
      r.n("Basin heat loss below the set-point", bh.heatLossKWPerK, 3, "kW/K", "entered, or the rating over the set-point's margin above -17.8 °C (0 °F)");
    if (bh.drainedWhenIdle) r.text("Basin when no water circulates", "drained (no heater)", ENTERED);
  }
  if (o.cyclesOfConcentration !== undefined)
    r.n("This loop's own cycles of concentration", o.cyclesOfConcentration, 1, "", ENTERED);
  if (physicsCycles !== undefined && physicsCycles > 1)
    r.n("Cycles of concentration (as run)", physicsCycles, 1, "", "from the water input");
  const costs = o.costs;
  if (costs) {
    let total = 0;
    for (const item of FIRST_COST_ITEMS) {
      const v = costs.firstCost?.[item] ?? 0;
      total += v;
      if (v > 0)
        r.money(
          `First cost: ${FIRST_COST_LABELS[item].toLowerCase()}`,
          v,
          "consultant's selection and quotes (no default)",
        );
    }
    r.money("First cost, total", total, "sum of the items");
    r.n(
      "Service life",
      costs.serviceLifeYears,
      0,
      "years",
      sourceOf("options[].costs.serviceLifeYears", costs.serviceLifeYears),
    );
    for (const c of costs.components ?? []) {
      r.text(
        `Replacement: ${c.label ?? COMPONENT_LABELS[c.component] ?? c.component}`,
        `${fmtMoney(c.replacementCost, currency)} every ${fmtNumber(c.lifeYears, 0)} years`,
        ENTERED,
      );
    }
    if (costs.upkeep) {
      r.n(
        "Own staff, routine upkeep",
        costs.upkeep.annualLabourHours,
        0,
        "h/yr",
        sourceOf("options[].costs.upkeep.annualLabourHours", costs.upkeep.annualLabourHours),
      );
      r.money("Service contract and parts", costs.upkeep.annualServiceCost, ENTERED);
      if (costs.upkeep.cleaningCostPerEvent > 0)
        r.money("Cost per tube / exchanger cleaning", costs.upkeep.cleaningCostPerEvent, ENTERED);
      for (const p of costs.upkeep.periodicItems ?? []) {
        r.text(
          `Periodic: ${p.label ?? PERIODIC_LABELS[p.kind] ?? p.kind}`,
          `${fmtMoney(p.costPerEvent, currency)} + ${fmtNumber(p.labourHoursPerEvent, 0)} h every ${fmtNumber(p.everyYears, 1)} yr`,
          ENTERED,
        );
      }
    }
  }
  return { title: o.label ?? kindLabel, note: kindLabel, rows: r.rows };
}

const SEWER_BASIS_WORDS: Record<SewerBasis, string> = {
  makeup: "all makeup (no credit)",
  makeupMinusEvaporation: "makeup less evaporation (blowdown + drift)",
  blowdown: "metered blowdown only",
};

function waterGroup(
  w: Partial<WaterInput> | undefined,
  f: Partial<FoulingInput> | undefined,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  if (w) {
    const m = w.makeup;
    if (m) {
      r.q(
        "Makeup calcium hardness (as CaCO3)",
        "concentrationMgPerL",
        m.calciumHardnessMgPerLAsCaCO3,
        0,
        ENTERED,
      );
      r.q("Makeup M-alkalinity (as CaCO3)", "concentrationMgPerL", m.mAlkalinityMgPerLAsCaCO3, 0, ENTERED);
      r.q("Makeup silica", "concentrationMgPerL", m.silicaMgPerL, 1, ENTERED);
      r.q("Makeup chloride", "concentrationMgPerL", m.chlorideMgPerL, 0, ENTERED);
      r.q("Makeup TDS", "concentrationMgPerL", m.tdsMgPerL, 0, ENTERED);
      r.n("Makeup pH", m.ph, 2, "", ENTERED);
    }
    const l = w.limits;
    if (l) {
      r.q("Limit: silica", "concentrationMgPerL", l.silicaMgPerL, 0, "treatment programme limit, entered");
      r.q(
        "Limit: chloride",
        "concentrationMgPerL",
        l.chlorideMgPerL,
        0,
        "treatment programme limit, entered",
      );
      r.q("Limit: TDS", "concentrationMgPerL", l.tdsMgPerL, 0, "treatment programme limit, entered");
    }
    r.text(
      "Cycles of concentration",
      w.cyclesMode === "entered"
        ? `${fmtNumber(w.cyclesOfConcentration ?? NaN, 1)} (entered)`
        : w.cyclesMode
          ? "from makeup chemistry and limits"
          : undefined,
      ENTERED,
    );
    // Inputs stored before the sewer basis carry the evaporation-credit flag only.
    const legacyCredit = (w as { sewerEvaporationCredit?: boolean }).sewerEvaporationCredit;
    const basis = w.sewerBasis ?? (legacyCredit === undefined ? undefined : legacyCredit ? "makeupMinusEvaporation" : "makeup");
    r.text("Sewer billed on", basis === undefined ? undefined : SEWER_BASIS_WORDS[basis], ENTERED);
    const sc = w.scaleControl;
    if (sc) {
      r.n("Highest Langelier index accepted", sc.maximumLangelierIndex, 1, "", ENTERED);
      r.text(
        "Scale control above it",
        sc.acidFeed ? `sulfuric acid feed (${fmtPercent(sc.acidStrengthFraction, 0)} product)` : "none costed (warning only)",
        ENTERED,
      );
    }
  }
  if (f) {
    r.text(
      "Condenser fouling growth",
      f.model === "linear" ? "linear between cleanings" : f.model ? "asymptotic (Kern-Seaton)" : undefined,
      ENTERED,
    );
    r.q("Asymptotic fouling resistance", "foulingM2KPerW", f.asymptoticM2KPerW, 5, ENTERED);
    r.n("Fouling time constant", f.timeConstantMonths, 1, "months", ENTERED);
    r.n("Condenser tube cleaning interval", f.condenserCleaningIntervalMonths, 0, "months", ENTERED);
    r.n("Plate exchanger cleaning interval", f.plateExchangerCleaningIntervalMonths, 0, "months", ENTERED);
  }
  return { title: "Water, chemistry and fouling", rows: r.rows };
}

function tariffGroup(
  t: ScenarioInput["tariffs"] | undefined,
  labourRate: number | undefined,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  if (t) {
    const e = t.electricity;
    if (e) {
      if (e.pricing === "monthHour" && e.energyPricePerKWhByMonthHour?.length) {
        const arr = e.energyPricePerKWhByMonthHour;
        r.price(
          "Electricity energy price, mean of month x hour table",
          "pricePerKWh",
          arr.reduce((a, b) => a + b, 0) / arr.length,
          ENTERED,
          4,
        );
      } else
        r.price(
          "Electricity energy price",
          "pricePerKWh",
          e.energyPricePerKWh,
          sourceOf("tariffs.electricity.energyPricePerKWh", e.energyPricePerKWh),
          4,
        );
      r.price(
        "Demand charge",
        "pricePerKW",
        e.demandChargePerKWMonth,
        sourceOf("tariffs.electricity.demandChargePerKWMonth", e.demandChargePerKWMonth),
        2,
      );
      const demandRow = r.rows[r.rows.length - 1];
      if (demandRow && e.demandChargePerKWMonth !== undefined) demandRow.unit += " per month";
      r.pct(
        "Demand coincidence with the billed peak",
        e.demandCoincidenceFactor,
        sourceOf("tariffs.electricity.demandCoincidenceFactor", e.demandCoincidenceFactor),
        "%",
        0,
      );
    }
    r.price(
      "Water price",
      "pricePerM3",
      t.water?.pricePerM3,
      sourceOf("tariffs.water.pricePerM3", t.water?.pricePerM3),
    );
    r.money(
      "Water fixed charge per month",
      t.water?.fixedChargePerMonth,
      sourceOf("tariffs.water.fixedChargePerMonth", t.water?.fixedChargePerMonth),
      2,
    );
    r.price(
      "Sewer price",
      "pricePerM3",
      t.sewer?.pricePerM3,
      sourceOf("tariffs.sewer.pricePerM3", t.sewer?.pricePerM3),
    );
    r.money(
      "Sewer fixed charge per month",
      t.sewer?.fixedChargePerMonth,
      sourceOf("tariffs.sewer.fixedChargePerMonth", t.sewer?.fixedChargePerMonth),
      2,
    );
    r.price(
      "Treatment chemicals per volume of blowdown + drift",
      "pricePerM3",
      t.chemicals?.costPerM3Outflow,
      sourceOf("tariffs.chemicals.costPerM3Outflow", t.chemicals?.costPerM3Outflow),
    );
    r.money(
      "Treatment service, per wet loop and year",
      t.chemicals?.fixedCostPerYear,
      sourceOf("tariffs.chemicals.fixedCostPerYear", t.chemicals?.fixedCostPerYear),
    );
    r.money(
      "Water-management programme, per wet loop and year",
      t.waterManagementProgrammeCostPerYear,
      sourceOf("tariffs.waterManagementProgrammeCostPerYear", t.waterManagementProgrammeCostPerYear),
    );
    const esc = t.escalation;
    if (esc) {
      for (const [k, label] of [
        ["energy", "energy"],
        ["demand", "demand"],
        ["water", "water"],
        ["sewer", "sewer"],
        ["chemicals", "chemicals"],
        ["labour", "labour"],
        ["replacements", "replacements"],
      ] as const) {
        r.pct(`Real escalation: ${label}`, esc[k], sourceOf(`tariffs.escalation.${k}`, esc[k]), "%/yr");
      }
    }
  }
  r.money("Maintenance labour rate", labourRate, sourceOf("upkeep.labourRatePerHour", labourRate), 2);
  if (labourRate !== undefined) r.rows[r.rows.length - 1]!.unit = `${currency}/h`;
  return { title: "Tariffs and prices", rows: r.rows };
}

function economicsGroup(
  input: Partial<ScenarioInput>,
  result: ReportEngineResult,
  system: UnitSystem,
  currency: string,
): AssumptionGroup {
  const r = new Rows(system, currency);
  const e = input.economics;
  const eco = result.economics;
  r.n("Base year (1 January = base date)", eco.baseYear, 0, "", sourceOf("economics.baseYear", e?.baseYear));
  r.rows[r.rows.length - 1]!.value = String(eco.baseYear);
  r.n(
    "Study period",
    eco.studyPeriodYears,
    0,
    "years",
    sourceOf("economics.studyPeriodYears", e?.studyPeriodYears),
  );
  r.text(
    "Analysis",
    eco.analysis === "real" ? "constant dollars (real)" : "then-current dollars (nominal)",
    sourceOf("economics.analysis", e?.analysis),
  );
  r.text(
    "Discounting",
    eco.discounting === "midYear" ? "mid-year for recurring costs" : "end of year",
    sourceOf("economics.discounting", e?.discounting),
  );
  r.pct(
    "Real discount rate",
    eco.realDiscountRate,
    sourceOf("economics.realDiscountRate", e?.realDiscountRate),
    "%/yr",
    2,
  );
  r.pct(
    "General inflation",
    eco.inflationRate,
    sourceOf("economics.inflationRate", e?.inflationRate),
    "%/yr",
    2,
  );
  if (eco.analysis === "nominal")
    r.pct("Nominal discount rate (1 + d)(1 + I) - 1", eco.nominalDiscountRate, "derived", "%/yr", 2);
  r.text(
    "Residual value",
    e?.residualValueMethod === "none" ? "none" : "linear by remaining life",
    sourceOf("economics.residualValueMethod", e?.residualValueMethod),
  );
  const base = eco.options.find((o) => o.optionId === eco.baseOptionId);
  r.text("Base option for savings measures", base?.label, e?.baseOptionId ? ENTERED : "first option");
  return { title: "Economics", rows: r.rows };
}

/** How the option's tower or cooler was calibrated on its rating points, each point with its residual. */
function ratingFitGroup(label: string | undefined, fit: RatingFitSummary | undefined, system: UnitSystem, currency: string): AssumptionGroup {
  const r = new Rows(system, currency);
  if (!fit) return { title: "", rows: [] };
  r.text("Calibration", fit.note, "fit of the manufacturer's rating points");
  if (fit.device === "tower") {
    r.n("Characteristic coefficient C", fit.coefficientC, 3, "", fit.method === "designPoint" ? "design point" : "fitted");
    r.n("Characteristic exponent n", fit.exponentN, 3, "", fit.method === "fitted" ? "fitted" : "entered or default");
  } else {
    r.pct("Tube-side share of the wet resistance", fit.internalResistanceFraction, fit.method === "fitted" ? "fitted" : "entered or default");
    r.n("Dry external conductance factor", fit.dryExternalConductanceFactor, 3, "", "calibrated on the dry rating when given, else entered or default");
  }
  const t = (c: number | undefined) => (c === undefined ? "—" : fmtNumber(convert("temperatureC", c, system), 2));
  for (const p of fit.points) {
    const name = p.label === "design" ? "Design point" : p.label === "dry" ? "Dry rating" : p.label.charAt(0).toUpperCase() + p.label.slice(1);
    const residual =
      p.residualK === undefined ? (p.rejected ?? "not computed") : `residual ${p.residualK >= 0 ? "+" : "-"}${fmtNumber(Math.abs(convert("temperatureDifferenceK", p.residualK, system)), 2)} ${unitOf("temperatureDifferenceK", system, currency)}`;
    r.text(`${name}: leaving, rated / predicted`, `${t(p.ratedLeavingC)} / ${t(p.predictedLeavingC)}`, `${residual}${p.usedInFit ? "" : " (not in the fit)"}`, unitOf("temperatureC", system, currency));
  }
  return { title: `Rating points: ${label ?? "option"}`, rows: r.rows };
}

/** Every assumption group of the report, in reading order. */
export function buildAssumptions(
  rawInput: unknown,
  result: ReportEngineResult,
  system: UnitSystem,
  currency: string,
): AssumptionGroup[] {
  const input = (typeof rawInput === "object" && rawInput !== null ? rawInput : {}) as Partial<ScenarioInput>;
  const groups: AssumptionGroup[] = [
    climateGroup(input, result.climate, system, currency),
    dutyGroup(input.duty, system, currency),
  ];
  for (const o of input.options ?? []) {
    const phys = result.physics.find((p) => p.optionId === o.id);
    groups.push(optionGroup(o, phys?.cyclesOfConcentration, system, currency));
    groups.push(ratingFitGroup(o.label, phys?.ratingFit, system, currency));
  }
  groups.push(waterGroup(input.water, input.fouling, system, currency));
  groups.push(tariffGroup(input.tariffs, input.upkeep?.labourRatePerHour, system, currency));
  groups.push(economicsGroup(input, result, system, currency));
  return groups.filter((g) => g.rows.length > 0);
}
