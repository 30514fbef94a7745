import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_PROJECT } from "@/db/seed";
import { analysedScenario, uploadDataset } from "./authz-fixtures";
import { signInHttp } from "./http-session";

/**
 * A new project of the demo firm (so the demo consultant works on it in the browser) with the test
 * weather file uploaded through the real climate import route and the fixture scenario on it, analysed and
 * stored the way a save does — ready to be issued from the UI. Only new rows; the seed is read, never changed.
 */
export async function projectWithAnalysedScenario(db: Kysely<Database>, tag: string, extra: { draftOnlyName?: string } = {}) {
  const demo = await db.selectFrom("projects").selectAll().where("name", "=", DEMO_PROJECT.name).executeTakeFirstOrThrow();
  const consultant = await db.selectFrom("users").select("id").where("email", "=", DEMO_ACCOUNTS.consultant.email).executeTakeFirstOrThrow();
  const projectName = `Invite flow ${tag}`;
  const project = await db
    .insertInto("projects")
    .values({
      firm_id: demo.firm_id,
      name: projectName,
      client_name: `Client ${tag}`,
      site_name: `Site ${tag}`,
      location_label: demo.location_label,
      elevation_m: demo.elevation_m,
      unit_system: demo.unit_system,
      currency: demo.currency,
      created_by: consultant.id,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  const cookie = await signInHttp(DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD, { "x-forwarded-for": `192.0.2.200-${tag}` });
  if (!cookie) throw new Error("the demo consultant could not sign in");
  const datasetId = await uploadDataset(cookie, project.id, `Harrowgate Flats weather ${tag}`);
  const scenarioName = `Loop comparison ${tag}`;
  const scenarioId = await analysedScenario(db, project.id, datasetId, scenarioName, consultant.id);
  const draftOnlyId = extra.draftOnlyName ? await analysedScenario(db, project.id, datasetId, extra.draftOnlyName, consultant.id) : null;
  return { projectId: project.id, projectName, scenarioId, scenarioName, draftOnlyId };
}
