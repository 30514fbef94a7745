import { mulberry32 } from "@/lib/engine/random";

/**
 * Seeded malformed payloads for the fuzz tests (integration: every server action's data-access function;
 * e2e: the route handlers and the server-action envelope over HTTP). Same seed, same payloads: a failure
 * names its seed and index, and `fuzzPayloads(seed, …)[index]` rebuilds the payload.
 *
 * Each payload is a valid base input with at least one of its fields replaced by a value that no schema
 * may accept there (the wrong type, NUL or a lone surrogate, a huge string, deep nesting, an array of
 * 100,000 items, NaN/±Infinity, 1e308), plus random noise elsewhere (prototype keys, −0, 5e-324, extra
 * fields, missing fields). So a payload that was stored would mean a check is missing.
 */

export type Rand = () => number;

export const FAMILIES = [
  "wrongType",
  "missingField",
  "hugeString",
  "deepNesting",
  "prototypeKeys",
  "nonUuid",
  "specialNumber",
  "unsafeText",
  "hugeArray",
] as const;
export type Family = (typeof FAMILIES)[number];

const pick = <T>(r: Rand, xs: readonly T[]): T => xs[Math.floor(r() * xs.length)]!;

function deep(depth: number): unknown {
  let v: unknown = "leaf";
  for (let i = 0; i < depth; i++) v = i % 2 ? [v] : { a: v };
  return v;
}

function protoObject(r: Rand): unknown {
  // JSON.parse makes "__proto__" an own key, as a request body would.
  return JSON.parse(pick(r, ['{"__proto__":{"isAdmin":true}}', '{"constructor":{"prototype":{"polluted":1}}}', '{"__proto__":null,"toString":1}']));
}

/**
 * A value the field holding `was` (a valid string, number or boolean) cannot accept, by family: the wrong
 * type for that field, a huge or unsafe string, deep nesting, NaN/±Infinity or ±1e308 (beyond every range).
 */
export function badValue(r: Rand, family: Family, was: unknown): unknown {
  switch (family) {
    case "wrongType":
      if (typeof was === "number") return pick(r, ["42", true, false, {}, [], [1, 2], { value: 1 }, "1e3"]);
      if (typeof was === "boolean") return pick(r, ["true", "false", 1, 0, {}, [], [true]]);
      return pick(r, [true, false, 42, -1, {}, [], [1, 2], { value: 1 }, ["x"]]);
    case "hugeString":
      return "x".repeat(pick(r, [100_001, 250_000, 1_000_000]));
    case "deepNesting":
      return deep(pick(r, [50, 500, 5000]));
    case "prototypeKeys":
      return protoObject(r);
    case "nonUuid":
      // Wrong in shape for an id, and not a number / boolean / text a non-id field would take either.
      return pick(r, [{ id: "../../etc/passwd" }, ["00000000-0000-0000-0000-000000000000"], { $ne: null }]);
    case "specialNumber":
      return pick(r, [NaN, Infinity, -Infinity, 1e308, -1e308]);
    case "unsafeText":
      return pick(r, ["a\u0000b", "\u0000", "\uD800", "x\uDC00y", "\uDBFF", "ok\u0000'; drop table users; --"]);
    case "hugeArray":
      return Array.from({ length: 100_000 }, (_, i) => i);
    case "missingField":
      return pick(r, [{}, []]);
  }
}

/** Noise: values that may or may not be valid somewhere (they never make a broken payload valid). */
function noiseValue(r: Rand): unknown {
  return pick(r, [-0, 5e-324, "", " ", null, "not-a-uuid", "00000000-0000-0000-0000-000000000000", 0, 1, "0", protoObject(r), "\u202eevil", "é", "😀"]);
}

type Json = Record<string, unknown>;

/** Dotted paths of every scalar leaf (string, number, boolean) of a value. */
export function leafPaths(v: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (v === null || typeof v !== "object") return prefix.length ? [prefix] : [];
  const out: (string | number)[][] = [];
  if (Array.isArray(v)) v.forEach((x, i) => out.push(...leafPaths(x, [...prefix, i])));
  else for (const [k, x] of Object.entries(v)) out.push(...leafPaths(x, [...prefix, k]));
  return out;
}

function getAt(obj: unknown, path: (string | number)[]): unknown {
  let o = obj as Record<string | number, unknown> | undefined;
  for (const k of path) o = o?.[k] as Record<string | number, unknown> | undefined;
  return o;
}

function setAt(obj: unknown, path: (string | number)[], value: unknown): void {
  let o = obj as Record<string | number, unknown>;
  for (let i = 0; i < path.length - 1; i++) o = o[path[i]!] as Record<string | number, unknown>;
  o[path[path.length - 1]!] = value;
}

export interface FuzzPayload {
  family: Family;
  /** The field broken on purpose (dotted), or "(root)". */
  broken: string;
  value: unknown;
}

/**
 * `n` payloads from `base`: each breaks one (sometimes two or three) of the base's scalar leaves with a
 * family's bad value, then adds noise to other top-level keys (never to `keep`, e.g. the project id most
 * payloads need to pass the gate) and never to `ignored` leaves. About 3 % replace the whole input (null, a number, a string, an array).
 */
export function fuzzPayloads(seed: number, n: number, base: Json, opts: { keep?: string[]; keepRate?: number; ignored?: string[] } = {}): FuzzPayload[] {
  const r = mulberry32(seed);
  // Leaves the entry point ignores by design (e.g. the document's name, which the save's own name replaces).
  const ignored = opts.ignored ?? [];
  const leaves = leafPaths(base).filter((p) => !ignored.some((x) => p.join(".") === x || p.join(".").startsWith(`${x}.`)));
  const keep = new Set(opts.keep ?? []);
  const keepRate = opts.keepRate ?? 0.9;
  const out: FuzzPayload[] = [];
  for (let i = 0; i < n; i++) {
    const family = FAMILIES[i % FAMILIES.length]!;
    if (r() < 0.03) {
      out.push({ family: "wrongType", broken: "(root)", value: pick(r, [null, 0, "x", [], [base], true]) });
      continue;
    }
    const v = structuredClone(base) as Json;
    const candidates = leaves.filter((p) => !(keep.has(String(p[0])) && r() < keepRate));
    const targets = candidates.length ? candidates : leaves;
    const k = 1 + Math.floor(r() * r() * 3);
    const broken: string[] = [];
    for (let j = 0; j < k; j++) {
      const path = pick(r, targets);
      const fam = j === 0 ? family : pick(r, FAMILIES);
      setAt(v, path, badValue(r, fam, getAt(base, path)));
      broken.push(path.join("."));
    }
    // Noise on a top-level key that is not kept (and was not broken): extra or replaced.
    // (Deleting or replacing a field that is not broken never makes the payload valid.)
    if (r() < 0.6) {
      const keys = Object.keys(v).filter((key) => !keep.has(key) && !broken.some((b) => b.split(".")[0] === key));
      const x = r();
      const own = (key: string, value: unknown) => Object.defineProperty(v, key, { value, enumerable: true, configurable: true, writable: true });
      if (x < 0.4 || keys.length === 0) own(pick(r, ["__proto__", "constructor", "extra", "toString", "hasOwnProperty"]), noiseValue(r));
      else if (x < 0.7) delete v[pick(r, keys)];
      else own(pick(r, keys), noiseValue(r));
    }
    out.push({ family, broken: broken.join(","), value: v });
  }
  return out;
}

/** Raw bodies for the HTTP envelope: broken JSON and other wrongs a parser must refuse. */
export function brokenJsonBodies(seed: number, n: number, valid: string): string[] {
  const r = mulberry32(seed);
  const makers: (() => string)[] = [
    () => valid.slice(0, Math.max(1, Math.floor(r() * valid.length))),
    () => valid.replace(/"/, ""),
    () => `${valid}}`,
    () => "[".repeat(pick(r, [1000, 10_000, 100_000])),
    () => `{"a":${"[".repeat(5000)}${"]".repeat(5000)}}`,
    () => "\u0000\u0001\u0002",
    () => "{'single': 'quotes'}",
    () => "NaN",
    () => `{"x": 1e999999}`,
    () => "",
    // Two byte-order marks: a decoder may drop the first; the second is never JSON.
    () => `\uFEFF\uFEFF${valid}`,
    () => `{"__proto__": {"polluted": true}, "constructor": {"prototype": {"x": 1}}}`,
  ];
  return Array.from({ length: n }, (_, i) => makers[i % makers.length]!());
}

/** Totals by status code, printed as one line per test ("[fuzz] name: 422×1800 404×200"). */
export class StatusTally {
  readonly counts = new Map<number, number>();
  add(status: number): void {
    this.counts.set(status, (this.counts.get(status) ?? 0) + 1);
  }
  get total(): number {
    let t = 0;
    for (const c of this.counts.values()) t += c;
    return t;
  }
  text(): string {
    return [...this.counts.entries()].sort((a, b) => a[0] - b[0]).map(([s, c]) => `${s}×${c}`).join(" ");
  }
}
