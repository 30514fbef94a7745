import type { Metadata } from "next";
import { forbidden } from "next/navigation";
import { db } from "@/db";
import { listFirmMembers } from "@/db/queries/firms";
import { canInFirm } from "@/lib/auth/permissions";
import { requireViewer } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { PageHeader, Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Firm members" };

export default async function FirmPage() {
  const viewer = await requireViewer();
  const firm = viewer.firms.find((f) => canInFirm(viewer.principal, f.firmId, "firm.manageMembers"));
  if (!firm) forbidden();
  const members = await listFirmMembers(db, firm.firmId);
  return (
    <>
      <PageHeader title="Firm members" subtitle={firm.firmName} />
      <Panel title="Members">
        <table className="w-full text-sm" data-testid="firm-members">
          <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
            <tr><th className="py-2 pr-4 font-medium">Name</th><th className="py-2 pr-4 font-medium">E-mail</th><th className="py-2 font-medium">Role</th></tr>
          </thead>
          <tbody>
            {members.map((m) => (
              <tr key={m.userId} className="border-t border-line">
                <td className="py-2 pr-4">{m.name}</td>
                <td className="py-2 pr-4">{m.email}</td>
                <td className="py-2">{ROLE_LABELS[m.role]}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Panel>
    </>
  );
}
