/**
 * Fan power and fan control of towers and coolers.
 *
 * Affinity laws for a fan on a fixed system: airflow ∝ speed, pressure ∝ speed², power ∝ speed³
 * (fan laws, e.g. ASHRAE Handbook—HVAC Systems and Equipment, Fans chapter). A variable-speed drive
 * adds losses that do not vanish at low speed: P/Pdesign = a + (1 − a)·f³ with a small floor a
 * (~0.05 [practice]). Discrete controls (two-speed, cycling) are a time mix of their states.
 */

export type FanControlKind = "variableSpeed" | "twoSpeed" | "cycling";

/** Fan of one tower or cooler (all its cells treated as one). */
export interface FanModel {
  designPowerKW: number;
  control: FanControlKind;
  /** Lowest speed a variable-speed drive runs at continuously, fraction of full speed. */
  minSpeedFraction: number;
  /** Power floor a of P/Pdesign = a + (1 − a)·f³ (variable speed only). */
  powerFloorFraction: number;
  /** Low speed of a two-speed motor, fraction of full speed (0.5 or 0.67 typical). */
  lowSpeedFraction: number;
  /** Airflow with the fan off (natural draft through the unit), fraction of design airflow. */
  naturalDraftAirflowFraction: number;
}

/** One running state of the fan: airflow fraction and electric power. */
export interface FanState {
  airflowFraction: number;
  powerKW: number;
}

/**
 * How the installed control meets a required (continuous) airflow fraction:
 * one continuous state, or a time mix of two states (the fraction of time in `high` follows from
 * the leaving-water temperatures of the two states, computed by the equipment model).
 */
export type FanOperation =
  | { kind: "continuous"; state: Readonly<FanState> }
  | { kind: "mix"; low: Readonly<FanState>; high: Readonly<FanState> }
  | { kind: "insufficient"; state: Readonly<FanState> };

/**
 * Fan power at a speed fraction f by the affinity (cube) law, kW.
 * Variable speed: P = Pd·(a + (1 − a)·f³); fixed-speed motors (two-speed, cycling): P = Pd·f³.
 * f = 0 is "fan off": 0 kW. Source: fan laws [pub]; floor a [practice].
 */
export function fanPowerAtSpeedKW(fan: FanModel, speedFraction: number): number {
  if (speedFraction <= 0) return 0;
  const f3 = speedFraction * speedFraction * speedFraction;
  if (fan.control === "variableSpeed") {
    return fan.designPowerKW * (fan.powerFloorFraction + (1 - fan.powerFloorFraction) * f3);
  }
  return fan.designPowerKW * f3;
}

/**
 * Map a required airflow fraction (from holding the leaving-water set-point) to the fan operation
 * the installed control can deliver.
 * - required ≤ natural draft: fan off all hour.
 * - variable speed: continuous between the minimum speed and full speed; below the minimum a time
 *   mix of "off" and minimum speed.
 * - two-speed: mix of off/low or low/high. - cycling: mix of off/full.
 * - required > 1: the fan runs at full speed and the set-point is not held ("insufficient").
 */
export function fanOperationForRequiredAirflow(fan: FanModel, requiredAirflowFraction: number): Readonly<FanOperation> {
  // The answer is read before the next call (once per record and option): the fan's fixed states and
  // operations are built once per fan (the year runs one option at a time) and shared, and the one
  // variable state is a scratch object; none is ever changed by a caller.
  const ops = operationsOf(fan);
  const f = requiredAirflowFraction;
  // 1e-6: the L/G root's own tolerance, so the design point itself counts as held.
  if (f > 1 + 1e-6) return ops.insufficient;
  if (f > 1 - 1e-6 && fan.control !== "variableSpeed") return ops.full;
  if (f <= fan.naturalDraftAirflowFraction) return ops.off;
  switch (fan.control) {
    case "variableSpeed": {
      if (f >= ops.minSpeedFraction) {
        const v = VARIABLE_SPEED;
        v.state.airflowFraction = f;
        v.state.powerKW = fanPowerAtSpeedKW(fan, f);
        return v;
      }
      return ops.belowMinimum;
    }
    case "twoSpeed": {
      if (f === fan.lowSpeedFraction) return ops.lowSpeed;
      if (f < fan.lowSpeedFraction) return ops.offLow;
      if (f === 1) return ops.full;
      return ops.lowHigh;
    }
    case "cycling":
      if (f === 1) return ops.full;
      return ops.offFull;
  }
}

/** The operations of one fan that do not depend on the required airflow. */
interface FanOperations {
  fan: FanModel;
  /** The fan's fields when these were built (a changed field rebuilds them). */
  key: readonly [number, FanControlKind, number, number, number, number];
  minSpeedFraction: number;
  insufficient: FanOperation;
  full: FanOperation;
  off: FanOperation;
  belowMinimum: FanOperation;
  lowSpeed: FanOperation;
  offLow: FanOperation;
  lowHigh: FanOperation;
  offFull: FanOperation;
}

let lastOperations: FanOperations | null = null;
const VARIABLE_SPEED: { kind: "continuous"; state: FanState } = { kind: "continuous", state: { airflowFraction: 0, powerKW: 0 } };

function operationsOf(fan: FanModel): FanOperations {
  const c = lastOperations;
  if (
    c !== null &&
    c.fan === fan &&
    c.key[0] === fan.designPowerKW &&
    c.key[1] === fan.control &&
    c.key[2] === fan.minSpeedFraction &&
    c.key[3] === fan.powerFloorFraction &&
    c.key[4] === fan.lowSpeedFraction &&
    c.key[5] === fan.naturalDraftAirflowFraction
  ) {
    return c;
  }
  const fmin = Math.max(fan.minSpeedFraction, fan.naturalDraftAirflowFraction);
  const full: FanState = { airflowFraction: 1, powerKW: fan.designPowerKW };
  const off: FanState = { airflowFraction: fan.naturalDraftAirflowFraction, powerKW: 0 };
  const low: FanState = { airflowFraction: fan.lowSpeedFraction, powerKW: fanPowerAtSpeedKW(fan, fan.lowSpeedFraction) };
  const ops: FanOperations = {
    fan,
    key: [fan.designPowerKW, fan.control, fan.minSpeedFraction, fan.powerFloorFraction, fan.lowSpeedFraction, fan.naturalDraftAirflowFraction],
    minSpeedFraction: fmin,
    insufficient: { kind: "insufficient", state: full },
    full: { kind: "continuous", state: full },
    off: { kind: "continuous", state: off },
    belowMinimum: { kind: "mix", low: off, high: { airflowFraction: fmin, powerKW: fanPowerAtSpeedKW(fan, fmin) } },
    lowSpeed: { kind: "continuous", state: low },
    offLow: { kind: "mix", low: off, high: low },
    lowHigh: { kind: "mix", low, high: full },
    offFull: { kind: "mix", low: off, high: full },
  };
  lastOperations = ops;
  return ops;
}

/**
 * Fraction of time in the high state of a two-state mix that holds the required leaving temperature:
 * x = (T_low − T_req)/(T_low − T_high), clamped to 0…1. Temperature weighting of the two states'
 * leaving-water temperatures, as in the single-speed tower cycling ratio of the U.S. DOE EnergyPlus
 * Engineering Reference [pub]; the condensing temperature is linear in the entering water, so the
 * time-averaged condensing temperature equals its set-point.
 */
export function highStateTimeFraction(lowStateLeavingC: number, highStateLeavingC: number, requiredLeavingC: number): number {
  const span = lowStateLeavingC - highStateLeavingC;
  if (!(span > 1e-9)) return 1;
  const x = (lowStateLeavingC - requiredLeavingC) / span;
  return x < 0 ? 0 : x > 1 ? 1 : x;
}
