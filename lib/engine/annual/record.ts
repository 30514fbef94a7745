/**
 * Pipeline step 3 — one record (an hour, or a bin's representative hour): the duty → the condenser
 * entering water the target condensing temperature needs → the tower or cooler (record-tower.ts,
 * record-cooler.ts) holds it or floats → condensing temperature, powers, compressor, water flows.
 *
 * Basin heater rule: the heater runs in hours below its dry-bulb threshold in which no warm water
 * wets the basin — the tower idle (no load), or the cooler's spray pump off (dry mode or idle).
 */
import type { EnteringAir } from "../air-side";
import { compressorPenaltyKW, compressorPowerKW } from "../compressor";
import { condensingTemperatureC, fouledUaKWPerK, requiredEnteringWaterC } from "../condenser";
import { targetCondensingC } from "../duty";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { coolerRecord } from "./record-cooler";
import { towerRecord } from "./record-tower";

/** Results of one record, per hour (rates), before weighting. */
export interface RecordRates {
  heatKW: number;
  fanKW: number;
  condenserPumpKW: number;
  secondaryPumpKW: number;
  sprayPumpKW: number;
  heaterKW: number;
  penaltyKW: number;
  compressorKW: number;
  evaporationKgPerS: number;
  driftKgPerS: number;
  dry: boolean;
  unmet: boolean;
  running: boolean;
  condensingC: number;
  referenceC: number;
  hottestSurfaceC: number;
}

/** What the heat-rejection device reports for one record. */
export interface DeviceRecord {
  held: boolean;
  /** Water (tower) or fluid (cooler) leaving the device, °C. */
  leavingC: number;
  /** Plate-exchanger approach added between the tower water and the condenser water, K. */
  approachK: number;
}

export function evaluateRecord(po: PreparedOption, ctx: YearContext, air: EnteringAir, heatKW: number, towerSideRf: number): RecordRates {
  const o = po.input;
  const rates: RecordRates = {
    heatKW,
    fanKW: 0,
    condenserPumpKW: 0,
    secondaryPumpKW: 0,
    sprayPumpKW: 0,
    heaterKW: 0,
    penaltyKW: 0,
    compressorKW: 0,
    evaporationKgPerS: 0,
    driftKgPerS: 0,
    dry: false,
    unmet: false,
    running: false,
    condensingC: 0,
    referenceC: 0,
    hottestSurfaceC: Number.NEGATIVE_INFINITY,
  };
  const heaterBelow = air.dryBulbC < o.basinHeater.belowDryBulbC;
  if (!(heatKW > 0)) {
    if (heaterBelow) rates.heaterKW = o.basinHeater.powerKW;
    return rates;
  }
  rates.running = true;
  const target = targetCondensingC(ctx.duty);
  const cw = po.condenserCapacityKWPerK;
  const condRf = o.kind === "openTowerDirect" ? towerSideRf : po.condenserFixedFoulingM2KPerW;
  const uaCond = fouledUaKWPerK(po.condenserCleanUaKWPerK, po.condenserCleanUWPerM2K, condRf);
  const condenserEnteringReq = requiredEnteringWaterC(target, heatKW, uaCond, cw);
  const dev: DeviceRecord =
    po.device.kind === "tower"
      ? towerRecord(po, po.device.model, ctx, air, heatKW, condenserEnteringReq, towerSideRf, rates)
      : coolerRecord(po, po.device.model, ctx, air, heatKW, condenserEnteringReq, heaterBelow, rates);
  rates.condenserPumpKW = po.condenserPumpKW;
  rates.secondaryPumpKW = po.secondaryPumpKW;
  const condensing = dev.held ? target : condensingTemperatureC(dev.leavingC + dev.approachK, heatKW, uaCond, cw);
  const cleanRef = condensingTemperatureC(dev.leavingC, heatKW, po.condenserCleanUaKWPerK, cw);
  const reference = Math.max(target, Math.min(cleanRef, condensing));
  const qe = heatKW * ctx.refrigerationPerRejection;
  rates.condensingC = condensing;
  rates.referenceC = reference;
  rates.penaltyKW = Math.max(0, compressorPenaltyKW(ctx.compressor, qe, condensing, reference));
  rates.compressorKW = compressorPowerKW(ctx.compressor, qe, condensing, ctx.duty.condensingSetPointC);
  rates.unmet = ctx.duty.headPressureControl === "fixedSetPoint" ? !dev.held : condensing > ctx.duty.condensingSetPointC + 1e-6;
  return rates;
}
