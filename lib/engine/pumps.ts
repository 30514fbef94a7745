/**
 * Pump power: P = ρ·g·V̇·H/η = ṁ·g·H/η (H in metres of the pumped fluid), wire-to-water efficiency η.
 * Source: hydraulics (pump power equation); head and efficiency from the selection.
 */
import { WATER_DENSITY_KG_PER_M3 } from "@/lib/units/factors";
import type { FluidProperties } from "./glycol";
import { pressureDropRatioAtSameVolumeFlow } from "./glycol";

const G = 9.80665;

/** Pump electric power for water, kW: ṁ·g·H/η/1000. */
export function pumpPowerKW(massFlowKgPerS: number, headM: number, efficiency: number): number {
  if (!(massFlowKgPerS > 0) || !(headM > 0) || !(efficiency > 0)) return 0;
  return (massFlowKgPerS * G * headM) / efficiency / 1000;
}

/** Head in metres of water for a pressure drop in kPa (ρw of the water-density convention, Methods §8). */
export function waterHeadFromPressureDropM(pressureDropKPa: number): number {
  return (pressureDropKPa * 1000) / (WATER_DENSITY_KG_PER_M3 * G);
}

/**
 * Pump power for a glycol loop whose head was given for water at the same volumetric flow, kW:
 * Δp = ρw·g·H·(ρ/ρw)^0.75·(μ/μw)^0.25 (Blasius), P = V̇·Δp/η with V̇ = ṁ/ρ.
 */
export function glycolPumpPowerKW(
  massFlowKgPerS: number,
  waterHeadM: number,
  efficiency: number,
  fluid: FluidProperties,
  water: FluidProperties,
): number {
  if (!(massFlowKgPerS > 0) || !(waterHeadM > 0) || !(efficiency > 0)) return 0;
  const dpPa = water.densityKgPerM3 * G * waterHeadM * pressureDropRatioAtSameVolumeFlow(fluid, water);
  return ((massFlowKgPerS / fluid.densityKgPerM3) * dpPa) / efficiency / 1000;
}
