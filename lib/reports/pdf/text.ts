/**
 * Fixed prose of the report: methods, references, cautions and the screening-estimate note.
 * LoopLedger's own wording; references are the published methods the engine implements.
 */
import type { OptionKind } from "@/lib/engine/types";

export const SCREENING_NOTE =
  "Screening estimate. These results compare options for a decision; they are not a design. Equipment ratings must come from certified " +
  "manufacturer selections at the project's conditions, tariffs from the local utilities, and water-treatment limits from the treatment " +
  "specialist. Local codes, the authority having jurisdiction and a licensed professional engineer govern the design, installation and operation.";

export const METHODS: { title: string; text: string }[] = [
  {
    title: "Psychrometrics",
    text: "Wet-bulb temperature, humidity ratio and moist-air enthalpy from the hourly or binned weather at the site's pressure, p = 101325(1 - 2.25577e-5 Z)^5.2559 Pa, with the saturation-pressure correlations and the wet-bulb relation of ASHRAE Handbook-Fundamentals, chapter 1 [1].",
  },
  {
    title: "Open cooling tower",
    text: "Merkel's integral KaV/L = int cp dT/(hs - ha) evaluated with the four-point Chebyshev rule of CTI ATC-105 [2, 3]; the tower characteristic KaV/L = C(L/G)^-n calibrated at the manufacturer's design point. Fan speed is the root that holds the cold-water set-point; when full speed cannot, the cold water floats. Fan power follows the fan laws with the installed control (variable speed, two-speed or cycling).",
  },
  {
    title: "Closed-circuit cooler",
    text: "Effectiveness-NTU with an enthalpy-based (fictitious) specific heat of the saturated air film for the wet coil, and plain dry-coil heat transfer when the spray pump is off below the switch-over temperature [4, 5]. The selection's rating point calibrates the coil conductance; glycol properties adjust the process side.",
  },
  {
    title: "Condenser, fouling and compressor",
    text: "Condensing temperature from the entering water by effectiveness-NTU of the condenser, with 1/U = 1/Uclean + Rf(t). Fouling grows asymptotically, Rf(t) = Rf,inf(1 - e^(-t/tau)) after Kern and Seaton [6], or linearly, and is reset by each cleaning; the cleaning interval that minimises the average cost rate is reported. The compressor's extra energy follows from the higher condensing temperature. A plate exchanger adds its approach and a second pump.",
  },
  {
    title: "Water balance",
    text: "Evaporation from the air-side mass and energy balance, drift as a share of the circulating flow, blowdown from the cycles of concentration, B = E/(C - 1) - D, and makeup M = E + B + D. Cycles are entered or derived from the makeup analysis and the chemistry limits. Sewer volume is the makeup, or the makeup less evaporation where the utility grants an evaporation credit.",
  },
  {
    title: "Life-cycle cost",
    text: "Present-value life-cycle cost per NIST Handbook 135 and ASTM E917 [7, 8]: first cost, energy, demand, water, sewer, chemicals and upkeep, replacements and residual value, each stream with its own escalation, discounted to 1 January of the base year (single present value (1 + d)^-t, uniform present value with escalation for recurring costs). A real analysis uses constant dollars throughout; a nominal one converts rates with (1 + D) = (1 + d)(1 + I). Against the base option: net savings, the savings-to-investment ratio (ASTM E964 [9]), the adjusted internal rate of return AIRR = (1 + r)SIR^(1/N) - 1 (ASTM E1057 [10]) and simple and discounted payback (ASTM E1121 [11]).",
  },
  {
    title: "Sensitivity and uncertainty",
    text: "Tornado: one input at a time at its low and high value, ranked by the swing of net savings. Break-even: the value of one input at which two options cost the same over their life, by root finding. Monte Carlo: seeded draws of prices, escalation, first cost and other entered distributions; the share of draws in which each option is cheapest and the P10/P50/P90 of net savings [7, 12].",
  },
];

export const REFERENCES: string[] = [
  "ASHRAE. 2017 ASHRAE Handbook - Fundamentals, chapter 1, Psychrometrics. Atlanta: ASHRAE.",
  "Merkel, F. (1925). Verdunstungskühlung. VDI-Forschungsheft 275.",
  "Cooling Technology Institute. ATC-105, Acceptance Test Code for Water Cooling Towers (four-point Chebyshev integration of the Merkel integral).",
  "Incropera, F. P., DeWitt, D. P. et al. Fundamentals of Heat and Mass Transfer, effectiveness-NTU method.",
  "Braun, J. E., Klein, S. A., Mitchell, J. W. (1989). Effectiveness models for cooling towers and cooling coils. ASHRAE Transactions 95(2).",
  "Kern, D. Q., Seaton, R. E. (1959). A theoretical analysis of thermal surface fouling. British Chemical Engineering 4(5).",
  "Fuller, S. K., Petersen, S. R. (1996). Life-Cycle Costing Manual for the Federal Energy Management Program, NIST Handbook 135.",
  "ASTM E917, Standard Practice for Measuring Life-Cycle Costs of Buildings and Building Systems.",
  "ASTM E964, Standard Practice for Measuring Benefit-to-Cost and Savings-to-Investment Ratios for Buildings and Building Systems.",
  "ASTM E1057, Standard Practice for Measuring Internal Rate of Return and Adjusted Internal Rate of Return for Investments in Buildings and Building Systems.",
  "ASTM E1121, Standard Practice for Measuring Payback for Investments in Buildings and Building Systems.",
  "ASTM E1369, Standard Guide for Selecting Techniques for Treating Uncertainty and Risk in the Economic Evaluation of Buildings and Building Systems.",
  "ANSI/ASHRAE Standard 188, Legionellosis: Risk Management for Building Water Systems; ASHRAE Guideline 12, Managing the Risk of Legionellosis Associated with Building Water Systems.",
];

export interface Caution {
  title: string;
  text: string;
}

const WET: readonly OptionKind[] = ["openTowerDirect", "openTowerPlateHx", "closedCircuitCooler"];

/** Cautions for the options compared; every wet option carries the water-management duty. */
export function cautionsFor(kinds: OptionKind[], hasBasinHeater: boolean): Caution[] {
  const out: Caution[] = [];
  if (kinds.some((k) => WET.includes(k))) {
    out.push({
      title: "Legionella and the water-management programme",
      text: "Every option here has water that evaporates and can spread aerosols: the open tower's basin and fill, and the closed-circuit cooler's spray loop alike. Each needs a written water-management programme (ANSI/ASHRAE Standard 188, ASHRAE Guideline 12 and the local public-health rules) with a responsible person, monitoring, disinfection, start-up and shut-down procedures and records, and may need registration with the authorities. Its cost is in this report; its duty does not go away with a closed circuit or in dry-mode hours.",
    });
    out.push({
      title: "Treatment chemicals",
      text: "Scale and corrosion inhibitors and biocides are hazardous in concentrated form. Storage, dosing, bunding, eye-wash and personal protective equipment follow the supplier's safety data sheets and the local rules; blowdown discharge may need the sewer authority's consent.",
    });
  }
  out.push({
    title: "Ammonia and other refrigerants",
    text: "Where the condenser serves an ammonia plant, any change to condensing pressure, condenser isolation or heat-rejection equipment is work on a pressure system containing a toxic refrigerant: it follows the applicable refrigeration safety codes (for example ANSI/IIAR 2 and ASHRAE Standard 15, or the local equivalents), the plant's process-safety management and a competent refrigeration engineer.",
  });
  out.push({
    title: "Freezing and winter operation",
    text:
      "Basins, spray loops, exposed piping and coils can freeze. Winter operation needs freeze protection (basin heaters, heat tracing, drain-down or glycol at a verified concentration), a control sequence for low loads and low temperatures, and a check of ice on fill, louvres and nearby surfaces." +
      (hasBasinHeater ? " The basin-heater energy in this report assumes the heater works as entered." : ""),
  });
  out.push({
    title: "Structural and installation loads",
    text: "Operating weight, wind and seismic loads, vibration and crane lifts of the selected units must be checked by a licensed structural engineer for the actual support, roof or grade location. Clearances, plume and noise at the property line are the designer's to verify.",
  });
  return out;
}
