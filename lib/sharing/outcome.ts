import type { Refusal } from "@/lib/auth/access";

/**
 * What a sharing operation returns: the value, or an expected refusal with the HTTP status a route
 * handler answers with and a sentence a person can act on. Unexpected failures are thrown instead.
 */
export type Failure = {
  ok: false;
  status: 400 | 401 | 403 | 404 | 409 | 410 | 429;
  error: string;
  fieldErrors?: Record<string, string[]>;
};
export type Outcome<T> = { ok: true; value: T } | Failure;

export function success<T>(value: T): Outcome<T> {
  return { ok: true, value };
}

export function failure(status: Failure["status"], error: string, fieldErrors?: Record<string, string[]>): Failure {
  return fieldErrors ? { ok: false, status, error, fieldErrors } : { ok: false, status, error };
}

export function refused(r: Refusal): Failure {
  return { ok: false, status: r.status, error: r.error };
}

/** zod issues → every field's messages (all of them, not only the first). */
export function fieldErrorsOf(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const i of issues) {
    const key = String(i.path[0] ?? "form");
    (out[key] ??= []).push(i.message);
  }
  return out;
}
