import { NextResponse } from "next/server";
import { readiness } from "@/lib/health/probe";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/**
 * Readiness: the database answers and the job queue is installed → 200; otherwise 503 with Retry-After
 * (a load balancer sends no traffic here meanwhile). Also says when a worker last ran the queue's
 * maintenance (null: no worker has run yet), which does not change the status. Public, no detail of errors.
 */
export async function GET() {
  const r = await readiness();
  return NextResponse.json(
    { status: r.ready ? "ready" : "unavailable", database: r.database, queue: r.queue },
    { status: r.ready ? 200 : 503, headers: { "cache-control": "no-store", ...(r.ready ? {} : { "retry-after": "30" }) } },
  );
}
