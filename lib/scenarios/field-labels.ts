/**
 * The name of every scenario field as a person reads it, and how its value is shown (its quantity kind,
 * percent, or a volume flow of water), keyed by path pattern: numbers in a path become "[]"
 * ("options.1.tower.leavingWaterC" → "options[].tower.leavingWaterC"). The editor's fields take their label
 * from here and every error message names the field with it, so a field is named the same way on the
 * screen and in a message. Client-safe.
 */
import type { QuantityKind } from "@/lib/units";
import {
  BREAK_EVEN_INPUTS,
  FIRST_COST_ITEMS,
  MONTE_CARLO_INPUTS,
  SENSITIVITY_INPUTS,
  SENSITIVITY_INPUT_MODES,
  type MonteCarloInputKey,
} from "@/lib/engine/economics/types";

/** How a field's value is shown: a lib/units quantity, percent of a stored fraction, a mass flow as water volume flow, or a fixed unit. */
export type FieldDisplay =
  | { q: QuantityKind }
  | { percent: true; perYear?: boolean }
  | { waterFlow: true }
  | { unit: string }
  | { text: true };

export interface FieldInfo {
  label: string;
  /** The group of fields it is shown in (a sub-heading of its section). */
  group?: string;
  display?: FieldDisplay;
}

/** The one water-density convention (Methods §8), kg/L: lib/units. */
export { WATER_KG_PER_L } from "@/lib/units/factors";

export const FIRST_COST_LABELS: Record<(typeof FIRST_COST_ITEMS)[number], string> = {
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

export const TORNADO_LABELS: Record<(typeof SENSITIVITY_INPUTS)[number], string> = {
  waterPrice: "Water price",
  sewerPrice: "Sewer price",
  electricityPrice: "Electricity price",
  electricityEscalation: "Electricity escalation",
  cyclesOfConcentration: "Cycles of concentration",
  discountRate: "Discount rate",
  firstCostPremium: "Extra first cost",
  foulingRate: "Fouling rate",
  load: "Heat-rejection load",
  waterAndSewerEscalation: "Water and sewer escalation",
};

export const BREAK_EVEN_LABELS: Record<(typeof BREAK_EVEN_INPUTS)[number], string> = {
  waterAndSewerPrice: "Water + sewer price (factor)",
  electricityPrice: "Electricity price (factor)",
  cyclesOfConcentration: "Cycles of concentration",
  firstCostPremium: "Extra first cost (factor)",
};

export const MC_LABELS: Record<MonteCarloInputKey, { label: string; pct: boolean; kind?: "temperatureDifferenceK" }> = {
  waterPriceFactor: { label: "Water price factor", pct: false },
  sewerPriceFactor: { label: "Sewer price factor", pct: false },
  electricityPriceFactor: { label: "Electricity price factor", pct: false },
  demandChargeFactor: { label: "Demand charge factor", pct: false },
  chemicalsPriceFactor: { label: "Chemicals price factor", pct: false },
  energyEscalationDelta: { label: "Energy escalation change", pct: true },
  waterEscalationDelta: { label: "Water escalation change", pct: true },
  sewerEscalationDelta: { label: "Sewer escalation change", pct: true },
  discountRateDelta: { label: "Discount rate change", pct: true },
  firstCostFactor: { label: "First cost factor", pct: false },
  cyclesOfConcentration: { label: "Cycles of concentration", pct: false },
  foulingRateFactor: { label: "Fouling rate factor", pct: false },
  loadFactor: { label: "Load factor (on the duty in every hour)", pct: false },
  climateShiftK: { label: "Climate shift (added to every dry-bulb and wet-bulb)", pct: false, kind: "temperatureDifferenceK" },
  waterAndSewerEscalationDelta: { label: "Water and sewer escalation change", pct: true },
};

const q = (kind: QuantityKind): FieldDisplay => ({ q: kind });
const pct: FieldDisplay = { percent: true };
const pctYr: FieldDisplay = { percent: true, perYear: true };
const flow: FieldDisplay = { waterFlow: true };
const unit = (u: string): FieldDisplay => ({ unit: u });
const text: FieldDisplay = { text: true };

type Table = Record<string, [label: string, display?: FieldDisplay]>;
const grouped = (group: string, t: Table): Record<string, FieldInfo> =>
  Object.fromEntries(
    Object.entries(t).map(([k, [label, display]]) => [k, { label, group, ...(display ? { display } : {}) }]),
  );

const O = "options[]";

export const FIELD_INFO: Record<string, FieldInfo> = {
  ...grouped("General", {
    name: ["Scenario name", text],
    inputVersion: ["Input version"],
    climateDatasetId: ["Climate dataset", text],
    options: ["Options compared"],
  }),
  ...grouped("Design duty", {
    "duty.designBasis": ["Enter the duty as"],
    "duty.designHeatRejectionKW": ["Design heat rejection", q("heatDutyMbhKW")],
    "duty.designRefrigerationLoadKW": ["Design refrigeration load", q("refrigerationTonsKW")],
    "duty.designCop": ["Compressor COP at design", unit("kW/kW")],
    "duty.evaporatingC": ["Evaporating temperature", q("temperatureC")],
    "duty.condensingSetPointC": ["Condensing set-point", q("temperatureC")],
    "duty.minimumCondensingC": ["Minimum condensing temperature", q("temperatureC")],
    "duty.headPressureControl": ["Head-pressure control"],
    "duty.refrigerant": ["Refrigerant"],
  }),
  ...grouped("Load profile", {
    "duty.loadProfile": ["Load profile"],
    "duty.loadProfile.kind": ["Profile"],
    "duty.loadProfile.fraction": ["Fraction of design", pct],
    "duty.loadProfile.fractions": ["Profile fractions"],
    "duty.loadProfile.lowDryBulbC": ["Low dry-bulb point", q("temperatureC")],
    "duty.loadProfile.fractionAtLowDryBulb": ["Fraction at the low point", pct],
    "duty.loadProfile.highDryBulbC": ["High dry-bulb point", q("temperatureC")],
    "duty.loadProfile.fractionAtHighDryBulb": ["Fraction at the high point", pct],
  }),
  ...grouped("Compressor power", {
    "duty.compressorModel": ["Compressor model"],
    "duty.compressorModel.kind": ["Model of compressor power vs condensing temperature"],
    "duty.compressorModel.percentPerK": ["Compressor power rise", q("percentPerK")],
    "duty.compressorModel.floorFraction": ["Never below (of design power)", pct],
    "duty.compressorModel.refrigerant": ["Cycle"],
    "duty.compressorModel.curves": ["Compressor data"],
    "duty.compressorModel.curves[].evaporatingC": ["Suction (evaporating) temperature", q("temperatureC")],
    "duty.compressorModel.curves[].points": ["Compressor data points"],
    "duty.compressorModel.curves[].points[].condensingC": ["Compressor point: condensing", q("temperatureC")],
    "duty.compressorModel.curves[].points[].cop": ["COP", unit("kW/kW")],
    "duty.compressorModel.curves[].points[].powerKW": ["Compressor point: power", q("powerKW")],
    "duty.compressorModel.curves[].points[].refrigerationKW": ["Compressor point: capacity", q("refrigerationTonsKW")],
  }),
  ...grouped("Identification", {
    [`${O}`]: ["Option"],
    [`${O}.kind`]: ["Kind of option"],
    [`${O}.label`]: ["Label", text],
    [`${O}.id`]: ["Option id", text],
  }),
  ...grouped("Tower selection at design", {
    [`${O}.tower.waterFlowKgPerS`]: ["Tower water flow", flow],
    [`${O}.tower.enteringWaterC`]: ["Entering (hot) water", q("temperatureC")],
    [`${O}.tower.leavingWaterC`]: ["Leaving (cold) water", q("temperatureC")],
    [`${O}.tower.designWetBulbC`]: ["Design entering wet-bulb", q("temperatureC")],
    [`${O}.tower.designLiquidToGasRatio`]: ["Design L/G", unit("kg/kg")],
    [`${O}.tower.characteristicExponent`]: ["Characteristic exponent n", unit("—")],
  }),
  ...grouped("Tower rating points", {
    [`${O}.tower.ratingPoints`]: ["Tower rating points"],
    [`${O}.tower.ratingPoints[].waterFlowKgPerS`]: ["Rating point: water flow", flow],
    [`${O}.tower.ratingPoints[].enteringWaterC`]: ["Rating point: entering (hot) water", q("temperatureC")],
    [`${O}.tower.ratingPoints[].leavingWaterC`]: ["Rating point: leaving (cold) water", q("temperatureC")],
    [`${O}.tower.ratingPoints[].wetBulbC`]: ["Rating point: entering wet-bulb", q("temperatureC")],
    [`${O}.tower.ratingPoints[].airFlowKgPerS`]: ["Rating point: airflow (mass)", q("massFlowKgPerS")],
    [`${O}.tower.ratingPoints[].fanPowerKW`]: ["Rating point: fan motor input", q("powerKW")],
  }),
  ...grouped("Cooler selection at design", {
    [`${O}.cooler.fluidFlowKgPerS`]: ["Process fluid flow", flow],
    [`${O}.cooler.enteringFluidC`]: ["Entering fluid", q("temperatureC")],
    [`${O}.cooler.leavingFluidC`]: ["Leaving fluid", q("temperatureC")],
    [`${O}.cooler.designWetBulbC`]: ["Design entering wet-bulb", q("temperatureC")],
    [`${O}.cooler.designFluidToAirRatio`]: ["Design fluid-to-air mass ratio", unit("kg/kg")],
    [`${O}.cooler.internalResistanceFraction`]: ["Tube-side share of the wet resistance", pct],
    [`${O}.cooler.dryExternalConductanceFactor`]: ["Dry external conductance factor", unit("—")],
    [`${O}.cooler.allowDryMode`]: ["May run dry (spray pump off)"],
    [`${O}.cooler.dryModeMaxDryBulbC`]: ["Dry operation only below dry-bulb", q("temperatureC")],
    [`${O}.cooler.modeSelection`]: ["Wet or dry in each hour"],
    [`${O}.cooler.switchOverDryBulbC`]: ["Switch-over dry-bulb", q("temperatureC")],
    [`${O}.cooler.sprayLockoutDryBulbC`]: ["Spray locked out below dry-bulb", q("temperatureC")],
    [`${O}.cooler.dryRating`]: ["Dry rating"],
    [`${O}.cooler.dryRating.enteringFluidC`]: ["Dry rating: entering fluid", q("temperatureC")],
    [`${O}.cooler.dryRating.leavingFluidC`]: ["Dry rating: leaving fluid", q("temperatureC")],
    [`${O}.cooler.dryRating.dryBulbC`]: ["Dry rating: dry-bulb", q("temperatureC")],
    [`${O}.cooler.wetRatings`]: ["Extra wet ratings"],
    [`${O}.cooler.wetRatings[].fluidFlowKgPerS`]: ["Wet rating: fluid flow", flow],
    [`${O}.cooler.wetRatings[].enteringFluidC`]: ["Wet rating: entering fluid", q("temperatureC")],
    [`${O}.cooler.wetRatings[].leavingFluidC`]: ["Wet rating: leaving fluid", q("temperatureC")],
    [`${O}.cooler.wetRatings[].wetBulbC`]: ["Wet rating: entering wet-bulb", q("temperatureC")],
    [`${O}.cooler.wetRatings[].airFlowKgPerS`]: ["Wet rating: airflow (mass)", q("massFlowKgPerS")],
    [`${O}.cooler.glycol`]: ["Process fluid"],
    [`${O}.cooler.glycol.kind`]: ["Process fluid"],
    [`${O}.cooler.glycol.massFraction`]: ["Glycol mass fraction", pct],
    [`${O}.cooler.ratingFluid`]: ["The rating is given on"],
  }),
  ...grouped("Evaporative condenser at its rating", {
    [`${O}.evaporativeCondenser`]: ["Evaporative condenser"],
    [`${O}.evaporativeCondenser.ratedHeatRejectionKW`]: ["Rated heat rejection", q("heatDutyMbhKW")],
    [`${O}.evaporativeCondenser.ratedCondensingC`]: ["Rated condensing temperature", q("temperatureC")],
    [`${O}.evaporativeCondenser.ratedWetBulbC`]: ["Rated entering wet-bulb", q("temperatureC")],
    [`${O}.evaporativeCondenser.airFlowKgPerS`]: ["Rated airflow", q("massFlowKgPerS")],
    [`${O}.evaporativeCondenser.internalResistanceFraction`]: ["Condensing-side share of the wet resistance", pct],
  }),
  ...grouped("Evaporative condenser: wet and dry operation", {
    [`${O}.evaporativeCondenser.allowDryMode`]: ["May run dry (spray pump off)"],
    [`${O}.evaporativeCondenser.dryExternalConductanceFactor`]: ["Dry external conductance factor", unit("—")],
    [`${O}.evaporativeCondenser.modeSelection`]: ["Wet or dry in each hour"],
    [`${O}.evaporativeCondenser.switchOverDryBulbC`]: ["Switch-over dry-bulb", q("temperatureC")],
    [`${O}.evaporativeCondenser.sprayLockoutDryBulbC`]: ["Spray locked out below dry-bulb", q("temperatureC")],
    [`${O}.evaporativeCondenser.dryModeMaxDryBulbC`]: ["Dry operation only below dry-bulb", q("temperatureC")],
    [`${O}.evaporativeCondenser.dryRating`]: ["Dry rating"],
    [`${O}.evaporativeCondenser.dryRating.heatRejectionKW`]: ["Dry rating: heat rejection", q("heatDutyMbhKW")],
    [`${O}.evaporativeCondenser.dryRating.condensingC`]: ["Dry rating: condensing temperature", q("temperatureC")],
    [`${O}.evaporativeCondenser.dryRating.dryBulbC`]: ["Dry rating: dry-bulb", q("temperatureC")],
  }),
  ...grouped("Evaporative condenser coil", {
    [`${O}.evaporativeCondenser.coilMaterial`]: ["Coil material"],
    [`${O}.evaporativeCondenser.specificChargeKgPerKW`]: ["Refrigerant in the coil per kW", unit("kg/kW")],
    [`${O}.evaporativeCondenser.coilScaling`]: ["Coil scaling"],
    [`${O}.evaporativeCondenser.coilScaling.derateBeforeCleaning`]: ["Capacity lost to scale before a cleaning", pct],
    [`${O}.evaporativeCondenser.coilScaling.cleaningIntervalMonths`]: ["Coil cleaned every", q("months")],
    [`${O}.evaporativeCondenser.coilLifeYears`]: ["Coil life", q("years")],
    [`${O}.evaporativeCondenser.coilReplacementCost`]: ["Coil replacement", q("money")],
  }),
  ...grouped("Plate exchanger", {
    [`${O}.plateExchanger.designApproachK`]: ["Design approach", q("temperatureDifferenceK")],
    [`${O}.plateExchanger.cleanUWPerM2K`]: ["Clean U", q("heatTransferCoefficientWPerM2K")],
    [`${O}.plateExchanger.cleanSideFlowKgPerS`]: ["Clean (condenser) side flow", flow],
    [`${O}.plateExchanger.towerSidePressureDropKPa`]: ["Tower-side pressure drop", q("pressureDropKPa")],
    [`${O}.plateExchanger.cleanSidePressureDropKPa`]: ["Clean-side pressure drop", q("pressureDropKPa")],
    [`${O}.plateExchanger.foulingGrowthFactor`]: ["Plate fouling growth vs tubes", unit("×")],
  }),
  ...grouped("Fans", {
    [`${O}.fan.designPowerKW`]: ["Fan motor input at full speed (all cells)", q("powerKW")],
    [`${O}.fan.control`]: ["Fan control"],
    [`${O}.fan.minSpeedFraction`]: ["Minimum speed", pct],
    [`${O}.fan.powerFloorFraction`]: ["Power floor at low speed", pct],
    [`${O}.fan.lowSpeedFraction`]: ["Low speed", pct],
    [`${O}.fan.naturalDraftAirflowFraction`]: ["Airflow with the fan off", pct],
  }),
  ...grouped("Condenser", {
    [`${O}.condenser.designCondensingC`]: ["Design condensing temperature", q("temperatureC")],
    [`${O}.condenser.designEnteringWaterC`]: ["Design entering water", q("temperatureC")],
    [`${O}.condenser.cleanUWPerM2K`]: ["Clean U", q("heatTransferCoefficientWPerM2K")],
    [`${O}.condenser.designFoulingM2KPerW`]: ["Fouling allowance in the design point", q("foulingM2KPerW")],
    [`${O}.condenser.waterSideResistanceFraction`]: ["Water-side share of the clean condenser's resistance", pct],
  }),
  ...grouped("Condenser", {
    [`${O}.condenser.construction`]: ["Condenser construction"],
    [`${O}.condenser.material`]: ["Condenser material"],
    [`${O}.condenser.foulingGrowthMultiplier`]: ["Fouling growth vs shell-and-tube", unit("×")],
    [`${O}.condenser.specificChargeKgPerKW`]: ["Refrigerant charge per kW", unit("kg/kW")],
    [`${O}.condenser.upkeep.cleaningMethod`]: ["Condenser cleaning method"],
    [`${O}.condenser.upkeep.cleaningCostPerEvent`]: ["Condenser cleaning, per cleaning", q("money")],
    [`${O}.condenser.upkeep.inspectionIntervalYears`]: ["Condenser inspection every", q("years")],
    [`${O}.condenser.upkeep.inspectionCostPerEvent`]: ["Condenser inspection, per inspection", q("money")],
    [`${O}.condenser.upkeep.wearPartLifeYears`]: ["Condenser wear-part life", q("years")],
    [`${O}.condenser.upkeep.wearPartReplacementCost`]: ["Condenser wear-part replacement", q("money")],
  }),
  ...grouped("Pumps, basin and drift", {
    [`${O}.condenserPump.headM`]: ["Condenser-loop pump head", q("headM")],
    [`${O}.condenserPump.efficiency`]: ["Pump wire-to-water efficiency", pct],
    [`${O}.towerPump.headM`]: ["Tower-side pump head", q("headM")],
    [`${O}.towerPump.efficiency`]: ["Tower-side pump efficiency", pct],
    [`${O}.sprayPump.flowKgPerS`]: ["Spray-water flow", flow],
    [`${O}.sprayPump.headM`]: ["Spray pump head", q("headM")],
    [`${O}.sprayPump.efficiency`]: ["Spray pump efficiency", pct],
    [`${O}.sprayPump.powerKW`]: ["Spray pump motor input", q("powerKW")],
    [`${O}.basinHeater.powerKW`]: ["Basin heater rating", q("powerKW")],
    [`${O}.basinHeater.setPointC`]: ["Basin heater thermostat set-point", q("temperatureC")],
    [`${O}.basinHeater.belowDryBulbC`]: ["Basin heater thermostat set-point", q("temperatureC")],
    [`${O}.basinHeater.heatLossKWPerK`]: ["Basin heat loss per degree below the set-point", q("uaKWPerK")],
    [`${O}.basinHeater.drainedWhenIdle`]: ["Basin drained whenever no water circulates"],
    [`${O}.cyclesOfConcentration`]: ["This loop's own cycles of concentration", unit("—")],
    [`${O}.driftFractionOfFlow`]: ["Drift", unit("% of flow")],
    [`${O}.wetLoopVolumeM3`]: ["Wet-loop water volume", q("volumeM3")],
  }),
  ...grouped(
    "First cost",
    Object.fromEntries(
      FIRST_COST_ITEMS.map((k) => [`${O}.costs.firstCost.${k}`, [FIRST_COST_LABELS[k], q("money")]]),
    ) as Table,
  ),
  ...grouped("First cost", { [`${O}.costs.firstCost`]: ["First cost"], [`${O}.costs`]: ["Costs"] }),
  ...grouped("Life and upkeep", {
    [`${O}.costs.serviceLifeYears`]: ["Service life", q("years")],
    [`${O}.costs.replaceAtEndOfLife`]: ["Replace at the end of its life within the study"],
    [`${O}.costs.upkeep.annualLabourHours`]: ["Own staff routine upkeep", q("hours")],
    [`${O}.costs.upkeep.annualServiceCost`]: ["Service contract, parts, consumables", q("money")],
    [`${O}.costs.upkeep.cleaningCostPerEvent`]: ["Cleaning cost per event", q("money")],
  }),
  ...grouped("Component replacements", {
    [`${O}.costs.components`]: ["Component replacements"],
    [`${O}.costs.components[].component`]: ["Component"],
    [`${O}.costs.components[].lifeYears`]: ["Life", q("years")],
    [`${O}.costs.components[].replacementCost`]: ["Cost per replacement", q("money")],
  }),
  ...grouped("Periodic upkeep", {
    [`${O}.costs.upkeep.periodicItems`]: ["Periodic upkeep"],
    [`${O}.costs.upkeep.periodicItems[].kind`]: ["Item"],
    [`${O}.costs.upkeep.periodicItems[].everyYears`]: ["Every", q("years")],
    [`${O}.costs.upkeep.periodicItems[].costPerEvent`]: ["Cost per event", q("money")],
    [`${O}.costs.upkeep.periodicItems[].labourHoursPerEvent`]: ["Own labour per event", q("hours")],
  }),
  ...grouped("Makeup-water analysis", {
    "water.makeup.calciumHardnessMgPerLAsCaCO3": ["Calcium hardness (as CaCO₃)", q("concentrationMgPerL")],
    "water.makeup.mAlkalinityMgPerLAsCaCO3": ["M-alkalinity (as CaCO₃)", q("concentrationMgPerL")],
    "water.makeup.silicaMgPerL": ["Silica (SiO₂)", q("concentrationMgPerL")],
    "water.makeup.chlorideMgPerL": ["Chloride", q("concentrationMgPerL")],
    "water.makeup.tdsMgPerL": ["Total dissolved solids", q("concentrationMgPerL")],
    "water.makeup.ph": ["pH", unit("pH")],
    "water.makeup.conductivityUSPerCm": ["Conductivity", q("conductivityUSPerCm")],
  }),
  ...grouped("Cycles of concentration", {
    "water.cyclesMode": ["Cycles"],
    "water.cyclesOfConcentration": ["Cycles of concentration", unit("—")],
    "water.limits.silicaMgPerL": ["Silica limit", q("concentrationMgPerL")],
    "water.limits.chlorideMgPerL": ["Chloride limit", q("concentrationMgPerL")],
    "water.limits.tdsMgPerL": ["TDS limit", q("concentrationMgPerL")],
    "water.limits.calciumHardnessMgPerLAsCaCO3": ["Calcium hardness limit", q("concentrationMgPerL")],
    "water.recirculatingPh": ["Recirculating-water pH", unit("pH")],
  }),
  ...grouped("Scale control", {
    "water.scaleControl.maximumLangelierIndex": ["Highest Langelier index accepted", unit("LSI")],
    "water.scaleControl.acidFeed": ["Feed sulfuric acid to hold it"],
    "water.scaleControl.acidStrengthFraction": ["Acid product strength (H₂SO₄)", pct],
  }),
  ...grouped("Water and sewer prices", {
    "tariffs.water.pricePerM3": ["Water price", q("pricePerM3")],
    "tariffs.water.fixedChargePerMonth": ["Water fixed charge", q("money")],
    "tariffs.sewer.pricePerM3": ["Sewer price", q("pricePerM3")],
    "tariffs.sewer.fixedChargePerMonth": ["Sewer fixed charge", q("money")],
    "water.sewerBasis": ["Sewer billed on"],
    "water.sewerEvaporationCredit": ["Sewer billed on"],
    "tariffs.sewer.evaporationCreditMeterChargePerMonth": ["Credit-meter charge", q("money")],
  }),
  ...grouped("Treatment chemicals and the water-management programme", {
    "tariffs.chemicals.costPerM3Outflow": [
      "Treatment programme per volume of blowdown + drift",
      q("pricePerM3"),
    ],
    "tariffs.chemicals.inhibitorPricePerKg": ["Inhibitor product price", q("pricePerKg")],
    "tariffs.chemicals.biocidePricePerKg": ["Biocide product price", q("pricePerKg")],
    "tariffs.chemicals.acidPricePerKg": ["Acid product price", q("pricePerKg")],
    "tariffs.chemicals.fixedCostPerYear": ["Vendor service and testing, per wet loop", q("money")],
    "tariffs.waterManagementProgrammeCostPerYear": [
      "Water-management programme (Legionella), per wet loop",
      q("money"),
    ],
    "water.dosing.inhibitorMgPerLOutflow": ["Inhibitor dose in the blowdown", q("concentrationMgPerL")],
    "water.dosing.biocideMgPerLSystemVolume": ["Biocide slug dose", q("concentrationMgPerL")],
    "water.dosing.biocideSlugsPerYear": ["Biocide slugs", unit("per year")],
  }),
  ...grouped("Fouling of the open-tower condenser", {
    "fouling.model": ["Growth"],
    "fouling.linearRateM2KPerWPerMonth": ["Growth per month", q("foulingM2KPerW")],
    "fouling.asymptoticM2KPerW": ["Asymptotic fouling resistance", q("foulingM2KPerW")],
    "fouling.timeConstantMonths": ["Time constant", q("months")],
    "fouling.limitM2KPerW": ["Fouling limit before cleaning", q("foulingM2KPerW")],
    "fouling.condenserCleaningIntervalMonths": ["Condenser tube cleaning every", q("months")],
    "fouling.plateExchangerCleaningIntervalMonths": ["Plate-exchanger cleaning every", q("months")],
    "fouling.closedLoopFoulingM2KPerW": ["Fouling of condensers on a closed loop", q("foulingM2KPerW")],
  }),
  ...grouped("Labour", { "upkeep.labourRatePerHour": ["Loaded labour rate", unit("per hour")] }),
  ...grouped("Electricity", {
    "tariffs.electricity.pricing": ["Electricity pricing"],
    "tariffs.electricity.energyPricePerKWh": ["Energy price", q("pricePerKWh")],
    "tariffs.electricity.energyPricePerKWhByMonthHour": ["Month × hour energy prices"],
    "tariffs.electricity.demandChargePerKWMonth": ["Demand charge", unit("per kW·month")],
    "tariffs.electricity.demandChargePerKWMonthByMonth": ["Monthly demand charges"],
    "tariffs.electricity.demandCoincidenceFactor": ["Share of the option's peak in the billed peak", pct],
  }),
  ...grouped("Carbon price", {
    "tariffs.carbon.enabled": ["Price carbon emissions"],
    "tariffs.carbon.pricePerTonneCO2e": ["Carbon price", unit("per t CO₂e")],
  }),
  ...grouped("Footprint", {
    "footprint.gridEmissionFactorKgCO2ePerKWh": ["Grid emission factor", unit("kg CO₂e/kWh")],
    "footprint.gridEmissionFactorYear": ["Year of the grid factor", unit("year")],
    "footprint.gridEmissionFactorSource": ["Source of the grid factor", text],
    "footprint.gwpReport": ["IPCC assessment report for GWP"],
    "footprint.annualLeakFraction": ["Refrigerant leak rate", pctYr],
  }),
  ...grouped("Real escalation", {
    "tariffs.escalation.energy": ["Escalation of electric energy", pctYr],
    "tariffs.escalation.demand": ["Escalation of electric demand", pctYr],
    "tariffs.escalation.water": ["Escalation of water", pctYr],
    "tariffs.escalation.sewer": ["Escalation of sewer", pctYr],
    "tariffs.escalation.chemicals": ["Escalation of chemicals", pctYr],
    "tariffs.escalation.labour": ["Escalation of labour", pctYr],
    "tariffs.escalation.replacements": ["Escalation of replacements", pctYr],
    "tariffs.escalation.carbon": ["Escalation of the carbon price", pctYr],
  }),
  ...grouped("Study", {
    "economics.baseYear": ["Base year", unit("year")],
    "economics.studyPeriodYears": ["Study period", q("years")],
    "economics.analysis": ["Dollars"],
    "economics.realDiscountRate": ["Real discount rate", pctYr],
    "economics.inflationRate": ["General inflation", pctYr],
    "economics.discounting": ["Discounting of yearly costs"],
    "economics.residualValueMethod": ["Residual value"],
    "economics.baseOptionId": ["Base option"],
  }),
  ...grouped("Sensitivity", { "sensitivity.enabled": ["Run the tornado and break-evens"] }),
  ...grouped("Monte Carlo", {
    "monteCarlo.enabled": ["Run the Monte Carlo"],
    "monteCarlo.draws": ["Draws", q("count")],
    "monteCarlo.seed": ["Seed", q("count")],
    "monteCarlo.histogramBins": ["Histogram bins", q("count")],
  }),
  ...Object.fromEntries(
    SENSITIVITY_INPUTS.flatMap((k) => {
      const mode = SENSITIVITY_INPUT_MODES[k];
      const d: FieldDisplay = mode === "delta" ? pctYr : unit(mode === "factor" ? "×" : "cycles");
      const g = "Sensitivity";
      return [
        [`sensitivity.tornado.${k}.enabled`, { label: `${TORNADO_LABELS[k]} in the tornado`, group: g }],
        [`sensitivity.tornado.${k}.low`, { label: `${TORNADO_LABELS[k]}: low`, group: g, display: d }],
        [`sensitivity.tornado.${k}.high`, { label: `${TORNADO_LABELS[k]}: high`, group: g, display: d }],
      ];
    }),
  ),
  ...Object.fromEntries(
    BREAK_EVEN_INPUTS.flatMap((k) => {
      const d = unit(k === "cyclesOfConcentration" ? "cycles" : "×");
      const g = "Break-even search ranges";
      return [
        [`sensitivity.breakEven.${k}.enabled`, { label: `${BREAK_EVEN_LABELS[k]}: search`, group: g }],
        [`sensitivity.breakEven.${k}.min`, { label: `${BREAK_EVEN_LABELS[k]}: from`, group: g, display: d }],
        [`sensitivity.breakEven.${k}.max`, { label: `${BREAK_EVEN_LABELS[k]}: to`, group: g, display: d }],
      ];
    }),
  ),
  ...Object.fromEntries(
    MONTE_CARLO_INPUTS.flatMap((k) => {
      const m = MC_LABELS[k];
      const d: FieldDisplay = m.kind ? q(m.kind) : m.pct ? pctYr : unit(k === "cyclesOfConcentration" ? "cycles" : "×");
      const g = "Monte Carlo";
      return [
        [`monteCarlo.distributions.${k}`, { label: m.label, group: g }],
        [`monteCarlo.distributions.${k}.type`, { label: `${m.label}: distribution`, group: g }],
        [`monteCarlo.distributions.${k}.min`, { label: `${m.label}: min`, group: g, display: d }],
        [`monteCarlo.distributions.${k}.mode`, { label: `${m.label}: most likely`, group: g, display: d }],
        [`monteCarlo.distributions.${k}.max`, { label: `${m.label}: max`, group: g, display: d }],
      ];
    }),
  ),
};

/** A path's pattern: every numeric segment becomes "[]" ("options.1.costs.components.0.lifeYears" → "options[].costs.components[].lifeYears"). */
export function pathPattern(path: string): string {
  return path.replace(/\.(\d+)(?=\.|$)/g, "[]");
}

/** "designWetBulbC" → "Design wet bulb": the last resort for a field not in the table. */
function humanizeKey(key: string): string {
  const words = key
    .replace(/(KgPerS|LPerS|M2KPerW|KPa|KW|MgPerL|PerM3|PerKWh|PerKg|Years|Months|C|K|M)$/, "")
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The field's name and display, from the table or (for a field not in it) from its key. */
export function fieldInfo(path: string): FieldInfo {
  const pattern = pathPattern(path);
  const found = FIELD_INFO[pattern];
  if (found) return found;
  const last = pattern.split(".").pop() ?? pattern;
  return { label: humanizeKey(last.replace(/\[\]$/, "")) };
}
