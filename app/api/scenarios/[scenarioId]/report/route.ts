import { download, jsonError } from "@/lib/http";
import { prepareReportRequest, reportFileName } from "@/lib/reports/http";
import { renderReportPdfOffThread } from "@/lib/reports/pdf/offthread";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** The cost report as PDF: the issued version for client viewers, the draft (or ?version=N) for the firm. */
export async function GET(req: Request, ctx: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await ctx.params;
  const prep = await prepareReportRequest(req, scenarioId, "report.downloadPdf");
  if (!prep.ok) return prep.response;
  let pdf: Buffer;
  try {
    pdf = await renderReportPdfOffThread(prep.source);
  } catch (e) {
    console.error("report: PDF rendering failed", e);
    return jsonError(500, "The report could not be generated.");
  }
  await prep.audit("pdf", { bytes: pdf.length });
  const name = reportFileName(prep.source, "report", "pdf");
  return download(pdf, name, "application/pdf");
}
