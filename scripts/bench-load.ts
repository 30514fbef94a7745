/**
 * Load benchmark against a running production server on loopback (prints figures; asserts nothing).
 *
 *   npx tsx scripts/bench-load.ts [--base http://127.0.0.1:3000] [--clients 50] [--seconds 60] [--seed 13]
 *
 * 1. Unloaded: the five main pages (projects list, project, comparison, scenario editor, versions), each
 *    fetched 15 times one after another after two warm-ups: median time to the last byte and HTML size.
 * 2. Loaded: `clients` concurrent loops for `seconds`, each picking (seeded) a main page (60 %), a what-if
 *    (25 %) or a save through the editor's server action (15 %, each client on its own copy of the demo
 *    scenario, one input nudged so that every save is analysed). Each request has a 60 s timeout; the run
 *    stops by itself. The copies are deleted at the end.
 *
 * Needs the demo seed (consultant account) and DATABASE_URL of the server's database (read from .env).
 */
import { createDb } from "../db/client";
import { mulberry32 } from "../lib/engine/random";
import { loadDotEnv } from "./dotenv";
import { signInOverHttp } from "./support/http-session";
import { actionId, callAction, loadServerActions } from "./support/server-actions";

loadDotEnv();

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 && process.argv[i + 1] ? process.argv[i + 1]! : fallback;
}

const BASE = arg("base", process.env.APP_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const CLIENTS = Number(arg("clients", "50"));
const SECONDS = Number(arg("seconds", "60"));
const SEED = Number(arg("seed", "13"));
const EMAIL = "cole.consultant@corrandale.example";
const PASSWORD = "ledger-demo-2026";

if (!/^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?$/.test(BASE)) throw new Error("Loads run against loopback only.");

async function signIn(): Promise<string> {
  const session = await signInOverHttp(BASE, EMAIL, PASSWORD);
  if (!session) throw new Error("sign-in refused");
  return session;
}

function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1));
  return sorted[i]!;
}

const ms = (x: number) => `${Math.round(x)} ms`;

async function main() {
  const db = createDb(process.env.DATABASE_URL!, 2);
  const cookie = await signIn();
  const demo = await db
    .selectFrom("scenarios")
    .select(["id", "project_id", "name", "climate_dataset_id", "input", "input_version"])
    .where("archived_at", "is", null)
    .orderBy("created_at")
    .executeTakeFirstOrThrow();
  const p = demo.project_id;
  const s = demo.id;
  const pages = [
    ["projects", "/projects"],
    ["project", `/projects/${p}`],
    ["comparison", `/projects/${p}/scenarios/${s}`],
    ["editor", `/projects/${p}/scenarios/${s}/edit`],
    ["versions", `/projects/${p}/scenarios/${s}/versions`],
  ] as const;

  const get = async (path: string) => {
    const t0 = performance.now();
    const res = await fetch(BASE + path, { headers: { cookie }, redirect: "manual", signal: AbortSignal.timeout(60_000) });
    const body = await res.arrayBuffer();
    return { status: res.status, bytes: body.byteLength, ms: performance.now() - t0 };
  };

  console.log(`[load] ${BASE} — unloaded pages (median of 15 after 2 warm-ups)`);
  const unloaded: Record<string, { medianMs: number; bytes: number; status: number }> = {};
  for (const [name, path] of pages) {
    await get(path);
    await get(path);
    const runs = [];
    for (let i = 0; i < 15; i++) runs.push(await get(path));
    const times = runs.map((r) => r.ms).sort((a, b) => a - b);
    unloaded[name] = { medianMs: quantile(times, 0.5), bytes: runs.at(-1)!.bytes, status: runs.at(-1)!.status };
    console.log(`  ${name.padEnd(11)} ${String(Math.round(unloaded[name].medianMs)).padStart(5)} ms  ${(unloaded[name].bytes / 1024).toFixed(0).padStart(5)} KB  HTTP ${unloaded[name].status}`);
  }

  // One copy of the demo scenario per client for saves (no two clients ever race on one revision).
  const copies = await db
    .insertInto("scenarios")
    .values(
      Array.from({ length: CLIENTS }, (_, i) => ({
        project_id: p,
        name: `load-test copy ${i + 1}`,
        climate_dataset_id: demo.climate_dataset_id,
        input: JSON.stringify(demo.input),
        input_version: demo.input_version,
      })),
    )
    .returning(["id", "revision"])
    .execute();

  const actions = loadServerActions();
  const saveId = actionId(actions, "saveScenarioAction");
  const doc = demo.input as { upkeep?: { labourRatePerHour?: number } };

  type Kind = "page" | "whatIf" | "save";
  const samples: { kind: Kind; ms: number; status: number; ok: boolean }[] = [];
  const deadline = performance.now() + SECONDS * 1000;
  const rng = mulberry32(SEED);

  async function client(i: number) {
    const copy = copies[i]!;
    let revision = copy.revision;
    let n = 0;
    while (performance.now() < deadline) {
      const r = rng();
      const t0 = performance.now();
      let kind: Kind = "page";
      let status = 0;
      let ok = false;
      try {
        if (r < 0.6) {
          const [, path] = pages[Math.floor(rng() * pages.length)]!;
          const res = await get(path);
          status = res.status;
          ok = status === 200;
        } else if (r < 0.85) {
          kind = "whatIf";
          const res = await fetch(`${BASE}/api/scenarios/${s}/what-if`, {
            method: "POST",
            headers: { cookie, "content-type": "application/json", origin: BASE },
            body: JSON.stringify({ electricityPriceFactor: 0.8 + 0.4 * rng(), discountRate: 0.03 + 0.04 * rng() }),
            signal: AbortSignal.timeout(60_000),
          });
          await res.arrayBuffer();
          status = res.status;
          ok = status === 200;
        } else {
          kind = "save";
          n++;
          const document = { ...doc, upkeep: { ...doc.upkeep, labourRatePerHour: 80 + ((i * 997 + n * 13) % 400) / 10 } };
          const res = await callAction(
            BASE,
            `/projects/${p}/scenarios/${copy.id}/edit`,
            saveId,
            [p, copy.id, { revision, name: `load-test copy ${i + 1}`, climateDatasetId: demo.climate_dataset_id, document }],
            { cookie, timeoutMs: 60_000 },
          );
          status = res.status;
          const rev = /"revision":(\d+)/.exec(res.text) ?? /"currentRevision":(\d+)/.exec(res.text);
          if (rev) revision = Number(rev[1]);
          ok = status === 200 && /"ok":true/.test(res.text);
        }
      } catch {
        status = 0;
      }
      samples.push({ kind, ms: performance.now() - t0, status, ok });
    }
  }

  console.log(`[load] ${CLIENTS} clients × ${SECONDS} s: pages 60 %, what-if 25 %, saves 15 % (seed ${SEED})`);
  const t0 = performance.now();
  await Promise.all(Array.from({ length: CLIENTS }, (_, i) => client(i)));
  const wall = (performance.now() - t0) / 1000;

  const report = (label: string, list: typeof samples) => {
    const t = list.map((x) => x.ms).sort((a, b) => a - b);
    const errors = list.filter((x) => !x.ok).length;
    const byStatus = new Map<number, number>();
    for (const x of list) byStatus.set(x.status, (byStatus.get(x.status) ?? 0) + 1);
    const statuses = [...byStatus].sort((a, b) => a[0] - b[0]).map(([k, v]) => `${k}:${v}`).join(" ");
    console.log(
      `  ${label.padEnd(8)} n=${String(list.length).padStart(5)}  p50 ${ms(quantile(t, 0.5)).padStart(8)}  p95 ${ms(quantile(t, 0.95)).padStart(8)}  max ${ms(t.at(-1) ?? NaN).padStart(8)}  not-ok ${errors}  [${statuses}]`,
    );
  };
  console.log(`[load] ${samples.length} requests in ${wall.toFixed(1)} s = ${(samples.length / wall).toFixed(1)} requests/s`);
  report("all", samples);
  report("pages", samples.filter((x) => x.kind === "page"));
  report("what-if", samples.filter((x) => x.kind === "whatIf"));
  report("saves", samples.filter((x) => x.kind === "save"));

  await db.deleteFrom("scenarios").where("id", "in", copies.map((c) => c.id)).execute();
  await db.destroy();
}

main().catch((err) => {
  console.error("[load] failed:", err);
  process.exitCode = 1;
});
