"use client";

import { useId, useState } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/forms/field-shell";
import { toFieldErrors, type FieldErrorMap } from "@/lib/result";
import { BIN_FIELDS, binTableSubmissionSchema } from "@/lib/climate/bins-schema";
import { parsePastedBins } from "@/lib/climate/paste";
import { formatNumber, inputText, parseNumberInput, toSI, unitLabel, type UnitSystem } from "@/lib/units";
import { saveBinTableAction } from "./actions";

type Source = "wetBulbBins" | "dryBulbBins";

interface Row {
  key: number;
  bin: string;
  coincident: string;
  hours: string;
  month: string;
}

let nextKey = 1;
const emptyRow = (): Row => ({ key: nextKey++, bin: "", coincident: "", hours: "", month: "" });

const COLUMN_TEXT: Record<Source, { bin: string; coincident: string }> = {
  wetBulbBins: { bin: "Wet-bulb bin", coincident: "Mean coincident dry-bulb" },
  dryBulbBins: { bin: "Dry-bulb bin", coincident: "Mean coincident wet-bulb" },
};

function num(text: string): number | undefined {
  const n = parseNumberInput(text);
  return n === null ? undefined : n;
}

/** An editable bin table in the project's units; paste from a spreadsheet; validated with the server's schema. */
export function BinTableEditor({ projectId, unitSystem }: { projectId: string; unitSystem: UnitSystem }) {
  const router = useRouter();
  const ids = { name: useId(), source: useId(), paste: useId() };
  const [source, setSource] = useState<Source>("wetBulbBins");
  const [name, setName] = useState("");
  const [rows, setRows] = useState<Row[]>(() => [emptyRow(), emptyRow(), emptyRow()]);
  const [paste, setPaste] = useState("");
  const [pasteProblems, setPasteProblems] = useState<{ line: number; message: string }[]>([]);
  const [serverErrors, setServerErrors] = useState<FieldErrorMap>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [submitted, setSubmitted] = useState(false);
  const [pending, setPending] = useState(false);
  const unit = unitLabel("temperatureC", unitSystem);
  const [binField, coincidentField] = BIN_FIELDS[source];

  const filled = rows.filter((r) => r.bin.trim() || r.coincident.trim() || r.hours.trim() || r.month.trim());
  const submission = (() => {
    const bins = filled.map((r) => {
      const b = num(r.bin);
      const c = num(r.coincident);
      const month = num(r.month);
      return {
        [binField]: b === undefined ? undefined : toSI("temperatureC", b, unitSystem),
        [coincidentField]: c === undefined ? undefined : toSI("temperatureC", c, unitSystem),
        hours: num(r.hours),
        ...(month !== undefined ? { month } : {}),
      };
    });
    return { source, name, bins };
  })();

  // The same schema the server applies, run on every change (a few hundred rows at most); shown once the person has tried to save.
  const parsed = binTableSubmissionSchema.safeParse(submission);
  const clientErrors: FieldErrorMap = parsed.success ? {} : toFieldErrors(parsed.error.issues);
  const errors: FieldErrorMap = submitted ? { ...clientErrors, ...serverErrors } : serverErrors;
  // Row errors are reported against the filled rows' positions; map them back to the table's rows.
  const filledIndex = new Map(filled.map((r, i) => [r.key, i]));
  const cellError = (row: Row, field: string) => {
    const i = filledIndex.get(row.key);
    return i === undefined ? undefined : errors[`bins.${i}.${field}`]?.[0];
  };
  const hoursTotal = filled.reduce((s, r) => s + (num(r.hours) ?? 0), 0);
  const tableErrors = [...(errors["bins"] ?? []), ...(errors[""] ?? [])];
  const errorCount = Object.values(errors).reduce((s, l) => s + l.length, 0);

  const update = (key: number, patch: Partial<Row>) => {
    setServerErrors({});
    setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...patch } : r)));
  };

  function applyPaste() {
    const result = parsePastedBins(paste);
    setPasteProblems(result.problems);
    if (result.rows.length === 0) return;
    setServerErrors({});
    setRows(
      result.rows.map((p) => ({
        key: nextKey++,
        bin: inputText(p.bin),
        coincident: inputText(p.coincident),
        hours: inputText(p.hours),
        month: p.month !== undefined ? inputText(p.month) : "",
      })),
    );
  }

  async function save() {
    setSubmitted(true);
    setFormError(null);
    const check = binTableSubmissionSchema.safeParse(submission);
    if (!check.success) return;
    setPending(true);
    try {
      const r = await saveBinTableAction(projectId, check.data);
      if (r.ok) {
        router.push(`/projects/${projectId}/climate/${r.value.datasetId}`);
        router.refresh();
        return;
      }
      setServerErrors(r.fieldErrors ?? {});
      setFormError(r.fieldErrors ? null : r.error);
    } finally {
      setPending(false);
    }
  }

  const cellInput = (row: Row, rowIndex: number, key: "bin" | "coincident" | "hours" | "month", field: string, label: string) => {
    const error = cellError(row, field);
    const errId = `bin-${row.key}-${key}-error`;
    return (
      <td className="px-1 py-1 align-top">
        <input
          value={row[key]}
          onChange={(e) => update(row.key, { [key]: e.target.value })}
          inputMode="decimal"
          aria-label={`Row ${rowIndex + 1}: ${label}`}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? errId : undefined}
          className={`${inputClass} num ${error ? "border-danger-600" : "border-line-strong"} px-2 py-1`}
          data-testid={`bin-${key}-${rowIndex}`}
        />
        {error ? (
          <p id={errId} className="mt-0.5 text-2xs text-danger-700">
            {error}
          </p>
        ) : null}
      </td>
    );
  };

  return (
    <div className="space-y-5" data-testid="bin-editor">
      <div className="grid gap-4 md:grid-cols-2">
        <div>
          <label htmlFor={ids.name} className="block text-sm font-medium">
            Name <span className="text-danger-700" aria-hidden="true">*</span>
          </label>
          <input
            id={ids.name}
            value={name}
            maxLength={200}
            onChange={(e) => setName(e.target.value)}
            placeholder="e.g. Airport bins, 1 K, 30-year"
            aria-invalid={errors.name ? true : undefined}
            aria-describedby={`${ids.name}-error`}
            className={`mt-1 ${inputClass} ${errors.name ? "border-danger-600" : "border-line-strong"}`}
          />
          <p id={`${ids.name}-error`} aria-live="polite" className="mt-1 text-xs text-danger-700">
            {errors.name?.[0]}
          </p>
        </div>
        <div>
          <label htmlFor={ids.source} className="block text-sm font-medium">
            The table is binned on
          </label>
          <select
            id={ids.source}
            value={source}
            onChange={(e) => setSource(e.target.value as Source)}
            className={`mt-1 ${inputClass} border-line-strong`}
          >
            <option value="wetBulbBins">wet-bulb, with the mean coincident dry-bulb of each bin</option>
            <option value="dryBulbBins">dry-bulb, with the mean coincident wet-bulb of each bin</option>
          </select>
        </div>
      </div>

      <details className="rounded-md border border-line bg-paper px-3 py-2">
        <summary className="cursor-pointer text-sm font-medium text-basin-700">Paste from a spreadsheet</summary>
        <label htmlFor={ids.paste} className="mt-2 block text-sm">
          Copy 3 or 4 columns — bin temperature, coincident temperature (both {unit}), hours, and optionally the month 1…12 — and
          paste them here. Tabs, <code>;</code> or <code>,</code> between cells; a header row is skipped.
        </label>
        <textarea
          id={ids.paste}
          value={paste}
          onChange={(e) => setPaste(e.target.value)}
          rows={6}
          className={`mt-2 ${inputClass} border-line-strong font-mono`}
          data-testid="bin-paste"
        />
        <div className="mt-2 flex items-center gap-3">
          <Button type="button" variant="secondary" onClick={applyPaste} data-testid="bin-paste-apply">
            Replace the table with these rows
          </Button>
          <span aria-live="polite" className="text-xs text-danger-700">
            {pasteProblems.length > 0 ? pasteProblems.slice(0, 5).map((p) => `line ${p.line}: ${p.message}`).join("; ") : null}
          </span>
        </div>
      </details>

      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="bin-table">
          <thead className="text-left text-xs uppercase tracking-wide text-ink-faint">
            <tr>
              <th className="w-10 px-1 py-1 font-medium">#</th>
              <th className="px-1 py-1 text-right font-medium">{COLUMN_TEXT[source].bin}, {unit}</th>
              <th className="px-1 py-1 text-right font-medium">{COLUMN_TEXT[source].coincident}, {unit}</th>
              <th className="px-1 py-1 text-right font-medium">Hours, h</th>
              <th className="px-1 py-1 text-right font-medium">Month (optional)</th>
              <th className="px-1 py-1">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row, i) => (
              <tr key={row.key} className="border-t border-line">
                <td className="px-1 py-1 text-xs text-ink-faint">{i + 1}</td>
                {cellInput(row, i, "bin", binField, `${COLUMN_TEXT[source].bin}, ${unit}`)}
                {cellInput(row, i, "coincident", coincidentField, `${COLUMN_TEXT[source].coincident}, ${unit}`)}
                {cellInput(row, i, "hours", "hours", "hours")}
                {cellInput(row, i, "month", "month", "month 1 to 12")}
                <td className="px-1 py-1 align-top">
                  <button
                    type="button"
                    onClick={() => setRows((rs) => (rs.length > 1 ? rs.filter((r) => r.key !== row.key) : [emptyRow()]))}
                    className="rounded px-2 py-1 text-xs text-ink-soft hover:bg-paper-sunk"
                    aria-label={`Remove row ${i + 1}`}
                  >
                    Remove
                  </button>
                </td>
              </tr>
            ))}
          </tbody>
          <tfoot>
            <tr className="border-t border-line-strong">
              <td colSpan={3} className="px-1 py-2">
                <Button type="button" variant="ghost" onClick={() => setRows((rs) => [...rs, emptyRow()])}>
                  Add a row
                </Button>
              </td>
              <td className="num px-1 py-2 font-semibold" data-testid="bin-hours-total">
                {formatNumber(hoursTotal, { decimals: hoursTotal % 1 === 0 ? 0 : 1 })} h
              </td>
              <td colSpan={2} className="px-1 py-2 text-xs">
                {Math.abs(hoursTotal - 8760) < 0.5 ? (
                  <span className="text-ok-600">a full year</span>
                ) : (
                  <span className="text-caution-800">a year has 8760 h; yearly totals will cover {formatNumber(hoursTotal, { decimals: 0 })} h</span>
                )}
              </td>
            </tr>
          </tfoot>
        </table>
      </div>

      <div aria-live="polite">
        {(formError || (submitted && errorCount > 0)) && (
          <div role="alert" className="rounded-panel border border-danger-600 bg-danger-50 px-4 py-3 text-sm text-danger-700" data-testid="bin-errors">
            <p className="font-semibold">{formError ?? `Fix ${errorCount === 1 ? "this problem" : `these ${errorCount} problems`} to save; the cells are marked.`}</p>
            {tableErrors.length > 0 ? (
              <ul className="mt-1 list-disc pl-5">
                {tableErrors.map((m) => (
                  <li key={m}>{m}</li>
                ))}
              </ul>
            ) : null}
          </div>
        )}
      </div>

      <Button type="button" onClick={save} disabled={pending} data-testid="bin-save">
        {pending ? "Saving…" : "Save bin table"}
      </Button>
    </div>
  );
}
