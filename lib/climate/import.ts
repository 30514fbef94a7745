import "server-only";
import { createHash } from "node:crypto";
import type { Executor } from "@/db/schema";
import { inTransaction } from "@/db/transaction";
import { insertClimateDataset } from "@/db/queries/climate";
import { writeAudit } from "@/db/queries/audit";
import { looksLikeTmy3, parseEpw, parseHourlyCsv, parseTmy3, parseTmy3StationLine, tmy3Mapping, type ClimateIssue } from "@/lib/engine/climate";
import { binTableSubmissionSchema } from "./bins-schema";
import { ok, toFieldErrors, type FieldErrorMap, type Result } from "@/lib/result";
import { defineAction } from "@/lib/actions/define";
import { climateDatasetRow, datasetFromBins, datasetFromParsedFile, type NewDataset } from "./build";
import { csvMappingSchema, previewCsv, toHourlyCsvMapping, type CsvPreview } from "./csv-mapping";
import { readBodyLimited } from "@/lib/http";
import { text } from "@/lib/validation/text";
import { humaneIssues } from "@/lib/scenarios/field-messages";

import { MAX_CLIMATE_UPLOAD_BYTES } from "./limits";

export { MAX_CLIMATE_UPLOAD_BYTES };
/** Multipart overhead allowed on top of the file (boundaries, the name and mapping fields). */
const MULTIPART_OVERHEAD_BYTES = 256 * 1024;

export interface ImportTarget {
  projectId: string;
  firmId: string;
  actorId: string;
  siteElevationM: number;
}

export interface UploadedFile {
  name: string;
  bytes: Uint8Array;
}

export type ImportOutcome =
  | { status: 201; body: { ok: true; datasetId: string; name: string; warnings: ClimateIssue[] } }
  | { status: 200; body: { ok: false; step: "mapping"; fileName: string; preview: CsvPreview } }
  | {
      status: 400 | 413 | 415 | 422;
      body: { ok: false; error: string; issues?: ClimateIssue[]; fieldErrors?: FieldErrorMap };
    };

const fail = (status: 400 | 413 | 415 | 422, error: string, extra: { issues?: ClimateIssue[]; fieldErrors?: FieldErrorMap } = {}): ImportOutcome => ({
  status,
  body: { ok: false, error, ...extra },
});

export interface ClimateUploadForm {
  file: UploadedFile;
  name?: string;
  mapping?: unknown;
}

/** Parse the multipart upload (file, optional name, optional mapping JSON) within the size limit. */
export async function readClimateUpload(request: Request): Promise<{ ok: true; form: ClimateUploadForm } | { ok: false; outcome: ImportOutcome }> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().startsWith("multipart/form-data")) {
    return { ok: false, outcome: fail(415, "Send the weather file as a multipart/form-data upload (field \"file\").") };
  }
  const body = await readBodyLimited(request, MAX_CLIMATE_UPLOAD_BYTES + MULTIPART_OVERHEAD_BYTES);
  if (!body.ok) {
    return {
      ok: false,
      outcome:
        body.reason === "tooLarge"
          ? fail(413, "The file is larger than 10 MB. An hourly year is about 1.5 MB: check that this is one year of hourly data.")
          : fail(400, "The upload was empty."),
    };
  }
  let data: FormData;
  try {
    data = await new Request("http://upload.local/", { method: "POST", headers: { "content-type": type }, body: body.bytes as BodyInit }).formData();
  } catch {
    return { ok: false, outcome: fail(400, "The upload could not be read as a form.") };
  }
  const file = data.get("file");
  if (!file || typeof file === "string") return { ok: false, outcome: fail(400, "Choose a weather file to upload.") };
  if (file.size > MAX_CLIMATE_UPLOAD_BYTES) {
    return { ok: false, outcome: fail(413, "The file is larger than 10 MB. An hourly year is about 1.5 MB: check that this is one year of hourly data.") };
  }
  const name = data.get("name");
  const mappingText = data.get("mapping");
  let mapping: unknown;
  if (typeof mappingText === "string" && mappingText.trim() !== "") {
    try {
      mapping = JSON.parse(mappingText);
    } catch {
      return { ok: false, outcome: fail(400, "The column mapping was not valid JSON.") };
    }
  }
  return {
    ok: true,
    form: {
      file: { name: file.name || "upload", bytes: new Uint8Array(await file.arrayBuffer()) },
      ...(typeof name === "string" && name.trim() ? { name: name.trim().slice(0, 200) } : {}),
      ...(mapping !== undefined ? { mapping } : {}),
    },
  };
}

/** What a file is, from its content first and its name second. */
export function sniffWeatherFile(file: UploadedFile): { kind: "epw" | "tmy3" | "csv"; text: string } | { error: ImportOutcome } {
  const b = file.bytes;
  if (b.byteLength === 0) return { error: fail(422, "The file is empty.", { issues: [{ line: 0, field: "file", message: "the file has no content" }] }) };
  if (b[0] === 0x50 && b[1] === 0x4b && b[2] === 0x03 && b[3] === 0x04) {
    return {
      error: fail(415, "This is a ZIP archive or an Excel workbook. Unzip the .epw file, or save the sheet as CSV, and upload that."),
    };
  }
  if (b[0] === 0x25 && b[1] === 0x50 && b[2] === 0x44 && b[3] === 0x46) return { error: fail(415, "This is a PDF. Upload an .epw or .csv weather file.") };
  const head = b.subarray(0, Math.min(b.byteLength, 8192));
  if (head.includes(0)) return { error: fail(415, "This is not a text file. Upload an .epw or .csv weather file.") };
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(b);
  } catch {
    // Older weather files carry Latin-1 place names; windows-1252 decodes every byte.
    text = new TextDecoder("windows-1252").decode(b);
  }
  text = text.replace(/^\uFEFF/, "");
  const ext = (file.name.toLowerCase().match(/\.([a-z0-9]+)$/)?.[1] ?? "").trim();
  const looksEpw = /^\s*LOCATION\s*,/i.test(text);
  if (looksEpw || ext === "epw") return { kind: "epw", text };
  // The TMY3 layout (station line, then its own header) is read without asking for a column mapping.
  if (looksLikeTmy3(text)) return { kind: "tmy3", text };
  if (["csv", "txt", "tsv", "dat", ""].includes(ext)) return { kind: "csv", text };
  return { error: fail(415, `A .${ext} file is not a weather file LoopLedger reads. Upload an EnergyPlus .epw file or an hourly .csv table.`) };
}

const datasetName = text().trim().max(200).optional();

async function store(db: Executor, target: ImportTarget, ds: NewDataset): Promise<string> {
  return inTransaction(db, async (trx) => {
    const { id } = await insertClimateDataset(
      trx,
      climateDatasetRow(ds, { projectId: target.projectId, createdBy: target.actorId }),
    );
    await writeAudit(trx, {
      actorId: target.actorId,
      firmId: target.firmId,
      projectId: target.projectId,
      action: ds.fileName ? "climate.import" : "climate.enterBins",
      targetType: "climate_dataset",
      targetId: id,
      detail: {
        name: ds.name,
        sourceKind: ds.sourceKind,
        fileName: ds.fileName,
        records: ds.recordCount,
        hours: ds.hoursTotal,
        missing: ds.missingCount,
        warnings: ds.provenance.warnings.length,
      },
    });
    return id;
  });
}

/**
 * Import an uploaded weather file into a project (the caller has authorized climate.manage).
 * EPW: parsed at once. CSV without a mapping: a preview and a guessed mapping come back (200, nothing
 * stored); with a mapping: parsed with it. A file the parser rejects returns its line/field errors (422)
 * and nothing is stored.
 */
export async function importClimateFile(
  db: Executor,
  target: ImportTarget,
  form: ClimateUploadForm,
): Promise<ImportOutcome> {
  const name = datasetName.safeParse(form.name);
  const label = name.success ? name.data : undefined;
  const sniffed = sniffWeatherFile(form.file);
  if ("error" in sniffed) return sniffed.error;
  const sha256 = createHash("sha256").update(form.file.bytes).digest("hex");
  const meta = { fileName: form.file.name.slice(0, 255), name: label, byteSize: form.file.bytes.byteLength, sha256, siteElevationM: target.siteElevationM };

  if (sniffed.kind === "epw") {
    const parsed = parseEpw(sniffed.text);
    if (!parsed.ok) return fail(422, "The EPW file could not be read. Nothing was saved.", { issues: parsed.errors });
    const ds = datasetFromParsedFile(parsed.value, parsed.warnings, { ...meta, sourceKind: "epw" });
    const datasetId = await store(db, target, ds);
    return { status: 201, body: { ok: true, datasetId, name: ds.name, warnings: ds.provenance.warnings } };
  }

  if (sniffed.kind === "tmy3") {
    const parsed = parseTmy3(sniffed.text);
    if (!parsed.ok) return fail(422, "The file has the TMY3 layout but could not be read. Nothing was saved.", { issues: parsed.errors });
    const station = parseTmy3StationLine(sniffed.text.split(/\r?\n/, 1)[0] ?? "");
    const csvMapping = station ? (({ notes: _notes, ...m }) => m)(tmy3Mapping(sniffed.text, station)) : undefined;
    const ds = datasetFromParsedFile(parsed.value, parsed.warnings, { ...meta, sourceKind: "csv", layout: "TMY3", ...(csvMapping ? { csvMapping } : {}) });
    const datasetId = await store(db, target, ds);
    return { status: 201, body: { ok: true, datasetId, name: ds.name, warnings: ds.provenance.warnings } };
  }

  if (form.mapping === undefined) {
    return { status: 200, body: { ok: false, step: "mapping", fileName: meta.fileName, preview: previewCsv(sniffed.text) } };
  }
  const mapping = csvMappingSchema.safeParse(form.mapping);
  if (!mapping.success) {
    return fail(400, "The column mapping is incomplete.", { fieldErrors: toFieldErrors(humaneIssues(mapping.error.issues)) });
  }
  const engineMapping = toHourlyCsvMapping(mapping.data, { elevationM: target.siteElevationM, ...(label ? { label } : {}) });
  const parsed = parseHourlyCsv(sniffed.text, engineMapping);
  if (!parsed.ok) return fail(422, "The CSV file could not be read with this mapping. Nothing was saved.", { issues: parsed.errors });
  const ds = datasetFromParsedFile(parsed.value, parsed.warnings, { ...meta, sourceKind: "csv", csvMapping: engineMapping });
  const datasetId = await store(db, target, ds);
  return { status: 201, body: { ok: true, datasetId, name: ds.name, warnings: ds.provenance.warnings } };
}

/**
 * Save an entered bin table (SI values; validated with the scenario climate schema) as a climate dataset of
 * the project (climate.manage). Input: `{ projectId, source, name, bins }`. All field errors, or the new id.
 */
export const saveBinTable = defineAction({
  gate: { project: "climate.manage" },
  schema: binTableSubmissionSchema,
  run: async (db, { access }, v): Promise<Result<{ datasetId: string; warnings: ClimateIssue[] }>> => {
    const { project, viewer } = access;
    const target: ImportTarget = { projectId: project.id, firmId: project.firmId, actorId: viewer.id, siteElevationM: project.elevationM };
    const ds =
      v.source === "wetBulbBins"
        ? datasetFromBins({ source: "wetBulbBins", bins: v.bins }, { name: v.name, siteElevationM: target.siteElevationM })
        : datasetFromBins({ source: "dryBulbBins", bins: v.bins }, { name: v.name, siteElevationM: target.siteElevationM });
    const datasetId = await store(db, target, ds);
    return ok({ datasetId, warnings: ds.provenance.warnings });
  },
});
