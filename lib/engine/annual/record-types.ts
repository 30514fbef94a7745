/** Shapes shared by the record step (record.ts) and its per-equipment parts. */
import { fanPowerAtSpeedKW, type FanState } from "../fans";
import type { PreparedOption } from "./options";

/** Results of one record, per hour (rates), before weighting. */
export interface RecordRates {
  heatKW: number;
  fanKW: number;
  condenserPumpKW: number;
  secondaryPumpKW: number;
  sprayPumpKW: number;
  heaterKW: number;
  compressorKW: number;
  /** Explanation only: compressor power above the clean reference, ≥ 0. */
  aboveCleanKW: number;
  compressorExtrapolated: boolean;
  evaporationKgPerS: number;
  driftKgPerS: number;
  dry: boolean;
  unmet: boolean;
  running: boolean;
  condensingC: number;
  referenceC: number;
  hottestSurfaceC: number;
}

/** What the heat-rejection device reports for one record (fan, spray, evaporation go into the rates). */
export interface DeviceRecord {
  /** The control's target was held (fixed: the set-point; floating: within the minimum…set-point band). */
  held: boolean;
  condensingC: number;
  /** Water (tower) or fluid (cooler) leaving the device, °C. */
  leavingC: number;
}

/**
 * The device's record, filled anew by each record (read by `evaluateRecord` before the next one: the
 * engine is synchronous and never re-enters a record).
 */
const DEVICE: DeviceRecord = { held: true, condensingC: 0, leavingC: 0 };

/** The shared device record with these values. */
export function deviceRecord(held: boolean, condensingC: number, leavingC: number): DeviceRecord {
  DEVICE.held = held;
  DEVICE.condensingC = condensingC;
  DEVICE.leavingC = leavingC;
  return DEVICE;
}

/** The hour's condenser: Tc = device leaving water + liftK (lift = Q/(ε·Cw) + exchanger approach). */
export interface HourCondenser {
  heatKW: number;
  refrigerationKW: number;
  /** Q/(ε·Cw) of the (fouled) condenser, K. */
  condenserLiftK: number;
  /** Plate-exchanger approach between tower water and condenser water, K (0 without an exchanger). */
  approachK: number;
}

/** A condensing temperature within this of the set-point holds it (the solvers' own tolerance). */
export const SET_POINT_TOLERANCE_K = 1e-3;

/** The installed control's steady states (fan off with natural draft, low speed) below an airflow. */
export function lowerFanStates(po: PreparedOption, airflowFraction: number): FanState[] {
  const fan = po.fan;
  const states: FanState[] = [];
  if (fan.naturalDraftAirflowFraction > 0) states.push({ airflowFraction: fan.naturalDraftAirflowFraction, powerKW: 0 });
  if (fan.control === "twoSpeed") states.push({ airflowFraction: fan.lowSpeedFraction, powerKW: fanPowerAtSpeedKW(fan, fan.lowSpeedFraction) });
  return states.filter((s) => s.airflowFraction < airflowFraction - 1e-9);
}
