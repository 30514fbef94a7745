import type { Metadata } from "next";
import Link from "next/link";
import { requireViewer } from "@/lib/auth/session";
import { perform } from "@/lib/actions/request";
import { listProjectsFor } from "@/lib/projects/data";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { ButtonLink } from "@/components/ui/button";
import { canInFirm } from "@/lib/auth/permissions";

export const metadata: Metadata = { title: "Projects" };

type Row = Awaited<ReturnType<typeof listProjectsFor>>[number];

function ProjectTable({ rows, testId }: { rows: Row[]; testId: string }) {
  return (
    <table className="w-full text-sm" data-testid={testId}>
      <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
        <tr>
          <th className="py-2 pr-4 font-medium">Project</th>
          <th className="py-2 pr-4 font-medium">Client</th>
          <th className="py-2 pr-4 font-medium">Site</th>
          <th className="py-2 pr-4 font-medium">Units</th>
          <th className="py-2 font-medium">Your role</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((p) => (
          <tr key={p.id} className="border-t border-line">
            <td className="py-2 pr-4">
              <Link href={`/projects/${p.id}`} className="font-medium text-basin-700 hover:underline">{p.name}</Link>
            </td>
            <td className="py-2 pr-4">{p.clientName}</td>
            <td className="py-2 pr-4">{p.siteName}{p.locationLabel ? ` — ${p.locationLabel}` : ""}</td>
            <td className="py-2 pr-4">{p.unitSystem}</td>
            <td className="py-2">{ROLE_LABELS[(p.firmRole ?? p.clientRole)!]}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

export default async function ProjectsPage({ searchParams }: { searchParams: Promise<{ q?: string }> }) {
  const viewer = await requireViewer();
  const { q } = await searchParams;
  const rows = await perform(listProjectsFor, q);
  const mine = rows.filter((r) => r.firmRole);
  const shared = rows.filter((r) => !r.firmRole && r.clientRole);
  const isFirm = viewer.firms.length > 0;
  const canCreate = viewer.firms.some((f) => canInFirm(viewer.principal, f.firmId, "project.create"));
  return (
    <>
      <PageHeader
        title="Projects"
        subtitle={isFirm ? "Condenser-loop studies of your firm and those shared with you." : "Studies a consulting firm has shared with you."}
        actions={canCreate ? <ButtonLink href="/projects/new">New project</ButtonLink> : undefined}
      />
      <form className="mb-6 flex gap-2" role="search">
        <label htmlFor="q" className="sr-only">Search projects</label>
        <input id="q" name="q" defaultValue={q ?? ""} placeholder="Search by project, client or site"
          className="w-full max-w-md rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm" />
        <button className="rounded-md border border-line-strong px-3 py-2 text-sm hover:bg-paper-sunk">Search</button>
      </form>
      <div className="space-y-6">
        {isFirm && (
          <Panel title="Projects I work on">
            {mine.length ? <ProjectTable rows={mine} testId="projects-mine" /> : (
              <EmptyState title={q ? "No project matches that search." : "No projects yet."}>
                {q ? "Try another word, or clear the search." : "Start a project for a client site with New project, then import its climate and build a scenario."}
              </EmptyState>
            )}
          </Panel>
        )}
        <Panel title="Shared with me">
          {shared.length ? <ProjectTable rows={shared} testId="projects-shared" /> : (
            <EmptyState title="Nothing has been shared with you yet.">
              When a consultant shares a project with you, it appears here and you receive an e-mail.
            </EmptyState>
          )}
        </Panel>
      </div>
    </>
  );
}
