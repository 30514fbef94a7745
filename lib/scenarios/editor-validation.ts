/**
 * The editor's validation: the one scenario schema run on the editor's values (with a placeholder climate
 * and site, which are checked on the server), every problem as a field path and a message, grouped by the
 * editor's sections. A problem is "missing" when the field is empty and "invalid" otherwise, so a section can
 * say "2 to fill" apart from "1 error". Client-safe.
 */
import { scenarioSchema } from "./schema";
import { withPlaceholders } from "./validate";
import { partOfPath, sectionOfPath, type EditorValues, type PartId, type SectionId } from "./editor-values";
import { humanIssue, type MessageContext } from "./field-messages";

export interface EditorProblem {
  /** Dotted field path (never shown to a person). */
  path: string;
  section: SectionId;
  /** "missing": the field is empty; "invalid": it holds a value the schema refuses. */
  kind: "missing" | "invalid";
  /** The message shown under the field (it does not repeat the label). */
  message: string;
}

/** Every problem of the editor's values, in the schema's order. */
export function validateEditorValues(values: EditorValues, ctx: MessageContext): EditorProblem[] {
  const r = scenarioSchema.safeParse(withPlaceholders(values as unknown as Record<string, unknown>), {
    reportInput: true,
  });
  if (r.success) return [];
  const out: EditorProblem[] = [];
  const seen = new Set<string>();
  for (const issue of r.error.issues) {
    const path = issue.path.map(String).join(".");
    if (path === "climate" || path.startsWith("climate.") || path === "site" || path.startsWith("site."))
      continue;
    const h = humanIssue(issue, path, ctx);
    const key = `${path}\u0000${h.message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({
      path,
      section: sectionOfPath(path),
      kind: h.missing ? "missing" : "invalid",
      message: h.message,
    });
  }
  return out;
}

export interface SectionStatus {
  missing: number;
  invalid: number;
}

/** Problems counted per section. */
export function statusBySection(problems: readonly EditorProblem[]): Map<SectionId, SectionStatus> {
  const m = new Map<SectionId, SectionStatus>();
  for (const p of problems) {
    const s = m.get(p.section) ?? { missing: 0, invalid: 0 };
    s[p.kind] += 1;
    m.set(p.section, s);
  }
  return m;
}

/** Problems of one step counted per part (the step's own count is their sum). */
export function statusByPart(
  problems: readonly EditorProblem[],
  section: SectionId,
): Map<PartId, SectionStatus> {
  const m = new Map<PartId, SectionStatus>();
  for (const p of problems) {
    if (p.section !== section) continue;
    const part = partOfPath(p.path);
    if (!part) continue;
    const s = m.get(part) ?? { missing: 0, invalid: 0 };
    s[p.kind] += 1;
    m.set(part, s);
  }
  return m;
}
