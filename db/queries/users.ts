import { sql } from "kysely";
import type { Executor } from "../schema";
import type { FirmRole, ProjectRole } from "@/db/enums";


export async function findUserByEmail(db: Executor, email: string) {
  return db
    .selectFrom("users")
    .selectAll()
    .where(sql`lower(email)`, "=", email.trim().toLowerCase())
    .executeTakeFirst();
}

export async function findUserById(db: Executor, id: string) {
  return db
    .selectFrom("users")
    .select(["id", "email", "name", "created_at", "password_changed_at"])
    .where("id", "=", id)
    .executeTakeFirst();
}

export async function firmRolesOf(db: Executor, userId: string): Promise<{ firmId: string; firmName: string; role: FirmRole }[]> {
  return db
    .selectFrom("firm_members")
    .innerJoin("firms", "firms.id", "firm_members.firm_id")
    .select(["firm_members.firm_id as firmId", "firms.name as firmName", "firm_members.role as role"])
    .where("firm_members.user_id", "=", userId)
    .orderBy("firms.name")
    .execute();
}

export async function clientRolesOf(db: Executor, userId: string): Promise<{ projectId: string; role: ProjectRole }[]> {
  return db
    .selectFrom("project_access")
    .select(["project_id as projectId", "role"])
    .where("user_id", "=", userId)
    .execute();
}

export async function createUser(db: Executor, u: { email: string; name: string; passwordHash: string | null }) {
  return db
    .insertInto("users")
    .values({ email: u.email.trim(), name: u.name, password_hash: u.passwordHash })
    .returning(["id", "email", "name"])
    .executeTakeFirstOrThrow();
}

export async function setPasswordHash(db: Executor, userId: string, passwordHash: string) {
  await db
    .updateTable("users")
    .set({ password_hash: passwordHash, password_changed_at: new Date() })
    .where("id", "=", userId)
    .execute();
}

export async function findUserContact(db: Executor, userId: string) {
  return db.selectFrom("users").select(["email", "name"]).where("id", "=", userId).executeTakeFirst();
}

export async function findPasswordHash(db: Executor, userId: string): Promise<string | null | undefined> {
  const r = await db.selectFrom("users").select("password_hash").where("id", "=", userId).executeTakeFirst();
  return r?.password_hash;
}

export async function passwordChangedAt(db: Executor, userId: string): Promise<Date> {
  const r = await db.selectFrom("users").select("password_changed_at").where("id", "=", userId).executeTakeFirstOrThrow();
  return r.password_changed_at;
}
