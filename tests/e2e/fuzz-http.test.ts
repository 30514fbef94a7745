import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import path from "node:path";
import { testDb, uniq } from "../support/db";
import { changedTables, dbSnapshot } from "../support/db-snapshot";
import { brokenJsonBodies, fuzzPayloads, StatusTally } from "../support/fuzz";
import { loadServerActions, postAction } from "@/scripts/support/server-actions";
import { insertWorldPeople } from "../support/world";
import { hashPassword } from "@/lib/auth/password";
import { loadViewer } from "@/lib/auth/access";
import { issueScenario } from "@/lib/sharing/versions";
import { defaultScenario } from "@/lib/scenarios/schema";
import { analysedScenario, uploadDataset } from "./authz-fixtures";
import { signInHttp } from "./http-session";
import { BASE_URL } from "./support";

/**
 * The seeded fuzz over HTTP, through the built server and its edge (proxy.ts): every route handler that
 * takes a body gets PER_ROUTE (300) malformed requests (tests/support/fuzz.ts payloads as JSON, broken JSON,
 * wrong content types, bodies over the limit; broken multipart for the weather upload; malformed
 * credentials for sign-in), and the server-action envelope a few hundred (broken JSON, deep nesting,
 * __proto__, over 1 MB, multipart with a broken boundary or references to parts never sent, forms posted
 * without JavaScript whose bound arguments refer to missing parts). No answer may
 * be a 5xx, and the database must be as before (row count and checksum of every table). The actions' own
 * input checks get 2,000 payloads each in-process (tests/integration/fuzz-actions.test.ts).
 */
const db = testDb();
// A few hundred each over HTTP keeps this file near a minute on two cores; the 2,000-per-entry-point runs are
// in-process (tests/integration/fuzz-actions.test.ts). Raise them with the variables for a longer probe.
const PER_ROUTE = Number(process.env.FUZZ_HTTP_PER_ROUTE ?? 300);
const PER_ACTION_ENVELOPE = Number(process.env.FUZZ_HTTP_ACTIONS ?? 300);
const SEED = 20261203;
const PASSWORD = "fuzz-password-for-tests-2026";
const EPW = readFileSync(path.resolve(__dirname, "../fixtures/weather/harrowgate-flats.epw"));

let consultant = "";
let owner = "";
let projectId = "";
let scenarioId = "";
let versionId = "";
const grand = new StatusTally();
const lines: string[] = [];

/**
 * The background worker keeps finishing earlier tests' analyses: the snapshot is taken once two in a row
 * 1.5 s apart agree (the outbox counts by its messages, not their delivery state: MESSAGE_COLUMNS).
 */
async function quietSnapshot(): Promise<Record<string, string>> {
  // First let the worker finish every queued or running analysis (a Monte Carlo reports progress as it goes).
  for (let i = 0; i < 120; i++) {
    const open = await db.selectFrom("scenario_results").select("id").where("status", "in", ["queued", "running"]).executeTakeFirst();
    const api = await db.selectFrom("api_analyses").select("id").where("status", "in", ["queued", "running"]).executeTakeFirst();
    if (!open && !api) break;
    await new Promise((r) => setTimeout(r, 1000));
  }
  let prev = await dbSnapshot(db);
  for (let i = 0; i < 40; i++) {
    await new Promise((r) => setTimeout(r, 1500));
    const now = await dbSnapshot(db);
    if (changedTables(prev, now).length === 0) return now;
    prev = now;
  }
  return prev;
}

beforeAll(async () => {
  const tag = uniq("fz");
  const { users, firmA } = await insertWorldPeople(db, { tag, passwordHash: await hashPassword(PASSWORD), firmName: (k) => `Fuzz firm ${k} ${tag}` });
  projectId = (
    await db.insertInto("projects").values({ firm_id: firmA, name: `Fuzz ${tag}`, client_name: "Invented client", site_name: "Invented site", elevation_m: 240, created_by: users.consultant.id }).returning("id").executeTakeFirstOrThrow()
  ).id;
  await db.insertInto("project_access").values({ project_id: projectId, user_id: users.owner.id, role: "owner" }).execute();
  consultant = (await signInHttp(users.consultant.email, PASSWORD, { "x-forwarded-for": `198.51.100.7-${tag}` }))!;
  owner = (await signInHttp(users.owner.email, PASSWORD, { "x-forwarded-for": `198.51.100.8-${tag}` }))!;
  if (!consultant || !owner) throw new Error("fuzz: sign-in failed");
  const datasetId = await uploadDataset(consultant, projectId, `Fuzz climate ${tag}`);
  scenarioId = await analysedScenario(db, projectId, datasetId, `Fuzz scenario ${tag}`, users.consultant.id);
  const issued = await issueScenario(db, await loadViewer(db, users.consultant.id), { projectId, scenarioId, note: "fuzz" });
  if (!issued.ok) throw new Error(`fuzz: issue failed: ${issued.error}`);
  versionId = issued.value.versionId;
}, 180_000);

afterAll(async () => {
  console.log(`[fuzz-http] all: ${grand.total} requests → ${grand.text()}`);
  for (const l of lines) console.log(l);
  await db.destroy();
});

type Req = { body: BodyInit; contentType: string };

/** Send requests four at a time; tally statuses; list every 5xx (and a network failure as 599). */
async function fire(name: string, reqs: Req[], send: (r: Req) => Promise<Response>): Promise<string[]> {
  const tally = new StatusTally();
  const bad: string[] = [];
  for (let i = 0; i < reqs.length; i += 4) {
    await Promise.all(
      reqs.slice(i, i + 4).map(async (r, j) => {
        let status = 599;
        try {
          const res = await send(r);
          await res.arrayBuffer();
          status = res.status;
        } catch {
          status = 599;
        }
        tally.add(status);
        grand.add(status);
        if (status >= 500) bad.push(`${name} #${i + j}: ${status} (${r.contentType}, ${typeof r.body === "string" ? r.body.slice(0, 120) : "binary"})`);
      }),
    );
  }
  const line = `[fuzz-http] ${name}: ${tally.total} → ${tally.text()}`;
  lines.push(line);
  console.log(line);
  return bad;
}

/** JSON text of a payload; nesting too deep for this process's JSON.stringify is written out by hand. */
function jsonText(v: unknown): string {
  try {
    return JSON.stringify(v) ?? "null";
  } catch {
    return `{"deep":${"[".repeat(5000)}${"]".repeat(5000)}}`;
  }
}

/** JSON route bodies: seeded payloads (80 %), broken JSON, a wrong content type, a body over every limit. */
function jsonRequests(seed: number, n: number, base: Record<string, unknown>, keep: string[] = []): Req[] {
  const payloads = fuzzPayloads(seed, n, base, { keep });
  const broken = brokenJsonBodies(seed + 1, n, JSON.stringify(base));
  return payloads.map((p, i) => {
    const k = i % 10;
    if (k === 8) return { body: broken[i]!, contentType: "application/json" };
    if (k === 9) return { body: JSON.stringify(base), contentType: ["text/plain", "application/x-www-form-urlencoded", "multipart/form-data", ""][i % 4]! };
    if (i % 97 === 0) return { body: "x".repeat(6 * 1024 * 1024), contentType: "application/json" };
    return { body: jsonText(p.value), contentType: "application/json" };
  });
}

const post = (url: string, cookie: string) => (r: Req) =>
  fetch(BASE_URL + url, { method: "POST", redirect: "manual", headers: { cookie, origin: BASE_URL, ...(r.contentType ? { "content-type": r.contentType } : {}) }, body: r.body, signal: AbortSignal.timeout(60_000) });

describe("seeded fuzz over HTTP: route handlers and the server-action envelope", () => {
  it("no 5xx from any route handler or action envelope, and the database is unchanged", async () => {
    const before = await quietSnapshot();
    const bad: string[] = [];
    const doc = defaultScenario({ source: "wetBulbBins", label: "Bins", bins: [{ wetBulbC: 5, meanCoincidentDryBulbC: 8, hours: 4000 }, { wetBulbC: 18, meanCoincidentDryBulbC: 24, hours: 4760 }] }, { elevationM: 100, locationLabel: "Invented valley" });

    bad.push(...(await fire("POST /api/projects/[id]/comments", jsonRequests(SEED, PER_ROUTE, { versionId, body: "A comment" }), post(`/api/projects/${projectId}/comments`, owner))));
    bad.push(...(await fire("POST /api/projects/[id]/invitations", jsonRequests(SEED + 10, PER_ROUTE, { email: "someone.new@example.test", role: "owner" }), post(`/api/projects/${projectId}/invitations`, consultant))));
    bad.push(...(await fire("POST /api/scenarios/[id]/what-if", jsonRequests(SEED + 20, PER_ROUTE, { waterAndSewerPriceFactor: 1.2, discountRate: 0.05, loadFactor: 1.1 }), post(`/api/scenarios/${scenarioId}/what-if`, consultant))));
    bad.push(...(await fire("POST /api/v1/analyses", jsonRequests(SEED + 30, PER_ROUTE, doc as unknown as Record<string, unknown>), post("/api/v1/analyses", consultant))));

    // The weather upload: broken multipart bodies and broken files (nothing may be stored).
    const uploads: Req[] = Array.from({ length: PER_ROUTE }, (_, i) => {
      const k = i % 8;
      if (k === 0) return { body: "--x\r\nContent-Disposition: form-data; name=\"file\"\r\n\r\nabc", contentType: "multipart/form-data; boundary=x" };
      if (k === 1) return { body: "garbage without a boundary", contentType: "multipart/form-data" };
      if (k === 2) return { body: "{}", contentType: "application/json" };
      const form = new FormData();
      const bytes =
        k === 3 ? EPW.subarray(0, 200 + (i % 5000))
        : k === 4 ? new Uint8Array([0x50, 0x4b, 0x03, 0x04, i & 255])
        : k === 5 ? new TextEncoder().encode(`LOCATION,\u0000${"x".repeat(i % 300)}\n1,2,3`)
        : k === 6 ? new TextEncoder().encode(Array.from({ length: 30 }, (_, r) => `${r},${"\uD800"},${r * 1e308}`).join("\n"))
        : new Uint8Array(0);
      form.set("file", new Blob([new Uint8Array(bytes)]), k === 6 ? "w.csv" : "w.epw");
      form.set("name", k === 7 ? "\u0000".repeat(5) : "x".repeat(i % 400));
      if (k === 6) form.set("mapping", i % 2 ? "{not json" : JSON.stringify({ __proto__: { x: 1 }, dryBulb: "\uDC00" }));
      return { body: form, contentType: "" };
    });
    bad.push(...(await fire("POST /api/projects/[id]/climate (upload)", uploads, post(`/api/projects/${projectId}/climate`, consultant))));

    // Sign-in with malformed credentials: refused (a redirect or 401), never stored as a failure.
    const csrf = await fetch(`${BASE_URL}/api/auth/csrf`);
    const csrfCookie = csrf.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const creds = fuzzPayloads(SEED + 40, PER_ROUTE, { email: "someone@example.test", password: "a password" }).map((p): Req => {
      const v = (p.value && typeof p.value === "object" ? p.value : {}) as Record<string, unknown>;
      const form = new URLSearchParams({ csrfToken, json: "true" });
      // A form field is text: anything else arrives as its JSON text (the malformed e-mail never validates).
      for (const [k, x] of Object.entries(v)) form.set(k, typeof x === "string" ? x : jsonText(x).slice(0, 200_000));
      if (!("email" in v) || typeof v.email !== "string") form.set("email", jsonText(v.email ?? null).slice(0, 200_000));
      // A payload that broke only the password (a number arrives as the text "12345") is no malformed
      // request but an ordinary wrong password, which the throttle rightly counts: keep the e-mail broken.
      else if (/^[^@\s]+@[^@\s]+\.[^@\s]+$/.test(v.email)) form.set("email", v.email.replace("@", " at "));
      return { body: form.toString(), contentType: "application/x-www-form-urlencoded" };
    });
    bad.push(
      ...(await fire("POST /api/auth/callback/credentials", creds, (r) =>
        fetch(`${BASE_URL}/api/auth/callback/credentials`, { method: "POST", redirect: "manual", headers: { cookie: csrfCookie, "content-type": r.contentType }, body: r.body, signal: AbortSignal.timeout(60_000) }),
      )),
    );

    // The server-action envelope (framework decoder), a few hundred over every action of the build.
    const actions = loadServerActions();
    const pageOf = (w: string) => w.replace(/^app/, "").replace(/\/page$/, "").replace(/\/\([^)]+\)/g, "").replace("[projectId]", projectId).replace("[scenarioId]", scenarioId).replace("[token]", "x".repeat(43)) || "/";
    const envelopes: { body: BodyInit; contentType: string; id: string; page: string }[] = [];
    const broken = brokenJsonBodies(SEED + 50, PER_ACTION_ENVELOPE, '["a",{"b":1}]');
    for (let i = 0; i < PER_ACTION_ENVELOPE; i++) {
      const a = actions[i % actions.length]!;
      const page = pageOf(a.workers.find((x) => x.endsWith("/page")) ?? "app/page");
      const k = i % 10;
      const boundary = `----fuzz${i}`;
      const part = (name: string, value: string) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
      let body: BodyInit;
      let contentType = "text/plain;charset=UTF-8";
      if (k <= 3) body = broken[i]!;
      else if (k === 4) body = `[${"[".repeat(3000)}${"]".repeat(3000)}]`;
      else if (k === 5) body = i % 20 === 5 ? `\uFEFF["a",{"b":1}]` : `[{"__proto__":{"then":"$1:then"}}, "$@7", "$Q9"]`;
      else if (k === 6) body = `["${"x".repeat(1_100_000)}"]`;
      else if (k === 7) {
        // A multipart body with a broken boundary (the header names one the body never uses).
        contentType = `multipart/form-data; boundary=${boundary}`;
        body = `--other\r\nContent-Disposition: form-data; name="0"\r\n\r\n["$K1"]\r\n--other--\r\n`;
      } else if (k === 8) {
        // Parts referring to parts that were never sent.
        contentType = `multipart/form-data; boundary=${boundary}`;
        body = part("0", '["$K1","$@2","$Q3"]') + part("4", '{"x":"$W9"}') + `--${boundary}--\r\n`;
      } else {
        // Well-formed envelopes with malformed arguments: the action's own checks answer.
        contentType = `multipart/form-data; boundary=${boundary}`;
        body = part("0", '["$undefined","$K1"]') + part("1_body", "\u0000") + part("1_currentPassword", "x".repeat(10_000)) + `--${boundary}--\r\n`;
      }
      envelopes.push({ body, contentType, id: a.id, page });
    }
    const tally = new StatusTally();
    for (let i = 0; i < envelopes.length; i += 8) {
      await Promise.all(
        envelopes.slice(i, i + 8).map(async (e, j) => {
          let status = 599;
          try {
            status = (await postAction(BASE_URL, e.page, e.id, e.body, { cookie: consultant, contentType: e.contentType, timeoutMs: 60_000 })).status;
          } catch {
            status = 599;
          }
          tally.add(status);
          grand.add(status);
          if (status >= 500) bad.push(`server action ${e.id.slice(0, 8)} on ${e.page} #${i + j}: ${status} (${e.contentType}, ${typeof e.body === "string" ? e.body.slice(0, 100) : ""})`);
        }),
      );
    }
    // Forms posted without JavaScript: "$ACTION_REF_1" whose bound arguments refer to parts never sent.
    const noScript: Req[] = Array.from({ length: Math.max(20, Math.floor(PER_ACTION_ENVELOPE / 10)) }, (_, i) => {
      const a = actions[i % actions.length]!;
      const form = new FormData();
      form.set("$ACTION_REF_1", "");
      form.set("$ACTION_1:0", [`{"id":"${a.id}","bound":"$@5"}`, `{"id":"${a.id}","bound":["$Q9"]}`, "{broken", `{"id":"${a.id}","bound":[{"__proto__":{}}]}`][i % 4]!);
      form.set("$ACTION_KEY", "k1");
      return { body: form, contentType: "" };
    });
    for (const r of noScript) {
      const res = await post("/account", consultant)(r);
      await res.arrayBuffer();
      tally.add(res.status);
      grand.add(res.status);
      if (res.status >= 500) bad.push(`no-script form: ${res.status}`);
    }
    const line = `[fuzz-http] server-action envelopes (${actions.length} actions, incl. forms without JavaScript): ${tally.total} → ${tally.text()}`;
    lines.push(line);
    console.log(line);

    expect(bad.slice(0, 30)).toEqual([]);
    expect(changedTables(before, await quietSnapshot()), "tables changed by malformed requests").toEqual([]);
  }, 900_000);
});
