import type { Metadata } from "next";
import Link from "next/link";
import { forbidden } from "next/navigation";
import { perform } from "@/lib/actions/request";
import { requireViewer } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { firmOverview } from "@/lib/sharing/firm";
import { formatWhen } from "@/lib/dates";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Firm members" };

/** The firm admin's page: members and roles, and which client viewers see which project. */
export default async function FirmPage() {
  await requireViewer();
  const r = await perform(firmOverview);
  if (!r.ok) forbidden();
  const { firmName, members, clientAccess } = r.value;
  return (
    <>
      <PageHeader title="Firm members" subtitle={firmName} />
      <div className="space-y-6">
        <Panel title={`Members (${members.length})`}>
          <table className="w-full text-sm" data-testid="firm-members">
            <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
              <tr>
                <th className="py-2 pr-4 font-medium">Name</th>
                <th className="py-2 pr-4 font-medium">E-mail</th>
                <th className="py-2 pr-4 font-medium">Role</th>
                <th className="py-2 font-medium">Member since</th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <tr key={m.userId} className="border-t border-line">
                  <td className="py-2 pr-4">{m.name}</td>
                  <td className="py-2 pr-4">{m.email}</td>
                  <td className="py-2 pr-4">{ROLE_LABELS[m.role]}</td>
                  <td className="py-2 whitespace-nowrap">{formatWhen(m.since)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </Panel>
        <Panel title="Client viewers by project">
          {clientAccess.length === 0 ? (
            <EmptyState title="No project is shared with a client viewer yet." />
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="firm-client-access">
                <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
                  <tr>
                    <th className="py-2 pr-4 font-medium">Project</th>
                    <th className="py-2 pr-4 font-medium">Client viewer</th>
                    <th className="py-2 pr-4 font-medium">Role</th>
                    <th className="py-2 font-medium">Since</th>
                  </tr>
                </thead>
                <tbody>
                  {clientAccess.map((a) => (
                    <tr key={`${a.projectId}-${a.userId}`} className="border-t border-line">
                      <td className="py-2 pr-4">
                        <Link href={`/projects/${a.projectId}/access`} className="text-basin-700 hover:underline">
                          {a.projectName}
                        </Link>
                      </td>
                      <td className="py-2 pr-4">
                        {a.name} <span className="text-ink-faint">{a.email}</span>
                      </td>
                      <td className="py-2 pr-4">{ROLE_LABELS[a.role]}</td>
                      <td className="py-2 whitespace-nowrap">{formatWhen(a.since)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </Panel>
      </div>
    </>
  );
}
