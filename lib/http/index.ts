import "server-only";
import { NextResponse } from "next/server";
import { env } from "@/lib/env";
import { fail, type Failure, type Result } from "@/lib/result";
import { readBodyLimited } from "./body";

export { readBodyLimited };

/**
 * The one HTTP helper module of the route handlers: JSON answers (errors always `{ error, fieldErrors? }`),
 * a byte-limited body reader, the cross-site check for state-changing requests and download headers.
 */

/** Nothing a route answers is cached by the browser or a proxy: every answer depends on the viewer. */
export const NO_STORE = { "cache-control": "private, no-store" } as const;

/** A JSON error answer: `{ error, ...extra }` (extra: `fieldErrors` by dotted input path, limits, …). */
export function jsonError(status: number, error: string, extra: Record<string, unknown> = {}): NextResponse {
  return NextResponse.json({ error, ...extra }, { status, headers: NO_STORE });
}

/** A JSON answer with a value. */
export function jsonOk(value: unknown, status = 200): NextResponse {
  return NextResponse.json(value, { status, headers: NO_STORE });
}

/** A failure as JSON: its status with `{ error, fieldErrors?, detail? }`; a 429 says when to try again (Retry-After). */
export function failureResponse(f: Failure<unknown>): NextResponse {
  const res = jsonError(f.status, f.error, {
    ...(f.fieldErrors ? { fieldErrors: f.fieldErrors } : {}),
    ...(f.detail !== undefined ? { detail: f.detail } : {}),
  });
  if (f.status === 429) {
    const s = (f.detail as { retryAfterS?: unknown } | undefined)?.retryAfterS;
    res.headers.set("retry-after", String(typeof s === "number" && s > 0 ? Math.ceil(s) : 60));
  }
  return res;
}

/** A result as JSON: `okStatus` with the value, or the failure's status with its error and field errors. */
export function resultResponse<T>(r: Result<T, unknown>, okStatus = 200): NextResponse {
  return r.ok ? jsonOk(r.value, okStatus) : failureResponse(r);
}

/** "16 kB", "5 MB": a limit in words for an error message. */
export function bytesInWords(n: number): string {
  if (n < 1e6) return `${Math.round(n / 1e3)} kB`;
  return `${(n / 1e6).toLocaleString("en-US", { maximumFractionDigits: 1 })} MB`;
}

/**
 * A JSON request body of at most `maxBytes` (counted in bytes, not characters). 415 for another content
 * type, 413 when too large, 400 for an empty body or text that is not JSON.
 */
export async function readJsonBody(request: Request, maxBytes: number): Promise<Result<unknown>> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    return fail(415, "Send the document as JSON (Content-Type: application/json).");
  }
  const body = await readBodyLimited(request, maxBytes);
  if (!body.ok) {
    return body.reason === "tooLarge"
      ? fail(413, `The body is larger than ${bytesInWords(maxBytes)}.`)
      : fail(400, "The request has no body.");
  }
  try {
    return { ok: true, value: JSON.parse(new TextDecoder().decode(body.bytes)) as unknown };
  } catch {
    // The parser's own message (a position in a token stream) helps no one; a deep nesting lands here too.
    return fail(400, "The body is not valid JSON.");
  }
}

/**
 * A state-changing request must come from LoopLedger's own pages or from a client that sends no Origin
 * (a script with the session cookie). Browsers send Origin on cross-site POST/DELETE; refusing a foreign
 * one closes the cross-site request forgery door that SameSite=Lax leaves ajar on some browsers.
 */
export function isCrossSite(request: Request): boolean {
  const origin = request.headers.get("origin");
  if (!origin) return request.headers.get("sec-fetch-site") === "cross-site";
  const allowed = new Set([new URL(env().APP_URL).origin, new URL(env().NEXTAUTH_URL).origin]);
  const host = request.headers.get("x-forwarded-host") ?? request.headers.get("host");
  if (host) allowed.add(`${new URL(request.url).protocol}//${host}`);
  return !allowed.has(origin);
}

/** The 403 a cross-site state-changing request gets. */
export const crossSiteRefusal = (): NextResponse => jsonError(403, "Cross-site request refused.");

/** Headers of a file download (the name must be ASCII already; filename* repeats it per RFC 6266). */
export function downloadHeaders(
  fileName: string,
  contentType: string,
  length: number,
): Record<string, string> {
  return {
    ...NO_STORE,
    "content-type": contentType,
    "content-length": String(length),
    "content-disposition": `attachment; filename="${fileName}"; filename*=UTF-8''${encodeURIComponent(fileName)}`,
    "x-content-type-options": "nosniff",
  };
}

/** A file download answer. */
export function download(bytes: Uint8Array, fileName: string, contentType: string): Response {
  return new Response(new Uint8Array(bytes), {
    status: 200,
    headers: downloadHeaders(fileName, contentType, bytes.byteLength),
  });
}
