import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { sql } from "kysely";
import { testDb, uniq } from "../support/db";
import { insertClimateDataset } from "@/db/queries/climate";
import { insertProject } from "@/db/queries/projects";
import { findResultById } from "@/db/queries/results";
import { climateDatasetRow } from "@/lib/climate/build";
import { QUEUES } from "@/lib/jobs/queues";
import { analyzeAndStore } from "@/lib/scenarios/analysis";
import { demoClimateDataset, demoScenarioDocument } from "@/lib/scenarios/demo";
import type { ScenarioDocument } from "@/lib/scenarios/mappers";
import { createScenario, saveScenario } from "@/lib/scenarios/store";

/**
 * A worker process killed (SIGKILL) in the middle of a Monte Carlo run: the job stays active until its
 * expiry (budget × 1.25 + 5 s), pg-boss's maintenance in a new worker puts it back for a retry, the new
 * worker computes it and the result is stored once. Real child processes, as `npm start` runs them.
 */
const db = testDb();
const ROOT = path.resolve(__dirname, "../..");
const BUDGET_S = 20;
const DRAWS = 200_000;
const children: ChildProcess[] = [];

function startWorkerProcess(name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, [path.join(ROOT, "node_modules/tsx/dist/cli.mjs"), "scripts/worker.ts"], {
    cwd: ROOT,
    // Its own process group, so that the kill reaches the worker and not only tsx's launcher.
    detached: true,
    env: { ...process.env, ANALYSIS_BUDGET_S: String(BUDGET_S), WORKER_MAINTENANCE_S: "1" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  let out = "";
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${name} did not start: ${out}`)), 60_000);
    const onData = (d: Buffer) => {
      out += d.toString();
      if (/\[worker\] pid \d+ working/.test(out)) {
        clearTimeout(timer);
        resolve(child);
      }
    };
    child.stdout!.on("data", onData);
    child.stderr!.on("data", (d: Buffer) => (out += d.toString()));
    child.once("exit", (code) => reject(new Error(`${name} exited (${code}): ${out}`)));
  });
}

function killGroup(child: ChildProcess, signal: NodeJS.Signals) {
  if (child.pid && child.exitCode === null) {
    try {
      process.kill(-child.pid, signal);
    } catch {
      /* already gone */
    }
  }
}

async function exited(child: ChildProcess) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  await new Promise((r) => child.once("exit", r));
}

let scenarioId = "";

beforeAll(async () => {
  const firm = await db.selectFrom("firms").select("id").executeTakeFirstOrThrow();
  const user = await db.selectFrom("users").select("id").where("email", "=", "cole.consultant@corrandale.example").executeTakeFirstOrThrow();
  const projectId = (
    await insertProject(db, {
      firm_id: firm.id,
      name: uniq("Worker crash "),
      client_name: "Invented client",
      site_name: "Invented site",
      location_label: "Invented valley",
      elevation_m: 240,
      unit_system: "SI",
      currency: "USD",
      created_by: user.id,
    })
  ).id;
  const datasetId = (await insertClimateDataset(db, climateDatasetRow(demoClimateDataset(240), { projectId, createdBy: user.id }))).id;
  const d = structuredClone(demoScenarioDocument()) as unknown as Record<string, unknown>;
  d.sensitivity = { enabled: false };
  d.monteCarlo = { enabled: true, draws: DRAWS, seed: 11, histogramBins: 20 };
  const c = await createScenario(db, { projectId, name: uniq("crash"), climateDatasetId: datasetId, userId: user.id, document: d as unknown as ScenarioDocument });
  if (!c.ok) throw new Error(JSON.stringify(c.fieldErrors));
  scenarioId = c.id;
});

afterAll(async () => {
  for (const c of children) killGroup(c, "SIGKILL");
  await db.destroy();
});

describe("a worker killed during a Monte Carlo run", () => {
  it("leaves the job to be retried by the next worker; the result is stored exactly once", { timeout: 240_000 }, async () => {
    const first = await startWorkerProcess("worker A");
    // Queue after worker A has brought the queues to this test's expiry (jobs take it when they are sent).
    const ctx = await db.selectFrom("scenarios").select(["revision", "input", "climate_dataset_id", "name"]).where("id", "=", scenarioId).executeTakeFirstOrThrow();
    const saved = await saveScenario(db, {
      scenarioId,
      expectedRevision: ctx.revision,
      name: ctx.name,
      climateDatasetId: ctx.climate_dataset_id,
      document: { ...(ctx.input as object), name: ctx.name },
      userId: null,
    });
    if (!saved.ok) throw new Error(JSON.stringify(saved));
    const a = await analyzeAndStore(db, scenarioId, saved.input, { inline: true });
    const mcId = a.monteCarlo!.id;
    expect(a.monteCarlo?.status).toBe("queued");

    await expect.poll(async () => (await findResultById(db, mcId))?.status, { timeout: 90_000, interval: 25 }).toBe("running");
    killGroup(first, "SIGKILL");
    await exited(first);
    const orphan = await findResultById(db, mcId);
    expect(orphan?.status).toBe("running");
    expect(orphan?.result).toBeNull();
    const activeJob = await sql<{ state: string }>`select state from pgboss.job where name = ${QUEUES.monteCarlo} and singleton_key = ${mcId}`.execute(db);
    expect(activeJob.rows.map((r) => r.state)).toEqual(["active"]);

    const second = await startWorkerProcess("worker B");
    await expect.poll(async () => (await findResultById(db, mcId))?.status, { timeout: 150_000, interval: 250 }).toBe("done");
    killGroup(second, "SIGTERM");
    await exited(second);

    const rows = await db.selectFrom("scenario_results").select(["id", "status", "result"]).where("scenario_id", "=", scenarioId).where("kind", "=", "monteCarlo").execute();
    expect(rows).toHaveLength(1);
    expect((rows[0]!.result as { draws: number }).draws).toBe(DRAWS);
    // The same job, retried (not a fresh copy): one job for the row, completed on its second try.
    const jobs = await sql<{ state: string; retry_count: number }>`
      select state, retry_count from pgboss.job where name = ${QUEUES.monteCarlo} and singleton_key = ${mcId}
      union all select state::text::pgboss.job_state, retry_count from pgboss.archive where name = ${QUEUES.monteCarlo} and singleton_key = ${mcId}`.execute(db);
    expect(jobs.rows).toEqual([{ state: "completed", retry_count: 1 }]);
  });
});
