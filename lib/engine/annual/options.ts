/**
 * Pipeline step 2 — option preparation and calibration: each option's tower or cooler, condenser and
 * plate exchanger calibrated once on their design points, the constant pump powers, and the design-point
 * sanity checks (as warnings). Independent of the what-if overrides.
 */
import { calibrateCondenserCleanUaKWPerK, condenserGlycolUFactor } from "../condenser";
import { designHeatRejectionKW } from "../duty";
import type { FanModel } from "../fans";
import { type CoolerModel, calibrateCooler } from "../fluid-cooler";
import { fluidProperties, tubeSideCoefficientRatio } from "../glycol";
import { type EvaporativeCondenserModel, DEFAULT_AIRFLOW_KG_PER_S_PER_KW, calibrateEvaporativeCondenser } from "../evaporative-condenser";
import type { DutyInput, FoulingInput, OptionInput, WaterCooledOptionInput } from "../input";
import { calibratePlateExchangerUaKWPerK } from "../plate-exchanger";
import { waterSpecificHeatKJPerKgK } from "../psychrometrics";
import { glycolPumpPowerKW, pumpPowerKW, waterHeadFromPressureDropM } from "../pumps";
import { type TowerModel, calibrateTower } from "../tower";
import { calibrateTowerOnRatings } from "../tower-fit";
import { coolerRatingChecks, fitCoolerResistanceSplit } from "../cooler-fit";
import type { EngineWarning, RatingFitSummary } from "../types";
import { numericWarning, wv } from "../warnings";
import { WATER_DENSITY_KG_PER_M3 } from "./shared";

const CPW = waterSpecificHeatKJPerKgK;

export type Device =
  | { kind: "tower"; model: TowerModel }
  | { kind: "cooler"; model: CoolerModel }
  | { kind: "evaporativeCondenser"; model: EvaporativeCondenserModel };

/** An option with every model calibrated once. */
export interface PreparedOption {
  input: OptionInput;
  path: string;
  fan: FanModel;
  device: Device;
  /** Water-cooled condenser (0 for the evaporative condenser, which has none). */
  condenserCleanUaKWPerK: number;
  condenserCleanUWPerM2K: number;
  /** ṁ·cp through the condenser, kW/K. */
  condenserCapacityKWPerK: number;
  /** Constant fouling of a condenser on a closed loop (plate and cooler options), m²·K/W. */
  condenserFixedFoulingM2KPerW: number;
  plate?: { cleanUaKWPerK: number; cleanUWPerM2K: number; hotCapacityKWPerK: number; coldCapacityKWPerK: number };
  condenserPumpKW: number;
  secondaryPumpKW: number;
  sprayPumpKW: number;
  /** Circulating water whose drift counts: tower flow, or the cooler's spray flow, kg/s. */
  driftFlowKgPerS: number;
  wetLoopVolumeM3: number;
  /** Hot-water (tower), entering-fluid (cooler) or condensing (evaporative condenser) temperature at design, °C. */
  designHottestSurfaceC: number;
  /** How the tower or cooler was calibrated on the selection's rating points (absent for the evaporative condenser). */
  ratingFit?: RatingFitSummary;
  warnings: EngineWarning[];
}

function fanModel(o: OptionInput): FanModel {
  return {
    designPowerKW: o.fan.designPowerKW,
    control: o.fan.control,
    minSpeedFraction: o.fan.minSpeedFraction,
    powerFloorFraction: o.fan.powerFloorFraction,
    lowSpeedFraction: o.fan.lowSpeedFraction,
    naturalDraftAirflowFraction: o.fan.naturalDraftAirflowFraction,
  };
}

function calibrateCondenser(
  o: WaterCooledOptionInput,
  path: string,
  designHeatKW: number,
  defaultEnteringC: number,
  capacityKWPerK: number,
  warnings: EngineWarning[],
): number {
  const entering = o.condenser.designEnteringWaterC ?? defaultEnteringC;
  let ua = calibrateCondenserCleanUaKWPerK(
    o.condenser.designCondensingC,
    entering,
    designHeatKW,
    capacityKWPerK,
    o.condenser.cleanUWPerM2K,
    o.condenser.designFoulingM2KPerW,
  );
  if (!Number.isFinite(ua)) {
    ua = -capacityKWPerK * Math.log(0.05);
    warnings.push(
      numericWarning({
        code: "condenser.designInfeasible",
        severity: "warning",
        template:
          "A condensing temperature of {tc} cannot reject {q} into {tw} water at this flow (it needs more than the water's temperature rise); a condenser effectiveness of 0.95 was assumed.",
        values: { tc: wv.tempC(o.condenser.designCondensingC), q: wv.dutyKW(designHeatKW), tw: wv.tempC(entering) },
        path: `${path}.condenser.designCondensingC`,
        optionId: o.id,
      }),
    );
  }
  return ua;
}

/**
 * Calibrate an option's tower or cooler, condenser and exchanger on their design points and work out
 * the constant pump powers. Design-point sanity checks become warnings.
 */
export function prepareOption(o: OptionInput, index: number, duty: DutyInput, fouling: FoulingInput, pPa: number): PreparedOption {
  const path = `options.${index}`;
  const warnings: EngineWarning[] = [];
  const qDesign = designHeatRejectionKW(duty);
  const fan = fanModel(o);
  const volumeFromFlow = (kgPerS: number): number => (kgPerS * 180) / WATER_DENSITY_KG_PER_M3;
  if (o.kind === "evaporativeCondenser") {
    const e = o.evaporativeCondenser;
    const { model, warnings: w } = calibrateEvaporativeCondenser(e, pPa, `${path}.evaporativeCondenser`);
    warnings.push(...w.map((x) => ({ ...x, optionId: o.id })));
    if (qDesign > 0 && Math.abs(e.ratedHeatRejectionKW / qDesign - 1) > 0.1) {
      warnings.push({
        code: "evaporativeCondenser.selectionDutyMismatch",
        severity: "info",
        message: `The evaporative condenser is rated for ${Math.round(e.ratedHeatRejectionKW)} kW of heat rejection, the duty is ${Math.round(qDesign)} kW; the model uses the rating as the unit's characteristic and the duty as the load.`,
        path: `${path}.evaporativeCondenser.ratedHeatRejectionKW`,
        optionId: o.id,
      });
    }
    if (e.airFlowKgPerS === undefined) {
      warnings.push({
        code: "evaporativeCondenser.airflowDefaulted",
        severity: "info",
        message: `No rated airflow entered: ${DEFAULT_AIRFLOW_KG_PER_S_PER_KW.value} kg/s per kW of rated heat rejection was assumed (${DEFAULT_AIRFLOW_KG_PER_S_PER_KW.source}).`,
        path: `${path}.evaporativeCondenser.airFlowKgPerS`,
        optionId: o.id,
      });
    }
    return {
      input: o,
      path,
      fan,
      device: { kind: "evaporativeCondenser", model },
      condenserCleanUaKWPerK: 0,
      condenserCleanUWPerM2K: 0,
      condenserCapacityKWPerK: 0,
      condenserFixedFoulingM2KPerW: 0,
      condenserPumpKW: 0,
      secondaryPumpKW: 0,
      sprayPumpKW: o.sprayPump.powerKW ?? pumpPowerKW(o.sprayPump.flowKgPerS, o.sprayPump.headM, o.sprayPump.efficiency),
      driftFlowKgPerS: o.sprayPump.flowKgPerS,
      wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(o.sprayPump.flowKgPerS),
      designHottestSurfaceC: e.ratedCondensingC,
      warnings,
    };
  }
  if (o.kind === "closedCircuitCooler") {
    const split = fitCoolerResistanceSplit(o.cooler, pPa, `${path}.cooler`);
    const { model, warnings: w } = calibrateCooler({ ...o.cooler, internalResistanceFraction: split.internalResistanceFraction }, pPa, `${path}.cooler`);
    warnings.push(...[...split.warnings, ...w].map((x) => ({ ...x, optionId: o.id })));
    const ratingFit: RatingFitSummary = {
      ...split.summary,
      dryExternalConductanceFactor: model.dryFactor,
      points: coolerRatingChecks(o.cooler, split.internalResistanceFraction, model.dryFactor, split.method === "fitted", pPa),
    };
    const c = o.cooler;
    const meanC = 0.5 * (c.enteringFluidC + c.leavingFluidC);
    const loop = fluidProperties(c.glycol.kind, c.glycol.massFraction, meanC);
    const water = fluidProperties("none", 0, meanC);
    const cw = model.fluidCapacityKWPerK;
    // The condenser's design point is stated on the same fluid as the cooler's rating. Rated on water
    // with glycol in the loop: calibrate on water at the same mass flow, then derate the water-side
    // film (its share of the clean resistance) by the Dittus–Boelter coefficient ratio.
    const glycolOnWaterRating = c.ratingFluid === "water" && c.glycol.kind !== "none" && c.glycol.massFraction > 0;
    const cwRating = glycolOnWaterRating ? c.fluidFlowKgPerS * water.specificHeatKJPerKgK : cw;
    const glycolDerate = glycolOnWaterRating
      ? condenserGlycolUFactor(o.condenser.waterSideResistanceFraction, tubeSideCoefficientRatio(loop, water))
      : 1;
    const ua = calibrateCondenser(o, path, qDesign, c.leavingFluidC, cwRating, warnings) * glycolDerate;
    designChecks(warnings, o, path, qDesign, model.fluidCapacityKWPerK * (c.enteringFluidC - c.leavingFluidC), c.leavingFluidC - c.designWetBulbC, 2.5, "cooler");
    const sprayKW = o.sprayPump.powerKW ?? pumpPowerKW(o.sprayPump.flowKgPerS, o.sprayPump.headM, o.sprayPump.efficiency);
    return {
      input: o,
      path,
      fan,
      device: { kind: "cooler", model },
      condenserCleanUaKWPerK: ua,
      condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K * glycolDerate,
      condenserCapacityKWPerK: cw,
      condenserFixedFoulingM2KPerW: fouling.closedLoopFoulingM2KPerW,
      condenserPumpKW:
        c.glycol.kind === "none"
          ? pumpPowerKW(c.fluidFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency)
          : glycolPumpPowerKW(c.fluidFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency, loop, water),
      secondaryPumpKW: 0,
      sprayPumpKW: sprayKW,
      driftFlowKgPerS: o.sprayPump.flowKgPerS,
      wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(o.sprayPump.flowKgPerS),
      designHottestSurfaceC: c.enteringFluidC,
      ratingFit,
      warnings,
    };
  }
  const designCalibrated = calibrateTower(o.tower, pPa, `${path}.tower`);
  const fitted = calibrateTowerOnRatings(designCalibrated.model, o.tower, o.fan.designPowerKW, pPa, `${path}.tower`);
  const model = fitted.model;
  const ratingFit = fitted.summary;
  warnings.push(...[...designCalibrated.warnings, ...fitted.warnings].map((x) => ({ ...x, optionId: o.id })));
  const t = o.tower;
  const towerC = t.waterFlowKgPerS * CPW;
  designChecks(warnings, o, path, qDesign, towerC * (t.enteringWaterC - t.leavingWaterC), t.leavingWaterC - t.designWetBulbC, 2, "tower");
  if (o.kind === "openTowerDirect") {
    const ua = calibrateCondenser(o, path, qDesign, t.leavingWaterC, towerC, warnings);
    return {
      input: o,
      path,
      fan,
      device: { kind: "tower", model },
      condenserCleanUaKWPerK: ua,
      condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K,
      condenserCapacityKWPerK: towerC,
      condenserFixedFoulingM2KPerW: 0,
      condenserPumpKW: pumpPowerKW(t.waterFlowKgPerS, o.condenserPump.headM, o.condenserPump.efficiency),
      secondaryPumpKW: 0,
      sprayPumpKW: 0,
      driftFlowKgPerS: t.waterFlowKgPerS,
      wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(t.waterFlowKgPerS),
      designHottestSurfaceC: t.enteringWaterC,
      ratingFit,
      warnings,
    };
  }
  const px = o.plateExchanger;
  const cleanFlow = px.cleanSideFlowKgPerS ?? t.waterFlowKgPerS;
  const hotC = cleanFlow * CPW;
  const uaHx = calibratePlateExchangerUaKWPerK(qDesign, px.designApproachK, hotC, towerC);
  if (px.designApproachK < 0.5) {
    warnings.push(
      numericWarning({
        code: "plateExchanger.approachImplausiblySmall",
        severity: "warning",
        template: "A plate-exchanger approach of {a} is implausibly small for a screening study ({lo}–{hi} is usual).",
        values: { a: wv.dK(px.designApproachK), lo: wv.dK(1), hi: wv.dK(2) },
        path: `${path}.plateExchanger.designApproachK`,
        optionId: o.id,
      }),
    );
  }
  const ua = calibrateCondenser(o, path, qDesign, t.leavingWaterC + px.designApproachK, hotC, warnings);
  return {
    input: o,
    path,
    fan,
    device: { kind: "tower", model },
    condenserCleanUaKWPerK: ua,
    condenserCleanUWPerM2K: o.condenser.cleanUWPerM2K,
    condenserCapacityKWPerK: hotC,
    condenserFixedFoulingM2KPerW: fouling.closedLoopFoulingM2KPerW,
    plate: { cleanUaKWPerK: uaHx, cleanUWPerM2K: px.cleanUWPerM2K, hotCapacityKWPerK: hotC, coldCapacityKWPerK: towerC },
    condenserPumpKW: pumpPowerKW(cleanFlow, o.condenserPump.headM + waterHeadFromPressureDropM(px.cleanSidePressureDropKPa), o.condenserPump.efficiency),
    secondaryPumpKW: pumpPowerKW(t.waterFlowKgPerS, o.towerPump.headM + waterHeadFromPressureDropM(px.towerSidePressureDropKPa), o.towerPump.efficiency),
    sprayPumpKW: 0,
    driftFlowKgPerS: t.waterFlowKgPerS,
    wetLoopVolumeM3: o.wetLoopVolumeM3 ?? volumeFromFlow(t.waterFlowKgPerS),
    designHottestSurfaceC: t.enteringWaterC,
    ratingFit,
    warnings,
  };
}

function designChecks(
  warnings: EngineWarning[],
  o: WaterCooledOptionInput,
  path: string,
  dutyKW: number,
  selectionKW: number,
  approachK: number,
  minApproachK: number,
  what: "tower" | "cooler",
): void {
  if (approachK < minApproachK) {
    warnings.push(
      numericWarning({
        code: `${what}.approachImplausiblySmall`,
        severity: "warning",
        template: `The ${what} selection's approach to the design wet-bulb is {a}: below {min} is implausibly small for a real selection; check the rating.`,
        values: { a: wv.dK(approachK), min: wv.dK(minApproachK) },
        path: `${path}.${what}.leavingWaterC`.replace("cooler.leavingWaterC", "cooler.leavingFluidC"),
        optionId: o.id,
      }),
    );
  }
  if (dutyKW > 0 && Math.abs(selectionKW / dutyKW - 1) > 0.1) {
    warnings.push(
      numericWarning({
        code: `${what}.selectionDutyMismatch`,
        severity: "info",
        template: `The ${what} is rated for {sel} at its design point, the duty is {duty}; the model uses the rating as the unit's characteristic and the duty as the load.`,
        values: { sel: wv.dutyKW(selectionKW), duty: wv.dutyKW(dutyKW) },
        path: `${path}.${what}`,
        optionId: o.id,
      }),
    );
  }
}
