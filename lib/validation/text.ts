/**
 * Text safety shared by every schema (scenario, project, comments, invitations, accounts, climate names):
 * a NUL character or a lone UTF-16 surrogate in a text field is refused with a field message. PostgreSQL
 * cannot store NUL in text or jsonb, and a lone surrogate is not valid Unicode (it cannot be written as
 * UTF-8), so either would otherwise fail deep in a write. Client-safe (the forms use the same schemas).
 */
import { z } from "zod";

/** The message under a text field holding such a character (humanIssue passes it through). */
export const UNSAFE_TEXT_MESSAGE = "Remove the control character (NUL) or broken character from this text; retype it if you pasted it.";

// A high surrogate not followed by a low one, or a low surrogate not preceded by a high one.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** True when `s` has no NUL and no lone surrogate (it can be stored and shown as it is). */
export function isSafeText(s: string): boolean {
  return !s.includes("\u0000") && !LONE_SURROGATE.test(s);
}

/** A string schema that refuses NUL and lone surrogates; chain `.trim()`, `.min()`, `.max()` as usual. */
export function text(params?: Parameters<typeof z.string>[0]) {
  return z.string(params).refine(isSafeText, { message: UNSAFE_TEXT_MESSAGE });
}

/** Where a raw input (any JSON-like value) holds unsafe text, in a string value or in an object key. */
export interface UnsafeTextIssue {
  path: (string | number)[];
  message: string;
}

/**
 * Every string (value or key) of a raw input that `isSafeText` refuses, with its path; walks at most
 * `maxNodes` values and `maxDepth` levels (a hostile input cannot make the walk long), stopping after
 * `maxIssues`. The wrapper of every entry point runs it before the schema, so a text field that a schema
 * forgot, or a key, is caught the same way.
 */
export function unsafeTextIssues(raw: unknown, limits: { maxNodes?: number; maxDepth?: number; maxIssues?: number } = {}): UnsafeTextIssue[] {
  const maxNodes = limits.maxNodes ?? 200_000;
  const maxDepth = limits.maxDepth ?? 64;
  const maxIssues = limits.maxIssues ?? 20;
  const out: UnsafeTextIssue[] = [];
  let nodes = 0;
  const walk = (v: unknown, path: (string | number)[], depth: number): void => {
    if (out.length >= maxIssues || ++nodes > maxNodes || depth > maxDepth) return;
    if (typeof v === "string") {
      if (!isSafeText(v)) out.push({ path, message: UNSAFE_TEXT_MESSAGE });
      return;
    }
    if (!v || typeof v !== "object") return;
    if (Array.isArray(v)) {
      for (let i = 0; i < v.length && out.length < maxIssues && nodes <= maxNodes; i++) walk(v[i], [...path, i], depth + 1);
      return;
    }
    if (typeof FormData !== "undefined" && v instanceof FormData) return;
    for (const key of Object.keys(v)) {
      if (out.length >= maxIssues || nodes > maxNodes) return;
      if (!isSafeText(key)) {
        out.push({ path, message: UNSAFE_TEXT_MESSAGE });
        continue;
      }
      walk((v as Record<string, unknown>)[key], [...path, key], depth + 1);
    }
  };
  walk(raw, [], 0);
  return out;
}
