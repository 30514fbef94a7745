import type { z } from "zod";
import type { Executor } from "@/db/schema";
import { authorizeProject, isUuid, type ProjectAccess, type Viewer } from "@/lib/auth/access";
import { canInFirm, type Action } from "@/lib/auth/permissions";
import { env } from "@/lib/env";
import { fail, invalid, REFUSALS, type IssueLike, type Result } from "@/lib/result";
import { unsafeTextIssues } from "@/lib/validation/text";
import { humaneIssues } from "@/lib/scenarios/field-messages";

/**
 * The one wrapper of every state-changing entry point (server actions, and the route handlers that do the
 * same job): it turns a `run` that may assume an authorized viewer and parsed input into a data-access
 * function of the house style — executor first, viewer second, a `Result` back:
 *
 *   1. anonymous → 401 (unless the gate is "public" or its own);
 *   2. authorize: the project named by the input's `projectId` with the gate's action (404 no relation,
 *      403 no right), the firm named by `firmId` (403), or the gate's own check (an invitation token…);
 *   3. parse the input with the zod schema → 422 with every field's messages, nothing changed; any text
 *      (value or key) holding NUL or a lone surrogate is refused there too, even where a schema forgot it;
 *   4. run.
 * Authorization comes before parsing so that a refused viewer learns nothing from the field messages.
 * A FormData input is read as a plain object of its string fields.
 */

/** A gate of its own: reads what it needs from the raw input, refuses with a Failure or returns context. */
export interface CustomGate<C> {
  custom: (db: Executor, viewer: Viewer | null, raw: unknown) => Promise<Result<C>>;
}

export type Gate =
  | "public"
  | "signedIn"
  | { project: Action }
  | { firm: "project.create" | "firm.manageMembers" }
  | CustomGate<object>;

/** What a caller may set for one call: the clock and the address links in e-mails point to (tests set both). */
export interface OperationOptions {
  now?: Date;
  appUrl?: string;
}

interface Common {
  now: Date;
  /** The app's public address (APP_URL), for links in e-mails. */
  appUrl: () => string;
}

export type GateContext<G> = Common &
  (G extends "public"
    ? { viewer: Viewer | null }
    : G extends "signedIn"
      ? { viewer: Viewer }
      : G extends { project: Action }
        ? { viewer: Viewer; access: ProjectAccess }
        : G extends { firm: string }
          ? { viewer: Viewer; firmId: string }
          : G extends CustomGate<infer C>
            ? { viewer: Viewer | null } & C
            : never);

/** What `defineAction` makes: a data-access function (executor, viewer, raw input) → Result. */
export type Operation<T, D = never, O extends object = object> = (
  db: Executor,
  viewer: Viewer | null,
  raw: unknown,
  opts?: OperationOptions & Partial<O>,
) => Promise<Result<T, D>>;

export interface ActionSpec<G extends Gate, S extends z.ZodType, T, D, O extends object> {
  gate: G;
  /** The input's schema, or a function of the gate's context when the rules depend on who asks. */
  schema: S | ((ctx: GateContext<G>) => S);
  /** The message over the field errors (default "Nothing was saved: N problems to fix."). */
  invalidMessage?: string;
  /**
   * "schema": the schema checks every text itself and places the messages (the scenario document, whose
   * paths the editor maps to its fields); default "input": the wrapper also walks the whole raw input.
   */
  textCheck?: "input" | "schema";
  /** `opts`: what the caller passed beyond the clock and the address (a test's stand-in for a lookup, …). */
  run: (db: Executor, ctx: GateContext<G>, input: z.output<S>, opts: Partial<O>) => Promise<Result<T, D>>;
}

/** FormData → { field: string } (files and repeated fields are not used by LoopLedger's forms). */
export function formFields(form: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of form.entries()) if (typeof v === "string") out[k] = v;
  return out;
}

/** A string field of a raw input ("" when absent or not a string). */
export function rawField(raw: unknown, key: string): string {
  const v = raw && typeof raw === "object" ? (raw as Record<string, unknown>)[key] : undefined;
  return typeof v === "string" ? v : "";
}

async function pass(
  db: Executor,
  viewer: Viewer | null,
  gate: Gate,
  raw: unknown,
): Promise<Result<Record<string, unknown> & { viewer: Viewer | null }>> {
  if (gate === "public") return { ok: true, value: { viewer } };
  if (typeof gate === "object" && "custom" in gate) {
    const r = await gate.custom(db, viewer, raw);
    return r.ok ? { ok: true, value: { viewer, ...r.value } } : r;
  }
  if (!viewer) return REFUSALS.anonymous;
  if (gate === "signedIn") return { ok: true, value: { viewer } };
  if ("project" in gate) {
    const projectId = rawField(raw, "projectId");
    if (!isUuid(projectId)) return REFUSALS.notFound;
    const auth = await authorizeProject(db, viewer, projectId, gate.project);
    return auth.ok ? { ok: true, value: { viewer, access: auth.access } } : auth;
  }
  const firmId = rawField(raw, "firmId");
  if (!isUuid(firmId) || !canInFirm(viewer.principal, firmId, gate.firm)) {
    return fail(403, "You do not have permission to do this in that firm.", {
      firmId: ["Choose one of your own firms."],
    });
  }
  return { ok: true, value: { viewer, firmId } };
}

export function defineAction<G extends Gate, S extends z.ZodType, T, D = never, O extends object = object>(
  spec: ActionSpec<G, S, T, D, O>,
): Operation<T, D, O> {
  return async (db, viewer, rawInput, opts = {}) => {
    const raw =
      typeof FormData !== "undefined" && rawInput instanceof FormData ? formFields(rawInput) : rawInput;
    const gate = await pass(db, viewer, spec.gate, raw);
    if (!gate.ok) return gate;
    const common: Common = { now: opts.now ?? new Date(), appUrl: () => opts.appUrl ?? env().APP_URL };
    const ctx = { ...gate.value, ...common } as unknown as GateContext<G>;
    const schema =
      typeof spec.schema === "function" ? (spec.schema as (c: GateContext<G>) => S)(ctx) : spec.schema;
    const parsed = schema.safeParse(raw ?? {});
    const unsafe: IssueLike[] = spec.textCheck === "schema" ? [] : unsafeTextIssues(raw);
    if (!parsed.success) return invalid([...humaneIssues(parsed.error.issues), ...unsafe], spec.invalidMessage);
    if (unsafe.length > 0) return invalid(unsafe, spec.invalidMessage);
    return spec.run(db, ctx, parsed.data as z.output<S>, opts as Partial<O>);
  };
}
