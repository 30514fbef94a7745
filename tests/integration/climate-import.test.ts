import { afterAll, beforeAll, describe, expect, it } from "vitest";
import psychrolib from "psychrolib";
import { testDb, uniq } from "../support/db";
import { createUser } from "@/db/queries/users";
import { loadViewer, type Viewer } from "@/lib/auth/access";
import { insertProject } from "@/db/queries/projects";
import { countClimateDatasets, findClimateDatasetData, findClimateDatasetSummary, listClimateDatasetsOfProject } from "@/db/queries/climate";
import { generateSyntheticYear, syntheticYearToCsv, syntheticYearToEpw } from "@/lib/engine/climate";
import {
  importClimateFile,
  readClimateUpload,
  saveBinTable,
  MAX_CLIMATE_UPLOAD_BYTES,
  type ImportTarget,
} from "@/lib/climate/import";
import type { StoredClimateSummary, StoredHourlyData } from "@/lib/climate/build";

const db = testDb();
const enc = new TextEncoder();
let target: ImportTarget;
let consultant: Viewer;

beforeAll(async () => {
  const user = await createUser(db, { email: `${uniq("clim")}@example.test`, name: "Climate Tester", passwordHash: null });
  const firm = await db.insertInto("firms").values({ name: uniq("Climate firm ") }).returning("id").executeTakeFirstOrThrow();
  await db.insertInto("firm_members").values({ firm_id: firm.id, user_id: user.id, role: "consultant" }).execute();
  const project = await insertProject(db, {
    firm_id: firm.id,
    name: uniq("Climate project "),
    client_name: "Invented client",
    site_name: "Invented site",
    elevation_m: 240,
    created_by: user.id,
  });
  target = { projectId: project.id, firmId: firm.id, actorId: user.id, siteElevationM: 240 };
  consultant = (await loadViewer(db, user.id))!;
});
afterAll(() => db.destroy());

const file = (name: string, text: string) => ({ name, bytes: enc.encode(text) });

/** Wet-bulb exceeded by p % of the hours: the (1 − p) sample quantile, Hyndman & Fan (1996) type 7 (numpy's default). */
function exceeded(values: number[], p: number): number {
  const s = values.slice().sort((a, b) => a - b);
  const h = (s.length - 1) * (1 - p / 100);
  const lo = Math.floor(h);
  return s[lo]! + (h - lo) * (s[Math.min(lo + 1, s.length - 1)]! - s[lo]!);
}

describe("EPW upload → stored dataset", () => {
  const year = generateSyntheticYear({ seed: 4242 });
  const epw = syntheticYearToEpw(year);

  it("stores 8760 records and hours with location, elevation, summary and data", async () => {
    const before = await countClimateDatasets(db, target.projectId);
    const out = await importClimateFile(db, target, { file: file("invented-site.epw", epw), name: "Invented site TMY" });
    expect(out.status).toBe(201);
    if (out.status !== 201) return;
    expect(await countClimateDatasets(db, target.projectId)).toBe(before + 1);

    const row = await findClimateDatasetSummary(db, target.projectId, out.body.datasetId);
    expect(row).toBeDefined();
    // A common (non-leap) year has 365 × 24 = 8760 hours; the EPW format has one record per hour here
    // (EnergyPlus Auxiliary Programs, EPW data dictionary, DATA PERIODS "1" record per hour).
    expect(row!.recordCount).toBe(8760);
    expect(row!.hoursTotal).toBe(8760);
    expect(row!.missingCount).toBe(0);
    expect(row!.sourceKind).toBe("epw");
    expect(row!.name).toBe("Invented site TMY");
    const prov = row!.provenance as Record<string, unknown>;
    expect((prov.location as { name: string }).name).toBe("Harrowgate Flats");
    expect(prov.stationElevationM).toBe(240);
    expect(prov.fileName).toBe("invented-site.epw");
    expect(prov.sha256).toMatch(/^[0-9a-f]{64}$/);

    const summary = row!.summary as StoredClimateSummary;
    expect(summary.hours).toBe(8760);
    expect(summary.wetBulbHistogram.reduce((s, b) => s + b.hours, 0)).toBe(8760);
    expect(summary.monthHourMeanWetBulbC).toHaveLength(12);
    expect(summary.monthHourMeanWetBulbC![0]).toHaveLength(24);

    // Independent check of the design wet-bulbs: psychrolib (the ASHRAE Handbook—Fundamentals 2017 ch.1
    // formulas, npm reference implementation) from each hour's dry-bulb, dew point and station pressure,
    // then the annual exceedance percentiles of ASHRAE Fundamentals 2017 ch.14 (0.4 / 1 / 2 %).
    psychrolib.SetUnitSystem(psychrolib.SI);
    const wb = year.hours.map((h) => psychrolib.GetTWetBulbFromTDewPoint(h.dryBulbC, Math.min(h.dewPointC, h.dryBulbC), h.pressurePa));
    for (const d of summary.designWetBulbC) {
      // 0.02 K: the engine's solver and psychrolib's bisection each stop within ~0.001 K; stored values are rounded to 0.001 K.
      expect(Math.abs(d.wetBulbC! - exceeded(wb, d.exceedancePercent))).toBeLessThan(0.02);
    }

    const data = (await findClimateDatasetData(db, target.projectId, out.body.datasetId))!.data as StoredHourlyData;
    expect(data.dryBulbC).toHaveLength(8760);
    expect(data.wetBulbC).toHaveLength(8760);
    // EPW hour 1 is the hour ending 01:00; stored hours start at 0 (hour starting), per lib/engine/climate/types.ts.
    expect(data.hour[0]).toBe(0);
    expect(data.dryBulbC[0]).toBeCloseTo(year.hours[0]!.dryBulbC, 6);
    expect(data.wetBulbBins.reduce((s, b) => s + b.hours, 0)).toBe(8760);

    const list = await listClimateDatasetsOfProject(db, target.projectId);
    expect(list.some((d) => d.id === out.body.datasetId)).toBe(true);
  });

  it("a leap year with 29 February gives 8784 hours (366 × 24)", async () => {
    const leap = syntheticYearToEpw(generateSyntheticYear({ seed: 99, leapYear: true }));
    const out = await importClimateFile(db, target, { file: file("leap.epw", leap) });
    expect(out.status).toBe(201);
    if (out.status !== 201) return;
    const row = await findClimateDatasetSummary(db, target.projectId, out.body.datasetId);
    expect(row!.hoursTotal).toBe(8784);
    // Without a name, the dataset is named after the EPW LOCATION header.
    expect(row!.name).toBe("Harrowgate Flats");
  });

  it("a station far above the site gets an elevation warning", async () => {
    const out = await importClimateFile(db, { ...target, siteElevationM: 1500 }, { file: file("far.epw", epw) });
    expect(out.status).toBe(201);
    if (out.status !== 201) return;
    expect(out.body.warnings.some((w) => w.field === "elevation")).toBe(true);
  });
});

describe("broken uploads store nothing and say where the problem is", () => {
  const lines = syntheticYearToEpw(generateSyntheticYear({ seed: 5 })).split("\n");

  async function rejected(text: string, name = "broken.epw") {
    const before = await countClimateDatasets(db, target.projectId);
    const out = await importClimateFile(db, target, { file: file(name, text) });
    expect(await countClimateDatasets(db, target.projectId)).toBe(before);
    return out;
  }

  it("a truncated file: the line where the data stops", async () => {
    // 8 header lines + 5000 data rows: the file stops at line 5008 (header lines: EPW data dictionary).
    const out = await rejected(lines.slice(0, 8 + 5000).join("\n"));
    expect(out.status).toBe(422);
    if (out.status !== 422) return;
    const issue = out.body.issues?.[0];
    expect(issue?.line).toBe(5008);
    expect(issue?.field).toBe("data");
    expect(issue?.message).toMatch(/truncated/);
  });

  it("a row with the wrong field count: its line and the absent field", async () => {
    const broken = lines.slice();
    // Data row of hour 100 is file line 8 + 100 + 1 = 109; cut it to 7 fields (dew point, field 8, absent).
    broken[108] = broken[108]!.split(",").slice(0, 7).join(",");
    const out = await rejected(broken.join("\n"));
    expect(out.status).toBe(422);
    if (out.status !== 422) return;
    expect(out.body.issues).toEqual([
      expect.objectContaining({ line: 109, field: "dewPointC", message: expect.stringMatching(/7 fields, expected 35/) }),
    ]);
  });

  it("a non-numeric dry-bulb: its line and field", async () => {
    const broken = lines.slice();
    const f = broken[2000]!.split(",");
    f[6] = "warm";
    broken[2000] = f.join(",");
    const out = await rejected(broken.join("\n"));
    expect(out.status).toBe(422);
    if (out.status !== 422) return;
    expect(out.body.issues?.[0]).toMatchObject({ line: 2001, field: "dryBulbC" });
  });

  it("a wrong header, a binary file, an unknown type", async () => {
    const header = await rejected(["LOCATION,x,y,z,s,0,1,2,3,4", "NOT A HEADER", ...lines.slice(2)].join("\n"));
    expect(header.status).toBe(422);
    if (header.status === 422) expect(header.body.issues?.[0]).toMatchObject({ line: 2, field: "DESIGN CONDITIONS" });

    const before = await countClimateDatasets(db, target.projectId);
    const zip = await importClimateFile(db, target, { file: { name: "weather.xlsx", bytes: new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]) } });
    expect(zip.status).toBe(415);
    const pdf = await importClimateFile(db, target, { file: file("weather.docx", "hello") });
    expect(pdf.status).toBe(415);
    const empty = await importClimateFile(db, target, { file: file("empty.epw", "") });
    expect(empty.status).toBe(422);
    expect(await countClimateDatasets(db, target.projectId)).toBe(before);
  });
});

describe("CSV upload: a preview and a mapping, then the import", () => {
  const year = generateSyntheticYear({ seed: 77 });
  // `;` delimited with decimal commas and °F (as spreadsheet exports in many locales write them).
  const csv = syntheticYearToCsv(year, { delimiter: ";", decimalComma: true, temperatureUnit: "F", humidity: "dewPoint" });

  it("without a mapping: a preview with a guessed mapping, nothing stored", async () => {
    const before = await countClimateDatasets(db, target.projectId);
    const out = await importClimateFile(db, target, { file: file("site.csv", csv) });
    expect(out.status).toBe(200);
    expect(await countClimateDatasets(db, target.projectId)).toBe(before);
    if (out.status !== 200) return;
    const p = out.body.preview;
    expect(p.delimiter).toBe(";");
    expect(p.decimalSeparator).toBe(",");
    expect(p.header).toEqual(["timestamp", "dry_bulb_F", "dew_point_F"]);
    expect(p.rows.length).toBeGreaterThan(3);
    expect(p.guess).toMatchObject({
      temperatureUnit: "F",
      dryBulb: 1,
      humidity: { kind: "dewPoint", column: 2 },
      time: { kind: "timestamp", column: 0, format: "iso" },
    });
  });

  it("with the mapping: stored, °F converted by t°C = (t°F − 32)/1.8 (NIST SP 811 B.9)", async () => {
    const preview = await importClimateFile(db, target, { file: file("site.csv", csv) });
    if (preview.status !== 200) throw new Error("expected a preview");
    const out = await importClimateFile(db, target, { file: file("site.csv", csv), mapping: preview.body.preview.guess, name: "CSV year" });
    expect(out.status).toBe(201);
    if (out.status !== 201) return;
    const row = await findClimateDatasetSummary(db, target.projectId, out.body.datasetId);
    expect(row!.sourceKind).toBe("csv");
    expect(row!.recordCount).toBe(8760);
    const data = (await findClimateDatasetData(db, target.projectId, out.body.datasetId))!.data as StoredHourlyData;
    // The CSV carries the dry-bulb to 0.01 °F: 0.005 °F = 0.003 K of rounding.
    expect(Math.abs(data.dryBulbC[1000]! - year.hours[1000]!.dryBulbC)).toBeLessThan(0.005);
  });

  it("a mapping naming a column the file does not have: 422, nothing stored", async () => {
    const before = await countClimateDatasets(db, target.projectId);
    const out = await importClimateFile(db, target, {
      file: file("site.csv", csv),
      mapping: { delimiter: ";", decimalSeparator: ",", temperatureUnit: "F", dryBulb: 7, humidity: { kind: "dewPoint", column: 2 }, time: { kind: "timestamp", column: 0 } },
    });
    expect(out.status).toBe(422);
    if (out.status === 422) expect(out.body.issues?.[0]).toMatchObject({ line: 2, field: "column 8" });
    const incomplete = await importClimateFile(db, target, { file: file("site.csv", csv), mapping: { delimiter: ";" } });
    expect(incomplete.status).toBe(400);
    if (incomplete.status === 400) expect(Object.keys(incomplete.body.fieldErrors ?? {})).toEqual(expect.arrayContaining(["dryBulb", "temperatureUnit"]));
    expect(await countClimateDatasets(db, target.projectId)).toBe(before);
  });
});

describe("bin tables", () => {
  it("stores wet-bulb bins with their hours total and design wet-bulb from the bins", async () => {
    const bins = [
      { wetBulbC: 24, meanCoincidentDryBulbC: 30, hours: 40 },
      { wetBulbC: 22, meanCoincidentDryBulbC: 28, hours: 300 },
      { wetBulbC: 18, meanCoincidentDryBulbC: 23, hours: 2000 },
      { wetBulbC: 10, meanCoincidentDryBulbC: 13, hours: 3000 },
      { wetBulbC: 0, meanCoincidentDryBulbC: 2, hours: 3420 },
    ];
    const out = await saveBinTable(db, consultant, { projectId: target.projectId, source: "wetBulbBins", name: "Entered bins", bins });
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const row = await findClimateDatasetSummary(db, target.projectId, out.value.datasetId);
    expect(row!.hoursTotal).toBe(8760);
    expect(row!.sourceKind).toBe("wetBulbBins");
    const s = row!.summary as StoredClimateSummary;
    // 0.4 % of 8760 h = 35 h: the 24 °C bin (40 h) holds them — the weighted exceedance rule of ASHRAE 2017 ch.14 on bins.
    expect(s.designWetBulbC.find((d) => d.exceedancePercent === 0.4)?.wetBulbC).toBe(24);
    // 1 % = 87.6 h: reached inside the 22 °C bin (40 + 300 h).
    expect(s.designWetBulbC.find((d) => d.exceedancePercent === 1)?.wetBulbC).toBe(22);
  });

  it("every bad cell comes back with its path; nothing stored", async () => {
    const before = await countClimateDatasets(db, target.projectId);
    const out = await saveBinTable(db, consultant, {
      projectId: target.projectId,
      source: "dryBulbBins",
      name: "",
      bins: [
        { dryBulbC: 30, meanCoincidentWetBulbC: 22, hours: -5 },
        { dryBulbC: 20, meanCoincidentWetBulbC: 25, hours: 100 },
      ],
    });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(Object.keys(out.fieldErrors ?? {}).sort()).toEqual(["bins.0.hours", "bins.1.meanCoincidentWetBulbC", "name"]);
    expect(await countClimateDatasets(db, target.projectId)).toBe(before);
  });
});

describe("upload body limits", () => {
  it("refuses a declared body over 10 MB before reading it", async () => {
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled++;
        controller.enqueue(new Uint8Array(1024));
      },
    });
    const req = new Request("http://x/", {
      method: "POST",
      headers: { "content-type": "multipart/form-data; boundary=x", "content-length": String(MAX_CLIMATE_UPLOAD_BYTES * 2) },
      body,
      duplex: "half",
    } as RequestInit);
    const out = await readClimateUpload(req);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.outcome.status).toBe(413);
    expect(pulled).toBeLessThanOrEqual(1);
  });

  it("stops reading a streamed body once it passes the limit", async () => {
    let sent = 0;
    const chunk = new Uint8Array(1024 * 1024);
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += chunk.byteLength;
        if (sent > 40 * 1024 * 1024) controller.close();
        else controller.enqueue(chunk);
      },
    });
    const req = new Request("http://x/", { method: "POST", headers: { "content-type": "multipart/form-data; boundary=x" }, body, duplex: "half" } as RequestInit);
    const out = await readClimateUpload(req);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.outcome.status).toBe(413);
    expect(sent).toBeLessThan(12 * 1024 * 1024);
  });

  it("reads a real multipart upload with its name and mapping", async () => {
    const fd = new FormData();
    fd.set("file", new Blob(["LOCATION,a"]), "tiny.epw");
    fd.set("name", "  My year ");
    fd.set("mapping", JSON.stringify({ delimiter: ";" }));
    const req = new Request("http://x/", { method: "POST", body: fd });
    const out = await readClimateUpload(req);
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.form.file.name).toBe("tiny.epw");
    expect(out.form.name).toBe("My year");
    expect(out.form.mapping).toEqual({ delimiter: ";" });
    const notMultipart = await readClimateUpload(new Request("http://x/", { method: "POST", body: "x", headers: { "content-type": "text/plain" } }));
    expect(notMultipart.ok ? 0 : notMultipart.outcome.status).toBe(415);
  });
});

describe("pasting a bin table from a spreadsheet", () => {
  it("reads tab-separated rows with a header and decimal commas; reports a short row by its line", async () => {
    const { parsePastedBins } = await import("@/lib/climate/paste");
    const r = parsePastedBins("Wet-bulb\tDry-bulb\tHours\n24,5\t30\t40\n22\t28\t300\t7\n\n18\t23\n");
    expect(r.delimiter).toBe("\t");
    expect(r.rows).toEqual([
      { bin: 24.5, coincident: 30, hours: 40, line: 2 },
      { bin: 22, coincident: 28, hours: 300, month: 7, line: 3 },
    ]);
    expect(r.problems).toEqual([{ line: 5, message: expect.stringMatching(/3 or 4 cells/) }]);
    // Comma-separated: commas cannot be decimals, so "1,5" would be two cells.
    expect(parsePastedBins("10,12,300").rows).toEqual([{ bin: 10, coincident: 12, hours: 300, line: 1 }]);
    expect(parsePastedBins("10;12,5;300").rows).toEqual([{ bin: 10, coincident: 12.5, hours: 300, line: 1 }]);
    expect(parsePastedBins("10\twarm\t300").problems[0]).toMatchObject({ line: 1, message: expect.stringMatching(/cell 2/) });
  });
});
