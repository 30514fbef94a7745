import { describe, expect, it } from "vitest";
import { hashInvitationToken, invitationExpiry, invitationUrl, isWellFormedToken, newInvitationToken } from "@/lib/sharing/tokens";
import { invitationState } from "@/lib/sharing/invitations";
import { parseVersionParam } from "@/lib/sharing/versions";
import { commentRecipients } from "@/lib/sharing/comments";
import { escapeHtml, invitationMail } from "@/lib/mail/templates";

describe("invitation tokens", () => {
  it("hashes with SHA-256", () => {
    // FIPS 180-4 / NIST CSRC example "abc" → ba7816bf…f20015ad (one-block message, SHA-256).
    expect(hashInvitationToken("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
  it("carries 32 random bytes as 43 base64url characters", () => {
    // RFC 4648 §5: base64url alphabet A–Z a–z 0–9 - _; 32 bytes = 256 bits → ⌈256/6⌉ = 43 characters unpadded.
    const seen = new Set<string>();
    for (let i = 0; i < 200; i++) {
      const { token, tokenHash } = newInvitationToken();
      expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(token, "base64url")).toHaveLength(32);
      expect(tokenHash).toBe(hashInvitationToken(token));
      seen.add(token);
    }
    expect(seen.size).toBe(200);
  });
  it("refuses to look up anything that is not a token", () => {
    expect(isWellFormedToken("A".repeat(43))).toBe(true);
    for (const bad of ["", "A".repeat(42), "A".repeat(44), `${"A".repeat(42)}=`, `${"A".repeat(42)}/`, 42, null]) {
      expect(isWellFormedToken(bad)).toBe(false);
    }
  });
  it("links and expiry", () => {
    expect(invitationUrl("http://127.0.0.1:3000/", "tok")).toBe("http://127.0.0.1:3000/invite/tok");
    expect(invitationExpiry(new Date("2026-12-01T00:00:00Z")).toISOString()).toBe("2026-12-08T00:00:00.000Z");
  });
  it("states", () => {
    const now = new Date("2026-12-05T00:00:00Z");
    const base = { acceptedAt: null, revokedAt: null, expiresAt: new Date("2026-12-08T00:00:00Z") };
    expect(invitationState(base, now)).toBe("pending");
    expect(invitationState({ ...base, expiresAt: now }, now)).toBe("expired");
    expect(invitationState({ ...base, revokedAt: now }, now)).toBe("revoked");
    expect(invitationState({ ...base, revokedAt: now, acceptedAt: now }, now)).toBe("accepted");
  });
});

describe("version route segment", () => {
  it("accepts positive integers written plainly", () => {
    expect(parseVersionParam("1")).toBe(1);
    expect(parseVersionParam("12")).toBe(12);
    for (const bad of ["0", "01", "-1", "1.0", "1e3", "", "abc", "9999999999"]) expect(parseVersionParam(bad)).toBeNull();
  });
});

describe("mail content", () => {
  it("escapes what people typed", () => {
    expect(escapeHtml(`<a href="x">'&'</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;&#39;&amp;&#39;&lt;/a&gt;");
    const m = invitationMail({ projectName: "<script>", firmName: "F&G", inviterName: "I", role: "owner", url: "http://h/invite/t", expiresAt: new Date("2026-12-08T10:00:00Z") });
    expect(m.html).not.toContain("<script>");
    expect(m.text).toContain("http://h/invite/t");
    expect(m.text).toContain("2026-12-08 10:00 UTC");
  });
  it("comment e-mails go to every firm member except the author", () => {
    const members = [
      { userId: "a", email: "a@x", role: "admin" as const },
      { userId: "c", email: "c@x", role: "consultant" as const },
    ];
    expect(commentRecipients(members, "o")).toEqual(["a@x", "c@x"]);
    expect(commentRecipients(members, "c")).toEqual(["a@x"]);
  });
});

describe("audit wording", () => {
  it("groups events and reads unknown ones", async () => {
    const { auditCategory, humanizeAction } = await import("@/lib/sharing/audit");
    expect(auditCategory("report.download")).toBe("downloaded");
    expect(auditCategory("scenario.export")).toBe("downloaded");
    expect(auditCategory("version.view")).toBe("viewed");
    expect(auditCategory("scenario.issue")).toBe("issued");
    expect(auditCategory("access.revoke")).toBe("revoked");
    expect(auditCategory("invitation.revoke")).toBe("revoked");
    expect(auditCategory("invitation.create")).toBe("shared");
    expect(auditCategory("scenario.save")).toBe("changed");
    expect(humanizeAction("climate.binsSave")).toBe("climate bins save");
  });
});
