import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { testDb, uniq } from "../support/db";
import { buildWorld, ROLES, type World, type WorldRole } from "./sharing-fixtures";
import type { Action, ProjectRelation } from "@/lib/auth/permissions";
import { expectedAllowed } from "../support/authz-table";
import { loadProjectAccess, type Viewer } from "@/lib/auth/access";
import { changePassword } from "@/lib/auth/account";
import { createInvitation, revokeInvitation, INVITATION_MAIL_KIND } from "@/lib/sharing/invitations";
import { acceptAsNewAccount, acceptAsViewer } from "@/lib/sharing/acceptance";
import { revokeViewerAccess } from "@/lib/sharing/access";
import { issueScenario } from "@/lib/sharing/versions";
import { addComment } from "@/lib/sharing/comments";
import { createProject, updateProject } from "@/lib/projects/data";
import { authorizeScenario } from "@/lib/scenarios/data";

/**
 * Server actions × roles. A server action cannot be called outside a request, so each one is checked
 * through the data-access function it hands the request's viewer to (named beside it below) — with
 * every role, on this firm's project (own), another firm's (foreign) and this project's id with another
 * project's child id (mixed). The list of actions is read from app/ at test time: an exported action
 * without an entry here fails the run with its name, so none can be forgotten. Expected statuses come from
 * the literal table tests/support/authz-table.ts, not from lib/auth.
 */
const db = testDb();
const APP_DIR = path.resolve(__dirname, "../../app");
type Variant = "own" | "foreign" | "mixed";
let w: World;

beforeAll(async () => {
  w = await buildWorld(db);
});
afterAll(() => db.destroy());

function serverActions(dir = APP_DIR): { file: string; name: string }[] {
  const out: { file: string; name: string }[] = [];
  for (const entry of readdirSync(dir)) {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) out.push(...serverActions(full));
    else if (/\.(ts|tsx)$/.test(entry)) {
      const src = readFileSync(full, "utf8");
      if (!/^\s*["']use server["']/.test(src)) continue;
      for (const m of src.matchAll(/export\s+async\s+function\s+(\w+)/g)) out.push({ file: path.relative(APP_DIR, full), name: m[1]! });
    }
  }
  return out;
}

function relationOf(role: WorldRole, variant: Variant): ProjectRelation | null {
  if (variant === "foreign") return role === "consultantOther" ? "consultant" : null;
  return ({ admin: "admin", consultant: "consultant", owner: "owner", finance: "finance" } as Partial<Record<WorldRole, ProjectRelation>>)[role] ?? null;
}

/** 401 anonymous, 404 no relation, 403 relation without the action, 404 mixed ids, else `ok`. */
function expectedFor(action: Action, role: WorldRole, variant: Variant, ok: number): number {
  if (role === "anonymous") return 401;
  const rel = relationOf(role, variant);
  if (!rel) return 404;
  if (!expectedAllowed(rel, action)) return 403;
  if (variant === "mixed") return 404;
  return ok;
}

const status = (r: { ok: boolean; status?: number }) => (r.ok ? 200 : (r.status ?? 0));

interface Spec {
  /** The data-access function the action calls with the request's viewer. */
  dal: string;
  variants: Variant[];
  run(viewer: Viewer | null, role: WorldRole, variant: Variant): Promise<number>;
  expected(role: WorldRole, variant: Variant): number;
}

const ids = (variant: Variant) => ({
  projectId: variant === "foreign" ? w.C.id : w.P.id,
  child: variant === "own" ? w.P : w.C,
});

async function sacrificialViewer(projectId: string): Promise<string> {
  const u = await db.insertInto("users").values({ email: `${uniq("sac")}@example.test`, name: "Sacrificial", password_hash: null }).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("project_access").values({ project_id: projectId, user_id: u.id, role: "owner" }).execute();
  return u.id;
}
async function sacrificialInvitation(projectId: string): Promise<string> {
  return (
    await db
      .insertInto("invitations")
      .values({ project_id: projectId, email: `${uniq("sacinv")}@example.test`, role: "owner", token_hash: uniq("h").padEnd(64, "0"), expires_at: new Date(Date.now() + 86_400_000) })
      .returning("id")
      .executeTakeFirstOrThrow()
  ).id;
}
async function freshToken(email?: string): Promise<string> {
  const r = await createInvitation(db, await w.viewer("consultant"), { projectId: w.P.id, email: email ?? `${uniq("tok")}@example.test`, role: "finance" }, { appUrl: "http://127.0.0.1:1" });
  if (!r.ok) throw new Error(r.error);
  const m = await db.selectFrom("mail_outbox").select("text_body").where("kind", "=", INVITATION_MAIL_KIND).where("ref_id", "=", r.value.invitationId).executeTakeFirstOrThrow();
  return /\/invite\/([A-Za-z0-9_-]{43})/.exec(m.text_body)![1]!;
}

const ALL: Variant[] = ["own", "foreign", "mixed"];
const projectLevel: Variant[] = ["own", "foreign"];
const APP_URL = { appUrl: "http://127.0.0.1:1" };
/** W1's and W2's data-access results carry no status: ok, or a refusal of one kind or another. */
const coarse = (ok: boolean) => (ok ? 200 : 403);
const coarseExpected = (action: Action, role: WorldRole, variant: Variant) => (expectedFor(action, role, variant, 200) === 200 ? 200 : 403);

export const SPECS: Record<string, Spec> = {
  // ——— sharing (S)
  "(app)/projects/[projectId]/access/actions.ts#inviteAction": {
    dal: "createInvitation (lib/sharing/invitations.ts)",
    variants: projectLevel,
    run: async (v, _r, variant) => status(await createInvitation(db, v, { projectId: ids(variant).projectId, email: `${uniq("m")}@example.test`, role: "owner" }, APP_URL)),
    expected: (r, variant) => expectedFor("access.share", r, variant, 200),
  },
  "(app)/projects/[projectId]/access/actions.ts#revokeAccessAction": {
    dal: "revokeViewerAccess (lib/sharing/access.ts)",
    variants: ALL,
    run: async (v, _r, variant) => status(await revokeViewerAccess(db, v, { projectId: ids(variant).projectId, userId: await sacrificialViewer(ids(variant).child.id) })),
    expected: (r, variant) => expectedFor("access.revoke", r, variant, 200),
  },
  "(app)/projects/[projectId]/access/actions.ts#withdrawInvitationAction": {
    dal: "revokeInvitation (lib/sharing/invitations.ts)",
    variants: ALL,
    run: async (v, _r, variant) => status(await revokeInvitation(db, v, { projectId: ids(variant).projectId, invitationId: await sacrificialInvitation(ids(variant).child.id) })),
    expected: (r, variant) => expectedFor("access.revoke", r, variant, 200),
  },
  "(app)/projects/[projectId]/scenarios/[scenarioId]/versions/actions.ts#issueAction": {
    dal: "issueScenario (lib/sharing/versions.ts), with the real current-result lookup",
    variants: ALL,
    // The world's scenarios hold no analysable input: past authorization, issuing is refused with 409.
    run: async (v, _r, variant) => status(await issueScenario(db, v, { projectId: ids(variant).projectId, scenarioId: ids(variant).child.scenarioId })),
    expected: (r, variant) => expectedFor("scenario.issue", r, variant, 409),
  },
  "(app)/projects/[projectId]/scenarios/[scenarioId]/versions/actions.ts#commentAction": {
    dal: "addComment (lib/sharing/comments.ts)",
    variants: ALL,
    run: async (v, _r, variant) => status(await addComment(db, v, { projectId: ids(variant).projectId, versionId: ids(variant).child.versionId, body: "matrix comment" }, APP_URL)),
    expected: (r, variant) => expectedFor("scenario.comment", r, variant, 200),
  },
  "(app)/account/actions.ts#changePasswordAction": {
    dal: "changePassword (lib/auth/account.ts)",
    variants: ["own"],
    // A wrong current password: every signed-in person reaches the check (400), nothing changes.
    run: async (v) => status(await changePassword(db, v, { currentPassword: "not-it-at-all", newPassword: "a long enough passphrase", confirmPassword: "a long enough passphrase" })),
    expected: (r) => (r === "anonymous" ? 401 : 422),
  },
  "invite/[token]/actions.ts#acceptSignedInAction": {
    dal: "acceptAsViewer (lib/sharing/acceptance.ts)",
    variants: ["own"],
    // An invitation for another address: nobody but its addressee may spend it.
    run: async (v) => status(await acceptAsViewer(db, v, { token: await freshToken() })),
    expected: (r) => (r === "anonymous" ? 401 : 403),
  },
  "invite/[token]/actions.ts#acceptNewAccountAction": {
    dal: "acceptAsNewAccount (lib/sharing/acceptance.ts)",
    variants: ["own"],
    // Public by design (the token is the credential): the same answer whoever calls; a made-up token is unknown.
    run: async () => status(await acceptAsNewAccount(db, null, { token: "Z".repeat(43), name: "X", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" })),
    expected: () => 404,
  },

  // ——— projects and climate (W1)
  "(app)/projects/new/actions.ts#createProjectAction": {
    dal: "createProjectFor (lib/projects/data.ts)",
    variants: projectLevel,
    run: async (v, _r, variant) =>
      v
        ? coarse(
            (
              await createProject(db, v, {
                clientName: "Matrix client",
                name: `Matrix project ${uniq()}`,
                siteName: "Matrix site",
                locationLabel: "",
                elevationM: 10,
                unitSystem: "SI",
                currency: "USD",
                firmId: variant === "own" ? w.firmA : w.firmB,
              })
            ).ok,
          )
        : 401,
    expected: (r, variant) => {
      if (r === "anonymous") return 401;
      const member = variant === "own" ? r === "admin" || r === "consultant" : r === "consultantOther";
      return member ? 200 : 403;
    },
  },
  "(app)/projects/[projectId]/edit/actions.ts#updateProjectAction": {
    dal: "updateProjectFor (lib/projects/data.ts)",
    variants: projectLevel,
    run: async (v, _r, variant) => {
      if (!v) return 401;
      const p = variant === "own" ? w.P : w.C;
      const { revision } = await db.selectFrom("projects").select("revision").where("id", "=", p.id).executeTakeFirstOrThrow();
      const r = await updateProject(db, v, {
        projectId: p.id,
        revision,
        clientName: `Client of ${p.name}`,
        name: p.name,
        siteName: `Site of ${p.name}`,
        locationLabel: "",
        elevationM: 0,
        unitSystem: "SI",
        currency: "USD",
      });
      return coarse(r.ok);
    },
    expected: (r, variant) => (r === "anonymous" ? 401 : coarseExpected("project.edit", r, variant)),
  },
  "(app)/projects/[projectId]/climate/bins/actions.ts#saveBinTableAction": {
    dal: "loadProjectAccess(…).can(\"climate.manage\") — the gate the action applies before saveBinTable",
    variants: projectLevel,
    run: async (v, _r, variant) => (v ? coarse(Boolean((await loadProjectAccess(db, v, ids(variant).projectId))?.can("climate.manage"))) : 401),
    expected: (r, variant) => (r === "anonymous" ? 401 : coarseExpected("climate.manage", r, variant)),
  },

  // ——— scenarios (W2)
  "(app)/projects/[projectId]/scenarios/actions.ts#createScenarioAction": {
    dal: "loadProjectAccess(…).can(\"scenario.edit\") — the gate the action applies before createScenarioFor",
    variants: projectLevel,
    run: async (v, _r, variant) => (v ? coarse(Boolean((await loadProjectAccess(db, v, ids(variant).projectId))?.can("scenario.edit"))) : 401),
    expected: (r, variant) => (r === "anonymous" ? 401 : coarseExpected("scenario.edit", r, variant)),
  },
  ...Object.fromEntries(
    ["saveScenarioAction", "cloneScenarioAction", "archiveScenarioAction"].map((name) => [
      `(app)/projects/[projectId]/scenarios/[scenarioId]/actions.ts#${name}`,
      {
        dal: "authorizeScenario(viewer, scenarioId, \"scenario.edit\") + the scenario's project must be the URL's (lib/scenarios/data.ts)",
        variants: ALL,
        run: async (v: Viewer | null, _r: WorldRole, variant: Variant) => {
          const r = await authorizeScenario(v, ids(variant).child.scenarioId, "scenario.edit");
          if (!r.ok) return r.status;
          return r.ctx.row.projectId === ids(variant).projectId ? 200 : 404;
        },
        // authorizeScenario resolves the project from the scenario: a mixed pair is caught by the project check.
        expected: (r: WorldRole, variant: Variant) => {
          if (variant !== "mixed") return expectedFor("scenario.edit", r, variant, 200);
          if (r === "anonymous") return 401;
          const relToChild = relationOf(r, "foreign");
          if (!relToChild) return 404;
          return expectedAllowed(relToChild, "scenario.edit") ? 404 : 403;
        },
      } satisfies Spec,
    ]),
  ),
};

const found = serverActions();
/** Cases in the matrix below, counted from the table itself (not by the tests, whose order is free). */
const cases = Object.values(SPECS).reduce((n, spec) => n + spec.variants.length * ROLES.length, 0);

describe("every server action has an authorization check here", () => {
  it("no action is unknown", () => {
    const unknown = found.map((a) => `${a.file}#${a.name}`).filter((k) => !SPECS[k]);
    expect(unknown, `Server actions without an entry in tests/integration/authz-actions.test.ts SPECS (name the DAL function each calls):\n  ${unknown.join("\n  ")}`).toEqual([]);
  });
  it("no entry names an action that is gone", () => {
    const keys = new Set(found.map((a) => `${a.file}#${a.name}`));
    expect(Object.keys(SPECS).filter((k) => !keys.has(k))).toEqual([]);
  });
});

describe("server actions × roles, through their data-access functions", () => {
  for (const [key, spec] of Object.entries(SPECS)) {
    it(`${key} → ${spec.dal}`, async () => {
      const wrong: string[] = [];
      for (const variant of spec.variants) {
        for (const role of ROLES) {
          const got = await spec.run(await w.viewer(role), role, variant);
          const want = spec.expected(role, variant);
          if (got !== want) wrong.push(`${role} ${variant}: got ${got}, expected ${want}`);
        }
      }
      expect(wrong).toEqual([]);
    });
  }
  it("counts its cases", () => {
    console.log(`[authz-actions] ${cases} cases over ${Object.keys(SPECS).length} server actions × ${ROLES.length} roles`);
    expect(cases).toBeGreaterThan(100);
  });
});
