import { download, jsonError } from "@/lib/http";
import { prepareReportRequest, reportFileName } from "@/lib/reports/http";
import { buildWorkbook } from "@/lib/reports/workbook";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

const XLSX = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** The cash-flow workbook with live discounting formulas (finance and the firm). */
export async function GET(req: Request, ctx: { params: Promise<{ scenarioId: string }> }) {
  const { scenarioId } = await ctx.params;
  const prep = await prepareReportRequest(req, scenarioId, "report.downloadWorkbook");
  if (!prep.ok) return prep.response;
  if (prep.source.cashFlowsWithheld) return jsonError(403, "You do not have access to this.");
  let xlsx: Buffer;
  try {
    xlsx = await buildWorkbook(prep.source);
  } catch (e) {
    console.error("report: workbook failed", e);
    return jsonError(500, "The workbook could not be generated.");
  }
  await prep.audit("xlsx", { bytes: xlsx.length });
  const name = reportFileName(prep.source, "cash-flows", "xlsx");
  return download(xlsx, name, XLSX);
}
