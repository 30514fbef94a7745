import { afterAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { migrateToLatest } from "@/db/migrate";
import { seedDemo } from "@/db/seed";
import { createUser, findUserByEmail } from "@/db/queries/users";
import { isSignInBlocked, recordSignInFailure, SIGN_IN_LIMITS, clearSignInFailures } from "@/lib/auth/rate-limit";
import { FIRM_ROLES, PROJECT_ROLES, UNIT_SYSTEMS } from "@/lib/auth/roles";
import { hashPassword, passwordProblems, verifyPassword } from "@/lib/auth/password";

const db = testDb();
afterAll(() => db.destroy());

describe("migrations and seed on a real PostgreSQL", () => {
  it("a second migration run applies nothing", async () => {
    expect(await migrateToLatest(db)).toEqual([]);
  });

  it("the seed is idempotent: a database with users is left alone", async () => {
    const before = await db.selectFrom("users").select(sql<number>`count(*)`.as("n")).executeTakeFirstOrThrow();
    const r = await seedDemo(db);
    expect(r.seeded).toBe(false);
    const after = await db.selectFrom("users").select(sql<number>`count(*)`.as("n")).executeTakeFirstOrThrow();
    expect(after.n).toBe(before.n);
  });

  it("CHECK constraints mirror the role strings defined in lib/auth/roles.ts", async () => {
    const rows = await sql<{ table: string; def: string }>`
      select conrelid::regclass::text as table, pg_get_constraintdef(oid) as def
      from pg_constraint where contype = 'c'`.execute(db);
    const defOf = (table: string, column: string) =>
      rows.rows.find((r) => r.table === table && r.def.includes(column))?.def ?? "";
    for (const role of FIRM_ROLES) expect(defOf("firm_members", "role")).toContain(`'${role}'`);
    for (const role of PROJECT_ROLES) expect(defOf("project_access", "role")).toContain(`'${role}'`);
    for (const u of UNIT_SYSTEMS) expect(defOf("projects", "unit_system")).toContain(`'${u}'`);
    await expect(
      sql`insert into firm_members (firm_id, user_id, role) values (gen_random_uuid(), gen_random_uuid(), 'superuser')`.execute(db),
    ).rejects.toThrow();
  });
});

describe("users", () => {
  it("e-mail is unique without regard to case", async () => {
    const email = `${uniq("case")}@example.test`;
    await createUser(db, { email, name: "A", passwordHash: null });
    await expect(createUser(db, { email: email.toUpperCase(), name: "B", passwordHash: null })).rejects.toThrow(/unique|duplicate/i);
    expect((await findUserByEmail(db, email.toUpperCase()))?.email).toBe(email);
  });

  it("passwords are stored as bcrypt hashes and verified", async () => {
    const hash = await hashPassword("correct horse battery");
    expect(hash).toMatch(/^\$2[aby]\$/);
    expect(await verifyPassword("correct horse battery", hash)).toBe(true);
    expect(await verifyPassword("wrong", hash)).toBe(false);
    expect(await verifyPassword("anything", null)).toBe(false);
  });

  it("password policy: length and not the e-mail", () => {
    expect(passwordProblems("short", "a@b.c")).toContain("Use at least 12 characters.");
    expect(passwordProblems("someone@example.test", "someone@example.test").join(" ")).toMatch(/e-mail/);
    expect(passwordProblems("a long enough passphrase", "someone@example.test")).toEqual([]);
  });
});

describe("sign-in rate limiting stored in PostgreSQL", () => {
  it("blocks an account after the limit of failures and not before", async () => {
    const key = `acct:${uniq()}@example.test`;
    for (let i = 0; i < SIGN_IN_LIMITS.account.maxFailures - 1; i++) {
      await recordSignInFailure(db, key, SIGN_IN_LIMITS.account);
    }
    expect(await isSignInBlocked(db, [key])).toBe(false);
    await recordSignInFailure(db, key, SIGN_IN_LIMITS.account);
    expect(await isSignInBlocked(db, [key])).toBe(true);
    await clearSignInFailures(db, key);
    expect(await isSignInBlocked(db, [key])).toBe(false);
  });
});
