import type { ProjectAccess } from "@/lib/auth/session";

/** Placeholder until the scenario section lands: renders nothing. */
export async function ScenarioSection({ access }: { access: ProjectAccess }) {
  void access;
  return null;
}
