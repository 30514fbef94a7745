/**
 * Bundles a Node entry point (the background worker, the engine benchmark) into one CommonJS file:
 * `node scripts/bundle.mjs <entry.ts> <out.cjs>`. The project's own modules are joined into one scope
 * (calls between engine modules are plain function calls); packages from node_modules stay external and
 * load from there at run time. A source map sits beside the output (run with --enable-source-maps).
 */
import { build } from "esbuild";

const [entry, outfile] = process.argv.slice(2);
if (!entry || !outfile) {
  console.error("usage: node scripts/bundle.mjs <entry.ts> <out.cjs>");
  process.exit(2);
}
await build({
  entryPoints: [entry],
  outfile,
  bundle: true,
  platform: "node",
  format: "cjs",
  target: "node20",
  packages: "external",
  sourcemap: true,
  tsconfig: "tsconfig.json",
  logLevel: "warning",
});
