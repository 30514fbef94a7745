import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { perform } from "@/lib/actions/request";
import { requireProjectAction } from "@/lib/auth/session";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { accessOverview, type InvitationDTO } from "@/lib/sharing/invitations";
import { formatWhen } from "@/lib/dates";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { InviteForm } from "./_components/invite-form";
import { ConfirmButton } from "./_components/confirm-button";
import { revokeAccessAction, withdrawInvitationAction } from "./actions";

export const metadata: Metadata = { title: "Access" };

const STATE_STYLE: Record<InvitationDTO["state"], string> = {
  pending: "bg-caution-50 text-caution-800",
  accepted: "bg-ok-50 text-ok-600",
  revoked: "bg-paper-sunk text-ink-soft",
  expired: "bg-paper-sunk text-ink-soft",
};
const STATE_LABEL: Record<InvitationDTO["state"], string> = {
  pending: "Waiting for acceptance",
  accepted: "Accepted",
  revoked: "Withdrawn",
  expired: "Expired",
};

function MailStatus({ mail }: { mail: InvitationDTO["mail"] }) {
  if (!mail) return <span className="text-ink-faint">—</span>;
  if (mail.status === "sent") return <span className="text-ok-600">Sent {formatWhen(mail.sentAt)}</span>;
  if (mail.status === "failed") {
    return (
      <span className="text-danger-700" title={mail.lastError ?? undefined}>
        Not sent{mail.lastError ? `: ${mail.lastError}` : ""}
      </span>
    );
  }
  return (
    <span className="text-caution-800">
      {mail.attempts === 0 ? "Queued" : `Retrying (attempt ${mail.attempts + 1} at ${formatWhen(mail.nextAttemptAt)})`}
      {mail.lastError && <span className="block text-xs text-ink-faint">Last error: {mail.lastError}</span>}
    </span>
  );
}

/** Who has access to the project, the invitations and their e-mails, and the invite form (firm only). */
export default async function AccessPage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const access = await requireProjectAction(projectId, "access.share");
  const overview = await perform(accessOverview, projectId);
  if (!overview.ok) notFound();
  const { viewers, invitations } = overview.value;
  const mayRevoke = access.can("access.revoke");
  return (
    <>
      <PageHeader
        title="Access"
        subtitle={
          <>
            <Link href={`/projects/${projectId}`} className="text-basin-700 hover:underline">
              {access.project.name}
            </Link>{" "}
            · client viewers see issued versions only, never drafts
          </>
        }
      />
      <div className="space-y-6">
        <Panel title="Invite a client viewer">
          <InviteForm projectId={projectId} />
          <p className="mt-3 text-xs text-ink-faint">
            The link in the e-mail works once and for 7 days. A person without an account sets a name and password; someone with an
            account signs in with the invited address. Either way they get exactly the role chosen here, on this project only.
          </p>
        </Panel>

        <Panel title={`Client viewers (${viewers.length})`}>
          {viewers.length === 0 ? (
            <EmptyState title="No client viewer has access yet.">Invite the owner or the finance team above.</EmptyState>
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="access-viewers">
                <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
                  <tr>
                    <th className="py-2 pr-4 font-medium">Name</th>
                    <th className="py-2 pr-4 font-medium">E-mail</th>
                    <th className="py-2 pr-4 font-medium">Role</th>
                    <th className="py-2 pr-4 font-medium">Since</th>
                    <th className="py-2 font-medium">
                      <span className="sr-only">Actions</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {viewers.map((v) => (
                    <tr key={v.userId} className="border-t border-line" data-testid="access-viewer-row">
                      <td className="py-2 pr-4">{v.name}</td>
                      <td className="py-2 pr-4">{v.email}</td>
                      <td className="py-2 pr-4">{ROLE_LABELS[v.role]}</td>
                      <td className="py-2 pr-4 whitespace-nowrap">
                        {formatWhen(v.since)}
                        {v.grantedByName && <span className="block text-xs text-ink-faint">invited by {v.grantedByName}</span>}
                      </td>
                      <td className="py-2 text-right">
                        {mayRevoke && (
                          <ConfirmButton
                            action={revokeAccessAction.bind(null, projectId, v.userId)}
                            label="Revoke access"
                            confirm={`Revoke ${v.name}'s access to this project? Their next page load is refused.`}
                            testId={`revoke-${v.email}`}
                          />
                        )}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </Panel>

        <Panel title="Invitations">
          {invitations.length === 0 ? (
            <EmptyState title="No invitations sent from this project yet." />
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="access-invitations">
                <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
                  <tr>
                    <th className="py-2 pr-4 font-medium">E-mail</th>
                    <th className="py-2 pr-4 font-medium">Role</th>
                    <th className="py-2 pr-4 font-medium">Status</th>
                    <th className="py-2 pr-4 font-medium">Expires</th>
                    <th className="py-2 pr-4 font-medium">E-mail delivery</th>
                    <th className="py-2 font-medium">
                      <span className="sr-only">Actions</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {invitations.map((i) => (
                    <tr key={i.id} className="border-t border-line align-top" data-testid="access-invitation-row" data-email={i.email}>
                      <td className="py-2 pr-4">
                        {i.email}
                        <span className="block text-xs text-ink-faint">
                          sent {formatWhen(i.createdAt)}
                          {i.inviterName ? ` by ${i.inviterName}` : ""}
                        </span>
                      </td>
                      <td className="py-2 pr-4">{ROLE_LABELS[i.role]}</td>
                      <td className="py-2 pr-4">
                        <span className={`rounded px-2 py-0.5 text-xs font-medium ${STATE_STYLE[i.state]}`} data-testid="invitation-state">
                          {STATE_LABEL[i.state]}
                        </span>
                        {i.state === "accepted" && (
                          <span className="block text-xs text-ink-faint">
                            {formatWhen(i.acceptedAt)}
                            {i.acceptorName ? ` by ${i.acceptorName}` : ""}
                          </span>
                        )}
                        {i.state === "revoked" && <span className="block text-xs text-ink-faint">{formatWhen(i.revokedAt)}</span>}
                      </td>
                      <td className="py-2 pr-4 whitespace-nowrap">{formatWhen(i.expiresAt)}</td>
                      <td className="py-2 pr-4" data-testid="invitation-mail">
                        <MailStatus mail={i.mail} />
                      </td>
                      <td className="py-2 text-right">
                        {mayRevoke && i.state === "pending" && (
                          <ConfirmButton
                            action={withdrawInvitationAction.bind(null, projectId, i.id)}
                            label="Withdraw"
                            confirm={`Withdraw the invitation for ${i.email}? The link stops working at once.`}
                            testId={`withdraw-${i.email}`}
                          />
                        )}
                      </td>
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
