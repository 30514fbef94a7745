/**
 * The envelope of a server-action request, checked in proxy.ts before Next.js decodes it. Next.js answers
 * 500 for every envelope its decoder rejects (broken JSON, a body over the 1 MB limit, nesting that
 * overflows the decoder's stack, a reference to a part that was never sent, an origin that is not the
 * host); those are the client's mistakes, so they are answered here as 400/403/413 before any app code
 * runs. What passes is exactly what React's client encoder produces for plain values: JSON whose strings
 * that begin with "$" are escapes or inline values, or (multipart) references to parts that exist.
 * No framework imports (unit-tested on its own).
 */

/** Next.js's default server-action body limit (next.config.mjs `serverActions.bodySizeLimit`). */
export const ACTION_BODY_LIMIT_BYTES = 1024 * 1024;
/** Next.js refuses more arguments than this with a 500 (SERVER_ACTION_ARGS_LIMIT). */
export const ACTION_ARGS_LIMIT = 1000;
/** Nesting far deeper than any form produces (the scenario document is about ten levels deep). */
export const ACTION_MAX_DEPTH = 64;

export type EnvelopeCheck = { ok: true } | { ok: false; status: 400 | 403 | 413 | 415; error: string };

const bad = (error: string): EnvelopeCheck => ({ ok: false, status: 400, error });

/**
 * Strings React's reply decoder reads without looking up another part: "$$…" (an escaped "$"),
 * "$u…" (undefined), "$I…" (Infinity), "$-…" (-0, -Infinity), "$N…" (NaN), "$D…" (a date), "$T" (an
 * opaque client value), "$H…", and "$n" with at most 300 digits (a bigint).
 */
function inlineToken(s: string): boolean {
  const c = s[1];
  if (c === "$" || c === "u" || c === "I" || c === "-" || c === "N" || c === "D" || c === "T" || c === "H") return true;
  if (c === "n") return /^\$n-?\d{1,300}$/.test(s);
  return false;
}

/** Part ids a "$…" string refers to in a multipart reply ("$@1", "$K2", "$Q3", "$5", …), or null. */
function referencedPart(s: string): string | null {
  const m = /^\$(?:[@hQWiKAOoUSsLlGgMmVbBRrXx])?([0-9a-f]+)$/.exec(s);
  return m ? String(parseInt(m[1]!, 16)) : null;
}

/**
 * Walk a parsed value without recursion: depth, "$" strings and "__proto__" keys (which React's reviver
 * would turn into the object's prototype).
 */
export function checkReplyValue(root: unknown, partExists: (id: string) => boolean = () => false): EnvelopeCheck {
  const stack: { v: unknown; depth: number }[] = [{ v: root, depth: 0 }];
  while (stack.length) {
    const { v, depth } = stack.pop()!;
    if (depth > ACTION_MAX_DEPTH) return bad(`The request is nested more than ${ACTION_MAX_DEPTH} levels deep.`);
    if (typeof v === "string") {
      if (v.startsWith("$") && !inlineToken(v)) {
        const part = referencedPart(v);
        if (part === null || !partExists(part)) return bad("The request refers to a part it does not contain.");
      }
    } else if (Array.isArray(v)) {
      for (const x of v) if (x !== null && typeof x === "object") stack.push({ v: x, depth: depth + 1 });
      else if (typeof x === "string") stack.push({ v: x, depth });
    } else if (v !== null && typeof v === "object") {
      for (const key of Object.keys(v)) {
        if (key === "__proto__") return bad("The request contains a __proto__ key.");
        const x = (v as Record<string, unknown>)[key];
        if (x !== null && typeof x === "object") stack.push({ v: x, depth: depth + 1 });
        else if (typeof x === "string") stack.push({ v: x, depth });
      }
    }
  }
  return { ok: true };
}

function parseJson(text: string): { ok: true; value: unknown } | { ok: false } {
  try {
    return { ok: true, value: JSON.parse(text) as unknown };
  } catch {
    return { ok: false };
  }
}

/**
 * A fetch action's text body (what the client sends when the arguments are plain values): one JSON
 * array of arguments.
 */
export function checkTextReply(text: string): EnvelopeCheck {
  const parsed = parseJson(text);
  if (!parsed.ok) return bad("The request body is not valid JSON.");
  if (!Array.isArray(parsed.value)) return bad("The request body must be the list of the action's arguments.");
  if (parsed.value.length > ACTION_ARGS_LIMIT) return bad(`The request has more than ${ACTION_ARGS_LIMIT} arguments.`);
  return checkReplyValue(parsed.value);
}

/**
 * A fetch action's multipart body (arguments that hold a FormData — the app's forms): part "0" is the JSON
 * list of arguments, other numbered parts are JSON values it refers to, and "<n>_<field>" (or
 * "_<n>_<field>") parts are the FormData's own fields (free text).
 */
export function checkMultipartReply(form: FormData): EnvelopeCheck {
  const parts = new Map<string, string>();
  for (const [key, value] of form.entries()) {
    if (/^\d+$/.test(key)) {
      if (typeof value !== "string") continue;
      parts.set(key, value);
    }
  }
  const root = parts.get("0");
  if (root === undefined) return bad("The request has no argument list.");
  // A FormData argument's own fields travel as "<id>_<field>" or, from React 19's client, "_<id>_<field>".
  const exists = (id: string) => parts.has(id) || [...form.keys()].some((k) => k.startsWith(`${id}_`) || k.startsWith(`_${id}_`));
  for (const [key, text] of parts) {
    const parsed = parseJson(text);
    if (!parsed.ok) return bad(`Part ${key} of the request is not valid JSON.`);
    if (key === "0" && (!Array.isArray(parsed.value) || parsed.value.length > ACTION_ARGS_LIMIT)) {
      return bad("The request's argument list is malformed.");
    }
    const r = checkReplyValue(parsed.value, exists);
    if (!r.ok) return r;
  }
  return { ok: true };
}

/**
 * A form posted without JavaScript whose action has bound arguments: "$ACTION_REF_<n>" names the form, and
 * "$ACTION_<n>:0" holds `{ id, bound }` in the reply format, its references naming "$ACTION_<n>:<k>" parts.
 * The framework answers 500 when `bound` refers to a part that was not sent; refused here with 400.
 */
export function checkNoScriptForm(form: FormData): EnvelopeCheck {
  for (const key of form.keys()) {
    if (!key.startsWith("$ACTION_REF_")) continue;
    const prefix = `$ACTION_${key.slice("$ACTION_REF_".length)}:`;
    const root = form.get(`${prefix}0`);
    if (typeof root !== "string") return bad("The form names an action it does not describe.");
    const parsed = parseJson(root);
    if (!parsed.ok) return bad("The form's action description is not valid JSON.");
    const meta = parsed.value as { id?: unknown; bound?: unknown } | null;
    if (!meta || typeof meta !== "object" || typeof meta.id !== "string") return bad("The form's action description is malformed.");
    const r = checkReplyValue(meta, (id) => typeof form.get(`${prefix}${id}`) === "string");
    if (!r.ok) return r;
    for (const [k, v] of form.entries()) {
      if (!k.startsWith(prefix) || k === `${prefix}0` || typeof v !== "string") continue;
      const part = parseJson(v);
      if (!part.ok) return bad("A part of the form's action description is not valid JSON.");
      const rp = checkReplyValue(part.value, (id) => typeof form.get(`${prefix}${id}`) === "string");
      if (!rp.ok) return rp;
    }
  }
  return { ok: true };
}

/** A form posted without JavaScript (progressive enhancement): its action is named by "$ACTION_…" fields. */
export function hasNoScriptActionFields(form: FormData): boolean {
  for (const key of form.keys()) if (key.startsWith("$ACTION_")) return true;
  return false;
}

/**
 * Does the Origin (when sent) name this host? Next.js compares the Origin's host with X-Forwarded-Host,
 * else Host, and answers 500 on a mismatch; the same comparison answers 403 here.
 */
export function sameOriginAction(headers: Headers): boolean {
  const origin = headers.get("origin");
  if (!origin) return true;
  if (origin === "null") return false;
  let originHost: string;
  try {
    originHost = new URL(origin).host;
  } catch {
    return false;
  }
  const host = (headers.get("x-forwarded-host") ?? headers.get("host") ?? "").split(",")[0]!.trim();
  return host !== "" && originHost === host;
}
