import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { loadViewer, type Viewer } from "@/lib/auth/access";
import { uniq } from "../support/db";

/**
 * A world of two firms for authorization tests, all with unique names (the seed is never touched):
 * firm A with an admin and a consultant, its project P (owner + finance) and project Q (its own owner +
 * finance); firm B with a consultant and project C. P and C each have a scenario with issued version 1.
 */
export const WORLD_PASSWORD = "world-password-for-tests-2026";
export const ROLES = ["admin", "consultant", "consultantOther", "owner", "finance", "ownerOther", "financeOther", "anonymous"] as const;
export type WorldRole = (typeof ROLES)[number];

export interface World {
  tag: string;
  firmA: string;
  firmB: string;
  users: Record<Exclude<WorldRole, "anonymous">, { id: string; email: string }>;
  P: { id: string; name: string; scenarioId: string; versionId: string };
  Q: { id: string; name: string };
  C: { id: string; name: string; scenarioId: string; versionId: string };
  viewer(role: WorldRole): Promise<Viewer | null>;
}

export async function buildWorld(db: Kysely<Database>, passwordHash?: string): Promise<World> {
  const tag = uniq("w");
  const hash = passwordHash ?? (await hashPassword(WORLD_PASSWORD));
  const mk = async (key: string) => {
    const email = `${key.toLowerCase()}.${tag}@example.test`;
    const u = await db.insertInto("users").values({ email, name: `${key} ${tag}`, password_hash: hash }).returning("id").executeTakeFirstOrThrow();
    return { id: u.id, email };
  };
  const users = {
    admin: await mk("Admin"),
    consultant: await mk("Consultant"),
    consultantOther: await mk("ConsultantOther"),
    owner: await mk("Owner"),
    finance: await mk("Finance"),
    ownerOther: await mk("OwnerOther"),
    financeOther: await mk("FinanceOther"),
  };
  const firmA = (await db.insertInto("firms").values({ name: `Firm A ${tag}` }).returning("id").executeTakeFirstOrThrow()).id;
  const firmB = (await db.insertInto("firms").values({ name: `Firm B ${tag}` }).returning("id").executeTakeFirstOrThrow()).id;
  await db
    .insertInto("firm_members")
    .values([
      { firm_id: firmA, user_id: users.admin.id, role: "admin" },
      { firm_id: firmA, user_id: users.consultant.id, role: "consultant" },
      { firm_id: firmB, user_id: users.consultantOther.id, role: "consultant" },
    ])
    .execute();
  const project = async (firmId: string, name: string) =>
    (
      await db
        .insertInto("projects")
        .values({ firm_id: firmId, name, client_name: `Client of ${name}`, site_name: `Site of ${name}`, created_by: null })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
  const pName = `Project P ${tag}`;
  const qName = `Project Q ${tag}`;
  const cName = `Project C ${tag}`;
  const P = await project(firmA, pName);
  const Q = await project(firmA, qName);
  const C = await project(firmB, cName);
  await db
    .insertInto("project_access")
    .values([
      { project_id: P, user_id: users.owner.id, role: "owner" },
      { project_id: P, user_id: users.finance.id, role: "finance" },
      { project_id: Q, user_id: users.ownerOther.id, role: "owner" },
      { project_id: Q, user_id: users.financeOther.id, role: "finance" },
    ])
    .execute();
  const scenarioWithVersion = async (projectId: string, name: string) => {
    const s = await db
      .insertInto("scenarios")
      .values({ project_id: projectId, name, input: JSON.stringify({ marker: name }), created_by: users.consultant.id })
      .returning("id")
      .executeTakeFirstOrThrow();
    const v = await db
      .insertInto("scenario_versions")
      .values({
        scenario_id: s.id,
        project_id: projectId,
        version_number: 1,
        name,
        input: JSON.stringify({ marker: name }),
        input_version: 1,
        result: JSON.stringify({ marker: name }),
        engine_version: "test",
        inputs_hash: "test",
        scenario_revision: 1,
        issued_by: users.consultant.id,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    return { scenarioId: s.id, versionId: v.id };
  };
  const pS = await scenarioWithVersion(P, `Scenario of P ${tag}`);
  const cS = await scenarioWithVersion(C, `Scenario of C ${tag}`);
  return {
    tag,
    firmA,
    firmB,
    users,
    P: { id: P, name: pName, ...pS },
    Q: { id: Q, name: qName },
    C: { id: C, name: cName, ...cS },
    viewer: (role) => (role === "anonymous" ? Promise.resolve(null) : loadViewer(db, users[role].id)),
  };
}
