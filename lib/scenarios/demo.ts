/**
 * The demo's invented scenario: a ~1,500 kW heat-rejection ammonia cold store at the invented Harrowgate
 * Flats site, comparing four ways to reject the heat: an open tower on a shell-and-tube condenser, an open
 * tower isolated by a plate exchanger (welded plate-and-shell condenser on the clean loop), a closed-circuit
 * cooler on glycol, and an evaporative condenser. Every figure is invented (realistic orders of magnitude for such a plant,
 * not any manufacturer's selection or any real utility's tariff).
 * Weather: lib/engine/climate/synthetic.ts (seeded model documented there), never station data.
 */
import { createHash } from "node:crypto";
import { generateSyntheticYear, HARROWGATE_FLATS, parseEpw, syntheticYearToEpw } from "@/lib/engine/climate";
import { datasetFromParsedFile, type NewDataset } from "@/lib/climate/build";
import type { ScenarioDocument } from "./mappers";

export const DEMO_WEATHER_SEED = 20240611;
export const DEMO_SCENARIO_NAME = "Condenser heat rejection: tower, isolated tower, closed-circuit cooler or evaporative condenser";

/** The invented typical year as a stored climate dataset (generated, written as EPW, parsed like an upload). */
export function demoClimateDataset(siteElevationM: number): NewDataset {
  const year = generateSyntheticYear({ seed: DEMO_WEATHER_SEED, site: HARROWGATE_FLATS });
  const epw = syntheticYearToEpw(year);
  const parsed = parseEpw(epw);
  if (!parsed.ok) throw new Error(`demo weather did not parse: ${parsed.errors[0]?.message}`);
  return datasetFromParsedFile(parsed.value, parsed.warnings, {
    sourceKind: "epw",
    fileName: `harrowgate-flats-synthetic-${DEMO_WEATHER_SEED}.epw`,
    name: `Harrowgate Flats — invented typical year (seed ${DEMO_WEATHER_SEED})`,
    byteSize: Buffer.byteLength(epw),
    sha256: createHash("sha256").update(epw).digest("hex"),
    siteElevationM,
  });
}

const range = 5; // K across the condenser at design
const flowKgPerS = 1500 / (4.186 * range);

/** The complete demo scenario document (no climate, no site: those come from the dataset and the project). */
export function demoScenarioDocument(): ScenarioDocument {
  return {
    inputVersion: 1,
    name: DEMO_SCENARIO_NAME,
    duty: {
      designBasis: "heatRejection",
      designHeatRejectionKW: 1500,
      designCop: 2.3,
      evaporatingC: -28,
      condensingSetPointC: 35.5,
      minimumCondensingC: 21,
      headPressureControl: "fixedSetPoint",
      loadProfile: { kind: "linearInDryBulb", lowDryBulbC: 0, fractionAtLowDryBulb: 0.65, highDryBulbC: 32, fractionAtHighDryBulb: 1 },
      compressorModel: { kind: "refrigerantCycle" },
      refrigerant: "R717",
    },
    options: [
      {
        id: "tower-direct",
        kind: "openTowerDirect",
        label: "Open tower, direct",
        tower: { waterFlowKgPerS: flowKgPerS, enteringWaterC: 33.5, leavingWaterC: 28.5, designWetBulbC: 23.5 },
        fan: { designPowerKW: 22, control: "variableSpeed" },
        condenser: { designCondensingC: 35.5 },
        condenserPump: { headM: 18, efficiency: 0.68 },
        basinHeater: { powerKW: 8, setPointC: 4.4 },
        costs: {
          firstCost: { equipment: 185_000, installation: 62_000, structureAndCrane: 34_000, electrical: 28_000, controls: 14_000, plateExchanger: 0, waterTreatmentEquipment: 18_000, meters: 3_500, other: 6_000 },
          serviceLifeYears: 20,
          components: [
            { component: "fill", label: "PVC film fill", lifeYears: 15, replacementCost: 38_000 },
            { component: "fanMotor", lifeYears: 18, replacementCost: 9_000 },
            { component: "gearbox", lifeYears: 15, replacementCost: 12_000 },
          ],
          upkeep: {
            annualLabourHours: 60,
            annualServiceCost: 4_000,
            cleaningCostPerEvent: 9_500,
            periodicItems: [
              { kind: "eddyCurrentTesting", label: "Eddy-current test of condenser tubes", everyYears: 3, costPerEvent: 7_500, labourHoursPerEvent: 16 },
              { kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 1_200, labourHoursPerEvent: 8 },
            ],
          },
        },
      },
      {
        id: "tower-plate",
        kind: "openTowerPlateHx",
        label: "Open tower + plate exchanger",
        tower: { waterFlowKgPerS: flowKgPerS, enteringWaterC: 32, leavingWaterC: 27, designWetBulbC: 23.5 },
        plateExchanger: { designApproachK: 1.5, towerSidePressureDropKPa: 45, cleanSidePressureDropKPa: 45 },
        towerPump: { headM: 14, efficiency: 0.68 },
        fan: { designPowerKW: 30, control: "variableSpeed" },
        condenser: { designCondensingC: 35.5, construction: "plateAndShell" },
        condenserPump: { headM: 16, efficiency: 0.68 },
        basinHeater: { powerKW: 9, setPointC: 4.4 },
        costs: {
          firstCost: { equipment: 205_000, installation: 70_000, structureAndCrane: 38_000, electrical: 32_000, controls: 16_000, plateExchanger: 62_000, waterTreatmentEquipment: 18_000, meters: 3_500, other: 6_000 },
          serviceLifeYears: 20,
          components: [
            { component: "fill", label: "PVC film fill", lifeYears: 15, replacementCost: 40_000 },
            { component: "exchangerPlates", label: "Plate pack and gaskets", lifeYears: 15, replacementCost: 24_000 },
            { component: "fanMotor", lifeYears: 18, replacementCost: 10_500 },
          ],
          upkeep: {
            annualLabourHours: 70,
            annualServiceCost: 4_500,
            cleaningCostPerEvent: 6_000,
            periodicItems: [{ kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 1_200, labourHoursPerEvent: 8 }],
          },
        },
      },
      {
        id: "cooler",
        kind: "closedCircuitCooler",
        label: "Closed-circuit cooler",
        cooler: {
          fluidFlowKgPerS: flowKgPerS,
          enteringFluidC: 34.5,
          leavingFluidC: 29.5,
          designWetBulbC: 23.5,
          allowDryMode: true,
          glycol: { kind: "propyleneGlycol", massFraction: 0.3 },
          ratingFluid: "loopFluid",
        },
        sprayPump: { flowKgPerS: 0.4 * flowKgPerS, headM: 6, efficiency: 0.6, powerKW: 5.5 },
        fan: { designPowerKW: 37, control: "variableSpeed" },
        condenser: { designCondensingC: 37 },
        condenserPump: { headM: 20, efficiency: 0.68 },
        basinHeater: { powerKW: 4, setPointC: 4.4 },
        costs: {
          firstCost: { equipment: 310_000, installation: 75_000, structureAndCrane: 45_000, electrical: 30_000, controls: 15_000, plateExchanger: 0, waterTreatmentEquipment: 12_000, meters: 3_500, other: 6_000 },
          serviceLifeYears: 22,
          components: [
            { component: "sprayPump", lifeYears: 10, replacementCost: 6_000 },
            { component: "fanMotor", lifeYears: 18, replacementCost: 12_000 },
          ],
          upkeep: {
            annualLabourHours: 50,
            annualServiceCost: 3_500,
            cleaningCostPerEvent: 0,
            periodicItems: [
              { kind: "coilExteriorDescaling", everyYears: 3, costPerEvent: 6_500, labourHoursPerEvent: 12 },
              { kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 900, labourHoursPerEvent: 6 },
            ],
          },
        },
      },
      {
        id: "evap",
        kind: "evaporativeCondenser",
        label: "Evaporative condenser",
        evaporativeCondenser: {
          ratedHeatRejectionKW: 1600,
          ratedCondensingC: 35,
          ratedWetBulbC: 24,
          airFlowKgPerS: 46,
          coilMaterial: "galvanizedSteel",
          coilScaling: { derateBeforeCleaning: 0.05, cleaningIntervalMonths: 12 },
          coilLifeYears: 20,
          coilReplacementCost: 95_000,
        },
        sprayPump: { flowKgPerS: 30, headM: 6, efficiency: 0.6, powerKW: 5.5 },
        fan: { designPowerKW: 30, control: "variableSpeed" },
        basinHeater: { powerKW: 6, belowDryBulbC: 4.4 },
        costs: {
          firstCost: { equipment: 285_000, installation: 70_000, structureAndCrane: 40_000, electrical: 24_000, controls: 14_000, plateExchanger: 0, waterTreatmentEquipment: 12_000, meters: 3_500, other: 18_000 },
          serviceLifeYears: 20,
          components: [
            { component: "sprayPump", lifeYears: 10, replacementCost: 5_500 },
            { component: "fanMotor", lifeYears: 18, replacementCost: 9_000 },
          ],
          upkeep: {
            annualLabourHours: 55,
            annualServiceCost: 3_500,
            cleaningCostPerEvent: 3_200,
            periodicItems: [{ kind: "basinDisinfection", everyYears: 0.5, costPerEvent: 900, labourHoursPerEvent: 6 }],
          },
        },
      },
    ],
    water: {
      makeup: { calciumHardnessMgPerLAsCaCO3: 140, mAlkalinityMgPerLAsCaCO3: 120, silicaMgPerL: 18, chlorideMgPerL: 45, ph: 7.8, tdsMgPerL: 380, conductivityUSPerCm: 600 },
      cyclesMode: "fromChemistry",
    },
    tariffs: {
      electricity: { pricing: "flat", energyPricePerKWh: 0.105, demandChargePerKWMonth: 14.5, demandCoincidenceFactor: 0.8 },
      water: { pricePerM3: 3.1, fixedChargePerMonth: 0 },
      sewer: { pricePerM3: 4.2, fixedChargePerMonth: 0, evaporationCreditMeterChargePerMonth: 0 },
      chemicals: { costPerM3Outflow: 0.55, inhibitorPricePerKg: 0, biocidePricePerKg: 0, fixedCostPerYear: 3_600 },
      waterManagementProgrammeCostPerYear: 4_800,
    },
    upkeep: { labourRatePerHour: 92 },
    economics: { baseYear: 2026, studyPeriodYears: 25, analysis: "real", realDiscountRate: 0.03, inflationRate: 0.025, discounting: "endOfYear", residualValueMethod: "linear", baseOptionId: "tower-direct" },
    sensitivity: {},
    monteCarlo: { enabled: true, draws: 10_000, seed: 20260101, histogramBins: 30 },
  } as unknown as ScenarioDocument;
}
