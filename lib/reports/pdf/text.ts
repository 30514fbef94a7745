/**
 * Fixed prose of the report: cautions and the screening-estimate note (the methods and references are
 * lib/methods/methods.md, rendered as the report's appendix). LoopLedger's own wording.
 */
import type { OptionKind } from "@/lib/engine/types";

export const SCREENING_NOTE =
  "Screening estimate. These results compare options for a decision; they are not a design. Equipment ratings must come from certified " +
  "manufacturer selections at the project's conditions, tariffs from the local utilities, and water-treatment limits from the treatment " +
  "specialist. Local codes, the authority having jurisdiction and a licensed professional engineer govern the design, installation and operation.";

export interface Caution {
  title: string;
  text: string;
}

const WET: readonly OptionKind[] = ["openTowerDirect", "openTowerPlateHx", "closedCircuitCooler", "evaporativeCondenser"];

/** Cautions for the options compared; every wet option carries the water-management duty. */
export function cautionsFor(kinds: OptionKind[], hasBasinHeater: boolean): Caution[] {
  const out: Caution[] = [];
  if (kinds.some((k) => WET.includes(k))) {
    out.push({
      title: "Legionella and the water-management programme",
      text: "Every option here has water that evaporates and can spread aerosols: the open tower's basin and fill, the closed-circuit cooler's and the evaporative condenser's spray loops alike. Each needs a written water-management programme (ANSI/ASHRAE Standard 188, ASHRAE Guideline 12 and the local public-health rules) with a responsible person, monitoring, disinfection, start-up and shut-down procedures and records, and may need registration with the authorities. Its cost is in this report; its duty does not go away with a closed circuit or in dry-mode hours.",
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
