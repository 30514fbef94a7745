import { describe, expect, it } from "vitest";
import { clientAddress, FORWARDED_COPY, setAsideForwardedFor, trustedProxies } from "@/lib/http/client-address";

const headers = (h: Record<string, string>) => (name: string) => h[name];

describe("the client address for the sign-in throttle", () => {
  it("without a trusted proxy it is the connection's own address, whatever X-Forwarded-For the client sent", () => {
    // proxy.ts moves the arriving header aside; Next.js writes the socket's address into X-Forwarded-For.
    const h = new Headers({ "x-forwarded-for": "203.0.113.9", "x-real-ip": "203.0.113.10", [FORWARDED_COPY]: "forged" });
    setAsideForwardedFor(h);
    expect(h.get("x-forwarded-for")).toBeNull();
    expect(h.get("x-real-ip")).toBeNull();
    expect(h.get(FORWARDED_COPY)).toBe("203.0.113.9");
    expect(clientAddress(headers({ "x-forwarded-for": "127.0.0.1", [FORWARDED_COPY]: "203.0.113.9" }), [])).toBe("127.0.0.1");
    // 30 invented header values are one and the same client.
    const seen = new Set(Array.from({ length: 30 }, (_, i) => clientAddress(headers({ "x-forwarded-for": "::ffff:192.0.2.1", [FORWARDED_COPY]: `198.51.100.${i}` }), [])));
    expect([...seen]).toEqual(["192.0.2.1"]);
  });

  it("behind a named proxy it is the right-most forwarded address that is not a trusted proxy", () => {
    // RFC 7239 §5.2 / de-facto X-Forwarded-For: each proxy appends the address it saw on the right.
    const trusted = trustedProxies("10.0.0.2, 10.0.0.3");
    expect(trusted).toEqual(["10.0.0.2", "10.0.0.3"]);
    expect(clientAddress(headers({ "x-forwarded-for": "10.0.0.2", [FORWARDED_COPY]: "1.2.3.4, 198.51.100.7" }), trusted)).toBe("198.51.100.7");
    expect(clientAddress(headers({ "x-forwarded-for": "10.0.0.2", [FORWARDED_COPY]: "1.2.3.4, 198.51.100.7, 10.0.0.3" }), trusted)).toBe("198.51.100.7");
    // A peer that is not the named proxy is taken as it is, even if it sends a forwarded chain.
    expect(clientAddress(headers({ "x-forwarded-for": "192.0.2.50", [FORWARDED_COPY]: "1.2.3.4" }), trusted)).toBe("192.0.2.50");
    expect(clientAddress(headers({}), trusted)).toBe("unknown");
  });
});
