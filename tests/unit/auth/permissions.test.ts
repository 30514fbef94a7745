import { describe, expect, it } from "vitest";
import { ACTIONS, allows, can, canInFirm, navigationFor, relationTo } from "@/lib/auth/permissions";
import { AUTHZ_TABLE, expectedAllowed } from "../../support/authz-table";

describe("permission table: every role × action against the literal table (tests/support/authz-table.ts)", () => {
  it("every action of the code has a row in the table, and the table names no action the code lacks", () => {
    expect(Object.keys(AUTHZ_TABLE).sort()).toEqual([...ACTIONS].sort());
  });
  for (const relation of ["admin", "consultant", "owner", "finance"] as const) {
    for (const action of ACTIONS) {
      const expected = expectedAllowed(relation, action);
      it(`${relation} ${expected ? "may" : "may not"} ${action}`, () => {
        expect(allows(relation, action)).toBe(expected);
      });
    }
  }
  it("no relation may do nothing", () => {
    for (const action of ACTIONS) expect(allows(null, action)).toBe(false);
  });
});

describe("relation to a project", () => {
  const firmA = "11111111-1111-4111-8111-111111111111";
  const firmB = "22222222-2222-4222-8222-222222222222";
  const consultantA = { userId: "u1", firms: [{ firmId: firmA, role: "consultant" as const }] };
  const client = { userId: "u2", firms: [] };

  it("a consultant relates to their own firm's projects only", () => {
    expect(relationTo(consultantA, { projectId: "p", firmId: firmA, clientRole: null })).toBe("consultant");
    expect(relationTo(consultantA, { projectId: "p", firmId: firmB, clientRole: null })).toBeNull();
    expect(can(consultantA, { projectId: "p", firmId: firmB, clientRole: null }, "project.view")).toBe(false);
  });
  it("a client viewer relates only through a grant on that project", () => {
    expect(relationTo(client, { projectId: "p", firmId: firmA, clientRole: "finance" })).toBe("finance");
    expect(relationTo(client, { projectId: "p", firmId: firmA, clientRole: null })).toBeNull();
  });
  it("firm role wins over a client grant on the same project", () => {
    expect(relationTo(consultantA, { projectId: "p", firmId: firmA, clientRole: "owner" })).toBe("consultant");
  });
  it("firm-level actions", () => {
    expect(canInFirm(consultantA, firmA, "project.create")).toBe(true);
    expect(canInFirm(consultantA, firmA, "firm.manageMembers")).toBe(false);
    expect(canInFirm(consultantA, firmB, "project.create")).toBe(false);
    expect(canInFirm({ userId: "a", firms: [{ firmId: firmA, role: "admin" }] }, firmA, "firm.manageMembers")).toBe(true);
  });
  it("navigation shows firm members to admins only", () => {
    expect(navigationFor({ userId: "a", firms: [{ firmId: firmA, role: "admin" }] }).map((n) => n.label)).toContain("Firm members");
    expect(navigationFor(consultantA).map((n) => n.label)).not.toContain("Firm members");
    expect(navigationFor(client).map((n) => n.label)).toEqual(["Projects", "Methods", "Account"]);
  });

  it("navigation offers New project to firm members (project.create) and not to client viewers", () => {
    expect(navigationFor(consultantA).map((n) => n.href)).toEqual(["/projects", "/projects/new", "/methods", "/account"]);
    expect(navigationFor({ userId: "a", firms: [{ firmId: firmA, role: "admin" }] }).map((n) => n.label)).toContain("New project");
    expect(navigationFor(client).map((n) => n.label)).not.toContain("New project");
  });
});
