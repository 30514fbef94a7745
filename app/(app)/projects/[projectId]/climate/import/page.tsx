import type { Metadata } from "next";
import Link from "next/link";
import { requireProjectAction } from "@/lib/auth/session";
import { PageHeader, Panel } from "@/components/ui/panel";
import { MAX_CLIMATE_UPLOAD_BYTES } from "@/lib/climate/limits";
import { ClimateUpload } from "./climate-upload";
import { formatQuantity } from "@/lib/units";

export const metadata: Metadata = { title: "Import climate" };

export default async function ImportClimatePage({ params }: { params: Promise<{ projectId: string }> }) {
  const { projectId } = await params;
  const { project } = await requireProjectAction(projectId, "climate.manage");
  return (
    <>
      <PageHeader
        title="Import climate"
        subtitle={
          <Link href={`/projects/${project.id}`} className="text-basin-700 hover:underline">
            {project.name}
          </Link>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[1fr_18rem]">
        <Panel>
          <ClimateUpload projectId={project.id} maxBytes={MAX_CLIMATE_UPLOAD_BYTES} />
        </Panel>
        <aside className="space-y-3 text-sm text-ink-soft">
          <p>
            <strong className="text-ink">EPW</strong> — the open EnergyPlus weather format: one typical year, hourly, with its
            location header. Read as is.
          </p>
          <p>
            <strong className="text-ink">Hourly CSV</strong> — one row per hour (or shorter steps, averaged), with a time column or
            month/day/hour columns, the dry-bulb and one humidity column (RH, dew point or wet-bulb). You pick the columns after
            the upload; <code>;</code> delimiters and decimal commas are fine.
          </p>
          <p>
            Wet-bulbs are computed at the station pressure when the file has it, otherwise at the pressure of the site&apos;s
            elevation ({formatQuantity("elevationM", project.elevationM, project.unitSystem, { decimals: 0 })}). Gaps of up to 6 h are interpolated; longer gaps are refused.
          </p>
          <p>
            Only a bin table? <Link className="text-basin-700 hover:underline" href={`/projects/${project.id}/climate/bins`}>Enter bins</Link>.
          </p>
        </aside>
      </div>
    </>
  );
}
