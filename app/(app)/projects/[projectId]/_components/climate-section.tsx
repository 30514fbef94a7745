import Link from "next/link";
import type { ProjectAccess } from "@/lib/auth/session";
import { listClimateDatasets } from "@/lib/climate/data";
import { EmptyState, Panel } from "@/components/ui/panel";
import { ButtonLink } from "@/components/ui/button";
import { formatNumber, formatQuantity } from "@/lib/units";
import { isoDate, SOURCE_LABELS } from "../climate/labels";

/** The project's climate datasets with their headline figures; import and bin entry for climate.manage. */
export async function ClimateSection({ access }: { access: ProjectAccess }) {
  const datasets = await listClimateDatasets(access);
  const canManage = access.can("climate.manage");
  const { id: projectId, unitSystem } = access.project;
  const base = `/projects/${projectId}/climate`;
  return (
    <Panel
      title="Climate"
      actions={
        canManage ? (
          <div className="flex flex-wrap gap-2">
            <ButtonLink href={`${base}/import`} variant="secondary">Import climate</ButtonLink>
            <ButtonLink href={`${base}/bins`} variant="secondary">Enter bins</ButtonLink>
          </div>
        ) : undefined
      }
    >
      {datasets.length === 0 ? (
        <EmptyState title="No climate data yet.">
          {canManage
            ? "Import a typical weather year (an EPW file or an hourly CSV) or enter a wet-bulb bin table. Scenarios take their wet-bulb hours from it."
            : "The consulting firm has not added climate data to this project yet."}
        </EmptyState>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-sm" data-testid="climate-datasets">
            <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
              <tr>
                <th className="py-2 pr-4 font-medium">Dataset</th>
                <th className="py-2 pr-4 font-medium">Source</th>
                <th className="py-2 pr-4 text-right font-medium">Records</th>
                <th className="py-2 pr-4 text-right font-medium">Hours</th>
                <th className="py-2 pr-4 text-right font-medium">Missing</th>
                <th className="py-2 pr-4 text-right font-medium">Design wet-bulb 0.4 %</th>
                <th className="py-2 font-medium">Added</th>
              </tr>
            </thead>
            <tbody>
              {datasets.map((d) => (
                <tr key={d.id} className="border-t border-line">
                  <td className="py-2 pr-4">
                    <Link href={`${base}/${d.id}`} className="font-medium text-basin-700 hover:underline">
                      {d.name}
                    </Link>
                    {d.fileName ? <div className="text-xs text-ink-faint">{d.fileName}</div> : null}
                  </td>
                  <td className="py-2 pr-4">{SOURCE_LABELS[d.sourceKind]}</td>
                  <td className="num whitespace-nowrap py-2 pr-4">{formatNumber(d.recordCount, { decimals: 0 })}</td>
                  <td className="num whitespace-nowrap py-2 pr-4">{`${formatNumber(d.hoursTotal, { decimals: 0 })}\u00a0h`}</td>
                  <td className="num whitespace-nowrap py-2 pr-4">{formatNumber(d.missingCount, { decimals: 0 })}</td>
                  <td className="num whitespace-nowrap py-2 pr-4">{formatQuantity("temperatureC", d.designWetBulb04C, unitSystem, { decimals: 1 })}</td>
                  <td className="py-2 text-xs text-ink-soft">
                    {isoDate(d.createdAt)}
                    {d.createdByName ? ` · ${d.createdByName}` : ""}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </Panel>
  );
}
