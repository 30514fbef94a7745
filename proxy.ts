import { getToken } from "next-auth/jwt";
import { NextResponse, type NextRequest } from "next/server";
import { ACTION_BODY_LIMIT_BYTES, checkMultipartReply, checkNoScriptForm, checkTextReply, hasNoScriptActionFields, sameOriginAction, type EnvelopeCheck } from "@/lib/http/action-envelope";
import { readBodyLimited } from "@/lib/http/body";
import { setAsideForwardedFor } from "@/lib/http/client-address";
import { contentSecurityPolicy, newNonce, SECURITY_HEADERS, STRICT_CSP } from "@/lib/http/security";
import { databaseUp } from "@/lib/health/probe";

/**
 * The edge of every request (pages, actions, APIs; not the static files):
 *  1. security headers on every answer; a Content-Security-Policy with a fresh nonce for pages (Next.js
 *     puts the nonce on its own scripts);
 *  2. X-Forwarded-For is only believed from a proxy named in TRUSTED_PROXIES (lib/http/client-address.ts);
 *  3. server-action envelopes the framework would answer with a 500 (broken JSON, over 1 MB, deep nesting,
 *     dangling references, a foreign Origin) are answered 400/403/413 here, before any app code;
 *  4. while the database is unreachable: 503 with Retry-After (JSON for APIs and actions, a page for pages);
 *  5. an anonymous visitor of an app page goes to sign-in (a cookie-level redirect, not authorization:
 *     every page, action and route handler checks the viewer through lib/auth).
 */
export async function proxy(request: NextRequest) {
  const path = request.nextUrl.pathname;
  const isApi = path.startsWith("/api/");
  const isAction = request.method === "POST" && !isApi && (request.headers.has("next-action") || isMultipart(request));
  const forwarded = new Headers(request.headers);
  setAsideForwardedFor(forwarded);

  if (isAction) {
    const refused = await checkActionEnvelope(request);
    if (!refused.ok) return withHeaders(NextResponse.json({ error: refused.error }, { status: refused.status, headers: NO_STORE }), null);
  }

  if (!path.startsWith("/api/health/") && !(await databaseUp())) {
    return withHeaders(isApi || isAction ? unavailableJson() : unavailablePage(), null);
  }

  if (!isApi && SIGNED_IN_ONLY.test(path)) {
    const token = await getToken({ req: request, secret: process.env.NEXTAUTH_SECRET });
    if (!token) {
      const url = new URL("/signin", request.url);
      url.searchParams.set("callbackUrl", request.nextUrl.pathname + request.nextUrl.search);
      return withHeaders(NextResponse.redirect(url), null);
    }
  }

  if (isApi) return withHeaders(NextResponse.next({ request: { headers: forwarded } }), null);
  const nonce = newNonce();
  const csp = contentSecurityPolicy(nonce, { development: process.env.NODE_ENV === "development" });
  // Next.js reads the policy from the request to find the nonce it puts on its scripts.
  forwarded.set("content-security-policy", csp);
  forwarded.set("x-nonce", nonce);
  return withHeaders(NextResponse.next({ request: { headers: forwarded } }), csp);
}

export const config = {
  // Everything but the build's static files (they get the fixed headers from next.config.mjs).
  matcher: ["/((?!_next/static|_next/image|favicon.ico).*)"],
};

const SIGNED_IN_ONLY = /^\/(projects|firm|account|reports)(\/|$)/;
const NO_STORE = { "cache-control": "no-store" };
const UNAVAILABLE = "The database is unavailable. Nothing you saved is lost — try again in a minute.";

function withHeaders(res: NextResponse, csp: string | null): NextResponse {
  for (const [k, v] of Object.entries(SECURITY_HEADERS)) res.headers.set(k, v);
  res.headers.set("content-security-policy", csp ?? STRICT_CSP);
  return res;
}

function isMultipart(request: NextRequest): boolean {
  return (request.headers.get("content-type") ?? "").toLowerCase().startsWith("multipart/form-data");
}

async function checkActionEnvelope(request: NextRequest): Promise<EnvelopeCheck> {
  if (!sameOriginAction(request.headers)) return { ok: false, status: 403, error: "Cross-site request refused." };
  const body = await readBodyLimited(request.clone(), ACTION_BODY_LIMIT_BYTES);
  if (!body.ok) {
    return body.reason === "tooLarge"
      ? { ok: false, status: 413, error: "The request is larger than 1 MB." }
      : { ok: false, status: 400, error: "The request has no body." };
  }
  if (isMultipart(request)) {
    let form: FormData;
    try {
      form = await new Response(new Blob([new Uint8Array(body.bytes)]), { headers: { "content-type": request.headers.get("content-type") ?? "" } }).formData();
    } catch {
      return { ok: false, status: 400, error: "The request is not a readable form." };
    }
    // A fetch action (the Next-Action header) encodes its arguments as numbered parts: every reference must
    // name a part that was sent. A form posted without JavaScript carries "$ACTION_…" fields instead and
    // no header: its bound arguments' description is checked the same way (checkNoScriptForm).
    if (request.headers.has("next-action") && !hasNoScriptActionFields(form)) return checkMultipartReply(form);
    return checkNoScriptForm(form);
  }
  // ignoreBOM: a byte-order mark stays in the text, so JSON.parse refuses it here as the framework would.
  return checkTextReply(new TextDecoder("utf-8", { ignoreBOM: true }).decode(body.bytes));
}

function unavailableJson(): NextResponse {
  return NextResponse.json({ error: UNAVAILABLE, retryAfterS: 30 }, { status: 503, headers: { ...NO_STORE, "retry-after": "30" } });
}

function unavailablePage(): NextResponse {
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Database unavailable · LoopLedger</title><style>body{font-family:system-ui,sans-serif;max-width:36rem;margin:15vh auto;padding:0 1.5rem;color:#1d2a33;line-height:1.5}h1{font-size:1.5rem;margin-bottom:.5rem}p{color:#45535c}</style></head><body><main><h1>The database is unavailable</h1><p>Nothing you saved is lost — try again in a minute.</p><p><a href="">Try again</a></p></main></body></html>`;
  return new NextResponse(html, { status: 503, headers: { ...NO_STORE, "content-type": "text/html; charset=utf-8", "retry-after": "60" } });
}
