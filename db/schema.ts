import type { ColumnType, Generated, Insertable, Selectable, Updateable } from "kysely";
import type { FirmRole, ProjectRole, UnitSystem } from "@/lib/auth/roles";

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

/** The typed database. Later migrations add their tables here. */
export interface Database {
  users: UsersTable;
  firms: FirmsTable;
  firm_members: FirmMembersTable;
  projects: ProjectsTable;
  project_access: ProjectAccessTable;
  audit_events: AuditEventsTable;
  sign_in_attempts: SignInAttemptsTable;
}

export type User = Selectable<UsersTable>;
export type NewUser = Insertable<UsersTable>;
export type Project = Selectable<ProjectsTable>;
export type NewProject = Insertable<ProjectsTable>;
export type ProjectUpdate = Updateable<ProjectsTable>;
export type AuditEvent = Selectable<AuditEventsTable>;
