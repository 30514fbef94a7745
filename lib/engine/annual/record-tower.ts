/**
 * One record of a tower option (direct, or isolated by a plate exchanger): the tower holds the water
 * the condenser (plus the exchanger's approach) needs, or floats at full fan speed.
 */
import type { EnteringAir } from "../air-side";
import { fouledUaKWPerK } from "../condenser";
import { plateExchangerApproachK } from "../plate-exchanger";
import { type TowerModel, solveTowerHour } from "../tower";
import type { YearContext } from "./context";
import type { PreparedOption } from "./options";
import type { DeviceRecord, RecordRates } from "./record";

export function towerRecord(
  po: PreparedOption,
  model: TowerModel,
  ctx: YearContext,
  air: EnteringAir,
  heatKW: number,
  condenserEnteringReqC: number,
  towerSideRf: number,
  rates: RecordRates,
): DeviceRecord {
  let approachK = 0;
  if (po.plate) {
    const uaHx = fouledUaKWPerK(po.plate.cleanUaKWPerK, po.plate.cleanUWPerM2K, towerSideRf);
    approachK = plateExchangerApproachK(heatKW, uaHx, po.plate.hotCapacityKWPerK, po.plate.coldCapacityKWPerK);
  }
  const r = solveTowerHour(model, po.fan, air, heatKW, condenserEnteringReqC - approachK, ctx.pPa);
  rates.fanKW = r.fanPowerKW;
  rates.evaporationKgPerS = r.evaporationKgPerS;
  rates.driftKgPerS = po.input.driftFractionOfFlow * po.driftFlowKgPerS;
  rates.hottestSurfaceC = r.hotWaterC;
  return { held: r.held, leavingC: r.coldWaterC, approachK };
}
