/**
 * Water balance and chemistry of a wet loop (tower, or a cooler's spray loop).
 *
 * Mass balance: makeup M = E + B + D; cycles of concentration C = M/(B + D); so
 * B = E/(C − 1) − D (≥ 0) and M = E·C/(C − 1) when B > 0. [pub: standard mass balance]
 * Cycles limit from the makeup chemistry: Cmax = min over species (limit/makeup concentration).
 * Scaling indices at the hottest wetted surface: Langelier (1936) and Ryznar (1944) with the
 * saturation pH by the standard (Carrier 1965) approximation
 *   pHs = (9.3 + A + B) − (C + D), A = (log10 TDS − 1)/10, B = −13.12·log10(T + 273.15) + 34.55,
 *   C = log10[Ca as CaCO3] − 0.4, D = log10[M-alkalinity as CaCO3]   (mg/L, °C).
 */

/** Makeup-water analysis. mg/L; hardness and alkalinity as CaCO3. */
export interface MakeupAnalysis {
  calciumHardnessMgPerLAsCaCO3: number;
  mAlkalinityMgPerLAsCaCO3: number;
  silicaMgPerL: number;
  chlorideMgPerL: number;
  tdsMgPerL: number;
  ph: number;
  conductivityUSPerCm?: number;
}

/** Upper limits in the recirculating water, same units. */
export interface ChemistryLimits {
  silicaMgPerL: number;
  chlorideMgPerL: number;
  tdsMgPerL: number;
  calciumHardnessMgPerLAsCaCO3: number;
}

export type LimitingSpecies = "silica" | "chloride" | "tds" | "calciumHardness";

/**
 * Highest cycles the chemistry allows: Cmax = min over species of limit/makeup (species with a
 * makeup concentration ≤ 0 do not limit). Returns the limiting species too. Cycles never below 1.5.
 */
export function maximumCyclesFromChemistry(
  makeup: MakeupAnalysis,
  limits: ChemistryLimits,
): { cycles: number; limitingSpecies: LimitingSpecies | null; bySpecies: Record<LimitingSpecies, number> } {
  const ratio = (limit: number, c: number): number => (c > 0 ? limit / c : Number.POSITIVE_INFINITY);
  const bySpecies: Record<LimitingSpecies, number> = {
    silica: ratio(limits.silicaMgPerL, makeup.silicaMgPerL),
    chloride: ratio(limits.chlorideMgPerL, makeup.chlorideMgPerL),
    tds: ratio(limits.tdsMgPerL, makeup.tdsMgPerL),
    calciumHardness: ratio(limits.calciumHardnessMgPerLAsCaCO3, makeup.calciumHardnessMgPerLAsCaCO3),
  };
  let cycles = Number.POSITIVE_INFINITY;
  let limiting: LimitingSpecies | null = null;
  for (const key of Object.keys(bySpecies) as LimitingSpecies[]) {
    if (bySpecies[key] < cycles) {
      cycles = bySpecies[key];
      limiting = key;
    }
  }
  return { cycles: Number.isFinite(cycles) ? Math.max(cycles, 1.5) : 10, limitingSpecies: limiting, bySpecies };
}

/** Blowdown for evaporation E, cycles C and drift D (same units): B = max(0, E/(C − 1) − D). */
export function blowdown(evaporation: number, cycles: number, drift: number): number {
  const b = evaporation / (cycles - 1) - drift;
  return b > 0 ? b : 0;
}

/** Cycles actually achieved: C = M/(B + D) = (E + B + D)/(B + D); +∞ without outflow. */
export function achievedCycles(evaporation: number, blowdownAmount: number, drift: number): number {
  const out = blowdownAmount + drift;
  return out > 0 ? (evaporation + out) / out : Number.POSITIVE_INFINITY;
}

/** Volume billed by the sewer utility: makeup, or makeup − evaporation with an evaporation credit. */
export function sewerBilled(makeup: number, evaporation: number, evaporationCredit: boolean): number {
  return evaporationCredit ? Math.max(0, makeup - evaporation) : makeup;
}

/**
 * Saturation pH of calcium carbonate: pHs = (9.3 + A + B) − (C + D) (see module comment), with
 * T in °C and concentrations in mg/L. Source: Langelier (1936) index in the standard approximation
 * (Carrier, System Design Manual, 1965).
 */
export function saturationPh(tempC: number, tdsMgPerL: number, calciumMgPerLAsCaCO3: number, alkalinityMgPerLAsCaCO3: number): number {
  const a = (Math.log10(Math.max(tdsMgPerL, 1)) - 1) / 10;
  const b = -13.12 * Math.log10(tempC + 273.15) + 34.55;
  const c = Math.log10(Math.max(calciumMgPerLAsCaCO3, 0.01)) - 0.4;
  const d = Math.log10(Math.max(alkalinityMgPerLAsCaCO3, 0.01));
  return 9.3 + a + b - (c + d);
}

/** Langelier saturation index LSI = pH − pHs (Langelier 1936). > 0 scale-forming, < 0 corrosive. */
export function langelierIndex(ph: number, saturation: number): number {
  return ph - saturation;
}

/** Ryznar stability index RSI = 2·pHs − pH (Ryznar 1944). < 6 scale-forming, > 7 corrosive. */
export function ryznarIndex(ph: number, saturation: number): number {
  return 2 * saturation - ph;
}

/** Recirculating-water chemistry at C cycles (every conservative species × C). */
export function concentrated(makeup: MakeupAnalysis, cycles: number): MakeupAnalysis {
  return {
    calciumHardnessMgPerLAsCaCO3: makeup.calciumHardnessMgPerLAsCaCO3 * cycles,
    mAlkalinityMgPerLAsCaCO3: makeup.mAlkalinityMgPerLAsCaCO3 * cycles,
    silicaMgPerL: makeup.silicaMgPerL * cycles,
    chlorideMgPerL: makeup.chlorideMgPerL * cycles,
    tdsMgPerL: makeup.tdsMgPerL * cycles,
    ph: makeup.ph,
    ...(makeup.conductivityUSPerCm !== undefined ? { conductivityUSPerCm: makeup.conductivityUSPerCm * cycles } : {}),
  };
}

/**
 * Chemical quantities of a wet loop, kg: inhibitor dosed in proportion to the water leaving the loop
 * (blowdown + drift), biocide as slug doses on the system volume. Dose in mg/L = g/m³.
 * Source: common practice of treatment programmes [practice].
 */
export function chemicalQuantitiesKg(
  treatedOutflowM3: number,
  systemVolumeM3: number,
  inhibitorMgPerL: number,
  biocideMgPerL: number,
  biocideSlugsPerYear: number,
  yearFraction: number,
): { inhibitorKg: number; biocideKg: number } {
  return {
    inhibitorKg: (inhibitorMgPerL * treatedOutflowM3) / 1000,
    biocideKg: (biocideMgPerL * systemVolumeM3 * biocideSlugsPerYear * yearFraction) / 1000,
  };
}
