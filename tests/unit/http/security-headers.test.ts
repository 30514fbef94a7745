import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, newNonce, SECURITY_HEADERS } from "@/lib/http/security";

describe("security headers", () => {
  it("next.config.mjs gives the static files the same fixed headers as the proxy gives everything else", async () => {
    // @ts-expect-error next.config.mjs is plain JavaScript without declarations
    const mod: { default: { headers: () => Promise<{ source: string; headers: { key: string; value: string }[] }[]> } } = await import("../../../next.config.mjs");
    const config = mod.default;
    const rules = await config.headers();
    const staticRule = rules.find((r) => r.source.startsWith("/_next/static"));
    expect(staticRule).toBeTruthy();
    const fromConfig = Object.fromEntries(staticRule!.headers.map((h) => [h.key, h.value]));
    for (const [k, v] of Object.entries(SECURITY_HEADERS)) expect(fromConfig[k], k).toBe(v);
  });

  it("the pages' policy: nonce and strict-dynamic for scripts, unsafe-eval only in development, no framing", () => {
    const n = newNonce();
    expect(n).toMatch(/^[A-Za-z0-9+/]{22}==$/);
    expect(newNonce()).not.toBe(n);
    const prod = contentSecurityPolicy(n);
    expect(prod).toContain(`script-src 'self' 'nonce-${n}' 'strict-dynamic'`);
    expect(prod).not.toContain("unsafe-eval");
    expect(prod).toContain("frame-ancestors 'none'");
    expect(prod).toContain("object-src 'none'");
    expect(contentSecurityPolicy(n, { development: true })).toContain("'unsafe-eval'");
  });
});
