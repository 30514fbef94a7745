import { renderToBuffer } from "@react-pdf/renderer";
import type { ReportSource } from "../types";
import { ReportDocument } from "./document";
import { registerFonts } from "./theme";

/** The cost report as PDF bytes (server-side). */
export async function renderReportPdf(source: ReportSource): Promise<Buffer> {
  registerFonts();
  return renderToBuffer(ReportDocument({ source }));
}
