/**
 * Security headers of every response, and the Content-Security-Policy of the pages (proxy.ts sets them;
 * next.config.mjs repeats the fixed ones for the static files the proxy does not see — a unit test keeps
 * the two lists equal). No framework imports.
 */

/** Headers every response carries. */
export const SECURITY_HEADERS: Readonly<Record<string, string>> = {
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "Permissions-Policy": "accelerometer=(), camera=(), geolocation=(), gyroscope=(), magnetometer=(), microphone=(), payment=(), usb=(), browsing-topics=()",
  // frame-ancestors 'none' in the CSP says the same to browsers that read it; this covers older ones.
  "X-Frame-Options": "DENY",
  "Cross-Origin-Opener-Policy": "same-origin",
};

/** A fresh nonce per page request (128 random bits, base64). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  let s = "";
  for (const b of bytes) s += String.fromCharCode(b);
  return btoa(s);
}

/**
 * The pages' policy. Scripts: only those carrying this request's nonce (Next.js puts it on its own
 * scripts when the request carries the policy) and what they load ('strict-dynamic'); `unsafe-eval` only
 * in development, where React uses eval for its error overlays. Styles may be inline (the charts and
 * React's style attributes use them; they cannot run code). Nothing may frame the app.
 */
export function contentSecurityPolicy(nonce: string, opts: { development?: boolean } = {}): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${opts.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/** The policy of answers that carry no page (APIs, downloads, the proxy's own error pages). */
export const STRICT_CSP = "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";
