import type { ProjectAccess } from "@/lib/auth/session";

/** Placeholder until the audit section lands: renders nothing. */
export async function AuditSection({ access }: { access: ProjectAccess }) {
  void access;
  return null;
}
