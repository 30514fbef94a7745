import { NextResponse } from "next/server";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** Liveness: the web process answers (nothing else is checked; a load balancer restarts it when this fails). */
export function GET() {
  return NextResponse.json({ status: "live", uptimeS: Math.round(process.uptime()) }, { headers: { "cache-control": "no-store" } });
}
