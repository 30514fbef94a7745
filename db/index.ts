import "server-only";
import type { Kysely } from "kysely";
import { env } from "@/lib/env";
import { createDb } from "./client";
import type { Database } from "./schema";

const globalForDb = globalThis as unknown as { loopledgerDb?: Kysely<Database> };

/** The app's one Kysely instance (server-only). */
export const db: Kysely<Database> = globalForDb.loopledgerDb ?? createDb(env().DATABASE_URL);
if (process.env.NODE_ENV !== "production") globalForDb.loopledgerDb = db;

export type { Database } from "./schema";
