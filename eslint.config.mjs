import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";

const config = [
  ...nextVitals,
  ...nextTs,
  // A leading underscore marks a parameter kept for its position (server actions called by useActionState
  // receive (prevState, formData) whether they use them or not).
  {
    rules: {
      "@typescript-eslint/no-unused-vars": ["warn", { argsIgnorePattern: "^_", varsIgnorePattern: "^_", caughtErrorsIgnorePattern: "^_" }],
    },
  },
  // Layering: lib never imports components; lib/engine stays pure (no framework, validation, database or auth).
  {
    files: ["lib/**/*.{ts,tsx,mjs}"],
    ignores: ["lib/engine/**"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ group: ["@/components", "@/components/*", "**/components/**"], message: "lib must not import components (move the shared piece into lib)." }] },
      ],
    },
  },
  {
    files: ["lib/engine/**/*.{ts,tsx,mjs}"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            { group: ["@/components", "@/components/*", "**/components/**"], message: "lib must not import components." },
            { group: ["next", "next/*", "next-auth", "next-auth/*"], message: "lib/engine is pure: no Next.js." },
            { group: ["react", "react/*", "react-dom", "react-dom/*"], message: "lib/engine is pure: no React." },
            { group: ["zod", "zod/*"], message: "lib/engine is pure: validation belongs to lib/scenarios." },
            { group: ["@/db", "@/db/*", "kysely", "pg"], message: "lib/engine is pure: no database." },
            { group: ["@/lib/auth", "@/lib/auth/*"], message: "lib/engine is pure: no auth." },
          ],
        },
      ],
    },
  },
  // Routes and pages reach the database through the data-access layer (lib/*/data.ts, db/queries), never
  // through the connection itself; scripts never import test code (shared helpers live in scripts/support).
  {
    files: ["app/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          paths: [
            { name: "@/db", message: "app/ reaches the database through lib/*/data.ts or db/queries, not the db instance." },
            { name: "kysely", allowTypeImports: true, message: "Queries live in db/queries; app/ may import kysely's types only." },
          ],
        },
      ],
    },
  },
  // Queries are written in db/queries only: lib and components may use kysely's types, not its builders
  // (lib/jobs/boss.ts is the queue's bridge onto the same connection and runs the queue's own SQL).
  {
    files: ["lib/**/*.{ts,tsx}"],
    ignores: ["lib/engine/**", "lib/jobs/boss.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          paths: [{ name: "kysely", allowTypeImports: true, message: "Queries live in db/queries; lib may import kysely's types only." }],
          patterns: [{ group: ["@/components", "@/components/*", "**/components/**"], message: "lib must not import components (move the shared piece into lib)." }],
        },
      ],
    },
  },
  {
    files: ["components/**/*.{ts,tsx}"],
    rules: {
      "no-restricted-imports": [
        "error",
        { paths: [{ name: "kysely", allowTypeImports: true, message: "Queries live in db/queries; components may import kysely's types only." }] },
      ],
    },
  },
  {
    files: ["scripts/**/*.{ts,mjs}"],
    // Freezes the regression guard from the test's own case list (issue 15's engine-speed work owns it).
    ignores: ["scripts/engine-regression.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        { patterns: [{ group: ["@/tests/*", "**/tests/**"], message: "scripts must not import tests (move the shared helper to scripts/support)." }] },
      ],
    },
  },
  // Migrations are frozen in time and typed against Kysely<any> on purpose.
  { files: ["migrations/**/*.ts", "db/migrate.ts"], rules: { "@typescript-eslint/no-explicit-any": "off" } },
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".data/**", "test-results/**", "next-env.d.ts"] },
];

export default config;
