import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { testDb, uniq } from "../support/db";
import { changedTables, dbSnapshot } from "../support/db-snapshot";
import { brokenJsonBodies, fuzzPayloads, StatusTally, type FuzzPayload } from "../support/fuzz";
import { readJsonBody } from "@/lib/http";
import { importClimateFile, readClimateUpload, saveBinTable } from "@/lib/climate/import";
import { parseScenarioDocument } from "@/lib/scenarios/validate";
import { whatIfBodySchema, WHAT_IF_MAX_BYTES } from "@/lib/scenarios/what-if";
import { buildWorld, type World } from "./sharing-fixtures";
import type { Viewer } from "@/lib/auth/access";
import { changePassword } from "@/lib/auth/account";
import { createProject, updateProject } from "@/lib/projects/data";
import { archiveScenarioIn, cloneScenarioIn, createScenarioIn, saveScenarioIn } from "@/lib/scenarios/data";
import { documentFromStored } from "@/lib/scenarios/mappers";
import { acceptAsNewAccount, acceptAsViewer } from "@/lib/sharing/acceptance";
import { revokeViewerAccess } from "@/lib/sharing/access";
import { addComment } from "@/lib/sharing/comments";
import { createInvitation, INVITATION_MAIL_KIND, revokeInvitation } from "@/lib/sharing/invitations";
import { issueScenario } from "@/lib/sharing/versions";

/**
 * The seeded fuzz of every server action, through the data-access function the action hands the request's
 * viewer to (the wrapper lib/actions/define.ts: auth → gate → schema → run), against the real test
 * PostgreSQL. 2,000 malformed payloads each (tests/support/fuzz.ts: wrong types, huge strings, deep
 * nesting, prototype keys, non-UUID ids, NaN/±Infinity/1e308, NUL and lone surrogates, arrays of 100,000
 * items, missing fields; noise of −0, 5e-324, extra and deleted fields). Every answer must be a 4xx
 * Result (never a thrown error, which the framework would answer 500), and the database must be exactly as
 * before (row count and checksum of every table). The framework's own envelope (broken JSON, oversized
 * bodies) is fuzzed over HTTP in tests/e2e/fuzz-http.test.ts.
 */
/** Exported functions of every "use server" file under app/ (as authz-actions.test.ts finds them). */
function serverActionNames(dir = path.resolve(__dirname, "../../app")): string[] {
  const out: string[] = [];
  for (const entry of readdirSync(dir)) {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) out.push(...serverActionNames(full));
    else if (/\.(ts|tsx)$/.test(entry)) {
      const src = readFileSync(full, "utf8");
      if (/^\s*["']use server["']/.test(src)) for (const m of src.matchAll(/export\s+async\s+function\s+(\w+)/g)) out.push(m[1]!);
    }
  }
  return out;
}

const db = testDb();
const PER_ACTION = Number(process.env.FUZZ_PER_ACTION ?? 2000);
const ONLY = process.env.FUZZ_ONLY ?? "";
const SEED = 20261202;
let w: World;
let consultant: Viewer;

type Op = { name: string; viewer: () => Viewer | null; base: () => Record<string, unknown>; keep?: string[]; ignored?: string[]; run: (v: Viewer | null, raw: unknown) => Promise<{ ok: boolean; status?: number }> };
const ops: Op[] = [];
type RouteOp = { name: string; requests: () => Request[]; run: (req: Request) => Promise<number>; stateless?: boolean };
const routes: RouteOp[] = [];
const grand = new StatusTally();

async function tokenFor(email: string): Promise<string> {
  const r = await createInvitation(db, consultant, { projectId: w.P.id, email, role: "finance" }, { appUrl: "http://127.0.0.1:1" });
  if (!r.ok) throw new Error(r.error);
  const m = await db.selectFrom("mail_outbox").select("text_body").where("kind", "=", INVITATION_MAIL_KIND).where("ref_id", "=", r.value.invitationId).executeTakeFirstOrThrow();
  return /\/invite\/([A-Za-z0-9_-]{43})/.exec(m.text_body)![1]!;
}

beforeAll(async () => {
  w = await buildWorld(db);
  consultant = (await w.viewer("consultant"))!;
  // A bin-table dataset and a scenario on it, saved once with its own document (the fuzz's valid base).
  const bins = await saveBinTable(db, consultant, {
    projectId: w.P.id,
    source: "wetBulbBins",
    name: "Fuzz bins",
    bins: [
      { wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 4000 },
      { wetBulbC: 18, meanCoincidentDryBulbC: 24, hours: 4760 },
    ],
  });
  if (!bins.ok) throw new Error(`bins: ${bins.error}`);
  const datasetId = (bins.value as { datasetId: string }).datasetId;
  const created = await createScenarioIn(db, consultant, { projectId: w.P.id, name: "Fuzz base", climateDatasetId: datasetId });
  if (!created.ok) throw new Error(`scenario: ${created.error}`);
  const row = await db.selectFrom("scenarios").select(["input", "revision"]).where("id", "=", created.value.id).executeTakeFirstOrThrow();
  const saveBase = {
    projectId: w.P.id,
    scenarioId: created.value.id,
    revision: row.revision,
    name: "Fuzz base",
    climateDatasetId: datasetId,
    document: documentFromStored(row.input) as unknown as Record<string, unknown>,
  };
  const saved = await saveScenarioIn(db, consultant, saveBase, { waitMs: 0 });
  if (!saved.ok) throw new Error(`base save: ${saved.error} ${JSON.stringify(saved.fieldErrors)}`);
  saveBase.revision = saved.value.revision;
  const viewerUser = await db.insertInto("users").values({ email: `${uniq("fz")}@example.test`, name: "Fuzz viewer", password_hash: null }).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("project_access").values({ project_id: w.P.id, user_id: viewerUser.id, role: "owner" }).execute();
  const inv = await createInvitation(db, consultant, { projectId: w.P.id, email: `${uniq("fzinv")}@example.test`, role: "owner" }, { appUrl: "http://127.0.0.1:1" });
  if (!inv.ok) throw new Error(inv.error);
  const newAccountToken = await tokenFor(`${uniq("fznew")}@example.test`);
  const viewerToken = await tokenFor(`${uniq("fzview")}@example.test`);
  const admin = (await w.viewer("admin"))!;
  const owner = (await w.viewer("owner"))!;
  const P = w.P;
  const as = (v: Viewer | null) => () => v;
  const keepP = ["projectId"];

  const url = "http://127.0.0.1:1/api";
  const asObject = (v: unknown) => (v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {});
  const status = (r: { ok: boolean; status?: number }, okStatus = 200) => (r.ok ? okStatus : (r.status ?? 0));
  /** Requests as a client sends them: seeded payloads as JSON, broken JSON, other content types, too large. */
  const jsonRequests = (seed: number, base: Record<string, unknown>): Request[] => {
    const broken = brokenJsonBodies(seed + 1, PER_ACTION, JSON.stringify(base));
    return fuzzPayloads(seed, PER_ACTION, base).map((p, i) => {
      const k = i % 10;
      const body = k === 8 ? broken[i]! : i % 97 === 0 ? "x".repeat(6 * 1024 * 1024) : jsonText(p.value);
      const type = k === 9 ? ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data", ""][i % 4]! : "application/json";
      return new Request(url, { method: "POST", headers: type ? { "content-type": type } : {}, body });
    });
  };
  const scenarioDoc = structuredClone(saveBase.document);
  routes.push(
    {
      name: "POST /api/projects/[id]/comments",
      requests: () => jsonRequests(SEED + 100, { versionId: P.versionId, body: "A comment" }),
      run: async (req) => {
        const b = await readJsonBody(req, 16 * 1024);
        if (!b.ok) return b.status;
        const v = asObject(b.value);
        return status(await addComment(db, owner, { versionId: v.versionId, body: v.body, projectId: P.id }, { appUrl: "http://127.0.0.1:1" }), 201);
      },
    },
    {
      name: "POST /api/projects/[id]/invitations",
      requests: () => jsonRequests(SEED + 110, { email: "someone.new@example.test", role: "owner" }),
      run: async (req) => {
        const b = await readJsonBody(req, 16 * 1024);
        if (!b.ok) return b.status;
        return status(await createInvitation(db, consultant, { ...asObject(b.value), projectId: P.id }, { appUrl: "http://127.0.0.1:1" }), 201);
      },
    },
    {
      name: "POST /api/scenarios/[id]/what-if (body checks)",
      stateless: true,
      requests: () => jsonRequests(SEED + 120, { waterAndSewerPriceFactor: 1.2, discountRate: 0.05, loadFactor: 1.1 }),
      run: async (req) => {
        const b = await readJsonBody(req, WHAT_IF_MAX_BYTES);
        if (!b.ok) return b.status;
        return whatIfBodySchema.safeParse(b.value).success ? 200 : 422;
      },
    },
    {
      name: "POST /api/v1/analyses (body checks)",
      stateless: true,
      requests: () => jsonRequests(SEED + 130, scenarioDoc),
      run: async (req) => {
        const b = await readJsonBody(req, 5 * 1024 * 1024);
        if (!b.ok) return b.status;
        return parseScenarioDocument(b.value).ok ? 200 : 422;
      },
    },
    {
      name: "POST /api/projects/[id]/climate (upload)",
      requests: () =>
        Array.from({ length: PER_ACTION }, (_, i) => {
          const k = i % 8;
          if (k === 0) return new Request(url, { method: "POST", headers: { "content-type": "multipart/form-data; boundary=x" }, body: '--x\r\nContent-Disposition: form-data; name="file"\r\n\r\nabc' });
          if (k === 1) return new Request(url, { method: "POST", headers: { "content-type": "multipart/form-data" }, body: "no boundary" });
          if (k === 2) return new Request(url, { method: "POST", headers: { "content-type": "application/json" }, body: "{}" });
          const form = new FormData();
          const enc = new TextEncoder();
          const bytes =
            k === 3 ? enc.encode(`LOCATION,Nowhere,,,,${i},1,2,3\n${"DESIGN CONDITIONS,0\n".repeat(i % 3)}garbage`)
            : k === 4 ? new Uint8Array([0x50, 0x4b, 0x03, 0x04, i & 255])
            : k === 5 ? enc.encode(`LOCATION,\u0000${"x".repeat(i % 300)}\n1,2,3`)
            : k === 6 ? enc.encode(Array.from({ length: 30 }, (_, r) => `${r},\uD800,${r * 1e308}`).join("\n"))
            : new Uint8Array(0);
          form.set("file", new Blob([new Uint8Array(bytes)]), k === 6 ? "w.csv" : "w.epw");
          form.set("name", k === 7 ? "\u0000".repeat(5) : "x".repeat(i % 400));
          if (k === 6) form.set("mapping", i % 2 ? "{not json" : JSON.stringify({ dryBulb: "\uDC00", columns: [1e308, NaN] }));
          return new Request(url, { method: "POST", body: form });
        }),
      run: async (req) => {
        const upload = await readClimateUpload(req);
        if (!upload.ok) return upload.outcome.status;
        const o = await importClimateFile(db, { projectId: P.id, firmId: w.firmA, actorId: consultant.id, siteElevationM: 240 }, upload.form);
        return o.status;
      },
    },
  );

  ops.push(
    { name: "createProjectAction → createProject", viewer: as(consultant), base: () => ({ firmId: w.firmA, clientName: "Invented client", name: "Fuzz project", siteName: "Site", locationLabel: "Valley", elevationM: 10, unitSystem: "SI", currency: "USD" }), keep: ["firmId"], run: (v, raw) => createProject(db, v, raw) },
    { name: "updateProjectAction → updateProject", viewer: as(consultant), base: () => ({ projectId: P.id, revision: 1, clientName: "Invented client", name: "Fuzz project", siteName: "Site", locationLabel: "Valley", elevationM: 10, unitSystem: "SI", currency: "USD" }), keep: keepP, run: (v, raw) => updateProject(db, v, raw) },
    { name: "saveBinTableAction → saveBinTable", viewer: as(consultant), base: () => ({ projectId: P.id, source: "wetBulbBins", name: "Bins", bins: [{ wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 4000 }, { wetBulbC: 18, meanCoincidentDryBulbC: 24, hours: 4760 }] }), keep: keepP, run: (v, raw) => saveBinTable(db, v, raw) },
    { name: "createScenarioAction → createScenarioIn", viewer: as(consultant), base: () => ({ projectId: P.id, name: "Fuzz scenario", climateDatasetId: datasetId }), keep: keepP, run: (v, raw) => createScenarioIn(db, v, raw) },
    { name: "saveScenarioAction → saveScenarioIn", viewer: as(consultant), base: () => structuredClone(saveBase), keep: keepP, ignored: ["document.name", "document.site", "document.climate"], run: (v, raw) => saveScenarioIn(db, v, raw, { waitMs: 0 }) },
    { name: "cloneScenarioAction → cloneScenarioIn", viewer: as(consultant), base: () => ({ projectId: P.id, scenarioId: saveBase.scenarioId, name: "Copy" }), keep: keepP, run: (v, raw) => cloneScenarioIn(db, v, raw) },
    { name: "archiveScenarioAction → archiveScenarioIn", viewer: as(consultant), base: () => ({ projectId: P.id, scenarioId: saveBase.scenarioId, archived: true }), keep: keepP, run: (v, raw) => archiveScenarioIn(db, v, raw) },
    { name: "issueAction → issueScenario", viewer: as(consultant), base: () => ({ projectId: P.id, scenarioId: saveBase.scenarioId, note: "Issued for review" }), keep: keepP, run: (v, raw) => issueScenario(db, v, raw) },
    { name: "commentAction → addComment", viewer: as(owner), base: () => ({ projectId: P.id, versionId: P.versionId, body: "A comment" }), keep: keepP, run: (v, raw) => addComment(db, v, raw, { appUrl: "http://127.0.0.1:1" }) },
    { name: "inviteAction → createInvitation", viewer: as(consultant), base: () => ({ projectId: P.id, email: "new.person@example.test", role: "owner" }), keep: keepP, run: (v, raw) => createInvitation(db, v, raw, { appUrl: "http://127.0.0.1:1" }) },
    { name: "revokeAccessAction → revokeViewerAccess", viewer: as(admin), base: () => ({ projectId: P.id, userId: viewerUser.id }), keep: keepP, run: (v, raw) => revokeViewerAccess(db, v, raw) },
    { name: "withdrawInvitationAction → revokeInvitation", viewer: as(admin), base: () => ({ projectId: P.id, invitationId: inv.value.invitationId }), keep: keepP, run: (v, raw) => revokeInvitation(db, v, raw) },
    { name: "changePasswordAction → changePassword", viewer: as(consultant), base: () => ({ currentPassword: "world-password-for-tests-2026", newPassword: "a brand new long passphrase", confirmPassword: "a brand new long passphrase" }), run: (v, raw) => changePassword(db, v, raw) },
    { name: "acceptNewAccountAction → acceptAsNewAccount", viewer: as(null), base: () => ({ token: newAccountToken, name: "New Person", password: "a long enough passphrase", confirmPassword: "a long enough passphrase" }), keep: ["token"], run: (v, raw) => acceptAsNewAccount(db, v, raw) },
    { name: "acceptSignedInAction → acceptAsViewer", viewer: as(consultant), base: () => ({ token: viewerToken }), run: (v, raw) => acceptAsViewer(db, v, raw) },
  );
}, 120_000);
afterAll(async () => {
  console.log(`[fuzz-actions] all server actions and route bodies: ${grand.total} payloads → ${grand.text()}`);
  await db.destroy();
});

/** JSON text of a payload; nesting too deep for JSON.stringify is written out by hand. */
function jsonText(v: unknown): string {
  try {
    return JSON.stringify(v) ?? "null";
  } catch {
    return `{"deep":${"[".repeat(5000)}${"]".repeat(5000)}}`;
  }
}

describe("seeded fuzz of every server action (in-process, real PostgreSQL)", () => {
  it("covers every exported server action", () => {
    expect(ops.map((o) => o.name.split(" → ")[0]).sort()).toEqual(serverActionNames().sort());
  });

  it(`${PER_ACTION} malformed payloads per action: only 4xx answers, nothing changed`, async () => {
    const before = await dbSnapshot(db);
    const problems: string[] = [];
    const t0 = performance.now();
    for (const [k, op] of ops.entries()) {
      if (ONLY && !op.name.includes(ONLY)) continue;
      const tally = new StatusTally();
      const payloads = fuzzPayloads(SEED + k, PER_ACTION, op.base(), { keep: op.keep, ignored: op.ignored });
      const viewer = op.viewer();
      const one = async (p: FuzzPayload, i: number) => {
        try {
          const r = await op.run(viewer, p.value);
          const status = r.ok ? 200 : (r.status ?? 0);
          tally.add(status);
          if (!(status >= 400 && status < 500)) problems.push(`${op.name} #${i} (${p.family} at ${p.broken}): answered ${status} ${JSON.stringify(p.value, (_k, x) => (typeof x === "string" && x.length > 60 ? `${x.slice(0, 60)}…(${x.length})` : Array.isArray(x) && x.length > 10 ? `[array of ${x.length}]` : x)).slice(0, 400)}`);
        } catch (err) {
          tally.add(500);
          problems.push(`${op.name} #${i} (${p.family} at ${p.broken}): threw ${(err as Error).message.slice(0, 200)}`);
        }
      };
      // Four at a time (the pool's size): the checks see concurrent requests as a server would.
      for (let i = 0; i < payloads.length; i += 4) await Promise.all(payloads.slice(i, i + 4).map((p, j) => one(p, i + j)));
      for (const [s, c] of tally.counts) for (let j = 0; j < c; j++) grand.add(s);
      console.log(`[fuzz-actions] ${op.name}: ${tally.total} → ${tally.text()}`);
    }
    console.log(`[fuzz-actions] ${ops.length} actions × ${PER_ACTION} in ${Math.round(performance.now() - t0)} ms`);
    expect(problems.slice(0, 30)).toEqual([]);
    expect(changedTables(before, await dbSnapshot(db)), "tables changed by malformed payloads").toEqual([]);
  }, 600_000);

  it(`${PER_ACTION} malformed requests per route handler body (in-process Request objects): only 4xx (2xx only where nothing is stored), nothing changed`, async () => {
    const before = await dbSnapshot(db);
    const problems: string[] = [];
    for (const route of routes) {
      if (ONLY && !route.name.includes(ONLY)) continue;
      const tally = new StatusTally();
      const reqs = route.requests();
      const one = async (req: Request, i: number) => {
        try {
          const st = await route.run(req);
          tally.add(st);
          const fine = (st >= 400 && st < 500) || (route.stateless && st === 200) || (route.name.includes("climate") && st === 200);
          if (!fine) problems.push(`${route.name} #${i}: answered ${st}`);
        } catch (err) {
          tally.add(500);
          problems.push(`${route.name} #${i}: threw ${(err as Error).message.slice(0, 200)}`);
        }
      };
      for (let i = 0; i < reqs.length; i += 4) await Promise.all(reqs.slice(i, i + 4).map((r, j) => one(r, i + j)));
      for (const [st, c] of tally.counts) for (let j = 0; j < c; j++) grand.add(st);
      console.log(`[fuzz-actions] ${route.name}: ${tally.total} → ${tally.text()}`);
    }
    expect(problems.slice(0, 30)).toEqual([]);
    expect(changedTables(before, await dbSnapshot(db)), "tables changed by malformed requests").toEqual([]);
  }, 600_000);
});
