/**
 * Latency of the physical what-if route under load, against a trivial authenticated route in the same run.
 * Loopback only, bounded (a fixed number of requests per phase). Needs a running app with the demo seed and
 * DATABASE_URL of its database (from the environment, else .env) to find the demo scenario:
 *
 *   BASE_URL=http://127.0.0.1:3016 npx tsx scripts/bench-what-if.ts
 *
 * Signs the demo consultant in over HTTP, then for 1 and 16 concurrent users: the trivial route alone
 * (GET /api/auth/session, which decodes the session), the what-if alone (each request moves the load and the
 * climate shift to new values, so the physics is re-run every time), and the trivial route probed while 16
 * users move what-if sliders. Prints p50/p95 (wall clock, ms) per phase. Every what-if answer must say that the
 * physics was re-run (`physicsRerun`), else the run stops: the figure would be the re-pricing alone.
 */
import pg from "pg";
import { loadDotEnv } from "./dotenv";
import { signInOverHttp } from "./support/http-session";

loadDotEnv();

const BASE = (process.env.BASE_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
if (!/^http:\/\/(127\.0\.0\.1|localhost)(:\d+)?$/.test(BASE)) throw new Error("The what-if bench runs against loopback only.");
const EMAIL = process.env.BENCH_EMAIL ?? "cole.consultant@corrandale.example";
const PASSWORD = process.env.BENCH_PASSWORD ?? "ledger-demo-2026";
const PER_USER = Number(process.env.BENCH_REQUESTS_PER_USER ?? 12);

async function signIn(): Promise<string> {
  const session = await signInOverHttp(BASE, EMAIL, PASSWORD);
  if (!session) throw new Error("sign-in refused");
  return session;
}

function pct(xs: number[], q: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.floor(q * (s.length - 1) + 0.5))] ?? Number.NaN;
}

/** Wall clock to the last byte; `check` then inspects the body (outside the timed span). */
async function timed(f: () => Promise<Response>, check?: (body: ArrayBuffer) => void): Promise<number> {
  const t0 = performance.now();
  const r = await f();
  const body = await r.arrayBuffer();
  const ms = performance.now() - t0;
  if (!r.ok) throw new Error(`HTTP ${r.status}: ${new TextDecoder().decode(body).slice(0, 200)}`);
  check?.(body);
  return ms;
}

/** A what-if answer that did not re-run the physics (e.g. the scenario could not be prepared) stops the run. */
function physicsWasRerun(body: ArrayBuffer): void {
  const j = JSON.parse(new TextDecoder().decode(body)) as { physicsRerun?: boolean };
  if (j.physicsRerun !== true) throw new Error("the what-if answer did not re-run the physics (physicsRerun is not true)");
}

async function main() {
  if (!process.env.DATABASE_URL) throw new Error("DATABASE_URL is not set (environment or .env): the bench reads the demo scenario's id from it.");
  const cookie = await signIn();
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const row = await client.query(
    "select id from scenarios where name like 'Condenser heat rejection:%' and archived_at is null order by created_at asc limit 1",
  );
  await client.end();
  const scenarioId = row.rows[0]?.id as string | undefined;
  if (!scenarioId) throw new Error("no demo scenario in this database: run `npm run db:seed`");
  let k = 0;
  const whatIf = () => {
    k++;
    // New values every request: the physics is re-run, not served from a cache.
    const body = { loadFactor: 0.8 + ((k * 7) % 40) / 100, climateShiftK: ((k * 3) % 12) / 4 - 1 };
    return fetch(`${BASE}/api/scenarios/${scenarioId}/what-if`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie },
      body: JSON.stringify(body),
    });
  };
  const trivial = () => fetch(`${BASE}/api/auth/session`, { headers: { cookie } });
  // Warm-up: JIT, the prepared scenario and the compressed climate's reference run.
  for (let i = 0; i < 5; i++) await timed(whatIf, physicsWasRerun);
  for (let i = 0; i < 5; i++) await timed(trivial);

  const users = async (n: number, f: () => Promise<Response>, per: number, check?: (body: ArrayBuffer) => void) => {
    const times: number[] = [];
    await Promise.all(
      Array.from({ length: n }, async () => {
        for (let i = 0; i < per; i++) times.push(await timed(f, check));
      }),
    );
    return times;
  };
  const line = (label: string, t: number[]) =>
    console.log(`${label.padEnd(58)} n=${String(t.length).padStart(4)}  p50 ${pct(t, 0.5).toFixed(1).padStart(7)} ms  p95 ${pct(t, 0.95).toFixed(1).padStart(7)} ms`);

  console.log(`what-if route under load, ${BASE} (loopback), ${PER_USER} requests per user`);
  for (const n of [1, 16]) {
    line(`trivial authenticated route, ${n} user(s)`, await users(n, trivial, PER_USER));
    line(`physical what-if (load + climate shift), ${n} user(s)`, await users(n, whatIf, PER_USER, physicsWasRerun));
    let probing = true;
    const probe: number[] = [];
    const probeLoop = (async () => {
      while (probing) probe.push(await timed(trivial));
    })();
    await users(n, whatIf, PER_USER, physicsWasRerun);
    probing = false;
    await probeLoop;
    line(`trivial route while ${n} user(s) move what-if sliders`, probe);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
