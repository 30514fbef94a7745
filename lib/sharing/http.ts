import { NextResponse } from "next/server";
import { env } from "@/lib/env";
import type { Outcome } from "./outcome";

const NO_STORE = { "cache-control": "no-store" } as const;

/** An outcome as JSON: 200/201 with the value, or its status with { error, fieldErrors }. */
export function outcomeResponse<T>(outcome: Outcome<T>, okStatus = 200): NextResponse {
  if (outcome.ok) return NextResponse.json(outcome.value, { status: okStatus, headers: NO_STORE });
  return NextResponse.json(
    { error: outcome.error, ...(outcome.fieldErrors ? { fieldErrors: outcome.fieldErrors } : {}) },
    { status: outcome.status, headers: NO_STORE },
  );
}

export function errorResponse(status: number, error: string): NextResponse {
  return NextResponse.json({ error }, { status, headers: NO_STORE });
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
  const host = request.headers.get("host");
  if (host) allowed.add(`${new URL(request.url).protocol}//${host}`);
  return !allowed.has(origin);
}

/** The request body as JSON, at most `maxBytes`; undefined when absent, too large or not JSON. */
export async function readJsonBody(request: Request, maxBytes = 16 * 1024): Promise<unknown> {
  const text = await request.text();
  if (!text || text.length > maxBytes) return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}
