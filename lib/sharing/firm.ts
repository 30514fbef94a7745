import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { Viewer } from "@/lib/auth/access";
import { canInFirm } from "@/lib/auth/permissions";
import type { FirmRole, ProjectRole } from "@/lib/auth/roles";
import { listFirmMembers } from "@/db/queries/firms";
import { listFirmClientAccess } from "@/db/queries/sharing";
import { fail, ok, type Result } from "@/lib/result";

export interface FirmOverview {
  firmId: string;
  firmName: string;
  members: { userId: string; name: string; email: string; role: FirmRole; since: Date }[];
  clientAccess: { projectId: string; projectName: string; userId: string; name: string; email: string; role: ProjectRole; since: Date }[];
}

/** The firm admin's view: members with their roles, and which client viewers see which project. */
export async function firmOverview(db: Kysely<Database>, viewer: Viewer | null): Promise<Result<FirmOverview>> {
  if (!viewer) return fail(401, "Sign in first.");
  const firm = viewer.firms.find((f) => canInFirm(viewer.principal, f.firmId, "firm.manageMembers"));
  if (!firm) return fail(403, "Only a firm admin sees the firm's members and client access.");
  const [members, clientAccess] = await Promise.all([listFirmMembers(db, firm.firmId), listFirmClientAccess(db, firm.firmId)]);
  return ok({ firmId: firm.firmId, firmName: firm.firmName, members, clientAccess });
}
