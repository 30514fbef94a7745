import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";
import type { Kysely, Transaction } from "kysely";
import type { FirmRole, ProjectRole, UnitSystem } from "./enums";

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type Json<T = unknown> = ColumnType<T, T | string, T | string>;

export interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string | null;
  created_at: Timestamp;
  password_changed_at: Timestamp;
}

export interface FirmsTable {
  id: Generated<string>;
  name: string;
  created_at: Timestamp;
}

export interface FirmMembersTable {
  firm_id: string;
  user_id: string;
  role: FirmRole;
  created_at: Timestamp;
}

export interface ProjectsTable {
  id: Generated<string>;
  firm_id: string;
  name: string;
  client_name: string;
  site_name: string;
  location_label: Generated<string>;
  elevation_m: Generated<number>;
  unit_system: Generated<UnitSystem>;
  currency: Generated<string>;
  /** Optimistic concurrency: +1 on every edit of the project's fields. */
  revision: Generated<number>;
  created_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface ProjectAccessTable {
  project_id: string;
  user_id: string;
  role: ProjectRole;
  granted_by: string | null;
  created_at: Timestamp;
}

export interface AuditEventsTable {
  id: Generated<string>;
  at: Timestamp;
  actor_id: string | null;
  firm_id: string | null;
  project_id: string | null;
  action: string;
  target_type: string | null;
  target_id: string | null;
  detail: Json<Record<string, unknown>>;
}

export interface SignInAttemptsTable {
  key: string;
  failures: Generated<number>;
  window_start: Timestamp;
  blocked_until: Date | null;
}

export interface ClimateDatasetsTable {
  id: Generated<string>;
  project_id: string;
  name: string;
  source_kind: "epw" | "csv" | "wetBulbBins" | "dryBulbBins";
  file_name: string | null;
  provenance: Json<Record<string, unknown>>;
  record_count: number;
  missing_count: Generated<number>;
  hours_total: number;
  data: Json<unknown>;
  summary: Json<unknown>;
  created_by: string | null;
  created_at: Timestamp;
}

export interface ScenariosTable {
  id: Generated<string>;
  project_id: string;
  name: string;
  climate_dataset_id: string | null;
  input: Json<unknown>;
  input_version: Generated<number>;
  /** Optimistic concurrency: a save must name the revision it edited. */
  revision: Generated<number>;
  created_by: string | null;
  updated_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
  archived_at: Date | null;
}

export type ResultStatus = "queued" | "running" | "done" | "failed";

export interface ScenarioResultsTable {
  id: Generated<string>;
  scenario_id: string;
  engine_version: string;
  inputs_hash: string;
  kind: Generated<"full" | "monteCarlo">;
  status: ResultStatus;
  progress: Generated<number>;
  result: Json<unknown> | null;
  error: string | null;
  created_at: Timestamp;
  finished_at: Date | null;
  /** When a worker last started on the row (the queue itself is pg-boss, migration 2026_12_02_0900). */
  started_at: Date | null;
  /** Who asked for the run (a save, a page view), for the per-user limits. */
  requested_by: string | null;
  /** Monte Carlo draws the row stands for (0 for the deterministic result). */
  draws: Generated<number>;
}

/** The analysis API's queued requests (migration 2026_12_02_0900). */
export interface ApiAnalysesTable {
  id: Generated<string>;
  user_id: string;
  status: Generated<ResultStatus>;
  draws: Generated<number>;
  inputs_hash: string;
  input: Json<unknown> | null;
  result: Json<unknown> | null;
  error: string | null;
  created_at: Timestamp;
  started_at: Date | null;
  finished_at: Date | null;
}

export interface ScenarioVersionsTable {
  id: Generated<string>;
  scenario_id: string;
  project_id: string;
  version_number: number;
  name: string;
  note: Generated<string>;
  input: Json<unknown>;
  input_version: number;
  result: Json<unknown>;
  engine_version: string;
  inputs_hash: string;
  scenario_revision: number;
  issued_by: string | null;
  issued_at: Timestamp;
}

export interface CommentsTable {
  id: Generated<string>;
  version_id: string;
  project_id: string;
  author_id: string | null;
  body: string;
  created_at: Timestamp;
}

export interface InvitationsTable {
  id: Generated<string>;
  project_id: string;
  email: string;
  role: ProjectRole;
  /** SHA-256 of the single-use token; the token itself is only in the e-mail. */
  token_hash: string;
  expires_at: Date;
  invited_by: string | null;
  accepted_at: Date | null;
  accepted_by: string | null;
  revoked_at: Date | null;
  created_at: Timestamp;
}

export interface MailOutboxTable {
  id: Generated<string>;
  kind: string;
  ref_id: string | null;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  status: Generated<"pending" | "sent" | "failed">;
  attempts: Generated<number>;
  last_error: string | null;
  next_attempt_at: Timestamp;
  created_at: Timestamp;
  sent_at: Date | null;
}

/** The typed database. Later migrations add their tables here. */
export interface Database {
  users: UsersTable;
  firms: FirmsTable;
  firm_members: FirmMembersTable;
  projects: ProjectsTable;
  project_access: ProjectAccessTable;
  audit_events: AuditEventsTable;
  sign_in_attempts: SignInAttemptsTable;
  climate_datasets: ClimateDatasetsTable;
  scenarios: ScenariosTable;
  scenario_results: ScenarioResultsTable;
  scenario_versions: ScenarioVersionsTable;
  comments: CommentsTable;
  invitations: InvitationsTable;
  mail_outbox: MailOutboxTable;
  api_analyses: ApiAnalysesTable;
}

/** What every query function takes first: the app's Kysely instance or a transaction. */
export type Executor = Kysely<Database> | Transaction<Database>;

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type Project = Selectable<ProjectsTable>;
export type NewProject = Insertable<ProjectsTable>;
export type ProjectUpdate = Updateable<ProjectsTable>;
export type AuditEvent = Selectable<AuditEventsTable>;
