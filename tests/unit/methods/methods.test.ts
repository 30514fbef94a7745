import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { methodsDocument } from "@/lib/methods";
import { fieldDefaults } from "@/lib/scenarios/schema";
import { ENGINE_VERSION } from "@/lib/engine/version";

const ROOT = path.resolve(__dirname, "../../..");

function sourceFiles(dir: string): string[] {
  const out: string[] = [];
  for (const e of readdirSync(dir)) {
    if (e === "node_modules" || e.startsWith(".")) continue;
    const full = path.join(dir, e);
    if (statSync(full).isDirectory()) out.push(...sourceFiles(full));
    else if (/\.(ts|tsx|mjs)$/.test(e)) out.push(full);
  }
  return out;
}

describe("the methods document (lib/methods/methods.md)", () => {
  const doc = methodsDocument();
  const text = JSON.stringify(doc.blocks);

  it("names the engine version and leaves no placeholder", () => {
    expect(doc.engineVersion).toBe(ENGINE_VERSION);
    expect(text).toContain(`engine version ${ENGINE_VERSION}`);
    expect(text).not.toMatch(/\{\{[A-Z_]+\}\}/);
  });

  it("has the numbered sections the code cites, and explains the three tags", () => {
    const numbers = doc.blocks.flatMap((b) =>
      b.kind === "heading" && b.level === 2 ? [Number(/^(\d+)\./.exec(b.text)?.[1])] : [],
    );
    expect(numbers).toEqual(Array.from({ length: numbers.length }, (_, i) => i + 1));
    for (const tag of ["[pub]", "[practice]", "[memory]"]) expect(text).toContain(tag);
  });

  it("lists every default of the scenario schema with a source", () => {
    const table = doc.blocks.find((b) => b.kind === "table");
    expect(table?.kind).toBe("table");
    if (table?.kind !== "table") return;
    const fields = new Set(table.rows.map((r) => r[0]));
    for (const key of Object.keys(fieldDefaults)) expect(fields, key).toContain(key);
    for (const r of table.rows) expect(r[2]?.trim().length, `source of ${r[0]}`).toBeGreaterThan(0);
  });

  it("states one water-density convention", () => {
    expect(text).toMatch(/Water density: 998\.2 kg\/m³/);
  });

  it("is what code comments cite: every 'Methods §N' exists, nothing cites notes outside the repository", () => {
    const sections = new Set(
      doc.blocks.flatMap((b) =>
        b.kind === "heading" && b.level === 2 ? [/^(\d+)\./.exec(b.text)?.[1]] : [],
      ),
    );
    const bad: string[] = [];
    for (const f of ["app", "lib", "components", "db", "scripts", "tests"].flatMap((d) =>
      sourceFiles(path.join(ROOT, d)),
    )) {
      const src = readFileSync(f, "utf8");
      const rel = path.relative(ROOT, f);
      if (rel === "tests/unit/methods/methods.test.ts") continue;
      if (/engineering notes|engineering\.md|\/work\/shared/i.test(src))
        bad.push(`${rel}: cites notes outside the repository`);
      for (const m of src.matchAll(/Methods §(\d+)/g))
        if (!sections.has(m[1])) bad.push(`${rel}: Methods §${m[1]} does not exist`);
    }
    expect(bad).toEqual([]);
  });
});
