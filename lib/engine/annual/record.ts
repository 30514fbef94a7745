/**
 * Pipeline step 3 — one record (an hour, or a bin's representative hour): the duty → the condenser's
 * temperature lift over its entering water → the tower or cooler (record-tower.ts, record-cooler.ts)
 * chosen by the head-pressure control → condensing temperature, powers, compressor, water flows.
 *
 * Condenser: Tc = Tw,in + Q/(ε·Cw) (condenser.ts), so for a given hour the condensing temperature is the
 * device's leaving water plus a fixed lift (plus the plate exchanger's approach): the device solvers work
 * on Tc directly. Compressor power W(Tc) at the hour's refrigeration load Qe = Q·COPd/(1 + COPd)
 * (compressor.ts) is what the option pays; W(Tc) − W(Tc,ref) against the clean reference (clean
 * condenser, no exchanger, the same device water) is kept as an explanation only.
 *
 * Basin heater rule: the heater holds the still basin at its thermostat set-point against the basin's
 * heat loss (basin-heater.ts) in the hours when the basin holds water and no warm water wets it — the
 * tower idle (no load), or the cooler's spray pump off (dry mode or idle) — unless the basin is drained
 * in those hours (`basinHeater.drainedWhenIdle`).
 */
import type { EnteringAir } from "../air-side";
import { compressorExtrapolates, compressorPowerKW } from "../compressor";
import { condensingTemperatureC, fouledUaKWPerK } from "../condenser";
import { isothermalStreamEffectiveness } from "../heat-exchanger";
import { basinHeaterPowerKW } from "../basin-heater";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import { coolerRecord } from "./record-cooler";
import { evaporativeCondenserRecord } from "./record-evaporative-condenser";
import { towerRecord } from "./record-tower";
import type { DeviceRecord, HourCondenser, RecordRates } from "./record-types";
import { SET_POINT_TOLERANCE_K } from "./record-types";

export type { RecordRates } from "./record-types";

/**
 * One record's rates. `into` (optional) is a rates object to fill instead of a new one — the year loop
 * passes one scratch object and reads it before the next record; every field is reset here.
 */
export function evaluateRecord(po: PreparedOption, ctx: YearContext, air: EnteringAir, heatKW: number, towerSideRf: number, into?: RecordRates): RecordRates {
  const o = po.input;
  const rates = into ?? newRecordRates();
  rates.heatKW = heatKW;
  rates.fanKW = 0;
  rates.condenserPumpKW = 0;
  rates.secondaryPumpKW = 0;
  rates.sprayPumpKW = 0;
  rates.heaterKW = 0;
  rates.compressorKW = 0;
  rates.aboveCleanKW = 0;
  rates.compressorExtrapolated = false;
  rates.evaporationKgPerS = 0;
  rates.driftKgPerS = 0;
  rates.dry = false;
  rates.unmet = false;
  rates.running = false;
  rates.condensingC = 0;
  rates.referenceC = 0;
  rates.hottestSurfaceC = Number.NEGATIVE_INFINITY;
  // Heater power should the basin hold still water in this hour (0 when drained then).
  const stillBasinHeaterKW = o.basinHeater.drainedWhenIdle ? 0 : basinHeaterPowerKW(o.basinHeater, air.dryBulbC);
  if (!(heatKW > 0)) {
    rates.heaterKW = stillBasinHeaterKW;
    return rates;
  }
  rates.running = true;
  const target = ctx.duty.headPressureControl === "floating" ? ctx.duty.minimumCondensingC : ctx.duty.condensingSetPointC;
  if (po.device.kind === "evaporativeCondenser") {
    // No condenser water: the coil is the condenser. `towerSideRf` carries the month's coil-scale derate.
    const hourEc = HOUR;
    hourEc.heatKW = heatKW;
    hourEc.refrigerationKW = heatKW * ctx.refrigerationPerRejection;
    hourEc.condenserLiftK = 0;
    hourEc.approachK = 0;
    const dev = evaporativeCondenserRecord(po, po.device.model, ctx, air, hourEc, towerSideRf, stillBasinHeaterKW, rates);
    finishRates(rates, ctx, hourEc.refrigerationKW, dev.condensingC, Math.max(target, Math.min(dev.cleanCondensingC, dev.condensingC)), dev.held);
    return rates;
  }
  const cw = po.condenserCapacityKWPerK;
  const condRf = o.kind === "openTowerDirect" ? towerSideRf : po.condenserFixedFoulingM2KPerW;
  const uaCond = fouledUaKWPerK(po.condenserCleanUaKWPerK, po.condenserCleanUWPerM2K, condRf);
  const hour = HOUR;
  hour.heatKW = heatKW;
  hour.refrigerationKW = heatKW * ctx.refrigerationPerRejection;
  hour.condenserLiftK = heatKW / (isothermalStreamEffectiveness(uaCond, cw) * cw);
  hour.approachK = 0;
  const dev: DeviceRecord =
    po.device.kind === "tower"
      ? towerRecord(po, po.device.model, ctx, air, hour, towerSideRf, rates)
      : coolerRecord(po, po.device.model, ctx, air, hour, stillBasinHeaterKW, rates);
  rates.condenserPumpKW = po.condenserPumpKW;
  rates.secondaryPumpKW = po.secondaryPumpKW;
  const condensing = dev.condensingC;
  const cleanRef = condensingTemperatureC(dev.leavingC, heatKW, po.condenserCleanUaKWPerK, cw);
  // A clean condenser on the same water would have let the control hold its target with less fan, not
  // condense below it: the reference never goes below the target.
  finishRates(rates, ctx, hour.refrigerationKW, condensing, Math.max(target, Math.min(cleanRef, condensing)), dev.held);
  return rates;
}

/** The record's condenser, filled anew by each record (the engine never re-enters a record). */
const HOUR: HourCondenser = { heatKW: 0, refrigerationKW: 0, condenserLiftK: 0, approachK: 0 };

/** Condensing temperature, its clean reference, the compressor power the option pays, and whether the control held. */
function finishRates(rates: RecordRates, ctx: YearContext, refrigerationKW: number, condensing: number, reference: number, held: boolean): void {
  rates.condensingC = condensing;
  rates.referenceC = reference;
  rates.compressorKW = compressorPowerKW(ctx.compressor, refrigerationKW, condensing);
  rates.aboveCleanKW = Math.max(0, rates.compressorKW - compressorPowerKW(ctx.compressor, refrigerationKW, reference));
  rates.compressorExtrapolated = compressorExtrapolates(ctx.compressor, condensing);
  rates.unmet = ctx.duty.headPressureControl === "fixedSetPoint" ? !held : condensing > ctx.duty.condensingSetPointC + SET_POINT_TOLERANCE_K;
}

/** A rates object with every field at its idle value. */
export function newRecordRates(): RecordRates {
  return {
    heatKW: 0,
    fanKW: 0,
    condenserPumpKW: 0,
    secondaryPumpKW: 0,
    sprayPumpKW: 0,
    heaterKW: 0,
    compressorKW: 0,
    aboveCleanKW: 0,
    compressorExtrapolated: false,
    evaporationKgPerS: 0,
    driftKgPerS: 0,
    dry: false,
    unmet: false,
    running: false,
    condensingC: 0,
    referenceC: 0,
    hottestSurfaceC: Number.NEGATIVE_INFINITY,
  };
}
