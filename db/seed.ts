import type { Kysely } from "kysely";
import type { Database } from "./schema";
import { createUser } from "./queries/users";
import { grantProjectAccess, insertProject } from "./queries/projects";
import { hashPassword } from "@/lib/auth/password";
import { seedDemoScenario } from "@/lib/scenarios/demo-seed";

/** Development-only demo accounts (also listed in README.md). Invented firm, client and site. */
export const DEMO_PASSWORD = "ledger-demo-2026";
export const DEMO_ACCOUNTS = {
  admin: { email: "ada.admin@corrandale.example", name: "Ada Marlow" },
  consultant: { email: "cole.consultant@corrandale.example", name: "Cole Pereira" },
  owner: { email: "olive.owner@bellwether.example", name: "Olive Hartmann" },
  finance: { email: "finn.finance@bellwether.example", name: "Finn Osei" },
} as const;
export const DEMO_FIRM = "Corrandale Thermal Consulting";
export const DEMO_PROJECT = {
  name: "Harrowgate Flats cold store — condenser loop",
  clientName: "Bellwether Cold Chain Co.",
  siteName: "Harrowgate Flats distribution centre",
  locationLabel: "Harrowgate Flats (invented inland valley site)",
  elevationM: 240,
};

export interface SeedResult {
  seeded: boolean;
  firmId: string;
  projectId: string;
  userIds: Record<keyof typeof DEMO_ACCOUNTS, string>;
  /** The demo's invented climate dataset, its complete three-option scenario and that scenario's issued version 1. */
  demo: { datasetId: string; scenarioId: string; versionId: string; inputsHash: string };
}

/** Seed the demo when the database has no users; a no-op otherwise (nothing a user saved is touched). */
export async function seedDemo(db: Kysely<Database>): Promise<SeedResult | { seeded: false }> {
  const anyUser = await db.selectFrom("users").select("id").limit(1).executeTakeFirst();
  if (anyUser) return { seeded: false };
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db.transaction().execute(async (trx) => {
    const ids = {} as Record<keyof typeof DEMO_ACCOUNTS, string>;
    for (const [key, acct] of Object.entries(DEMO_ACCOUNTS) as [keyof typeof DEMO_ACCOUNTS, { email: string; name: string }][]) {
      ids[key] = (await createUser(trx, { ...acct, passwordHash })).id;
    }
    const firm = await trx.insertInto("firms").values({ name: DEMO_FIRM }).returning("id").executeTakeFirstOrThrow();
    await trx
      .insertInto("firm_members")
      .values([
        { firm_id: firm.id, user_id: ids.admin, role: "admin" },
        { firm_id: firm.id, user_id: ids.consultant, role: "consultant" },
      ])
      .execute();
    const project = await insertProject(trx, {
      firm_id: firm.id,
      name: DEMO_PROJECT.name,
      client_name: DEMO_PROJECT.clientName,
      site_name: DEMO_PROJECT.siteName,
      location_label: DEMO_PROJECT.locationLabel,
      elevation_m: DEMO_PROJECT.elevationM,
      unit_system: "IP",
      currency: "USD",
      created_by: ids.consultant,
    });
    await grantProjectAccess(trx, { projectId: project.id, userId: ids.owner, role: "owner", grantedBy: ids.consultant });
    await grantProjectAccess(trx, { projectId: project.id, userId: ids.finance, role: "finance", grantedBy: ids.consultant });
    const demo = await seedDemoScenario(trx, { projectId: project.id, firmId: firm.id, siteElevationM: DEMO_PROJECT.elevationM, consultantId: ids.consultant });
    return { seeded: true, firmId: firm.id, projectId: project.id, userIds: ids, demo };
  });
}
