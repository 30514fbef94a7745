import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { loadViewer, type Viewer } from "@/lib/auth/access";
import { uniq } from "../support/db";
import { grantWorldViewers, insertWorldPeople, type WorldRole, type WorldUsers } from "../support/world";

/**
 * A world of two firms for authorization tests, all with unique names (the seed is never touched):
 * firm A with an admin and a consultant, its project P (owner + finance) and project Q (its own owner +
 * finance); firm B with a consultant and project C. P and C each have a scenario with issued version 1.
 */
export const WORLD_PASSWORD = "world-password-for-tests-2026";
export { ROLES, type WorldRole } from "../support/world";

export interface World {
  tag: string;
  firmA: string;
  firmB: string;
  users: WorldUsers;
  P: { id: string; name: string; scenarioId: string; versionId: string };
  Q: { id: string; name: string };
  C: { id: string; name: string; scenarioId: string; versionId: string };
  viewer(role: WorldRole): Promise<Viewer | null>;
}

export async function buildWorld(db: Kysely<Database>, passwordHash?: string): Promise<World> {
  const tag = uniq("w");
  const hash = passwordHash ?? (await hashPassword(WORLD_PASSWORD));
  const { users, firmA, firmB } = await insertWorldPeople(db, { tag, passwordHash: hash, firmName: (k) => `Firm ${k} ${tag}` });
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
  await grantWorldViewers(db, users, P, Q);
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
