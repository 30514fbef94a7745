import { buildCsv, isCsvTable } from "@/lib/reports/csv";
import { download, jsonError } from "@/lib/http";
import { prepareReportRequest, reportFileName } from "@/lib/reports/http";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** CSV exports: cashflows, climate-bins, water-energy (same right as the workbook). */
export async function GET(req: Request, ctx: { params: Promise<{ scenarioId: string; table: string }> }) {
  const { scenarioId, table } = await ctx.params;
  const prep = await prepareReportRequest(req, scenarioId, "report.downloadWorkbook");
  if (!prep.ok) return prep.response;
  if (!isCsvTable(table)) return jsonError(404, "Not found.");
  // The data-access layer already withheld the yearly flows; a table of them would be empty, so refuse it.
  if (table === "cashflows" && prep.source.cashFlowsWithheld) return jsonError(403, "You do not have access to this.");
  // A byte-order mark so spreadsheet programs read the UTF-8 unit symbols (°F, m³) correctly.
  const body = Buffer.from("\ufeff" + buildCsv(prep.source, table), "utf8");
  await prep.audit("csv", { table, bytes: body.length });
  const name = reportFileName(prep.source, table, "csv");
  return download(body, name, "text/csv; charset=utf-8");
}
