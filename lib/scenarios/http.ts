import "server-only";
import { NextResponse } from "next/server";
import { readBodyLimited } from "@/lib/http/body";

export type JsonBody = { ok: true; value: unknown } | { ok: false; response: NextResponse };

/** A JSON error response; `fieldErrors` maps dotted input paths to messages. */
export function jsonError(status: number, error: string, extra: Record<string, unknown> = {}): NextResponse {
  return NextResponse.json({ error, ...extra }, { status, headers: { "cache-control": "no-store" } });
}

/**
 * Read a JSON request body of at most `maxBytes`, counting the bytes as they arrive (a missing or false
 * Content-Length cannot slip a larger body through). 415 for another content type, 413 when too large,
 * 400 for text that is not JSON.
 */
export async function readJsonBody(request: Request, maxBytes: number): Promise<JsonBody> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    return { ok: false, response: jsonError(415, "Send the document as JSON (Content-Type: application/json).") };
  }
  const limitText = `${(maxBytes / 1e6).toLocaleString("en-US", { maximumFractionDigits: 1 })} MB`;
  const body = await readBodyLimited(request, maxBytes);
  if (!body.ok) {
    return {
      ok: false,
      response:
        body.reason === "tooLarge"
          ? jsonError(413, `The body is larger than ${limitText}.`, { maxBytes })
          : jsonError(400, "The request has no body."),
    };
  }
  const text = new TextDecoder().decode(body.bytes);
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch (err) {
    return { ok: false, response: jsonError(400, `The body is not valid JSON: ${(err as Error).message}`) };
  }
}
