import type { ScenarioResult } from "@/lib/engine";
import type { ScenarioInput } from "@/lib/engine/input";
import { formatQuantity, type UnitSystem } from "@/lib/units";

export interface Caution {
  id: string;
  title: string;
  body: string;
}

const AMMONIA_WORDS = /\b(ammonia|nh3|nh₃|r-?717)\b/i;

/**
 * Where the work can hurt someone. Each caution defers to local codes, the authority having jurisdiction
 * and a licensed engineer; none replaces a site's water-management programme or a design review.
 */
export function cautionsFor(input: ScenarioInput, result: ScenarioResult, system: UnitSystem, context: string): Caution[] {
  const out: Caution[] = [];
  const wet = input.options.map((o) =>
    o.kind === "closedCircuitCooler" || o.kind === "evaporativeCondenser"
      ? `${o.label} (its spray-water loop)`
      : `${o.label} (its tower basin and fill)`,
  );
  out.push({
    id: "legionella",
    title: "Legionella and the water-management programme",
    body:
      `Every option here has recirculating water open to the air: ${wet.join("; ")}. Each needs a written water-management programme ` +
      "(risk assessment, control limits, monitoring, corrective actions and validation, e.g. under ASHRAE Standard 188 and the local health authority's rules), " +
      "high-efficiency drift eliminators, start-up and shut-down disinfection, and no stagnant dead legs. A closed-circuit cooler's dry hours shorten the wet season but do not remove the duty: " +
      "a spray loop left standing warm is a growth risk. Registration and sampling rules vary by jurisdiction.",
  });
  out.push({
    id: "chemicals",
    title: "Treatment chemicals",
    body:
      "Biocides, scale and corrosion inhibitors and any acid feed are hazardous: store and dose them per their safety data sheets with containment, " +
      "eye-wash and ventilation, keep incompatible products apart (oxidising biocides with acids), and have a trained person or the treatment vendor handle them. " +
      "Blowdown discharge may need the sewer authority's permit.",
  });
  const minDryC = result.climateSummary.dryBulb.minC;
  if (Number.isFinite(minDryC) && minDryC < 2) {
    const glycolOptions = input.options.filter((o) => o.kind === "closedCircuitCooler" && o.cooler.glycol.kind !== "none");
    out.push({
      id: "freezing",
      title: "Winter freezing",
      body:
        `The climate reaches ${formatQuantity("temperatureC", minDryC, system, { sig: 3 })}. Tower basins, make-up lines and exposed piping need freeze protection ` +
        "(basin heaters, heat tracing, indoor sump or drain-down), and fans need a de-icing or low-speed routine. A closed-circuit cooler's coil freezes if water stands in it at low load: " +
        (glycolOptions.length > 0
          ? `glycol is entered for ${glycolOptions.map((o) => o.label).join(", ")} — confirm the freeze point against the local design minimum. `
          : "use glycol of a freeze point below the local design minimum, or a positive drain-down arrangement. ") +
        "Follow the manufacturer's winter operating instructions.",
    });
  }
  const ammoniaHint =
    input.duty.refrigerant === "R717" || AMMONIA_WORDS.test(`${context} ${input.name} ${input.options.map((o) => o.label).join(" ")}`) || input.duty.evaporatingC <= -15;
  if (ammoniaHint) {
    const evap = input.options.some((o) => o.kind === "evaporativeCondenser");
    const inventory = (result.condensers ?? []).map((c) => `${input.options.find((o) => o.id === c.optionId)?.label ?? c.optionId} ≈ ${formatQuantity("massKg", c.inventoryKg, system, { sig: 2 })}`);
    out.push({
      id: "ammonia",
      title: "Ammonia refrigeration",
      body:
        "If the condensers serve an ammonia (R-717) plant, condenser changes, tube cleaning and eddy-current testing are work on a pressure system with a toxic refrigerant: " +
        "follow the plant's process-safety and mechanical-integrity procedures (e.g. IIAR 2, IIAR 6 and the local pressure-equipment rules), isolate and pump down before opening, " +
        "and note that a tube leak in a direct tower loop carries ammonia into open tower water and the air; an isolated loop (plate exchanger or closed-circuit cooler) keeps it out of the open water. " +
        (evap ? "An evaporative condenser puts the ammonia coil outdoors under the spray: a coil leak goes to the air and the spray water, so detection, relief and emergency procedures must cover the roof. " : "") +
        (inventory.length > 0 ? `Estimated ammonia held in each option's condenser (screening figures by construction): ${inventory.join("; ")}. ` : "") +
        "Process-safety and risk-management rules apply above threshold quantities set by regulation — e.g. the US OSHA Process Safety Management standard (29 CFR 1910.119) and the EPA Risk Management Program (40 CFR Part 68), 10,000 lb of anhydrous ammonia in a process [recalled from memory: verify] — counted over the whole system, not one condenser. Defer to the plant's process-safety management, local codes and a licensed engineer.",
    });
  }
  out.push({
    id: "structure",
    title: "Structural load of wet equipment",
    body:
      "Operating weight (basin water, wetted fill, a full coil) is far above shipping weight, and wind, seismic and snow loads act on the casing. " +
      "A structural engineer must check the roof or steel support, anchorage and vibration isolation for the selected unit's certified operating weight.",
  });
  return out;
}

export function CautionList({ cautions }: { cautions: Caution[] }) {
  return (
    <ul className="space-y-3" data-testid="cautions">
      {cautions.map((c) => (
        <li key={c.id} className="rounded-panel border border-caution-200 bg-caution-50 px-4 py-3 text-sm" data-caution={c.id}>
          <p className="font-semibold text-caution-800">{c.title}</p>
          <p className="mt-1 text-ink-soft">{c.body}</p>
        </li>
      ))}
    </ul>
  );
}

export function ScreeningNote() {
  return (
    <p className="rounded-panel border border-line bg-paper px-4 py-3 text-xs text-ink-soft" data-testid="screening-note">
      <span className="font-semibold text-ink">Screening estimate.</span> These results come from simplified models of the selections entered and are for
      comparing options, not for design. Capacities, airflows, fan and pump powers must come from certified manufacturer selections; local codes, the
      authority having jurisdiction and a licensed engineer govern design, installation and operation.
    </p>
  );
}
