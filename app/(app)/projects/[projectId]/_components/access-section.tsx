import type { ProjectAccess } from "@/lib/auth/session";

/** Placeholder until the access section lands: renders nothing. */
export async function AccessSection({ access }: { access: ProjectAccess }) {
  void access;
  return null;
}
