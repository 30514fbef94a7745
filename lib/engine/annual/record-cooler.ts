/**
 * One record of the closed-circuit cooler option: the cooler holds the fluid the condenser needs (dry
 * when dry operation holds it, else wet), or floats at full fan speed; the spray pump, drift and the
 * basin heater follow the spray.
 */
import type { EnteringAir } from "../air-side";
import { type CoolerModel, solveCoolerHour } from "../fluid-cooler";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import type { DeviceRecord, RecordRates } from "./record";

export function coolerRecord(
  po: PreparedOption,
  model: CoolerModel,
  ctx: YearContext,
  air: EnteringAir,
  heatKW: number,
  condenserEnteringReqC: number,
  heaterBelow: boolean,
  rates: RecordRates,
): DeviceRecord {
  const o = po.input;
  const r = solveCoolerHour(model, po.fan, air, heatKW, condenserEnteringReqC, ctx.pPa);
  rates.fanKW = r.fanPowerKW;
  rates.evaporationKgPerS = r.evaporationKgPerS;
  rates.dry = r.mode === "dry";
  if (r.sprayOn) {
    rates.sprayPumpKW = po.sprayPumpKW;
    rates.driftKgPerS = o.driftFractionOfFlow * po.driftFlowKgPerS;
    rates.hottestSurfaceC = r.enteringFluidC;
  } else if (heaterBelow) {
    rates.heaterKW = o.basinHeater.powerKW;
  }
  return { held: r.held, leavingC: r.leavingFluidC, approachK: 0 };
}
