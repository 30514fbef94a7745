/**
 * A break-even line of the comparison page in the project's units and currency. The engine works in SI
 * and a bare currency amount, so its own note says "per m³" and leaves money without a currency; a tie
 * that has an absolute value is restated here (water + sewer per kgal in IP, money with its currency).
 * A result without a tie keeps the engine's note, which carries the searched range.
 */
import type { BreakEvenResult } from "@/lib/engine/economics/types";
import { formatNumber, formatQuantity, type UnitSystem } from "@/lib/units";
import { money } from "./headline";

export function breakEvenLine(b: BreakEvenResult, currency: string, system: UnitSystem): string {
  if (b.value === null) return b.note;
  const more = /There are \d+ ties in the range[^.]*\./.exec(b.note)?.[0];
  const tail = more ? ` ${more}` : "";
  const factor = `×${formatNumber(b.value, { sig: 3 })}`;
  switch (b.input) {
    case "waterAndSewerPrice": {
      const abs =
        b.absoluteValue === null
          ? ""
          : ` (${formatQuantity("pricePerM3", b.absoluteValue, system, { sig: 3, currency })} of water and sewer together)`;
      return `The options tie at ${factor} the entered water and sewer prices${abs}.${tail}`;
    }
    case "electricityPrice": {
      const abs = b.absoluteValue === null ? "" : ` (a mean energy price of ${formatQuantity("pricePerKWh", b.absoluteValue, system, { sig: 3, currency })})`;
      return `The options tie at ${factor} the entered electricity prices${abs}.${tail}`;
    }
    case "firstCostPremium": {
      const abs = b.absoluteValue === null ? "" : ` (an extra first cost of ${money(b.absoluteValue, currency)})`;
      return `The options tie at ${factor} the alternative's extra first cost${abs}.${tail}`;
    }
    case "cyclesOfConcentration":
      return b.note;
  }
}
