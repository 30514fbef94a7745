import type { Executor } from "../schema";


export async function listFirmMembers(db: Executor, firmId: string) {
  return db
    .selectFrom("firm_members")
    .innerJoin("users", "users.id", "firm_members.user_id")
    .select(["users.id as userId", "users.name", "users.email", "firm_members.role", "firm_members.created_at as since"])
    .where("firm_members.firm_id", "=", firmId)
    .orderBy("users.name")
    .execute();
}
