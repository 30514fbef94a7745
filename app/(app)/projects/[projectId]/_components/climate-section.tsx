import type { ProjectAccess } from "@/lib/auth/session";

/** Placeholder until the climate section lands: renders nothing. */
export async function ClimateSection({ access }: { access: ProjectAccess }) {
  void access;
  return null;
}
