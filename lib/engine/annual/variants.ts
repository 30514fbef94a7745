/**
 * What-if variants of a calibrated option: another fan control, or a larger or smaller selection.
 *
 * A selection size factor s stands for s units of the calibrated selection sharing the same circulating
 * water (or process fluid): airflow, fan power, basin heater and basin volume scale with s. For a tower the
 * characteristic KaV/L = C·(L/G)^−n is the fill's and is kept; the larger airflow lowers L/G at every fan
 * speed. For a closed-circuit cooler the external (air-side) conductance, the spray pump and its flow scale
 * with s; the internal conductance follows the fluid velocity in s times as many tubes: UAint ∝ s·s^−0.8 =
 * s^0.2 (Dittus–Boelter h ∝ velocity^0.8 [pub: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
 * eq. 8.60]). For an evaporative condenser the air-side conductance, airflow, spray pump and its flow and the
 * condensing-side conductance (s times the coil area; a condensing film coefficient depends little on the
 * refrigerant's flow [practice]) all scale with s. Pumps through the condenser keep their flow and head. A screening approximation: a real
 * reselection comes from the manufacturer [practice].
 */
import type { FanControlKind } from "../fans";
import type { PreparedOption } from "./options";

export interface OptionVariant {
  fanControl?: FanControlKind;
  sizeFactor?: number;
}

/** The option with another fan control and/or scaled by a selection size factor (module comment). */
export function optionVariant(po: PreparedOption, v: OptionVariant): PreparedOption {
  const s = v.sizeFactor ?? 1;
  const control = v.fanControl ?? po.fan.control;
  if (s === 1 && control === po.fan.control) return po;
  const o = po.input;
  const fan = { ...po.fan, control, designPowerKW: po.fan.designPowerKW * s };
  const input = {
    ...o,
    fan: { ...o.fan, control, designPowerKW: o.fan.designPowerKW * s },
    basinHeater: { ...o.basinHeater, powerKW: o.basinHeater.powerKW * s },
  };
  const base = { ...po, input, fan, wetLoopVolumeM3: po.wetLoopVolumeM3 * s };
  if (po.device.kind === "tower") {
    const m = po.device.model;
    return {
      ...base,
      device: {
        kind: "tower",
        model: { ...m, designAirFlowKgPerS: m.designAirFlowKgPerS * s, designLiquidToGasRatio: m.designLiquidToGasRatio / s },
      },
    };
  }
  if (po.device.kind === "evaporativeCondenser") {
    const m = po.device.model;
    return {
      ...base,
      sprayPumpKW: po.sprayPumpKW * s,
      driftFlowKgPerS: po.driftFlowKgPerS * s,
      device: {
        kind: "evaporativeCondenser",
        model: {
          ...m,
          designAirFlowKgPerS: m.designAirFlowKgPerS * s,
          externalMassTransferKgPerS: m.externalMassTransferKgPerS * s,
          internalUaKWPerK: m.internalUaKWPerK * s,
          ratedHeatRejectionKW: m.ratedHeatRejectionKW * s,
        },
      },
    };
  }
  const m = po.device.model;
  return {
    ...base,
    sprayPumpKW: po.sprayPumpKW * s,
    driftFlowKgPerS: po.driftFlowKgPerS * s,
    device: {
      kind: "cooler",
      model: {
        ...m,
        designAirFlowKgPerS: m.designAirFlowKgPerS * s,
        externalWetUaKWPerK: m.externalWetUaKWPerK * s,
        externalMassTransferKgPerS: m.externalMassTransferKgPerS * s,
        internalUaKWPerK: m.internalUaKWPerK * Math.pow(s, 0.2),
      },
    },
  };
}
