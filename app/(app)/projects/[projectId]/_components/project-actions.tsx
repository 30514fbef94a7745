import type { ReactNode } from "react";
import type { ProjectAccess } from "@/lib/auth/session";
import { ButtonLink } from "@/components/ui/button";

/**
 * Header actions of the project page, each shown only to roles allowed to use it. `children` is a slot
 * for actions owned by other sections; scenario actions live inside the scenario section itself.
 */
export async function ProjectActions({ access, children }: { access: ProjectAccess; children?: ReactNode }) {
  const id = access.project.id;
  return (
    <>
      {access.can("project.edit") && (
        <ButtonLink href={`/projects/${id}/edit`} variant="secondary">
          Edit project
        </ButtonLink>
      )}
      {children}
    </>
  );
}
