import Link from "next/link";
import type { IssuedVersionSummary } from "@/lib/sharing/versions";
import { formatWhen } from "@/lib/dates";

/** Issued versions as a table linking each to its page. */
export function VersionList({
  projectId,
  versions,
  scenarioNames,
  testId = "version-list",
}: {
  projectId: string;
  versions: IssuedVersionSummary[];
  /** When the list spans scenarios: the column of names (the name frozen at issue). */
  scenarioNames?: boolean;
  testId?: string;
}) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" data-testid={testId}>
        <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
          <tr>
            {scenarioNames && <th className="py-2 pr-4 font-medium">Scenario</th>}
            <th className="py-2 pr-4 font-medium">Version</th>
            <th className="py-2 pr-4 font-medium">Issued</th>
            <th className="py-2 pr-4 font-medium">By</th>
            <th className="py-2 font-medium">Note</th>
          </tr>
        </thead>
        <tbody>
          {versions.map((v) => (
            <tr key={v.id} className="border-t border-line" data-testid="version-row">
              {scenarioNames && <td className="py-2 pr-4">{v.name}</td>}
              <td className="py-2 pr-4">
                <Link href={`/projects/${projectId}/scenarios/${v.scenarioId}/versions/${v.versionNumber}`} className="font-medium text-basin-700 hover:underline">
                  {scenarioNames ? `Version ${v.versionNumber}` : `${v.name} — version ${v.versionNumber}`}
                </Link>
              </td>
              <td className="py-2 pr-4 whitespace-nowrap">{formatWhen(v.issuedAt)}</td>
              <td className="py-2 pr-4">{v.issuedByName ?? "—"}</td>
              <td className="py-2 text-ink-soft">{v.note || <span className="text-ink-faint">—</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
