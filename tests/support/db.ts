import { createDb } from "@/db/client";

/** The test run's own PostgreSQL (scripts/test.sh starts it and exports DATABASE_URL). */
export function testDb() {
  const url = process.env.DATABASE_URL;
  if (!url || !/loopledger_test/.test(url)) {
    throw new Error("Integration tests need DATABASE_URL of the test database: run them through `npm test`.");
  }
  return createDb(url, 4);
}

/** A unique suffix so tests never collide with the seed or with each other. */
export function uniq(prefix = "t"): string {
  return `${prefix}${Date.now().toString(36)}${Math.random().toString(36).slice(2, 7)}`;
}
