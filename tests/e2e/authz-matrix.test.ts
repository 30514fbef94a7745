import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import path from "node:path";
import { createDb } from "@/db/client";
import type { Action, ProjectRelation } from "@/lib/auth/permissions";
import { expectedAllowed } from "../support/authz-table";
import { BASE_URL } from "./support";
import { buildMatrixWorld, ROLES, sacrificialInvitation, sacrificialViewer, type MatrixWorld, type Role } from "./authz-fixtures";

/**
 * The authorization matrix, against the running app: EVERY page and route handler under app/ (found by
 * scanning the folder now, so a new route cannot be forgotten) × every role × the ids of this firm's
 * project (own), of another firm's project (foreign) and — where a route has a child id — this project's
 * id with another firm's child id (mixed, the insecure-direct-object-reference probe) → the expected
 * status. A refused response must carry nothing of the object; no response may carry a password hash, an
 * invitation token hash, or an invitation token (except the invitation page of that very token).
 *
 * Expectations come from the literal table tests/support/authz-table.ts (never from lib/auth): anonymous → sign-in (pages) or 401 (APIs); no relation
 * to the project → 404; a relation without the action → 403 (404 where client viewers must not learn
 * that a draft exists); otherwise the route's own success status.
 */
const db = createDb(process.env.DATABASE_URL!, 3);
const APP_DIR = path.resolve(__dirname, "../../app");
type Variant = "own" | "foreign" | "mixed";

// ————————————————————————————————————————— route discovery
interface DiscoveredRoute {
  key: string;
  pattern: string;
  kind: "page" | "handler";
  method: string;
  file: string;
  params: string[];
}

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE", "HEAD", "OPTIONS"] as const;

function handlerMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:async\s+)?function\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s+const\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS)\b/g)) found.add(m[1]!);
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const part of m[1]!.split(",")) {
      const name = part.trim().split(/\s+as\s+/).pop()?.trim();
      if (name && (METHODS as readonly string[]).includes(name)) found.add(name);
    }
  }
  return [...found].sort();
}

export function discoverRoutes(dir = APP_DIR, segments: string[] = []): DiscoveredRoute[] {
  const out: DiscoveredRoute[] = [];
  for (const entry of readdirSync(dir).sort()) {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) {
      // Private folders (_components) and parallel-route slots are not URL segments with routes of their own.
      if (entry.startsWith("_") || entry.startsWith("@")) continue;
      const seg = /^\(.*\)$/.test(entry) ? null : entry;
      out.push(...discoverRoutes(full, seg ? [...segments, seg] : segments));
      continue;
    }
    const pattern = `/${segments.join("/")}`;
    const params = segments.filter((s) => s.startsWith("[")).map((s) => s.replace(/^\[(\.\.\.)?/, "").replace(/\]$/, ""));
    const rel = path.relative(APP_DIR, full);
    if (/^page\.(tsx|ts|jsx|js)$/.test(entry)) out.push({ key: `GET ${pattern}`, pattern, kind: "page", method: "GET", file: rel, params });
    if (/^route\.(ts|js)$/.test(entry)) {
      const methods = handlerMethods(readFileSync(full, "utf8"));
      if (methods.length === 0) out.push({ key: `? ${pattern}`, pattern, kind: "handler", method: "?", file: rel, params });
      for (const method of methods) out.push({ key: `${method} ${pattern}`, pattern, kind: "handler", method, file: rel, params });
    }
  }
  return out;
}

// ————————————————————————————————————————— expectations
interface Expected {
  status: number;
  /** For redirects: where to. */
  location?: RegExp;
}
interface Case {
  role: Role;
  variant: Variant;
}
interface Rule {
  expect(c: Case): Expected;
  variants?: Variant[];
  /** A concrete path for routes whose URL is not made from ids (catch-alls). */
  paths?: string[];
  query?(w: MatrixWorld, v: Variant): string;
  body?(w: MatrixWorld, v: Variant): unknown;
  /** false: the response is about the object by design (the invitation page to its token holder). */
  leakCheck?: boolean;
}

const SIGNIN: Expected = { status: 307, location: /\/signin(\?|$)/ };
const CLIENTS: readonly ProjectRelation[] = ["owner", "finance"];

/** The role's relation to the project the URL names (own → firm A's P, foreign → firm B's C). */
function relationOf(role: Role, variant: Variant): ProjectRelation | null {
  const project = variant === "foreign" ? "C" : "P";
  if (project === "P") {
    return ({ admin: "admin", consultant: "consultant", owner: "owner", finance: "finance" } as Partial<Record<Role, ProjectRelation>>)[role] ?? null;
  }
  return role === "consultantOther" ? "consultant" : null;
}

interface ProjectRuleOptions {
  /** The route answers client viewers lacking the action with 404 (drafts: they must not learn one exists). */
  hideFromClients?: boolean;
  /** Client viewers are redirected (before the child id is even looked up). */
  clientRedirect?: RegExp;
  ok?: number;
  /** A role allowed to act still gets this (the request carries no valid payload: authorization passed, validation refused). */
  authorizedButInvalid?: number;
  api?: boolean;
}

function projectRule(action: Action, o: ProjectRuleOptions = {}): Omit<Rule, "variants"> {
  return {
    expect({ role, variant }) {
      if (role === "anonymous") return o.api ? { status: 401 } : SIGNIN;
      const rel = relationOf(role, variant);
      if (!rel) return { status: 404 };
      const client = CLIENTS.includes(rel);
      if (o.clientRedirect && client) return { status: 307, location: o.clientRedirect };
      if (!expectedAllowed(rel, action)) return { status: o.hideFromClients && client ? 404 : 403 };
      if (variant === "mixed") return { status: 404 };
      return { status: o.authorizedButInvalid ?? o.ok ?? 200 };
    },
  };
}

const page = (action: Action, o: ProjectRuleOptions = {}) => projectRule(action, o);
const api = (action: Action, o: ProjectRuleOptions = {}) => projectRule(action, { ...o, api: true });

/** Pages any signed-in person may open. */
const signedInPage: Rule = { expect: ({ role }) => (role === "anonymous" ? SIGNIN : { status: 200 }), variants: ["own"] };

const FIRM_MEMBERS: Role[] = ["admin", "consultant", "consultantOther"];

export const EXPECTATIONS: Record<string, Rule> = {
  "GET /": {
    variants: ["own"],
    expect: ({ role }) => (role === "anonymous" ? SIGNIN : { status: 307, location: /\/projects$/ }),
  },
  "GET /signin": {
    variants: ["own"],
    expect: ({ role }) => (role === "anonymous" ? { status: 200 } : { status: 307, location: /\/projects$/ }),
  },
  "GET /invite/[token]": { variants: ["own", "foreign"], expect: () => ({ status: 200 }), leakCheck: false },
  "GET /account": signedInPage,
  "GET /projects": signedInPage,
  "GET /firm": {
    variants: ["own"],
    expect: ({ role }) => (role === "anonymous" ? SIGNIN : { status: role === "admin" ? 200 : 403 }),
  },
  "GET /methods": signedInPage,
  "GET /projects/new": {
    variants: ["own"],
    expect: ({ role }) => (role === "anonymous" ? SIGNIN : { status: FIRM_MEMBERS.includes(role) ? 200 : 403 }),
  },
  "GET /projects/[projectId]": page("project.view"),
  "GET /projects/[projectId]/edit": page("project.edit"),
  "GET /projects/[projectId]/access": page("access.share"),
  "GET /projects/[projectId]/climate/import": page("climate.manage"),
  "GET /projects/[projectId]/climate/bins": page("climate.manage"),
  "GET /projects/[projectId]/climate/[datasetId]": page("project.view"),
  "GET /projects/[projectId]/scenarios/[scenarioId]": page("scenario.viewDraft", { clientRedirect: /\/scenarios\/[0-9a-f-]{36}\/versions$/ }),
  "GET /projects/[projectId]/scenarios/[scenarioId]/edit": page("scenario.edit", { hideFromClients: true }),
  "GET /projects/[projectId]/scenarios/[scenarioId]/versions": page("scenario.viewIssued"),
  "GET /projects/[projectId]/scenarios/[scenarioId]/versions/[version]": page("scenario.viewIssued"),

  // next-auth's own endpoints: public by design; the credentials POST is exercised by every sign-in above.
  "GET /api/auth/[...nextauth]": { variants: ["own"], paths: ["/api/auth/session", "/api/auth/csrf", "/api/auth/providers"], expect: () => ({ status: 200 }) },
  "POST /api/auth/[...nextauth]": {
    variants: ["own"],
    paths: ["/api/auth/callback/credentials"],
    body: () => ({}),
    // No CSRF token in the body: next-auth refuses and sends the browser back to sign-in.
    expect: () => ({ status: 302, location: /\/signin|csrf=true/ }),
  },

  "GET /api/projects/[projectId]/access": api("access.share"),
  "DELETE /api/projects/[projectId]/access/[userId]": api("access.revoke"),
  "GET /api/projects/[projectId]/invitations": api("access.share"),
  "POST /api/projects/[projectId]/invitations": {
    ...api("access.share", { ok: 201 }),
    body: (w) => ({ email: `matrix-invitee-${Math.random().toString(36).slice(2)}.${w.tag}@example.test`, role: "owner" }),
  },
  "DELETE /api/projects/[projectId]/invitations/[invitationId]": api("access.revoke"),
  "GET /api/projects/[projectId]/comments": {
    ...api("scenario.viewIssued"),
    variants: ["own", "foreign", "mixed"],
    query: (w, v) => `?versionId=${v === "own" ? w.P.versionId : w.C.versionId}`,
  },
  "POST /api/projects/[projectId]/comments": {
    ...api("scenario.comment", { ok: 201 }),
    variants: ["own", "foreign", "mixed"],
    body: (w, v) => ({ versionId: v === "own" ? w.P.versionId : w.C.versionId, body: "Matrix comment" }),
  },
  "GET /api/projects/[projectId]/climate": api("project.view"),
  // A JSON body is not the multipart upload the route reads: past authorization it is refused as 415.
  "POST /api/projects/[projectId]/climate": { ...api("climate.manage", { authorizedButInvalid: 415 }), body: () => ({}) },

  "GET /api/scenarios/[scenarioId]/results": api("project.view"),
  "GET /api/scenarios/[scenarioId]/export": api("project.view"),
  "POST /api/scenarios/[scenarioId]/what-if": { ...api("scenario.whatIf"), body: () => ({ electricityPriceFactor: 1.1 }) },
  "GET /api/scenarios/[scenarioId]/report": api("report.downloadPdf"),
  "GET /api/scenarios/[scenarioId]/workbook": api("report.downloadWorkbook"),
  "GET /api/scenarios/[scenarioId]/csv/[table]": api("report.downloadWorkbook"),
  "POST /api/v1/analyses": {
    variants: ["own"],
    body: () => ({}),
    // Any signed-in person may analyse a document of their own; nothing is read or stored.
    expect: ({ role }) => ({ status: role === "anonymous" ? 401 : 422 }),
  },
  "GET /api/health/live": { variants: ["own"], expect: () => ({ status: 200 }) },
  "GET /api/health/ready": { variants: ["own"], expect: () => ({ status: 200 }) },
  "GET /api/v1/analyses/[analysisId]": {
    variants: ["own"],
    // A queued analysis is its requester's alone; an id that is not yours is answered like an unknown one.
    paths: ["/api/v1/analyses/00000000-0000-4000-8000-000000000013", "/api/v1/analyses/not-a-uuid"],
    expect: ({ role }) => ({ status: role === "anonymous" ? 401 : 404 }),
  },
};

// ————————————————————————————————————————— building requests
function variantsOf(route: DiscoveredRoute, rule: Rule): Variant[] {
  if (rule.variants) return rule.variants;
  const hasProject = route.params.includes("projectId") || route.params.includes("scenarioId");
  const hasChild = route.params.some((p) => p !== "projectId");
  if (!hasProject) return ["own"];
  return route.params.includes("projectId") && hasChild ? ["own", "foreign", "mixed"] : ["own", "foreign"];
}

/** The id for a route parameter. Destructive routes get a fresh object for every case. */
async function paramValue(name: string, w: MatrixWorld, variant: Variant): Promise<string> {
  const owner = variant === "own" ? w.P : w.C;
  const child = variant === "mixed" ? w.C : owner;
  switch (name) {
    case "projectId":
      return variant === "foreign" ? w.C.id : w.P.id;
    case "scenarioId":
      return child.scenarioId;
    case "version":
      return "1";
    case "datasetId":
      return child.datasetId;
    case "token":
      return variant === "own" ? w.tokens[0]! : w.tokens[1]!;
    case "table":
      return "cashflows";
    case "invitationId":
      return sacrificialInvitation(db, child.id, w.tag);
    case "userId":
      return sacrificialViewer(db, child.id, w.tag);
    default:
      throw new Error(`authz-matrix: no id for route parameter [${name}]: add it to paramValue()`);
  }
}

async function urlFor(route: DiscoveredRoute, w: MatrixWorld, variant: Variant): Promise<string> {
  let url = route.pattern;
  for (const name of route.params) url = url.replace(new RegExp(`\\[(\\.\\.\\.)?${name}\\]`), await paramValue(name, w, variant));
  return url;
}

interface Observation {
  key: string;
  url: string;
  role: Role;
  variant: Variant;
  expected: Expected;
  status: number;
  location: string | null;
  body: string;
}

const observations: Observation[] = [];

async function request(w: MatrixWorld, route: DiscoveredRoute, rule: Rule, role: Role, variant: Variant, url: string): Promise<Observation> {
  const headers: Record<string, string> = { origin: BASE_URL };
  const cookie = w.cookies[role];
  if (cookie) headers.cookie = cookie;
  const body = rule.body?.(w, variant);
  let payload: string | undefined;
  if (body !== undefined && route.method !== "GET") {
    headers["content-type"] = route.key.includes("/api/auth/") ? "application/x-www-form-urlencoded" : "application/json";
    payload = route.key.includes("/api/auth/") ? new URLSearchParams(body as Record<string, string>).toString() : JSON.stringify(body);
  }
  const full = `${BASE_URL}${url}${rule.query?.(w, variant) ?? ""}`;
  const res = await fetch(full, { method: route.method, headers, body: payload, redirect: "manual" });
  const text = await res.text();
  return {
    key: route.key,
    url: full,
    role,
    variant,
    expected: rule.expect({ role, variant }),
    status: res.status,
    location: res.headers.get("location"),
    body: text,
  };
}

async function inBatches<T>(items: (() => Promise<T>)[], size: number): Promise<T[]> {
  const out: T[] = [];
  for (let i = 0; i < items.length; i += size) out.push(...(await Promise.all(items.slice(i, i + size).map((f) => f()))));
  return out;
}

// ————————————————————————————————————————— the tests
const routes = discoverRoutes();
let world: MatrixWorld;

beforeAll(async () => {
  world = await buildMatrixWorld(db);
}, 180_000);

afterAll(async () => {
  const summary = {
    cases: observations.length,
    routes: new Set(observations.map((o) => o.key)).size,
    failures: observations.filter((o) => !matches(o)).map((o) => ({ ...o, body: o.body.slice(0, 200) })),
  };
  mkdirSync(path.resolve(__dirname, "../../test-results"), { recursive: true });
  writeFileSync(path.resolve(__dirname, "../../test-results/authz-matrix.json"), JSON.stringify(summary, null, 2));
  console.log(`[authz-matrix] ${summary.cases} cases over ${summary.routes} route entries × ${ROLES.length} roles; ${summary.failures.length} mismatches`);
  await db.destroy();
});

function matches(o: Observation): boolean {
  if (o.status !== o.expected.status) return false;
  if (o.expected.location && !o.expected.location.test(o.location ?? "")) return false;
  return true;
}

describe("every route under app/ has an expectation", () => {
  it("no route is unknown to the matrix", () => {
    const unknown = routes.filter((r) => !EXPECTATIONS[r.key]).map((r) => `${r.key}   (app/${r.file})`);
    expect(
      unknown,
      `These routes have no expectation in tests/e2e/authz-matrix.test.ts EXPECTATIONS; add one for each (which action, which status):\n  ${unknown.join("\n  ")}`,
    ).toEqual([]);
  });
  it("no expectation names a route that is gone", () => {
    const keys = new Set(routes.map((r) => r.key));
    expect(Object.keys(EXPECTATIONS).filter((k) => !keys.has(k))).toEqual([]);
  });
});

describe("authorization matrix: route × role × object", () => {
  for (const route of routes) {
    const rule = EXPECTATIONS[route.key];
    if (!rule) continue;
    it(route.key, async () => {
      const jobs: (() => Promise<Observation>)[] = [];
      for (const variant of variantsOf(route, rule)) {
        for (const role of ROLES) {
          const paths = rule.paths ?? [null];
          for (const fixed of paths) {
            jobs.push(async () => request(world, route, rule, role, variant, fixed ?? (await urlFor(route, world, variant))));
          }
        }
      }
      const results = await inBatches(jobs, 4);
      observations.push(...results);
      const wrong = results.filter((o) => !matches(o));
      expect(
        wrong.map((o) => `${o.role} ${o.variant} ${o.url.replace(BASE_URL, "")}: got ${o.status}${o.location ? ` → ${o.location}` : ""}, expected ${o.expected.status}${o.expected.location ? ` → ${o.expected.location}` : ""}`),
      ).toEqual([]);

      // A refused response carries nothing of the object it refused.
      if (rule.leakCheck !== false) {
        for (const o of results.filter((r) => r.status >= 300)) {
          const markers = o.variant === "own" ? world.P.markers : o.variant === "foreign" ? world.C.markers : [...world.C.markers, ...world.P.markers];
          for (const m of markers) expect(o.body.includes(m), `${o.role} ${o.variant} ${o.url}: refused (${o.status}) but shows "${m}"`).toBe(false);
        }
      }
    });
  }
});

describe("nothing secret leaves the server", () => {
  it("no page or API response carries a password hash, a token hash or someone's invitation token", async () => {
    expect(observations.length).toBeGreaterThan(100);
    const hashes = (await db.selectFrom("invitations").select("token_hash").execute()).map((r) => r.token_hash);
    const bcrypt = /\$2[aby]\$\d{2}\$[./A-Za-z0-9]{53}/;
    for (const o of observations) {
      expect(bcrypt.test(o.body), `${o.role} ${o.url}: bcrypt hash in the response`).toBe(false);
      for (const h of hashes) expect(o.body.includes(h), `${o.role} ${o.url}: token hash in the response`).toBe(false);
      for (const t of world.tokens) {
        if (o.url.includes(`/invite/${t}`)) continue;
        expect(o.body.includes(t), `${o.role} ${o.url}: an invitation token in the response`).toBe(false);
      }
    }
  });
});
