import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { createDb } from "@/db/client";
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from "@/db/seed";
import { BASE_URL } from "./support";
import { signInHttp } from "./http-session";
import { actionId, callAction, loadServerActions } from "@/scripts/support/server-actions";

/**
 * PostgreSQL stops in the middle of the run (scripts/db.sh stop), under the running web server and worker:
 * pages answer 503 with the "database is unavailable, nothing you saved is lost" page, APIs and server
 * actions 503 with Retry-After and a JSON message, liveness stays 200 and readiness turns 503. Then the
 * database comes back (same data) and everything answers again without restarting anything — including
 * the worker, which takes a queued analysis.
 */
const ROOT = path.resolve(__dirname, "../..");
const db = createDb(process.env.DATABASE_URL!, 1);
let cookie = "";
let ids = { projectId: "", scenarioId: "" };
const observed: Record<string, number> = {};

function dbctl(cmd: "stop" | "start") {
  // PG_FRESH_DB=0: the restart must keep the test database (the test run starts with PG_FRESH_DB=1).
  execFileSync("bash", ["scripts/db.sh", cmd], { cwd: ROOT, env: { ...process.env, PG_FRESH_DB: "0" }, stdio: "pipe", timeout: 90_000 });
}

async function get(url: string, extra: Record<string, string> = {}) {
  const res = await fetch(BASE_URL + url, { headers: { cookie, ...extra }, redirect: "manual" });
  return { status: res.status, headers: res.headers, text: await res.text() };
}

async function until(check: () => Promise<boolean>, timeoutMs: number, what: string) {
  const end = Date.now() + timeoutMs;
  while (Date.now() < end) {
    if (await check()) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`timed out waiting for ${what}`);
}

beforeAll(async () => {
  cookie = (await signInHttp(DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD)) ?? "";
  expect(cookie).not.toBe("");
  const s = await db.selectFrom("scenarios").select(["id", "project_id"]).orderBy("created_at").executeTakeFirstOrThrow();
  ids = { projectId: s.project_id, scenarioId: s.id };
  await db.destroy();
});

afterAll(() => {
  // Whatever happened above, the database is running again for the tests that follow.
  dbctl("start");
  console.log(`[db-outage] statuses: ${JSON.stringify(observed)}`);
});

describe("a database outage", () => {
  it("is answered with 503s while it lasts and forgotten when it ends, without a restart", { timeout: 240_000 }, async () => {
    const page = `/projects/${ids.projectId}`;
    const api = `/api/scenarios/${ids.scenarioId}/results`;
    expect((await get(page)).status).toBe(200);
    expect((await get("/api/health/ready")).status).toBe(200);

    dbctl("stop");
    await until(async () => (await get(page)).status === 503, 15_000, "the page to answer 503");

    const p = await get(page, { accept: "text/html" });
    observed.page = p.status;
    expect(p.status).toBe(503);
    expect(p.headers.get("retry-after")).toBe("60");
    expect(p.headers.get("content-type")).toMatch(/text\/html/);
    expect(p.text).toMatch(/The database is unavailable/);
    expect(p.text).toMatch(/Nothing you saved is lost — try again in a minute/);

    const a = await get(api);
    observed.api = a.status;
    expect(a.status).toBe(503);
    expect(Number(a.headers.get("retry-after"))).toBeGreaterThan(0);
    expect(JSON.parse(a.text)).toMatchObject({ error: expect.stringMatching(/database is unavailable/) });

    const w = await fetch(`${BASE_URL}/api/scenarios/${ids.scenarioId}/what-if`, {
      method: "POST",
      headers: { cookie, "content-type": "application/json", origin: BASE_URL },
      body: JSON.stringify({ electricityPriceFactor: 1.1 }),
    });
    observed.whatIf = w.status;
    expect(w.status).toBe(503);

    const save = await callAction(BASE_URL, `/projects/${ids.projectId}/scenarios/${ids.scenarioId}/edit`, actionId(loadServerActions(), "saveScenarioAction"), [
      ids.projectId,
      ids.scenarioId,
      { revision: 1, name: "x", climateDatasetId: null, document: {} },
    ], { cookie });
    observed.action = save.status;
    expect(save.status).toBe(503);

    const signin = await get("/signin");
    observed.signin = signin.status;
    expect(signin.status).toBe(503);

    const live = await get("/api/health/live");
    const ready = await get("/api/health/ready");
    observed.live = live.status;
    observed.ready = ready.status;
    expect(live.status).toBe(200);
    expect(ready.status).toBe(503);
    expect(JSON.parse(ready.text)).toMatchObject({ status: "unavailable", database: { up: false } });

    dbctl("start");
    await until(async () => (await get(page)).status === 200, 30_000, "the page to answer 200 again");
    observed.pageAfter = (await get(page)).status;
    observed.apiAfter = (await get(api)).status;
    expect(observed.apiAfter).toBe(200);
    await until(async () => (await get("/api/health/ready")).status === 200, 15_000, "readiness");
    observed.readyAfter = 200;

    // A new sign-in works, and the worker (never restarted) takes a queued analysis again.
    const fresh = await signInHttp(DEMO_ACCOUNTS.consultant.email, DEMO_PASSWORD);
    expect(fresh).toBeTruthy();
    const doc = JSON.parse(readFileSync(path.join(ROOT, "tests/fixtures/scenario-bins.json"), "utf8"));
    const posted = await fetch(`${BASE_URL}/api/v1/analyses`, {
      method: "POST",
      headers: { cookie, "content-type": "application/json", origin: BASE_URL, prefer: "respond-async" },
      body: JSON.stringify(doc),
    });
    expect(posted.status).toBe(202);
    const { statusUrl } = (await posted.json()) as { statusUrl: string };
    let status = "";
    await until(
      async () => {
        status = (JSON.parse((await get(statusUrl)).text) as { status: string }).status;
        return status === "done" || status === "failed";
      },
      120_000,
      "the worker to finish a queued analysis after the outage",
    );
    expect(status).toBe("done");
  });
});
