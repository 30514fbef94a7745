/**
 * Report downloads for a scenario (or one issued version), showing only the links the viewer may use.
 * Plain anchors: the files come from route handlers that authorize again on every request.
 * Usable from server and client components (no hooks); pass the viewer's rights in, e.g.
 * `{...reportRights(access)}` on a server page.
 */
export interface DownloadLinksProps {
  scenarioId: string;
  /** Issued version number; omit for the firm's working draft (client viewers always get an issued version). */
  version?: number | null;
  canPdf: boolean;
  canWorkbook: boolean;
  /** Override the project's unit system for the files. */
  units?: "SI" | "IP";
  className?: string;
}

/** The two report rights of a viewer, from the DAL's project access. */
export function reportRights(access: {
  can: (action: "report.downloadPdf" | "report.downloadWorkbook") => boolean;
}) {
  return { canPdf: access.can("report.downloadPdf"), canWorkbook: access.can("report.downloadWorkbook") };
}

function href(scenarioId: string, path: string, version?: number | null, units?: "SI" | "IP"): string {
  const q = new URLSearchParams();
  if (version) q.set("version", String(version));
  if (units) q.set("units", units);
  const s = q.toString();
  return `/api/scenarios/${encodeURIComponent(scenarioId)}/${path}${s ? `?${s}` : ""}`;
}

const primary =
  "inline-flex items-center gap-2 rounded-md bg-basin-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-basin-700 focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-basin-600";
const secondary =
  "inline-flex items-center gap-2 rounded-md border border-line-strong bg-paper-raised px-3 py-1.5 text-sm font-medium text-ink hover:bg-paper-sunk focus-visible:outline focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-basin-600";
const quiet =
  "text-sm text-basin-700 underline-offset-2 hover:underline focus-visible:outline focus-visible:outline-2 focus-visible:outline-basin-600";

export function DownloadLinks({
  scenarioId,
  version,
  canPdf,
  canWorkbook,
  units,
  className = "",
}: DownloadLinksProps) {
  if (!canPdf && !canWorkbook) return null;
  return (
    <nav
      aria-label="Report downloads"
      className={`flex flex-wrap items-center gap-2 ${className}`}
      data-testid="report-downloads"
    >
      {canPdf ? (
        <a
          className={primary}
          href={href(scenarioId, "report", version, units)}
          download
          data-testid="download-pdf"
        >
          Cost report <span className="text-xs opacity-80">PDF</span>
        </a>
      ) : null}
      {canWorkbook ? (
        <>
          <a
            className={secondary}
            href={href(scenarioId, "workbook", version, units)}
            download
            data-testid="download-workbook"
          >
            Cash-flow workbook <span className="text-xs text-ink-faint">XLSX</span>
          </a>
          <span className="text-xs text-ink-faint" aria-hidden="true">
            CSV:
          </span>
          <a
            className={quiet}
            href={href(scenarioId, "csv/cashflows", version, units)}
            download
            data-testid="download-csv-cashflows"
          >
            cash flows
          </a>
          <a
            className={quiet}
            href={href(scenarioId, "csv/water-energy", version, units)}
            download
            data-testid="download-csv-water-energy"
          >
            water &amp; energy
          </a>
          <a
            className={quiet}
            href={href(scenarioId, "csv/climate-bins", version, units)}
            download
            data-testid="download-csv-climate-bins"
          >
            climate bins
          </a>
        </>
      ) : null}
    </nav>
  );
}
