import { describe, expect, it } from "vitest";
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { defaultCell, methodsDocument } from "@/lib/methods";
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
    // Each row names the input, then its key in the scenario file in parentheses.
    const fields = new Set(table.rows.map((r) => /\(([^()]+)\)$/.exec(r[0] ?? "")?.[1]));
    for (const key of Object.keys(fieldDefaults)) expect(fields, key).toContain(key);
    for (const r of table.rows) expect(r[2]?.trim().length, `source of ${r[0]}`).toBeGreaterThan(0);
  });

  it("shows each default as a person reads it: percent ×100, units, yes/no, words (hand conversions)", () => {
    // 0.005 as a fraction per year = 0.5 %/yr; a drift of 0.00005 of the flow = 0.005 % (hand calculation).
    expect(defaultCell("tariffs.escalation.energy", 0.005)).toBe("0.5 %/yr");
    expect(defaultCell("options[].driftFractionOfFlow", 0.00005)).toBe("0.005 % of flow");
    expect(defaultCell("options[].fan.minSpeedFraction", 0.25)).toBe("25 %");
    expect(defaultCell("options[].basinHeater.setPointC", 4.4)).toBe("4.4\u00a0°C");
    expect(defaultCell("economics.baseYear", 2026)).toBe("2026");
    expect(defaultCell("options[].cooler.allowDryMode", true)).toBe("yes");
    expect(defaultCell("options[].fan.control", "variableSpeed")).toBe("variable speed");
    const table = doc.blocks.find((b) => b.kind === "table");
    if (table?.kind !== "table") throw new Error("no defaults table");
    const row = table.rows.find((r) => r[0]?.endsWith("(tariffs.escalation.energy)"));
    expect(row?.[0]).toBe("Real escalation: Escalation of electric energy (tariffs.escalation.energy)");
    expect(row?.[1]).toBe("0.5 %/yr");
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
