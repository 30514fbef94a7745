import type { Metadata } from "next";
import { requireViewer } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { formatWhen } from "@/lib/dates";
import { PageHeader, Panel } from "@/components/ui/panel";
import { PasswordForm } from "./_components/password-form";

export const metadata: Metadata = { title: "Account" };

export default async function AccountPage() {
  const viewer = await requireViewer();
  const hours = Math.round(env().SESSION_MAX_AGE_S / 3600);
  return (
    <>
      <PageHeader title="Account" subtitle={viewer.email} />
      <div className="space-y-6">
        <Panel title="Your access">
          <ul className="space-y-1 text-sm">
            {viewer.firms.map((f) => (
              <li key={f.firmId}>
                {ROLE_LABELS[f.role]} at {f.firmName}
              </li>
            ))}
            {viewer.clientRoles.map((r) => (
              <li key={r}>{ROLE_LABELS[r]} on the projects shared with you</li>
            ))}
          </ul>
        </Panel>
        <Panel title="Password">
          <p className="mb-4 text-sm text-ink-soft">
            Last changed {formatWhen(viewer.passwordChangedAt)}. Changing it signs out every other session. Sessions end on their own after{" "}
            {hours} h.
          </p>
          <PasswordForm />
        </Panel>
      </div>
    </>
  );
}
