/**
 * The address a request came from, for the sign-in throttle. X-Forwarded-For is whatever a client chooses
 * to send unless a proxy we trust wrote it, so it is believed only when the request's direct peer is one
 * of the proxies named in TRUSTED_PROXIES (comma-separated addresses). proxy.ts sets the client's header
 * aside (under FORWARDED_COPY) and removes it, so that Next.js writes the connection's own address into
 * X-Forwarded-For (it fills the header only when it is absent). No framework imports.
 */

/** Where proxy.ts keeps the X-Forwarded-For the request arrived with (any client value of it is replaced). */
export const FORWARDED_COPY = "x-loopledger-forwarded-for";

export function trustedProxies(value = process.env.TRUSTED_PROXIES ?? ""): string[] {
  return value
    .split(",")
    .map((s) => normalise(s.trim()))
    .filter(Boolean);
}

/** "::ffff:10.0.0.1" and "10.0.0.1" are the same peer. */
function normalise(address: string): string {
  return address.replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/i, "$1").toLowerCase();
}

/** In the proxy: move the arriving X-Forwarded-For aside and drop X-Real-IP (nothing the client sent survives under those names). */
export function setAsideForwardedFor(h: Headers): void {
  const arriving = h.get("x-forwarded-for");
  h.delete(FORWARDED_COPY);
  if (arriving) h.set(FORWARDED_COPY, arriving);
  h.delete("x-forwarded-for");
  h.delete("x-real-ip");
}

/**
 * The client's address: the connection's peer (what Next.js wrote into X-Forwarded-For), or — when that
 * peer is a trusted proxy — the right-most address in the forwarded chain that is not itself a trusted proxy.
 */
export function clientAddress(header: (name: string) => string | null | undefined, trusted = trustedProxies()): string {
  const peer = normalise((header("x-forwarded-for") ?? "").split(",")[0]?.trim() ?? "");
  if (!peer) return "unknown";
  if (!trusted.includes(peer)) return peer;
  const chain = (header(FORWARDED_COPY) ?? "")
    .split(",")
    .map((s) => normalise(s.trim()))
    .filter(Boolean);
  for (let i = chain.length - 1; i >= 0; i--) if (!trusted.includes(chain[i]!)) return chain[i]!;
  return peer;
}
