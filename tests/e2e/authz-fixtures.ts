import { readFileSync } from "node:fs";
import path from "node:path";
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { hashPassword } from "@/lib/auth/password";
import { loadViewer } from "@/lib/auth/access";
import { buildEngineInput, loadScenarioContext } from "@/lib/scenarios/store";
import { analyzeAndStore } from "@/lib/scenarios/analysis";
import { toStoredInput, type ScenarioDocument } from "@/lib/scenarios/mappers";
import { issueScenario } from "@/lib/sharing/versions";
import { createInvitation, INVITATION_MAIL_KIND } from "@/lib/sharing/invitations";
import { uniq } from "../support/db";
import { grantWorldViewers, insertWorldPeople, ROLES, type WorldRole, type WorldUsers } from "../support/world";
import { BASE_URL } from "./support";
import { signInHttp } from "./http-session";

/**
 * The authorization matrix's world, built through the app's own paths wherever it can be: two firms (A with
 * an admin and a consultant, B with a consultant), firm A's project P shared with an owner and a finance
 * viewer, its project Q shared with another owner and finance viewer, and firm B's project C. P and C each get
 * a climate dataset uploaded through the real import route, a scenario on it analysed the way a save does,
 * issued version 1 (through the sharing DAL), an invitation and a comment. Every name carries a marker so a
 * refused page can be searched for any trace of the object.
 */
export const PASSWORD = "matrix-password-for-tests-2026";
export { ROLES };
export type Role = WorldRole;

export interface ProjectFixture {
  id: string;
  name: string;
  clientName: string;
  scenarioId: string;
  scenarioName: string;
  datasetId: string;
  versionId: string;
  invitationId: string;
  viewerUserId: string | null;
  markers: string[];
}

export interface MatrixWorld {
  tag: string;
  firmA: string;
  firmB: string;
  users: WorldUsers;
  cookies: Record<Role, string | null>;
  P: ProjectFixture;
  C: ProjectFixture;
  tokens: string[];
}

const EPW = path.resolve(__dirname, "../fixtures/weather/harrowgate-flats.epw");
const SCENARIO = path.resolve(__dirname, "../fixtures/scenario-hourly.json");

export async function uploadDataset(cookie: string, projectId: string, name: string): Promise<string> {
  const form = new FormData();
  form.set("file", new Blob([readFileSync(EPW)], { type: "text/plain" }), "harrowgate-flats.epw");
  form.set("name", name);
  const res = await fetch(`${BASE_URL}/api/projects/${projectId}/climate`, { method: "POST", body: form, headers: { cookie, origin: BASE_URL } });
  const body = (await res.json()) as { datasetId?: string; error?: string };
  const id = body.datasetId;
  if (res.status !== 201 || !id) throw new Error(`climate upload for the matrix failed: ${res.status} ${JSON.stringify(body).slice(0, 300)}`);
  return id;
}

export async function analysedScenario(db: Kysely<Database>, projectId: string, datasetId: string, name: string, userId: string): Promise<string> {
  const doc = JSON.parse(readFileSync(SCENARIO, "utf8")) as Record<string, unknown>;
  const stored = toStoredInput({ ...doc, name }, datasetId);
  const s = await db
    .insertInto("scenarios")
    .values({ project_id: projectId, name, climate_dataset_id: datasetId, input: JSON.stringify(stored), created_by: userId, updated_by: userId })
    .returning("id")
    .executeTakeFirstOrThrow();
  const ctx = await loadScenarioContext(db, s.id);
  const built = ctx && buildEngineInput(ctx.dto.document as ScenarioDocument, ctx.dataset, ctx.project);
  if (!built || !built.ok) throw new Error(`the scenario fixture does not build: ${JSON.stringify(built && !built.ok ? built.fieldErrors : null).slice(0, 400)}`);
  await analyzeAndStore(db, s.id, built.input, { inline: true });
  return s.id;
}

export async function buildMatrixWorld(db: Kysely<Database>): Promise<MatrixWorld> {
  const tag = uniq("mx");
  const hash = await hashPassword(PASSWORD);
  const { users, firmA, firmB } = await insertWorldPeople(db, { tag, passwordHash: hash, firmName: (k) => `Matrix firm ${k} ${tag}` });
  const newProject = async (firmId: string, key: string, by: string) => {
    const name = `MATRIX-${key}-${tag} project`;
    const clientName = `MATRIX-${key}-${tag} client`;
    const id = (
      await db
        .insertInto("projects")
        .values({ firm_id: firmId, name, client_name: clientName, site_name: `MATRIX-${key}-${tag} site`, elevation_m: 240, created_by: by })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
    return { id, name, clientName };
  };
  const p = await newProject(firmA, "P", users.consultant.id);
  const q = await newProject(firmA, "Q", users.consultant.id);
  const c = await newProject(firmB, "C", users.consultantOther.id);
  await grantWorldViewers(db, users, p.id, q.id);

  const cookies = {} as Record<Role, string | null>;
  for (const role of ROLES) {
    cookies[role] = role === "anonymous" ? null : await signInHttp(users[role].email, PASSWORD, { "x-forwarded-for": `192.0.2.${ROLES.indexOf(role) + 1}-${tag}` });
    if (role !== "anonymous" && !cookies[role]) throw new Error(`matrix: ${role} could not sign in`);
  }

  const tokens: string[] = [];
  const fill = async (proj: { id: string; name: string; clientName: string }, key: string, consultant: { id: string }, consultantCookie: string): Promise<ProjectFixture> => {
    const datasetName = `MATRIX-${key}-${tag} climate`;
    const scenarioName = `MATRIX-${key}-${tag} scenario`;
    const datasetId = await uploadDataset(consultantCookie, proj.id, datasetName);
    const scenarioId = await analysedScenario(db, proj.id, datasetId, scenarioName, consultant.id);
    const viewer = await loadViewer(db, consultant.id);
    const issued = await issueScenario(db, viewer, { projectId: proj.id, scenarioId, note: `MATRIX-${key}-${tag} note` });
    if (!issued.ok) throw new Error(`matrix: issuing failed: ${issued.error}`);
    const inv = await createInvitation(db, viewer, { projectId: proj.id, email: `invitee-${key.toLowerCase()}.${tag}@example.test`, role: "owner" }, { appUrl: BASE_URL });
    if (!inv.ok) throw new Error(`matrix: invitation failed: ${inv.error}`);
    const mail = await db.selectFrom("mail_outbox").select("text_body").where("kind", "=", INVITATION_MAIL_KIND).where("ref_id", "=", inv.value.invitationId).executeTakeFirstOrThrow();
    const token = /\/invite\/([A-Za-z0-9_-]{43})/.exec(mail.text_body)?.[1];
    if (token) tokens.push(token);
    return {
      ...proj,
      scenarioId,
      scenarioName,
      datasetId,
      versionId: issued.value.versionId,
      invitationId: inv.value.invitationId,
      viewerUserId: null,
      markers: [proj.name, proj.clientName, scenarioName, datasetName, `MATRIX-${key}-${tag} note`],
    };
  };
  const P = await fill(p, "P", users.consultant, cookies.consultant!);
  const C = await fill(c, "C", users.consultantOther, cookies.consultantOther!);
  P.viewerUserId = users.owner.id;
  return { tag, firmA, firmB, users, cookies, P, C, tokens };
}

/** A throw-away client viewer with a grant on the project (for the DELETE access cases, one per case). */
export async function sacrificialViewer(db: Kysely<Database>, projectId: string, tag: string): Promise<string> {
  const u = await db.insertInto("users").values({ email: `${uniq("sac")}.${tag}@example.test`, name: `Sacrificial ${tag}`, password_hash: null }).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("project_access").values({ project_id: projectId, user_id: u.id, role: "owner" }).execute();
  return u.id;
}

/** A throw-away open invitation (for the DELETE invitation cases, one per case). */
export async function sacrificialInvitation(db: Kysely<Database>, projectId: string, tag: string): Promise<string> {
  const r = await db
    .insertInto("invitations")
    .values({ project_id: projectId, email: `${uniq("sacinv")}.${tag}@example.test`, role: "owner", token_hash: uniq("h").padEnd(64, "0"), expires_at: new Date(Date.now() + 86_400_000) })
    .returning("id")
    .executeTakeFirstOrThrow();
  return r.id;
}
