import type { FieldErrors } from "react-hook-form";
import type { EditorValues } from "@/lib/scenarios/editor-values";
import type { EditorProblem } from "@/lib/scenarios/editor-validation";

type Node = { [key: string]: unknown };

/**
 * The editor's problems as react-hook-form's nested errors (the first message of each field). A problem
 * on a list itself (the options) sits under its `root`, where react-hook-form keeps field-array errors.
 */
export function toFormErrors(problems: readonly EditorProblem[]): FieldErrors<EditorValues> {
  const root: Node = {};
  for (const p of problems) {
    const keys = p.path.split(".");
    let node = root;
    keys.forEach((k, i) => {
      const last = i === keys.length - 1;
      const existing = node[k];
      if (last) {
        const error = { type: p.kind, message: p.message };
        if (existing && typeof existing === "object" && !("message" in existing)) {
          const holder = existing as Node;
          holder.root ??= error;
        } else if (!existing) node[k] = error;
        return;
      }
      if (!existing || typeof existing !== "object" || "message" in existing) {
        const child: Node = Array.isArray(existing) ? {} : {};
        if (existing && typeof existing === "object" && "message" in existing) child.root = existing;
        node[k] = child;
      }
      node = node[k] as Node;
    });
  }
  return root as FieldErrors<EditorValues>;
}
