import type { Metadata } from "next";
import { requireViewer } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { PageHeader, Panel } from "@/components/ui/panel";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const viewer = await requireViewer();
  return (
    <>
      <PageHeader title="Account" subtitle={viewer.email} />
      <Panel title="Your access">
        <ul className="space-y-1 text-sm">
          {viewer.firms.map((f) => (
            <li key={f.firmId}>{ROLE_LABELS[f.role]} at {f.firmName}</li>
          ))}
          {viewer.clientRoles.map((r) => (
            <li key={r}>{ROLE_LABELS[r]} on the projects shared with you</li>
          ))}
        </ul>
      </Panel>
    </>
  );
}
