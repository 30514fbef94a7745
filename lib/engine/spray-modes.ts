/**
 * Wet or dry in an hour, for the units that can switch their spray off (closed-circuit cooler, evaporative
 * condenser): the spray lock-out forces dry below its dry-bulb (freeze protection, even where dry mode is
 * otherwise not allowed); the switch-over rule fixes the mode by the dry-bulb; otherwise dry is allowed
 * where `allowDryMode` and the dry-bulb is at or below `dryModeMaxDryBulbC`, and wet always.
 * Source: common practice, no source (the rules are the user's inputs).
 */
export interface SprayModeRules {
  sprayLockoutDryBulbC: number;
  allowDryMode: boolean;
  dryModeMaxDryBulbC: number;
  modeSelection: "lowestTotalPower" | "switchOverDryBulb";
  switchOverDryBulbC: number;
}

export function allowedSprayModes(rules: SprayModeRules, dryBulbC: number): { wet: boolean; dry: boolean } {
  if (dryBulbC < rules.sprayLockoutDryBulbC) return { wet: false, dry: true };
  const dryAllowed = rules.allowDryMode && dryBulbC <= rules.dryModeMaxDryBulbC;
  if (rules.modeSelection === "switchOverDryBulb") {
    const dry = dryAllowed && dryBulbC <= rules.switchOverDryBulbC;
    return { wet: !dry, dry };
  }
  return { wet: true, dry: dryAllowed };
}
