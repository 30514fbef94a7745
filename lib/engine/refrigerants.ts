/**
 * Refrigerants of the condensers LoopLedger compares: global warming potentials, liquid density for
 * charge estimates, safety group, and the published rules whose thresholds a plant's inventory may cross.
 *
 * GWP: 100-year values of the IPCC assessment reports — AR5 (IPCC 2013, Climate Change 2013: The
 * Physical Science Basis, WG I, ch. 8, Table 8.A.1) and AR6 (IPCC 2021, WG I, ch. 7, Table 7.SM.7)
 * [memory: the single-compound values below are recalled; verify against the tables before relying on
 * them]. A blend's GWP is the mass-weighted mean of its components' (the usual convention, e.g. of the
 * EU F-gas Regulation, Annex VI), with the compositions of ASHRAE Standard 34. Ammonia (R-717) has no
 * direct radiative forcing listed: GWP 0.
 */

export const REFRIGERANTS = ["R717", "R134a", "R404A", "R407C", "R410A", "R507A", "R22"] as const;
export type Refrigerant = (typeof REFRIGERANTS)[number];

export const REFRIGERANT_LABELS: Record<Refrigerant, string> = {
  R717: "R-717 (ammonia)",
  R134a: "R-134a",
  R404A: "R-404A",
  R407C: "R-407C",
  R410A: "R-410A",
  R507A: "R-507A",
  R22: "R-22 (HCFC, phased out for new equipment)",
};

export const GWP_REPORTS = ["AR5", "AR6"] as const;
export type GwpReport = (typeof GWP_REPORTS)[number];

export const GWP_REPORT_LABELS: Record<GwpReport, string> = {
  AR5: "IPCC Fifth Assessment Report (2013), 100-year GWP",
  AR6: "IPCC Sixth Assessment Report (2021), 100-year GWP",
};

/** Single compounds that make up the refrigerants above. */
type Compound = "HFC-32" | "HFC-125" | "HFC-134a" | "HFC-143a" | "HCFC-22" | "NH3";

/** 100-year GWP of each compound by report [memory: AR5 Table 8.A.1; AR6 Table 7.SM.7]. */
const COMPOUND_GWP_100: Record<Compound, Record<GwpReport, number>> = {
  "HFC-32": { AR5: 677, AR6: 771 },
  "HFC-125": { AR5: 3170, AR6: 3740 },
  "HFC-134a": { AR5: 1300, AR6: 1530 },
  "HFC-143a": { AR5: 4800, AR6: 5810 },
  "HCFC-22": { AR5: 1760, AR6: 1960 },
  NH3: { AR5: 0, AR6: 0 },
};

/** Composition by mass fraction (ASHRAE Standard 34 designations). */
const COMPOSITION: Record<Refrigerant, Partial<Record<Compound, number>>> = {
  R717: { NH3: 1 },
  R134a: { "HFC-134a": 1 },
  R404A: { "HFC-125": 0.44, "HFC-143a": 0.52, "HFC-134a": 0.04 },
  R407C: { "HFC-32": 0.23, "HFC-125": 0.25, "HFC-134a": 0.52 },
  R410A: { "HFC-32": 0.5, "HFC-125": 0.5 },
  R507A: { "HFC-125": 0.5, "HFC-143a": 0.5 },
  R22: { "HCFC-22": 1 },
};

/**
 * 100-year global warming potential of a refrigerant, kg CO₂e per kg: Σ (mass fraction × compound GWP)
 * for blends. Source: IPCC AR5/AR6 (module comment) [memory for the compound values].
 */
export function globalWarmingPotential100(refrigerant: Refrigerant, report: GwpReport): number {
  let gwp = 0;
  for (const [compound, fraction] of Object.entries(COMPOSITION[refrigerant]) as [Compound, number][]) {
    gwp += fraction * COMPOUND_GWP_100[compound][report];
  }
  return gwp;
}

/** True for ammonia: no copper, and the ammonia process-safety rules apply. */
export function isAmmonia(refrigerant: Refrigerant): boolean {
  return refrigerant === "R717";
}

/**
 * Saturated-liquid density near 35 °C, kg/m³ — scales a construction's ammonia charge per kW to another
 * refrigerant held in the same liquid volume [memory: rounded values of the usual property tables;
 * a screening figure, not a property routine].
 */
export const LIQUID_DENSITY_35C_KG_PER_M3: Record<Refrigerant, number> = {
  R717: 588,
  R134a: 1168,
  R404A: 990,
  R407C: 1110,
  R410A: 1010,
  R507A: 990,
  R22: 1150,
};

/** ASHRAE Standard 34 safety group (toxicity A/B, flammability 1/2L/2/3). */
export const SAFETY_GROUP: Record<Refrigerant, string> = {
  R717: "B2L",
  R134a: "A1",
  R404A: "A1",
  R407C: "A1",
  R410A: "A1",
  R507A: "A1",
  R22: "A1",
};

/**
 * A published rule whose obligations start at a quantity of refrigerant. The rule is named as
 * published; the threshold amounts are recalled from memory and must be verified by the plant.
 * `thresholdKg` applies to the quantity in one process (usually the whole system, not one condenser).
 */
export interface RegulatoryThreshold {
  rule: string;
  appliesTo: "ammonia" | "halocarbon";
  /** Mass threshold, kg (for `basis: "co2e"`, tonnes CO₂e × 1000 / GWP gives kg of refrigerant). */
  thresholdKg?: number;
  thresholdTonnesCO2e?: number;
  thresholdText: string;
  /** Always true here: the amounts are recalled, not looked up. */
  fromMemory: true;
}

/** 10,000 lb in kg (1 lb = 0.45359237 kg exactly). */
const TEN_THOUSAND_LB_KG = 4535.9237;
/** 50 lb in kg. */
const FIFTY_LB_KG = 22.6796185;

export const REGULATORY_THRESHOLDS: RegulatoryThreshold[] = [
  {
    rule: "US OSHA Process Safety Management of Highly Hazardous Chemicals, 29 CFR 1910.119 (Appendix A)",
    appliesTo: "ammonia",
    thresholdKg: TEN_THOUSAND_LB_KG,
    thresholdText: "anhydrous ammonia 10,000 lb (4,536 kg) in a process [memory]",
    fromMemory: true,
  },
  {
    rule: "US EPA Risk Management Program, 40 CFR Part 68 (Clean Air Act §112(r))",
    appliesTo: "ammonia",
    thresholdKg: TEN_THOUSAND_LB_KG,
    thresholdText: "anhydrous ammonia 10,000 lb (4,536 kg) in a process [memory]; the general duty clause of §112(r)(1) applies at any quantity",
    fromMemory: true,
  },
  {
    rule: "EU Seveso III Directive 2012/18/EU (Annex I, Part 2)",
    appliesTo: "ammonia",
    thresholdKg: 50_000,
    thresholdText: "anhydrous ammonia 50 t lower tier, 200 t upper tier [memory]",
    fromMemory: true,
  },
  {
    rule: "US EPA refrigerant management, 40 CFR Part 82 Subpart F (Clean Air Act §608)",
    appliesTo: "halocarbon",
    thresholdKg: FIFTY_LB_KG,
    thresholdText: "leak-repair duties for appliances holding 50 lb (22.7 kg) or more [memory]",
    fromMemory: true,
  },
  {
    rule: "EU F-gas Regulation (EU) 2024/573",
    appliesTo: "halocarbon",
    thresholdTonnesCO2e: 5,
    thresholdText: "leak checks from 5 t CO₂e of fluorinated gas in a piece of equipment [memory]",
    fromMemory: true,
  },
];
