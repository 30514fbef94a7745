/**
 * Basin heater of a wet loop: a thermostat holds the still basin water at its set-point against the
 * basin's heat loss to the outdoor air.
 *
 * P = min(P_rated, UA_loss·(T_set − T_db)) for T_db < T_set, else 0 (kW). Steady state: the heater
 * supplies what the basin loses; the loss is taken as proportional to the set-point's margin above the
 * dry-bulb (wind and sky radiation folded into UA_loss). Without a manufacturer's figure,
 * UA_loss = P_rated/(T_set − T_sizing): the rating just holds the set-point at the sizing ambient
 * [practice: heaters are selected to hold about 40 °F (4.4 °C) water at about 0 °F (−17.8 °C)].
 * The caller decides the hours in which the basin holds still water (no warm water circulating, not
 * drained).
 */
import type { BasinHeaterInput } from "./input";

/** Heater power while the basin holds still water at outdoor dry-bulb T_db, kW (see module comment). */
export function basinHeaterPowerKW(heater: BasinHeaterInput, dryBulbC: number): number {
  if (!(heater.powerKW > 0) || !(dryBulbC < heater.setPointC)) return 0;
  const need = heater.heatLossKWPerK * (heater.setPointC - dryBulbC);
  return need < heater.powerKW ? need : heater.powerKW;
}
