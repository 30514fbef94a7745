import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";

/**
 * The people of the two-firm authorization world, shared by the integration world
 * (tests/integration/sharing-fixtures.ts) and the end-to-end matrix (tests/e2e/authz-fixtures.ts):
 * firm A with an admin and a consultant, firm B with a consultant; A's project P shared with an owner and a
 * finance viewer, A's project Q with another owner and finance viewer. Each caller adds its own projects,
 * scenarios and versions on top.
 */
export const ROLES = ["admin", "consultant", "consultantOther", "owner", "finance", "ownerOther", "financeOther", "anonymous"] as const;
export type WorldRole = (typeof ROLES)[number];
export type WorldUsers = Record<Exclude<WorldRole, "anonymous">, { id: string; email: string }>;

/** The seven users (e-mail and name carry `tag`), firms A and B named by `firmName`, and their memberships. */
export async function insertWorldPeople(
  db: Kysely<Database>,
  a: { tag: string; passwordHash: string; firmName: (key: "A" | "B") => string },
): Promise<{ users: WorldUsers; firmA: string; firmB: string }> {
  const mk = async (key: string) => {
    const email = `${key.toLowerCase()}.${a.tag}@example.test`;
    const u = await db.insertInto("users").values({ email, name: `${key} ${a.tag}`, password_hash: a.passwordHash }).returning("id").executeTakeFirstOrThrow();
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
  const firmA = (await db.insertInto("firms").values({ name: a.firmName("A") }).returning("id").executeTakeFirstOrThrow()).id;
  const firmB = (await db.insertInto("firms").values({ name: a.firmName("B") }).returning("id").executeTakeFirstOrThrow()).id;
  await db
    .insertInto("firm_members")
    .values([
      { firm_id: firmA, user_id: users.admin.id, role: "admin" },
      { firm_id: firmA, user_id: users.consultant.id, role: "consultant" },
      { firm_id: firmB, user_id: users.consultantOther.id, role: "consultant" },
    ])
    .execute();
  return { users, firmA, firmB };
}

/** The client viewers' grants: P to the owner and finance viewer, Q to the other owner and finance viewer. */
export async function grantWorldViewers(db: Kysely<Database>, users: WorldUsers, projectP: string, projectQ: string): Promise<void> {
  await db
    .insertInto("project_access")
    .values([
      { project_id: projectP, user_id: users.owner.id, role: "owner" },
      { project_id: projectP, user_id: users.finance.id, role: "finance" },
      { project_id: projectQ, user_id: users.ownerOther.id, role: "owner" },
      { project_id: projectQ, user_id: users.financeOther.id, role: "finance" },
    ])
    .execute();
}
