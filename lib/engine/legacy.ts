/**
 * Results stored by earlier engine versions (issued versions keep theirs for good) read with today's
 * shapes. Engine 1.x priced a "compressor penalty" against a clean reference instead of each option's
 * compressor energy: such a result has no compressor energy (shown as missing, NaN) and its penalty becomes
 * the explanatory "above the clean reference" figure; its totals stay what was priced then.
 */
import type { ScenarioResult } from "./index";
import type { EnergyByComponentKWh, OptionAnnualPhysics } from "./types";

type LegacyEnergy = EnergyByComponentKWh & { compressorPenalty?: number };

function upgradeEnergy(e: LegacyEnergy): EnergyByComponentKWh {
  if (typeof e.compressor === "number") return e;
  const { compressorPenalty: _penalty, ...rest } = e;
  return { ...rest, compressor: Number.NaN };
}

/** One option's physics in today's shape (unchanged when it already is). */
export function upgradeOptionPhysics(p: OptionAnnualPhysics): OptionAnnualPhysics {
  const energy = p.energyKWh as LegacyEnergy;
  if (typeof energy.compressor === "number") return p;
  return {
    ...p,
    energyKWh: upgradeEnergy(energy),
    monthly: p.monthly.map((m) => ({ ...m, energyKWh: upgradeEnergy(m.energyKWh as LegacyEnergy) })),
    compressorAboveCleanReferenceKWh: energy.compressorPenalty ?? Number.NaN,
    compressorExtrapolatedHours: 0,
  };
}

/** A stored result in today's shape. */
export function upgradeStoredResult<T extends Pick<ScenarioResult, "physics">>(r: T): T {
  if (!Array.isArray(r.physics) || r.physics.every((p) => typeof (p.energyKWh as Partial<EnergyByComponentKWh>).compressor === "number")) return r;
  return { ...r, physics: r.physics.map(upgradeOptionPhysics) };
}
