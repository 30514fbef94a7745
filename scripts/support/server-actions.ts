import { readFileSync } from "node:fs";
import path from "node:path";

/**
 * Server actions of a production build, found by their exported name in the build's
 * server-reference manifest, and called over plain HTTP the way the browser's router calls them
 * (POST to a page that uses the action, `Next-Action: <id>`, the arguments as a JSON array).
 */
export interface ServerActionRef {
  id: string;
  exportedName: string;
  filename: string;
  /** App paths of pages that import the action, e.g. "app/(app)/projects/[projectId]/page". */
  workers: string[];
}

interface ManifestEntry {
  workers: Record<string, unknown>;
  filename?: string;
  exportedName?: string;
}

export function loadServerActions(distDir = process.env.NEXT_DIST_DIR ?? ".next", root = process.cwd()): ServerActionRef[] {
  const file = path.join(root, distDir, "server", "server-reference-manifest.json");
  const manifest = JSON.parse(readFileSync(file, "utf8")) as { node: Record<string, ManifestEntry> };
  return Object.entries(manifest.node).map(([id, e]) => ({
    id,
    exportedName: e.exportedName ?? "",
    filename: e.filename ?? "",
    workers: Object.keys(e.workers),
  }));
}

export function actionId(actions: ServerActionRef[], exportedName: string, filenameIncludes = ""): string {
  const hit = actions.find((a) => a.exportedName === exportedName && a.filename.includes(filenameIncludes));
  if (!hit) throw new Error(`No server action ${exportedName} in the build manifest`);
  return hit.id;
}

/** POST a server action with a raw body (the fuzz test sends broken ones) and return status and text. */
export async function postAction(
  baseUrl: string,
  pagePath: string,
  id: string,
  body: BodyInit,
  opts: { cookie?: string; contentType?: string; headers?: Record<string, string>; timeoutMs?: number } = {},
): Promise<{ status: number; text: string; ms: number }> {
  const t0 = performance.now();
  const res = await fetch(baseUrl + pagePath, {
    method: "POST",
    redirect: "manual",
    headers: {
      "next-action": id,
      accept: "text/x-component",
      "content-type": opts.contentType ?? "text/plain;charset=UTF-8",
      origin: baseUrl,
      ...(opts.cookie ? { cookie: opts.cookie } : {}),
      ...opts.headers,
    },
    body,
    signal: AbortSignal.timeout(opts.timeoutMs ?? 60_000),
  });
  const text = await res.text();
  return { status: res.status, text, ms: performance.now() - t0 };
}

/** Call an action with JSON-encodable arguments (no string may start with "$", which React reserves). */
export function callAction(baseUrl: string, pagePath: string, id: string, args: unknown[], opts: { cookie?: string; timeoutMs?: number } = {}) {
  return postAction(baseUrl, pagePath, id, JSON.stringify(args), opts);
}
