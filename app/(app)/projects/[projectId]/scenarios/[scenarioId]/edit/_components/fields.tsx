"use client";

import { useState, type ReactNode } from "react";
import { useController, useFormContext } from "react-hook-form";
import { CheckboxField, NumberField, SelectField, TextField, useUnits } from "@/components/forms";
import { errorIdOf, fieldId, hintIdOf } from "@/components/forms/errors";
import { describedBy, FieldShell, inputBorder, inputClass } from "@/components/forms/field-shell";
import {
  convertedInputText,
  formatNumber,
  fromSI,
  inputText,
  parseNumberInput,
  toSI,
  unitLabel,
  unitName,
  waterKgPerSFromLPerS,
  waterLPerSFromKgPerS,
  type QuantityKind,
} from "@/lib/units";
import { defaultFor } from "@/lib/scenarios/prefill";
import type { EditorPath, EditorValues } from "@/lib/scenarios/editor-values";

type V = EditorValues;

function sourceOf(name: string): { value: unknown; source: string } | null {
  const d = defaultFor(name);
  return d ? { value: d.default, source: d.source } : null;
}

/** A quantity field: the project's units through lib/units, and the schema's default with its source. */
export function Num({
  name,
  label,
  kind,
  description,
  optional,
  className,
  noDefault,
}: {
  name: EditorPath;
  label: string;
  kind: QuantityKind;
  description?: ReactNode;
  optional?: boolean;
  className?: string;
  /** The description states the default itself (e.g. one that depends on another field). */
  noDefault?: boolean;
}) {
  const d = noDefault ? null : sourceOf(name);
  const desc = optional ? (
    <>
      {description}
      {description ? " " : null}Optional: leave empty to let the engine derive it.
    </>
  ) : (
    description
  );
  return (
    <NumberField<V>
      name={name}
      label={label}
      kind={kind}
      {...(typeof d?.value === "number" ? { defaultSI: d.value } : {})}
      {...(d
        ? { defaultSource: typeof d.value === "number" ? d.source : `${String(d.value)} · ${d.source}` }
        : {})}
      {...(desc ? { description: desc } : {})}
      {...(className ? { className } : {})}
    />
  );
}

const sameNumber = (a: unknown, b: unknown) =>
  Object.is(a, b) ||
  (typeof a === "number" && typeof b === "number" && Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b)));

/**
 * A number shown on another scale than it is stored: a fraction shown in percent, a mass flow shown as a
 * volume flow. `show`/`store` convert; the text typed is kept as typed, like NumberField.
 */
export function ScaledField({
  name,
  label,
  unit,
  unitTitle,
  show,
  store,
  description,
  sig = 6,
  shownText,
  className,
  noDefault,
}: {
  name: EditorPath;
  label: string;
  unit: string;
  unitTitle?: string;
  show: (stored: number) => number;
  store: (shown: number) => number;
  description?: ReactNode;
  sig?: number;
  /** The box's text for a shown value, when it is converted and reads rounded (default: `sig` figures). */
  shownText?: (shown: number) => string;
  className?: string;
  /** The description states the default itself (e.g. one that depends on another field). */
  noDefault?: boolean;
}) {
  const { control } = useFormContext<V>();
  const {
    field: {
      ref: inputRef,
      name: fieldName,
      value: fieldValue,
      onChange: fieldOnChange,
      onBlur: fieldOnBlur,
    },
    fieldState,
  } = useController({ name, control });
  const value: unknown = fieldValue;
  const textOf = (v: unknown) =>
    typeof v === "number" && Number.isFinite(v) ? (shownText ? shownText(show(v)) : inputText(show(v), sig)) : "";
  const [text, setText] = useState(() => textOf(value));
  const [seen, setSeen] = useState<unknown>(value);
  if (!sameNumber(seen, value)) {
    setSeen(value);
    const typed = parseNumberInput(text);
    const typedStored = typed === null || Number.isNaN(typed) ? typed : store(typed);
    if (!sameNumber(typedStored, value)) setText(textOf(value));
  }
  const d = noDefault ? null : sourceOf(name);
  const id = fieldId(name);
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const hasDefault = typeof d?.value === "number";
  const hint =
    description || d ? (
      <>
        {description ? <span className="block">{description}</span> : null}
        {d ? (
          <span className="inline-flex flex-wrap items-baseline gap-x-2" title={d.source}>
            <span data-testid="field-default">
              Default{" "}
              {hasDefault ? (
                <span className="font-mono tabular-nums">
                  {/* A year reads 2026, not 2,026. */}
                  {formatNumber(show(d.value as number), { sig: 4, grouping: unit !== "year" })} {unit}
                </span>
              ) : (
                String(d.value)
              )}{" "}
              · {d.source}
            </span>
            {hasDefault && !sameNumber(value, d.value) ? (
              <button
                type="button"
                className="rounded px-1 text-basin-700 underline-offset-2 hover:underline"
                onClick={() => fieldOnChange(d.value)}
                aria-label={`Use the default for ${label}`}
              >
                use default
              </button>
            ) : null}
          </span>
        ) : null}
      </>
    ) : null;
  return (
    <FieldShell
      id={id}
      label={label}
      unit={unit}
      hint={hint}
      hintId={hintId}
      errorId={errorId}
      error={fieldState.error?.message}
      className={className}
    >
      <div className="flex items-stretch">
        <input
          id={id}
          name={fieldName}
          ref={inputRef}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          value={text}
          aria-invalid={fieldState.error ? true : undefined}
          aria-describedby={describedBy(hint ? hintId : null, errorId)}
          data-unit={unit}
          onChange={(e) => {
            const raw = e.target.value;
            setText(raw);
            const n = parseNumberInput(raw);
            const v = n === null ? undefined : Number.isNaN(n) ? NaN : store(n);
            setSeen(v);
            fieldOnChange(v);
          }}
          onBlur={fieldOnBlur}
          className={`${inputClass} ${inputBorder(Boolean(fieldState.error))} num rounded-r-none`}
        />
        <span
          className="inline-flex min-w-12 items-center justify-center rounded-r-md border border-l-0 border-line-strong bg-paper-sunk px-2 text-xs text-ink-soft"
          title={unitTitle ?? unit}
          aria-hidden="true"
        >
          {unit}
        </span>
      </div>
    </FieldShell>
  );
}

/** A fraction (0.03) entered and shown in percent (3 %). */
export function Pct(props: {
  name: EditorPath;
  label: string;
  description?: ReactNode;
  className?: string;
  perYear?: boolean;
}) {
  return (
    <ScaledField
      {...props}
      unit={props.perYear ? "%/yr" : "%"}
      unitTitle="percent"
      show={(v) => v * 100}
      store={(v) => v / 100}
    />
  );
}

/** A loop's mass flow entered as the volume flow selection sheets give (gpm or L/s of water). */
export function FlowField({
  name,
  label,
  description,
}: {
  name: EditorPath;
  label: string;
  description?: ReactNode;
}) {
  const { system } = useUnits();
  return (
    <ScaledField
      name={name}
      label={label}
      unit={unitLabel("waterFlowLPerS", system)}
      unitTitle={`${unitName("waterFlowLPerS", system)} of water at 20 °C (stored as mass flow, kg/s)`}
      show={(kgPerS) => fromSI("waterFlowLPerS", waterLPerSFromKgPerS(kgPerS), system)}
      store={(shown) => waterKgPerSFromLPerS(toSI("waterFlowLPerS", shown, system))}
      {...(system === "IP" ? { shownText: convertedInputText } : {})}
      description={description ?? "Volume of water at 20 °C (998.2 kg/m³); stored as mass flow."}
    />
  );
}

/** A plain number with its unit written in the label, for quantities lib/units has no kind for. */
export function Plain({
  name,
  label,
  unit,
  description,
  className,
  noDefault,
}: {
  name: EditorPath;
  label: string;
  unit: string;
  description?: ReactNode;
  className?: string;
  noDefault?: boolean;
}) {
  return (
    <ScaledField
      name={name}
      label={label}
      unit={unit}
      show={(v) => v}
      store={(v) => v}
      {...(noDefault ? { noDefault } : {})}
      {...(description ? { description } : {})}
      {...(className ? { className } : {})}
    />
  );
}

export function Choice({
  name,
  label,
  options,
  description,
}: {
  name: EditorPath;
  label: string;
  options: { value: string; label: string }[];
  description?: ReactNode;
}) {
  const d = sourceOf(name);
  const defaultLabel = d ? (options.find((o) => o.value === d.value)?.label ?? String(d.value)) : null;
  return (
    <SelectField<V>
      name={name}
      label={label}
      options={options}
      {...(description ? { description } : {})}
      {...(d && defaultLabel ? { defaultSource: `${defaultLabel} · ${d.source}` } : {})}
    />
  );
}

export function Check({
  name,
  label,
  description,
}: {
  name: EditorPath;
  label: string;
  description?: ReactNode;
}) {
  const d = sourceOf(name);
  return (
    <CheckboxField<V>
      name={name}
      label={label}
      {...(description ? { description } : {})}
      {...(d ? { defaultSource: `${d.value ? "on" : "off"} · ${d.source}` } : {})}
    />
  );
}

export function Text({
  name,
  label,
  description,
  maxLength,
}: {
  name: EditorPath;
  label: string;
  description?: ReactNode;
  maxLength?: number;
}) {
  return (
    <TextField<V>
      name={name}
      label={label}
      {...(description ? { description } : {})}
      {...(maxLength ? { maxLength } : {})}
    />
  );
}

/** A titled group of fields in a responsive grid. */
export function Group({ title, children, note }: { title: string; children: ReactNode; note?: ReactNode }) {
  return (
    <fieldset className="rounded-md border border-line p-4">
      <legend className="px-1 text-sm font-semibold">{title}</legend>
      {note ? <p className="mb-3 text-xs text-ink-soft">{note}</p> : null}
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">{children}</div>
    </fieldset>
  );
}
