/**
 * The one result shape of LoopLedger's data-access layer, server actions and route handlers: the value,
 * or an expected failure with the HTTP status a route answers with, a sentence a person can act on and,
 * for bad input, every field's messages. Unexpected failures are thrown (error.tsx / a 500), never returned.
 *
 * Pure and client-safe: forms read `fieldErrors` from the same type the server returns.
 */

/** Field messages by dot-joined input path ("options.0.designWaterFlowLPerS"); "" holds form-level ones. */
export type FieldErrorMap = Record<string, string[]>;

export type FailureStatus = 400 | 401 | 403 | 404 | 409 | 410 | 413 | 415 | 422 | 429 | 503;

export interface Failure<D = never> {
  ok: false;
  status: FailureStatus;
  error: string;
  fieldErrors?: FieldErrorMap;
  /** Extra facts a caller can act on (the revision a conflicting save met, …). */
  detail?: D;
}

export type Success<T> = { ok: true; value: T };
export type Result<T, D = never> = Success<T> | Failure<D>;

export function ok<T>(value: T): Success<T> {
  return { ok: true, value };
}

export function fail<D = never>(
  status: FailureStatus,
  error: string,
  fieldErrors?: FieldErrorMap,
  detail?: D,
): Failure<D> {
  const f: Failure<D> = { ok: false, status, error };
  if (fieldErrors && Object.keys(fieldErrors).length) f.fieldErrors = fieldErrors;
  if (detail !== undefined) f.detail = detail;
  return f;
}

export interface IssueLike {
  path: readonly PropertyKey[];
  message: string;
}

/** Dot-joined path of an issue ("" for the root). */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.map((p) => (typeof p === "symbol" ? (p.description ?? "") : String(p))).join(".");
}

/** Every issue (a zod error's or any list), grouped by field path, in order, without duplicates. */
export function toFieldErrors(issues: readonly IssueLike[]): FieldErrorMap {
  const out: FieldErrorMap = {};
  for (const issue of issues) {
    const key = issuePath(issue.path);
    const list = (out[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return out;
}

/** How many messages a field-error map holds. */
export function countFieldErrors(errors: FieldErrorMap | undefined): number {
  return Object.values(errors ?? {}).reduce((n, l) => n + l.length, 0);
}

/** Bad input: 422 with every field's messages; nothing was changed. */
export function invalid(issues: readonly IssueLike[] | FieldErrorMap, error?: string): Failure {
  const fieldErrors = Array.isArray(issues)
    ? toFieldErrors(issues as readonly IssueLike[])
    : (issues as FieldErrorMap);
  const n = countFieldErrors(fieldErrors);
  return fail(
    422,
    error ?? `Nothing was saved: ${n} ${n === 1 ? "problem" : "problems"} to fix.`,
    fieldErrors,
  );
}

/** The three refusals every entry point answers with (401 anonymous, 404 no relation, 403 no right). */
export const REFUSALS = {
  anonymous: { ok: false, status: 401, error: "Sign in first (your session may have ended)." },
  notFound: { ok: false, status: 404, error: "Not found." },
  forbidden: { ok: false, status: 403, error: "You do not have access to this." },
} as const satisfies Record<string, Failure>;

export type Refusal = Failure & { status: 401 | 403 | 404 };
