import { describe, expect, it } from "vitest";
import { sessionIsCurrent } from "@/lib/auth/session-rules";
import { clientAddress } from "@/lib/auth/rate-limit";

const H = 3600_000;
const changed = new Date("2026-12-01T08:00:00.000Z");
const maxAgeS = 8 * 3600;

describe("session rules", () => {
  const signedAt = changed.getTime() + H;
  const claims = { authAtMs: signedAt, pwdAtMs: changed.getTime() };

  it("a session signed after the last password change counts until its absolute age runs out", () => {
    expect(sessionIsCurrent(claims, { passwordChangedAt: changed }, maxAgeS, signedAt + 7.9 * H)).toBe(true);
    expect(sessionIsCurrent(claims, { passwordChangedAt: changed }, maxAgeS, signedAt + 8.01 * H)).toBe(false);
  });
  it("a password change voids sessions signed before it", () => {
    const later = new Date(changed.getTime() + 2 * H);
    expect(sessionIsCurrent(claims, { passwordChangedAt: later }, maxAgeS, signedAt + 2 * H)).toBe(false);
  });
  it("a session without the claims, or from the future, does not count", () => {
    expect(sessionIsCurrent({}, { passwordChangedAt: changed }, maxAgeS, signedAt)).toBe(false);
    expect(sessionIsCurrent({ authAtMs: signedAt }, { passwordChangedAt: changed }, maxAgeS, signedAt)).toBe(false);
    expect(sessionIsCurrent({ ...claims, authAtMs: signedAt + H }, { passwordChangedAt: changed }, maxAgeS, signedAt)).toBe(false);
  });
});

describe("the address a sign-in is counted against", () => {
  it("is the connection's peer unless the peer is a named proxy; then the right-most forwarded client", () => {
    // What the credentials endpoint sees: X-Forwarded-For written by Next.js from the socket (proxy.ts set the
    // client's own header aside under x-loopledger-forwarded-for). RFC 7239 §5.2 / de-facto X-Forwarded-For:
    // each proxy appends the address it saw on the right.
    const before = process.env.TRUSTED_PROXIES;
    try {
      delete process.env.TRUSTED_PROXIES;
      expect(clientAddress({ "x-forwarded-for": "127.0.0.1", "x-loopledger-forwarded-for": "1.2.3.4, 10.0.0.7" })).toBe("127.0.0.1");
      expect(clientAddress({})).toBe("unknown");
      process.env.TRUSTED_PROXIES = "127.0.0.1";
      expect(clientAddress({ "x-forwarded-for": "127.0.0.1", "x-loopledger-forwarded-for": "1.2.3.4, 10.0.0.7" })).toBe("10.0.0.7");
    } finally {
      if (before === undefined) delete process.env.TRUSTED_PROXIES;
      else process.env.TRUSTED_PROXIES = before;
    }
  });
});
