/**
 * Ids that tie a field to its hint and error message. Field-error maps themselves are lib/result.ts's
 * (the server returns them; forms show them at the field). Pure: no React, no "use client".
 */
export type { FieldErrorMap } from "@/lib/result";

/** An id-safe form of a field path, for ids, aria-describedby and summary links. */
export function fieldId(name: string, prefix = "f"): string {
  return `${prefix}-${name.replace(/[^A-Za-z0-9_-]/g, "-")}`;
}
export const errorIdOf = (id: string) => `${id}-error`;
export const hintIdOf = (id: string) => `${id}-hint`;
