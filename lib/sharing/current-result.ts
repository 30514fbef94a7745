import type { Kysely, Transaction } from "kysely";
import type { Database } from "@/db/schema";

type Executor = Kysely<Database> | Transaction<Database>;

export interface DraftForIssue {
  id: string;
  projectId: string;
  name: string;
  climateDatasetId: string | null;
  input: unknown;
  inputVersion: number;
  revision: number;
}

export interface CurrentResult {
  engineVersion: string;
  inputsHash: string;
  result: unknown;
}

/** Finds the finished result computed from the draft's current inputs by the current engine, or null. */
export type CurrentResultResolver = (db: Executor, draft: DraftForIssue) => Promise<CurrentResult | null>;

/** Placeholder until the scenario analysis DAL can say which stored result belongs to the current inputs. */
export const currentStoredResult: CurrentResultResolver = async () => null;
