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
  // Migrations are frozen in time and typed against Kysely<any> on purpose.
  { files: ["migrations/**/*.ts", "db/migrate.ts"], rules: { "@typescript-eslint/no-explicit-any": "off" } },
  { ignores: [".next/**", ".next-*/**", "node_modules/**", ".data/**", "test-results/**", "next-env.d.ts"] },
];

export default config;
