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

/**
 * What the sewer utility bills (the user's choice, stated in the results):
 * - "makeup": every m³ of makeup (no credit);
 * - "makeupMinusEvaporation": makeup less evaporation, M − E = B + D (an evaporation credit on the makeup
 *   meter; drift is billed because it is not metered separately);
 * - "blowdown": the metered blowdown B only (a blowdown meter on the sewer connection; drift and
 *   evaporation never reach the sewer).
 * Source: the water balance M = E + B + D; credit practice varies by utility [practice].
 */
export type SewerBasis = "makeup" | "makeupMinusEvaporation" | "blowdown";

/** Volume billed by the sewer utility on a basis (same units as the inputs): M, M − E (= B + D) or B. */
export function sewerBilled(basis: SewerBasis, makeup: number, evaporation: number, blowdownAmount: number): number {
  if (basis === "blowdown") return blowdownAmount;
  if (basis === "makeupMinusEvaporation") return Math.max(0, makeup - evaporation);
  return makeup;
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

/**
 * Scale control of a wet loop: the highest Langelier index the treatment programme accepts at the hottest
 * wetted surface, and whether sulfuric acid is fed to hold it there (else the excess is only warned of).
 */
export interface ScaleControl {
  maximumLangelierIndex: number;
  acidFeed: boolean;
  /** Mass fraction of H2SO4 in the acid product (e.g. 0.93 for 66 °Bé acid). */
  acidStrengthFraction: number;
}

/** Mass of 100 % H2SO4 that neutralises 1 mg of M-alkalinity as CaCO3: 49.04/50.04 = 0.980 (equivalent weights). */
export const SULFURIC_ACID_PER_ALKALINITY_AS_CACO3 = 49.04 / 50.04;

/** Chemistry of a wet loop's recirculating water at C cycles, with acid feed where it is needed. */
export interface LoopChemistry {
  cycles: number;
  hottestSurfaceC: number;
  /** Untreated: conservative species × C at the entered recirculating pH. */
  untreatedLangelierIndex: number;
  /** After acid feed (equal to the untreated values without acid). */
  ph: number;
  mAlkalinityMgPerLAsCaCO3: number;
  saturationPh: number;
  langelierIndex: number;
  ryznarIndex: number;
  /** Alkalinity the acid destroys per m³ of water leaving the loop (B + D), mg/L as CaCO3. */
  alkalinityNeutralisedMgPerL: number;
  /** Acid product dosed per m³ of water leaving the loop (B + D), kg/m³. */
  acidProductKgPerM3Outflow: number;
}

/**
 * Recirculating-water chemistry at C cycles and the acid feed that holds the Langelier index at the limit.
 *
 * Untreated: Ca, M-alkalinity and TDS × C (conservative species), pH as entered → pHs (Langelier 1936,
 * standard A–D form), LSI = pH − pHs, RSI = 2·pHs − pH (Ryznar 1944).
 * Acid (H2SO4 + 2 HCO3⁻ → SO4²⁻ + 2 CO2 + 2 H2O) lowers the alkalinity from Alk_r = C·Alk_m to Alk_t. With the
 * dissolved CO2 held by stripping in the tower, pH = pK1 + log10([HCO3⁻]/[CO2]) falls by
 * Δ = log10(Alk_r/Alk_t) (carbonate equilibrium, e.g. Stumm & Morgan, Aquatic Chemistry) while pHs rises by
 * the same Δ (its D term), so LSI falls by 2Δ: Δ = (LSI − LSImax)/2. Calcium and TDS are taken as unchanged
 * (sulfate replaces bicarbonate; a small TDS change is neglected).
 * Alkalinity balance of the loop: acid destroys M·Alk_m − (B + D)·Alk_t = (B + D)·(Alk_r − Alk_t), so the
 * acid per m³ of outflow is 0.980·(Alk_r − Alk_t) g/m³ of H2SO4 (equivalent weights 49.04/50.04), divided
 * by the product strength. Rising cycles raise Alk_r and so the acid per m³ of (smaller) outflow.
 * Units: mg/L, °C, kg/m³.
 */
export function loopChemistryAtCycles(
  makeup: MakeupAnalysis,
  recirculatingPh: number,
  hottestSurfaceC: number,
  cycles: number,
  scale: ScaleControl,
): LoopChemistry {
  const r = concentrated(makeup, cycles);
  const phs0 = saturationPh(hottestSurfaceC, r.tdsMgPerL, r.calciumHardnessMgPerLAsCaCO3, r.mAlkalinityMgPerLAsCaCO3);
  const lsi0 = langelierIndex(recirculatingPh, phs0);
  const excess = lsi0 - scale.maximumLangelierIndex;
  const delta = scale.acidFeed && excess > 0 && r.mAlkalinityMgPerLAsCaCO3 > 0 ? excess / 2 : 0;
  const alkT = r.mAlkalinityMgPerLAsCaCO3 * Math.pow(10, -delta);
  const ph = recirculatingPh - delta;
  const phs = phs0 + delta;
  const neutralised = r.mAlkalinityMgPerLAsCaCO3 - alkT;
  return {
    cycles,
    hottestSurfaceC,
    untreatedLangelierIndex: lsi0,
    ph,
    mAlkalinityMgPerLAsCaCO3: alkT,
    saturationPh: phs,
    langelierIndex: langelierIndex(ph, phs),
    ryznarIndex: ryznarIndex(ph, phs),
    alkalinityNeutralisedMgPerL: neutralised,
    acidProductKgPerM3Outflow:
      neutralised > 0 ? (SULFURIC_ACID_PER_ALKALINITY_AS_CACO3 * neutralised) / 1000 / Math.max(scale.acidStrengthFraction, 1e-6) : 0,
  };
}
