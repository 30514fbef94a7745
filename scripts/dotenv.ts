import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

/** Load KEY=VALUE lines from .env into process.env (existing variables win). */
export function loadDotEnv(file = path.resolve(__dirname, "../.env")): void {
  if (!existsSync(file)) return;
  for (const line of readFileSync(file, "utf8").split(/\r?\n/)) {
    const m = /^\s*([A-Z0-9_]+)\s*=\s*(.*)\s*$/.exec(line);
    if (!m || line.trimStart().startsWith("#")) continue;
    const [, key, raw] = m as unknown as [string, string, string];
    if (process.env[key] === undefined) process.env[key] = raw.replace(/^"(.*)"$/, "$1");
  }
}
