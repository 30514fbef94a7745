import type { Outcome } from "./outcome";

/** What a server action hands back to its form (useActionState): plain data, no rows, no secrets. */
export type FormState =
  | { status: "idle" }
  | { status: "ok"; message: string; data?: Record<string, string> }
  | { status: "error"; message: string; fieldErrors?: Record<string, string[]> };

export const IDLE: FormState = { status: "idle" };

export function formStateOf<T>(outcome: Outcome<T>, okMessage: (value: T) => string, data?: (value: T) => Record<string, string>): FormState {
  if (outcome.ok) return { status: "ok", message: okMessage(outcome.value), ...(data ? { data: data(outcome.value) } : {}) };
  const message = outcome.status === 401 ? "Your session has ended. Sign in again." : outcome.error;
  return { status: "error", message, ...(outcome.fieldErrors ? { fieldErrors: outcome.fieldErrors } : {}) };
}

/** One readable timestamp everywhere on the server-rendered pages (UTC: the server does not know the reader's zone). */
export function formatWhen(d: Date | string | null | undefined): string {
  if (!d) return "—";
  const date = typeof d === "string" ? new Date(d) : d;
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

export function formatDay(d: Date | string): string {
  return (typeof d === "string" ? new Date(d) : d).toISOString().slice(0, 10);
}
