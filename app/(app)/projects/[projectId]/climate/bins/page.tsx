import type { Metadata } from "next";
import Link from "next/link";
import { requireProjectAction } from "@/lib/auth/session";
import { PageHeader, Panel } from "@/components/ui/panel";
import { BinTableEditor } from "./bin-table-editor";

export const metadata: Metadata = { title: "Enter climate bins" };

export default async function EnterBinsPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await requireProjectAction(projectId, "climate.manage");
  return (
    <>
      <PageHeader
        title="Enter a bin table"
        subtitle={
          <Link href={`/projects/${project.id}`} className="text-basin-700 hover:underline">
            {project.name}
          </Link>
        }
      />
      <Panel>
        <BinTableEditor projectId={project.id} unitSystem={project.unitSystem} />
      </Panel>
    </>
  );
}
