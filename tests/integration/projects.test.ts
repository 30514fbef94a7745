import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { createUser } from "@/db/queries/users";
import { grantProjectAccess } from "@/db/queries/projects";
import { createProject, updateProject } from "@/lib/projects/data";
import { loadViewer, type Viewer } from "@/lib/auth/access";

const db = testDb();
afterAll(() => db.destroy());

let consultant: Viewer;
let outsider: Viewer;
let owner: Viewer;
let firmId: string;

async function actor(userId: string): Promise<Viewer> {
  return (await loadViewer(db, userId))!;
}

async function newUser(label: string) {
  return createUser(db, { email: `${uniq(label)}@example.test`, name: label, passwordHash: null });
}

beforeAll(async () => {
  const [c, o, w] = [await newUser("consultant"), await newUser("outsider"), await newUser("owner")];
  const firm = await db.insertInto("firms").values({ name: uniq("Project firm ") }).returning("id").executeTakeFirstOrThrow();
  const other = await db.insertInto("firms").values({ name: uniq("Other firm ") }).returning("id").executeTakeFirstOrThrow();
  firmId = firm.id;
  await db.insertInto("firm_members").values({ firm_id: firm.id, user_id: c.id, role: "consultant" }).execute();
  await db.insertInto("firm_members").values({ firm_id: other.id, user_id: o.id, role: "consultant" }).execute();
  consultant = await actor(c.id);
  outsider = await actor(o.id);
  owner = await actor(w.id);
});

const valid = () => ({
  firmId,
  clientName: "Invented Dairy Co-op",
  name: uniq("Milk plant condenser loop "),
  siteName: "North plant",
  locationLabel: "Invented valley",
  elevationM: 412,
  unitSystem: "IP",
  currency: "cad",
});

const projectCount = async () =>
  Number((await db.selectFrom("projects").select(sql<number>`count(*)`.as("n")).executeTakeFirstOrThrow()).n);

describe("create a project", () => {
  it("an empty form returns every field's error and creates nothing", async () => {
    const before = await projectCount();
    const r = await createProject(db, consultant, {
      firmId,
      clientName: " ",
      name: "",
      siteName: "",
      elevationM: "high",
      unitSystem: "metric",
      currency: "dollars",
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(Object.keys(r.fieldErrors ?? {}).sort()).toEqual(["clientName", "currency", "elevationM", "name", "siteName", "unitSystem"]);
    expect(await projectCount()).toBe(before);
  });

  it("a firm that is not the viewer's is a refusal on the firm field", async () => {
    const r = await createProject(db, consultant, { ...valid(), firmId: "not-a-uuid" });
    expect(r).toMatchObject({ ok: false, status: 403, fieldErrors: { firmId: [expect.any(String)] } });
  });

  it("an unknown ISO 4217 code and an elevation beyond 5,000 m are refused", async () => {
    const r = await createProject(db, consultant, { ...valid(), currency: "XYZ", elevationM: 9000 });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.fieldErrors ?? {}).sort()).toEqual(["currency", "elevationM"]);
  });

  it("a firm member creates it (trimmed, currency upper-cased) and the audit trail records it", async () => {
    const input = valid();
    const r = await createProject(db, consultant, { ...input, name: `  ${input.name}  ` });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    const id = r.value.projectId;
    const row = await db.selectFrom("projects").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ name: input.name, firm_id: firmId, currency: "CAD", unit_system: "IP", elevation_m: 412, created_by: consultant.id });
    const audit = await db.selectFrom("audit_events").selectAll().where("project_id", "=", id).execute();
    expect(audit.map((a) => a.action)).toEqual(["project.create"]);
    expect(audit[0]!.actor_id).toBe(consultant.id);
  });

  it("a consultant of another firm and a client viewer cannot create in this firm", async () => {
    const before = await projectCount();
    const a = await createProject(db, outsider, valid());
    const b = await createProject(db, owner, valid());
    expect(a.ok).toBe(false);
    expect(b.ok).toBe(false);
    expect(await projectCount()).toBe(before);
  });
});

describe("edit a project", () => {
  let projectId: string;
  beforeAll(async () => {
    const r = await createProject(db, consultant, valid());
    if (!r.ok) throw new Error("setup failed");
    projectId = r.value.projectId;
    await grantProjectAccess(db, { projectId, userId: owner.id, role: "owner", grantedBy: consultant.id });
  });

  const current = () => db.selectFrom("projects").selectAll().where("id", "=", projectId).executeTakeFirstOrThrow();

  it("invalid fields all come back and nothing changes", async () => {
    const before = await current();
    const r = await updateProject(db, consultant, {
      projectId,
      revision: before.revision,
      clientName: "",
      name: "x".repeat(201),
      siteName: "Still fine",
      locationLabel: "",
      elevationM: -9000,
      unitSystem: "SI",
      currency: "EURO",
    });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(Object.keys(r.fieldErrors ?? {}).sort()).toEqual(["clientName", "currency", "elevationM", "name"]);
    expect(r.fieldErrors?.name?.[0]).toMatch(/200/);
    const after = await current();
    expect(after).toEqual(before);
  });

  it("a valid edit changes only what changed and audits old and new values", async () => {
    const before = await current();
    const r = await updateProject(db, consultant, {
      projectId,
      revision: before.revision,
      clientName: before.client_name,
      name: before.name,
      siteName: before.site_name,
      locationLabel: before.location_label,
      elevationM: 250,
      unitSystem: "SI",
      currency: before.currency,
    });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.changed.sort()).toEqual(["elevationM", "unitSystem"]);
    const after = await current();
    expect(after.elevation_m).toBe(250);
    expect(after.unit_system).toBe("SI");
    const audit = await db
      .selectFrom("audit_events")
      .select(["action", "detail"])
      .where("project_id", "=", projectId)
      .where("action", "=", "project.edit")
      .executeTakeFirstOrThrow();
    expect(audit.detail).toEqual({ changes: { elevationM: { from: 412, to: 250 }, unitSystem: { from: "IP", to: "SI" } }, revision: before.revision + 1 });
    expect(after.revision).toBe(before.revision + 1);
  });

  it("a client viewer of the project and an outsider cannot edit it", async () => {
    const before = await current();
    const input = { ...valid(), name: "Hijacked", revision: before.revision };
    const byOwner = await updateProject(db, owner, { ...input, projectId });
    const byOutsider = await updateProject(db, outsider, { ...input, projectId });
    expect(byOwner).toMatchObject({ ok: false, status: 403 });
    // No relation: answered as "not found", never hinting that the project exists.
    expect(byOutsider).toMatchObject({ ok: false, status: 404 });
    expect(await current()).toEqual(before);
  });
});

describe("two people edit the same project at once", () => {
  it("both opened revision N: the first edit is stored, the stale one is refused with a clear 409 and changes nothing", async () => {
    const r0 = await createProject(db, consultant, valid());
    if (!r0.ok) throw new Error("setup failed");
    const projectId = r0.value.projectId;
    const opened = await db.selectFrom("projects").selectAll().where("id", "=", projectId).executeTakeFirstOrThrow();
    const form = {
      projectId,
      revision: opened.revision,
      clientName: opened.client_name,
      name: opened.name,
      siteName: opened.site_name,
      locationLabel: opened.location_label,
      elevationM: opened.elevation_m,
      unitSystem: opened.unit_system,
      currency: opened.currency,
    };
    // Sent together: the row's revision check lets exactly one of them write.
    const [a, b] = await Promise.all([
      updateProject(db, consultant, { ...form, siteName: "South plant" }),
      updateProject(db, consultant, { ...form, siteName: "East plant" }),
    ]);
    const results = [a, b];
    const stored = results.filter((r) => r.ok);
    const refused = results.filter((r) => !r.ok);
    expect(stored).toHaveLength(1);
    expect(refused).toHaveLength(1);
    const loser = refused[0]!;
    if (loser.ok) return;
    expect(loser.status).toBe(409);
    expect(loser.error).toMatch(/^Not saved: .+ changed this project \(revision \d+\) after you opened it\. Nothing was overwritten/);
    const after = await db.selectFrom("projects").selectAll().where("id", "=", projectId).executeTakeFirstOrThrow();
    expect(after.revision).toBe(opened.revision + 1);
    const winner = a.ok ? "South plant" : "East plant";
    expect(after.site_name).toBe(winner);
    const edits = await db.selectFrom("audit_events").select("detail").where("project_id", "=", projectId).where("action", "=", "project.edit").execute();
    expect(edits).toHaveLength(1);

    // The stale form sent again (still at the old revision) is refused as well; one at the new revision is stored.
    const again = await updateProject(db, consultant, { ...form, siteName: "West plant" });
    expect(again).toMatchObject({ ok: false, status: 409, detail: { currentRevision: opened.revision + 1 } });
    const fresh = await updateProject(db, consultant, { ...form, revision: after.revision, siteName: "West plant" });
    expect(fresh).toMatchObject({ ok: true, value: { changed: ["siteName"], revision: opened.revision + 2 } });
  });

  it("an edit without a revision is a field error, not a silent overwrite", async () => {
    const r0 = await createProject(db, consultant, valid());
    if (!r0.ok) throw new Error("setup failed");
    const { revision: _r, ...noRevision } = { ...valid(), revision: 1 };
    const r = await updateProject(db, consultant, { ...noRevision, projectId: r0.value.projectId, name: "Changed" });
    expect(r).toMatchObject({ ok: false, status: 422, fieldErrors: { revision: ["The form is out of date; reload the page."] } });
  });
});
