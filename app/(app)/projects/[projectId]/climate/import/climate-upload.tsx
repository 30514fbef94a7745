"use client";

import { useId, useState, type FormEvent, type ReactNode } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/forms/field-shell";
import { previewCsv, type CsvMappingInput, type CsvPreview } from "@/lib/climate/csv-mapping";
import { formatNumber } from "@/lib/units";

interface Issue {
  line: number;
  field: string;
  message: string;
}

type Response =
  | { ok: true; datasetId: string; name: string; warnings: Issue[] }
  | { ok: false; step: "mapping"; fileName: string; preview: CsvPreview }
  | { ok: false; step?: undefined; error: string; issues?: Issue[]; fieldErrors?: Record<string, string[]> };

const selectClass = `${inputClass} border-line-strong`;

function Select({
  label,
  value,
  onChange,
  options,
  testId,
}: {
  label: string;
  value: string;
  onChange: (v: string) => void;
  options: { value: string; label: string }[];
  testId?: string;
}) {
  const id = useId();
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={`mt-1 ${selectClass}`} data-testid={testId}>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

function Fieldset({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
      <legend className="mb-1 text-sm font-semibold text-ink-soft">{legend}</legend>
      {children}
    </fieldset>
  );
}

/** The mapping's parts by name, for messages about them (never a schema path). */
const MAPPING_FIELD_NAMES: Record<string, string> = {
  delimiter: "Delimiter",
  decimalSeparator: "Decimal separator",
  skipLines: "Header on line",
  hasHeader: "Header line",
  temperatureUnit: "Temperatures in",
  dryBulb: "Dry-bulb column",
  humidity: "Humidity",
  time: "Time",
  pressure: "Station pressure",
};

/** Humidity choice as one select: RH in % or as a fraction, dew point, or wet-bulb. */
type HumidityChoice = "rhPercent" | "rhFraction" | "dewPoint" | "wetBulb";
function humidityChoice(m: CsvMappingInput): HumidityChoice {
  if (m.humidity.kind === "relativeHumidity") return m.humidity.unit === "fraction" ? "rhFraction" : "rhPercent";
  return m.humidity.kind;
}

function MappingEditor({
  preview,
  mapping,
  onChange,
  onHeaderLine,
}: {
  preview: CsvPreview;
  mapping: CsvMappingInput;
  onChange: (m: CsvMappingInput) => void;
  /** Re-read the preview with the header on another line (lines above it are skipped). */
  onHeaderLine: (skipLines: number) => void;
}) {
  const columns = preview.header.map((h, i) => ({ value: String(i), label: `${i + 1}: ${mapping.hasHeader === false ? `column ${i + 1}` : h || `column ${i + 1}`}` }));
  const set = (patch: Partial<CsvMappingInput>) => onChange({ ...mapping, ...patch });
  const time = mapping.time;
  const mdhDefaults = { month: 0, day: 1, hour: 2 };
  return (
    <div className="space-y-5" data-testid="csv-mapping">
      <div>
        <p className="text-sm font-semibold">First rows of the file</p>
        <div className="mt-2 max-h-64 overflow-auto rounded-md border border-line">
          <table className="w-full text-xs" data-testid="csv-preview">
            <thead className="sticky top-0 bg-paper-sunk text-left">
              <tr>
                {preview.header.map((h, i) => (
                  <th key={i} scope="col" className="px-2 py-1 font-medium">
                    <span className="text-ink-faint">{i + 1}</span> {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {preview.rows.map((r, ri) => (
                <tr key={ri} className="border-t border-line">
                  {preview.header.map((_, ci) => (
                    <td key={ci} className="px-2 py-1 font-mono">
                      {r[ci] ?? ""}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <p className="mt-1 text-xs text-ink-faint">About {formatNumber(preview.lineCount, { decimals: 0 })} lines. The choices below are a first guess from the header: check each one.</p>
      </div>

      <Fieldset legend="How the file is written">
        <div>
          <label htmlFor="csv-header-line" className="block text-sm font-medium">
            Header on line
          </label>
          <input
            id="csv-header-line"
            data-testid="csv-header-line"
            type="number"
            min={1}
            max={40}
            value={(mapping.skipLines ?? 0) + 1}
            onChange={(e) => {
              const n = Math.round(Number(e.target.value));
              if (Number.isFinite(n) && n >= 1 && n <= 40) onHeaderLine(n - 1);
            }}
            className="mt-1 w-full rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-sm"
            aria-describedby="csv-header-line-hint"
          />
          <p id="csv-header-line-hint" className="mt-1 text-xs text-ink-faint">
            {(mapping.skipLines ?? 0) === 0 ? "No lines above the header." : `The ${mapping.skipLines} line${mapping.skipLines === 1 ? "" : "s"} above it are skipped (station data, notes).`}
          </p>
        </div>
        <Select
          label="Delimiter"
          value={mapping.delimiter}
          onChange={(v) => set({ delimiter: v as CsvMappingInput["delimiter"] })}
          options={[
            { value: ",", label: "Comma ," },
            { value: ";", label: "Semicolon ;" },
            { value: "\t", label: "Tab" },
          ]}
        />
        <Select
          label="Decimal separator"
          value={mapping.decimalSeparator}
          onChange={(v) => set({ decimalSeparator: v as CsvMappingInput["decimalSeparator"] })}
          options={[
            { value: ".", label: "Point 12.5" },
            { value: ",", label: "Comma 12,5" },
          ]}
        />
        <Select
          label="Temperatures in"
          value={mapping.temperatureUnit}
          onChange={(v) => set({ temperatureUnit: v as "C" | "F" })}
          options={[
            { value: "C", label: "°C" },
            { value: "F", label: "°F" },
          ]}
          testId="csv-temperature-unit"
        />
      </Fieldset>

      <Fieldset legend="Time">
        <Select
          label="Time is given as"
          value={time.kind}
          onChange={(v) =>
            set({
              time:
                v === "timestamp"
                  ? { kind: "timestamp", column: 0, format: "iso", convention: "start" }
                  : v === "dateAndTime"
                    ? { kind: "dateAndTime", date: 0, time: 1, format: "mdy", convention: "start" }
                    : { kind: "monthDayHour", ...mdhDefaults, hourConvention: "auto" },
            })
          }
          options={[
            { value: "timestamp", label: "One date-and-time column" },
            { value: "dateAndTime", label: "A date column and a time column" },
            { value: "monthDayHour", label: "Month, day and hour columns" },
          ]}
          testId="csv-time-kind"
        />
        {time.kind === "timestamp" ? (
          <>
            <Select label="Date-and-time column" value={String(time.column)} onChange={(v) => set({ time: { ...time, column: Number(v) } })} options={columns} />
            <Select
              label="Date format"
              value={time.format ?? "iso"}
              onChange={(v) => set({ time: { ...time, format: v as "iso" | "dmy" | "mdy" } })}
              options={[
                { value: "iso", label: "2023-07-31 14:00" },
                { value: "dmy", label: "31.07.2023 14:00 (day first)" },
                { value: "mdy", label: "07/31/2023 14:00 (month first)" },
              ]}
            />
            <Select
              label="A stamp marks"
              value={time.convention ?? "start"}
              onChange={(v) => set({ time: { ...time, convention: v as "start" | "end" } })}
              options={[
                { value: "start", label: "the start of its hour" },
                { value: "end", label: "the end of its hour" },
              ]}
            />
          </>
        ) : time.kind === "dateAndTime" ? (
          <>
            <Select label="Date column" value={String(time.date)} onChange={(v) => set({ time: { ...time, date: Number(v) } })} options={columns} testId="csv-date-column" />
            <Select label="Time column" value={String(time.time)} onChange={(v) => set({ time: { ...time, time: Number(v) } })} options={columns} testId="csv-time-column" />
            <Select
              label="Date format"
              value={time.format ?? "mdy"}
              onChange={(v) => set({ time: { ...time, format: v as "iso" | "dmy" | "mdy" } })}
              options={[
                { value: "iso", label: "2023-07-31" },
                { value: "dmy", label: "31.07.2023 (day first)" },
                { value: "mdy", label: "07/31/2023 (month first)" },
              ]}
            />
            <Select
              label="A time marks"
              value={time.convention ?? "start"}
              onChange={(v) => set({ time: { ...time, convention: v as "start" | "end" } })}
              options={[
                { value: "start", label: "the start of its hour (00:00 … 23:00)" },
                { value: "end", label: "the end of its hour (01:00 … 24:00)" },
              ]}
            />
          </>
        ) : (
          <>
            <Select label="Month column" value={String(time.month)} onChange={(v) => set({ time: { ...time, month: Number(v) } })} options={columns} />
            <Select label="Day column" value={String(time.day)} onChange={(v) => set({ time: { ...time, day: Number(v) } })} options={columns} />
            <Select label="Hour column" value={String(time.hour)} onChange={(v) => set({ time: { ...time, hour: Number(v) } })} options={columns} />
            <Select
              label="Hours are numbered"
              value={time.hourConvention ?? "auto"}
              onChange={(v) => set({ time: { ...time, hourConvention: v as "0-23" | "1-24" | "auto" } })}
              options={[
                { value: "auto", label: "find out from the data" },
                { value: "0-23", label: "0…23 (hour starting)" },
                { value: "1-24", label: "1…24 (hour ending, as EPW)" },
              ]}
            />
          </>
        )}
      </Fieldset>

      <Fieldset legend="Weather">
        <Select label="Dry-bulb column" value={String(mapping.dryBulb)} onChange={(v) => set({ dryBulb: Number(v) })} options={columns} testId="csv-dry-bulb" />
        <Select
          label="Humidity is"
          value={humidityChoice(mapping)}
          onChange={(v) => {
            const column = mapping.humidity.column;
            const c = v as HumidityChoice;
            set({
              humidity:
                c === "rhPercent" || c === "rhFraction"
                  ? { kind: "relativeHumidity", column, unit: c === "rhPercent" ? "percent" : "fraction" }
                  : { kind: c, column },
            });
          }}
          options={[
            { value: "rhPercent", label: "Relative humidity, %" },
            { value: "rhFraction", label: "Relative humidity, 0…1" },
            { value: "dewPoint", label: "Dew point (same unit as dry-bulb)" },
            { value: "wetBulb", label: "Wet-bulb (same unit as dry-bulb)" },
          ]}
          testId="csv-humidity-kind"
        />
        <Select
          label="Humidity column"
          value={String(mapping.humidity.column)}
          onChange={(v) => set({ humidity: { ...mapping.humidity, column: Number(v) } })}
          options={columns}
          testId="csv-humidity-column"
        />
        <Select
          label="Station pressure column"
          value={mapping.pressure ? String(mapping.pressure.column) : ""}
          onChange={(v) => set({ pressure: v === "" ? undefined : { column: Number(v), unit: mapping.pressure?.unit ?? "hPa" } })}
          options={[{ value: "", label: "none — use the site's elevation" }, ...columns]}
        />
        {mapping.pressure ? (
          <Select
            label="Pressure unit"
            value={mapping.pressure.unit}
            onChange={(v) => set({ pressure: { column: mapping.pressure!.column, unit: v as "Pa" | "hPa" | "mbar" | "kPa" } })}
            options={[
              { value: "hPa", label: "hPa" },
              { value: "mbar", label: "mbar" },
              { value: "kPa", label: "kPa" },
              { value: "Pa", label: "Pa" },
            ]}
          />
        ) : null}
      </Fieldset>
    </div>
  );
}

/** Upload an EPW or hourly CSV; a CSV gets a column-mapping step; a broken file shows its line/field errors. */
export function ClimateUpload({ projectId, maxBytes }: { projectId: string; maxBytes: number }) {
  const router = useRouter();
  const fileId = useId();
  const nameId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState("");
  const [preview, setPreview] = useState<CsvPreview | null>(null);
  const [mapping, setMapping] = useState<CsvMappingInput | null>(null);
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [issues, setIssues] = useState<Issue[]>([]);
  const [mappingErrors, setMappingErrors] = useState<string[]>([]);
  const maxMb = Math.round(maxBytes / (1024 * 1024));

  async function submit(e: FormEvent) {
    e.preventDefault();
    setError(null);
    setIssues([]);
    setMappingErrors([]);
    if (!file) {
      setError("Choose a weather file first.");
      return;
    }
    if (file.size > maxBytes) {
      setError(`The file is ${formatNumber(file.size / (1024 * 1024), { decimals: 1 })} MB; the limit is ${maxMb} MB. An hourly year is about 1.5 MB.`);
      return;
    }
    const body = new FormData();
    body.set("file", file);
    if (name.trim()) body.set("name", name.trim());
    if (preview && mapping) body.set("mapping", JSON.stringify(mapping));
    setPending(true);
    try {
      const res = await fetch(`/api/projects/${projectId}/climate`, { method: "POST", body });
      const data = (await res.json().catch(() => ({ ok: false, error: `The server answered ${res.status}.` }))) as Response;
      if (data.ok) {
        router.push(`/projects/${projectId}/climate/${data.datasetId}`);
        router.refresh();
        return;
      }
      if (data.step === "mapping") {
        setPreview(data.preview);
        setMapping(data.preview.guess);
        return;
      }
      setError(data.error ?? `The upload failed (${res.status}).`);
      setIssues(data.issues ?? []);
      setMappingErrors(Object.entries(data.fieldErrors ?? {}).map(([k, v]) => `${MAPPING_FIELD_NAMES[k.split(".")[0] ?? ""] ?? "Column mapping"}: ${v.join(" ")}`));
    } catch {
      setError("The upload did not reach the server. Check the connection and try again; nothing was saved.");
    } finally {
      setPending(false);
    }
  }

  return (
    <form method="post" onSubmit={submit} className="space-y-5" noValidate data-testid="climate-upload">
      <div className="grid gap-4 md:grid-cols-2">
        <div>
          <label htmlFor={fileId} className="block text-sm font-medium">
            Weather file <span className="font-normal text-ink-faint">(.epw or .csv, up to {maxMb} MB)</span>
          </label>
          <input
            id={fileId}
            name="file"
            type="file"
            accept=".epw,.csv,.txt,.tsv,text/csv,text/plain"
            aria-describedby={`${fileId}-hint`}
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
              setMapping(null);
              setError(null);
              setIssues([]);
            }}
            className="mt-1 block w-full text-sm file:mr-3 file:rounded-md file:border file:border-line-strong file:bg-paper-raised file:px-3 file:py-1.5 file:text-sm hover:file:bg-paper-sunk"
          />
          <p id={`${fileId}-hint`} className="mt-1 text-xs text-ink-faint">
            The file is read on the server; nothing is stored unless it reads cleanly.
          </p>
        </div>
        <div>
          <label htmlFor={nameId} className="block text-sm font-medium">
            Name <span className="font-normal text-ink-faint">(optional)</span>
          </label>
          <input
            id={nameId}
            value={name}
            maxLength={200}
            onChange={(e) => setName(e.target.value)}
            placeholder="Defaults to the file's location"
            className={`mt-1 ${selectClass}`}
          />
        </div>
      </div>

      {preview && mapping ? (
        <MappingEditor
          preview={preview}
          mapping={mapping}
          onChange={setMapping}
          onHeaderLine={(skip) => {
            // The first lines came with the preview: read them again with the header lower down.
            const again = previewCsv(preview.headLines.join("\n"), skip);
            setPreview({ ...again, lineCount: preview.lineCount, headLines: preview.headLines });
            setMapping(again.guess);
          }}
        />
      ) : null}

      <div aria-live="polite">
        {error ? (
          <div role="alert" className="rounded-panel border border-danger-600 bg-danger-50 px-4 py-3 text-sm text-danger-700" data-testid="climate-upload-error">
            <p className="font-semibold">{error}</p>
            {mappingErrors.length > 0 ? (
              <ul className="mt-1 list-disc pl-5">
                {mappingErrors.map((m) => (
                  <li key={m}>{m}</li>
                ))}
              </ul>
            ) : null}
            {issues.length > 0 ? (
              <table className="mt-2 w-full text-xs" data-testid="climate-upload-issues">
                <thead className="text-left">
                  <tr>
                    <th className="py-1 pr-3 font-medium">Line</th>
                    <th className="py-1 pr-3 font-medium">Field</th>
                    <th className="py-1 font-medium">Problem</th>
                  </tr>
                </thead>
                <tbody>
                  {issues.slice(0, 50).map((i, k) => (
                    <tr key={k} className="border-t border-danger-600/30">
                      <td className="num py-1 pr-3">{i.line > 0 ? i.line : "—"}</td>
                      <td className="py-1 pr-3 font-mono">{i.field}</td>
                      <td className="py-1">{i.message}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            ) : null}
          </div>
        ) : null}
      </div>

      <div className="flex items-center gap-3">
        <Button type="submit" disabled={pending || !file} data-testid="climate-upload-submit">
          {pending ? "Reading the file…" : preview ? "Import with these columns" : "Upload and read"}
        </Button>
        {preview ? (
          <span className="text-sm text-ink-soft">The file is sent again with your column choices.</span>
        ) : null}
      </div>
    </form>
  );
}
