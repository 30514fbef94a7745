import { perform } from "@/lib/actions/request";
import type { ProjectAccess } from "@/lib/auth/session";
import { projectAuditTrail } from "@/lib/sharing/audit";
import { formatWhen } from "@/lib/dates";
import { EmptyState, Panel } from "@/components/ui/panel";

const CATEGORY_STYLE: Record<string, string> = {
  shared: "bg-basin-50 text-basin-700",
  revoked: "bg-danger-50 text-danger-700",
  issued: "bg-ok-50 text-ok-600",
  viewed: "bg-paper-sunk text-ink-soft",
  downloaded: "bg-copper-100 text-copper-700",
  commented: "bg-caution-50 text-caution-800",
  changed: "bg-paper-sunk text-ink-soft",
};

/** The project's audit trail, for the firm only (audit.view): who viewed, changed, issued, shared, revoked, downloaded. */
export async function AuditSection({ access }: { access: ProjectAccess }) {
  if (!access.can("audit.view")) return null;
  const trail = await perform(projectAuditTrail, access.project.id, 60);
  const rows = trail.ok ? trail.value : [];
  return (
    <Panel title="Audit trail">
      {rows.length === 0 ? (
        <EmptyState title="Nothing recorded yet." />
      ) : (
        <div className="max-h-[28rem] overflow-auto">
          <table className="w-full text-sm" data-testid="audit-trail">
            <thead className="sticky top-0 bg-paper-raised text-left text-xs uppercase tracking-wide text-ink-faint">
              <tr>
                <th className="py-2 pr-4 font-medium">When</th>
                <th className="py-2 pr-4 font-medium">Who</th>
                <th className="py-2 pr-4 font-medium">What</th>
                <th className="py-2 font-medium">Details</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((e) => (
                <tr key={e.id} className="border-t border-line align-top" data-testid="audit-row" data-action={e.action}>
                  <td className="py-1.5 pr-4 whitespace-nowrap text-ink-soft">{formatWhen(e.at)}</td>
                  <td className="py-1.5 pr-4">{e.actorName ?? <span className="text-ink-faint">system</span>}</td>
                  <td className="py-1.5 pr-4">
                    <span className={`mr-2 rounded px-1.5 py-0.5 text-2xs font-medium uppercase ${CATEGORY_STYLE[e.category] ?? ""}`}>{e.category}</span>
                    {e.label}
                  </td>
                  <td className="py-1.5 text-ink-soft">{e.summary || "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      <p className="mt-2 text-xs text-ink-faint">Latest 60 events. Client viewers do not see this trail.</p>
    </Panel>
  );
}
