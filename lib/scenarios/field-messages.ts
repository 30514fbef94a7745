/**
 * Validation messages a person can act on. A schema issue becomes a sentence in the project's units
 * ("Enter at least 50 °F."), never the library's wording or a schema path, and a problem is placed by its
 * section, option and field label ("Option 2: Open tower + plate exchanger › Tower selection at design ›
 * Leaving (cold) water"). Client-safe; the server action and the editor both use it.
 */
import { formatNumber, formatQuantity, fromSI, unitLabel, type UnitSystem } from "@/lib/units";
import { fieldInfo, WATER_KG_PER_L, type FieldDisplay } from "./field-labels";
import { EDITOR_SECTIONS, optionIndexOfSection, sectionOfPath } from "./editor-values";

export interface MessageContext {
  system: UnitSystem;
  currency: string;
}

/** The parts of a zod issue the messages read (zod 4's issue objects have these fields). */
export interface IssueParts {
  code: string;
  message: string;
  input?: unknown;
  expected?: unknown;
  minimum?: unknown;
  maximum?: unknown;
  inclusive?: boolean;
  origin?: string;
  values?: readonly unknown[];
  options?: readonly unknown[];
  params?: Record<string, unknown>;
}

/** A value stored in SI shown in the field's display unit, with its unit. */
export function showValue(valueSI: number, display: FieldDisplay | undefined, ctx: MessageContext): string {
  if (!display || "text" in display) return formatNumber(valueSI, { sig: 6 });
  if ("q" in display)
    return formatQuantity(display.q, valueSI, ctx.system, { currency: ctx.currency, sig: 6 });
  if ("percent" in display) return `${formatNumber(valueSI * 100, { sig: 6 })}\u00a0%`;
  if ("waterFlow" in display) {
    const shown = fromSI("waterFlowLPerS", valueSI / WATER_KG_PER_L, ctx.system);
    return `${formatNumber(shown, { sig: 4 })}\u00a0${unitLabel("waterFlowLPerS", ctx.system)}`;
  }
  const u = display.unit;
  return u && u !== "—" && u !== "×"
    ? `${formatNumber(valueSI, { sig: 6 })} ${u}`
    : `${formatNumber(valueSI, { sig: 6 })}${u === "×" ? "×" : ""}`;
}

const sentence = (s: string) => {
  const t = s.trim();
  const cap = t.charAt(0).toUpperCase() + t.slice(1);
  return /[.!?]$/.test(cap) ? cap : `${cap}.`;
};

/** Words a library might put in a message: such text is never shown as it is. */
const LIBRARY_WORDING =
  /invalid input|expected |received |too (small|big)|invalid (option|discriminator|union|type)|nonoptional|NaN/i;

/** True when a message is the schema library's own wording (to be replaced by `humanIssue`'s). */
export function isLibraryWording(message: string): boolean {
  return LIBRARY_WORDING.test(message);
}

/**
 * Issues of any schema (project, comment, what-if…) with the library's wording replaced by `humanIssue`'s
 * sentence (SI units, the project's currency unknown); messages the schema wrote itself stay as they are.
 */
export function humaneIssues<I extends IssueParts & { path: readonly PropertyKey[] }>(issues: readonly I[]): I[] {
  return issues.map((issue) => {
    if (!isLibraryWording(issue.message)) return issue;
    const path = issue.path.map(String).join(".");
    return { ...issue, message: humanIssue(issue, path, { system: "SI", currency: "USD" }).message };
  });
}

/**
 * The message shown under a field for one schema issue (the label is beside the field, so the message does
 * not repeat it), and whether the field is simply empty.
 */
export function humanIssue(
  issue: IssueParts,
  path: string,
  ctx: MessageContext,
): { message: string; missing: boolean } {
  const info = fieldInfo(path);
  const display = info.display;
  const isText = display !== undefined && "text" in display;
  switch (issue.code) {
    case "invalid_type": {
      const input = issue.input;
      if (input === undefined || input === null || input === "") {
        return {
          message:
            isText || issue.expected === "string"
              ? "Enter a value."
              : "Enter a value: this field has no default.",
          missing: true,
        };
      }
      if (issue.expected === "int") return { message: "Enter a whole number.", missing: false };
      if (issue.expected === "number")
        return { message: "Enter a number, e.g. 12.5 (digits, one decimal point or comma).", missing: false };
      if (issue.expected === "string") return { message: "Enter text.", missing: false };
      if (issue.expected === "boolean") return { message: "Choose yes or no.", missing: false };
      return { message: "This value has the wrong form; enter it again.", missing: false };
    }
    case "too_small": {
      const min = Number(issue.minimum);
      if (issue.origin === "string")
        return {
          message: min <= 1 ? "Enter a value." : `Use at least ${min} characters.`,
          missing: issue.input === "",
        };
      if (issue.origin === "array")
        return {
          message: path === "options" ? "Compare at least two options." : `Add at least ${min}.`,
          missing: false,
        };
      if (min === 0 && issue.inclusive === false)
        return { message: "Enter a value above zero.", missing: false };
      if (min === 0) return { message: "Enter zero or more.", missing: false };
      return {
        message: `Enter ${issue.inclusive === false ? "more than" : "at least"} ${showValue(min, display, ctx)}.`,
        missing: false,
      };
    }
    case "too_big": {
      const max = Number(issue.maximum);
      if (issue.origin === "string") return { message: `Use at most ${max} characters.`, missing: false };
      if (issue.origin === "array")
        return {
          message: path === "options" ? "Compare at most four options." : `Use at most ${max.toLocaleString("en-US")} entries.`,
          missing: false,
        };
      return {
        message: `Enter ${issue.inclusive === false ? "less than" : "at most"} ${showValue(max, display, ctx)}.`,
        missing: false,
      };
    }
    case "invalid_value":
    case "invalid_union":
      return { message: "Choose one of the listed values.", missing: issue.input === undefined };
    case "not_multiple_of":
      return { message: "Enter a whole number.", missing: false };
    case "invalid_format":
      return { message: "This value has the wrong form; enter it again.", missing: false };
    case "custom": {
      const p = issue.params ?? {};
      if (typeof p.aboveC === "number" && typeof p.what === "string")
        return {
          message: sentence(`${p.what} (${showValue(p.aboveC, { q: "temperatureC" }, ctx)})`),
          missing: false,
        };
      if (typeof issue.message === "string" && issue.message && !LIBRARY_WORDING.test(issue.message)) {
        const missing = /^enter /i.test(issue.message) && issue.input === undefined;
        return { message: sentence(issue.message), missing };
      }
      break;
    }
  }
  return { message: "This value cannot be used; check it against the selection sheet.", missing: false };
}

/** Where a field is: its section's title (the option's for an option field), its group and its label. */
export interface FieldPlace {
  sectionTitle: string;
  group?: string;
  label: string;
}

/** The place of a field path, with the option's own label when the values are at hand. */
export function placeOf(path: string, optionLabels: readonly string[] = []): FieldPlace {
  const info = fieldInfo(path);
  const section = sectionOfPath(path);
  const i = optionIndexOfSection(section);
  const sectionTitle =
    i !== null
      ? `Option ${i + 1}${optionLabels[i] ? `: ${optionLabels[i]}` : ""}`
      : (EDITOR_SECTIONS.find((s) => s.id === section)?.title ?? "General");
  return {
    sectionTitle,
    ...(info.group && info.group !== sectionTitle ? { group: info.group } : {}),
    label: info.label,
  };
}

/** One line naming a field for a summary: "Option 2: Tower + plates › Fans › Minimum speed". */
export function placeText(place: FieldPlace): string {
  return [place.sectionTitle, place.group, place.label].filter(Boolean).join(" › ");
}
