/**
 * Latency of the physical what-if route under load, against a trivial authenticated route in the same run.
 * Loopback only, bounded (a fixed number of requests per phase). Needs a running app with the demo seed:
 *
 *   BASE_URL=http://127.0.0.1:3016 npx tsx scripts/bench-what-if.ts
 *
 * Signs the demo consultant in over HTTP, then for 1 and 16 concurrent users: the trivial route alone
 * (GET /api/auth/session, which decodes the session), the what-if alone (each request moves the load and the
 * climate shift to new values, so the physics is re-run every time), and the trivial route probed while 16
 * users move what-if sliders. Prints p50/p95 (wall clock, ms) per phase.
 */
import pg from "pg";
import { signInOverHttp } from "./support/http-session";

const BASE = process.env.BASE_URL ?? "http://127.0.0.1:3000";
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

async function timed(f: () => Promise<Response>): Promise<number> {
  const t0 = performance.now();
  const r = await f();
  await r.arrayBuffer();
  if (!r.ok) throw new Error(`HTTP ${r.status}`);
  return performance.now() - t0;
}

async function main() {
  const cookie = await signIn();
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  const row = await client.query("select id from scenarios where name like 'Condenser heat rejection:%' order by created_at asc limit 1");
  await client.end();
  const scenarioId = row.rows[0]?.id as string;
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
  for (let i = 0; i < 5; i++) await timed(whatIf);
  for (let i = 0; i < 5; i++) await timed(trivial);

  const users = async (n: number, f: () => Promise<Response>, per: number) => {
    const times: number[] = [];
    await Promise.all(
      Array.from({ length: n }, async () => {
        for (let i = 0; i < per; i++) times.push(await timed(f));
      }),
    );
    return times;
  };
  const line = (label: string, t: number[]) =>
    console.log(`${label.padEnd(58)} n=${String(t.length).padStart(4)}  p50 ${pct(t, 0.5).toFixed(1).padStart(7)} ms  p95 ${pct(t, 0.95).toFixed(1).padStart(7)} ms`);

  console.log(`what-if route under load, ${BASE} (loopback), ${PER_USER} requests per user`);
  for (const n of [1, 16]) {
    line(`trivial authenticated route, ${n} user(s)`, await users(n, trivial, PER_USER));
    line(`physical what-if (load + climate shift), ${n} user(s)`, await users(n, whatIf, PER_USER));
    let probing = true;
    const probe: number[] = [];
    const probeLoop = (async () => {
      while (probing) probe.push(await timed(trivial));
    })();
    await users(n, whatIf, PER_USER);
    probing = false;
    await probeLoop;
    line(`trivial route while ${n} user(s) move what-if sliders`, probe);
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
