/**
 * Field errors as plain data, shared by server actions (which return them) and client forms (which show
 * them at the field). Pure and server-safe: no React, no "use client".
 * Paths are dot-joined ("options.0.designWaterFlowLPerS"); the empty path "" holds form-level messages.
 */

export type FieldErrorMap = Record<string, string[]>;

export interface IssueLike {
  path: readonly PropertyKey[];
  message: string;
}

/** Dot-joined path of an issue ("" for the root). */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.map((p) => (typeof p === "symbol" ? p.description ?? "" : String(p))).join(".");
}

/** Every issue of a zod error (or any issue list), grouped by field path, in order, without duplicates. */
export function toFieldErrors(issues: readonly IssueLike[]): FieldErrorMap {
  const out: FieldErrorMap = {};
  for (const issue of issues) {
    const key = issuePath(issue.path);
    const list = (out[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return out;
}

/** What a form's server action returns: ok (with optional data), or every field error (nothing was changed). */
export type ActionResult<T = undefined> =
  | { ok: true; data?: T }
  | { ok: false; fieldErrors: FieldErrorMap; formError?: string };

/** An id-safe form of a field path, for ids, aria-describedby and summary links. */
export function fieldId(name: string, prefix = "f"): string {
  return `${prefix}-${name.replace(/[^A-Za-z0-9_-]/g, "-")}`;
}
export const errorIdOf = (id: string) => `${id}-error`;
export const hintIdOf = (id: string) => `${id}-hint`;
