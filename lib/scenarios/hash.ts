import { createHash } from "node:crypto";

/**
 * Canonical JSON: object keys sorted, `undefined` members dropped, arrays kept in order, -0 written as 0.
 * Two documents that mean the same thing (keys in another order, an absent vs an undefined member)
 * give the same text, so their hash is the same.
 */
export function canonicalJson(value: unknown): string {
  return write(value);
}

function write(v: unknown): string {
  if (v === null) return "null";
  switch (typeof v) {
    case "number":
      // JSON has no NaN/Infinity; the schema rejects them before anything is hashed.
      if (!Number.isFinite(v)) throw new Error(`canonicalJson: ${v} is not a JSON number`);
      return Object.is(v, -0) ? "0" : JSON.stringify(v);
    case "string":
    case "boolean":
      return JSON.stringify(v);
    case "object": {
      if (Array.isArray(v)) return `[${v.map((x) => (x === undefined ? "null" : write(x))).join(",")}]`;
      if (v instanceof Date) return JSON.stringify(v.toISOString());
      const obj = v as Record<string, unknown>;
      const keys = Object.keys(obj)
        .filter((k) => obj[k] !== undefined)
        .sort();
      return `{${keys.map((k) => `${JSON.stringify(k)}:${write(obj[k])}`).join(",")}}`;
    }
    default:
      throw new Error(`canonicalJson: cannot encode a ${typeof v}`);
  }
}

/** sha256 (hex) of the canonical JSON of the engine input: the key under which a result is stored. */
export function inputsHash(engineInput: unknown): string {
  return createHash("sha256").update(canonicalJson(engineInput)).digest("hex");
}
