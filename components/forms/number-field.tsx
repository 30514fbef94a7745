"use client";

import { useState, type ReactNode } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import {
  formatQuantity,
  fromSI,
  inputText,
  parseNumberInput,
  quantityInputText,
  toSI,
  unitLabel,
  unitName,
  type QuantityKind,
  type UnitSystem,
} from "@/lib/units";
import { errorIdOf, fieldId, hintIdOf } from "./errors";
import { describedBy, FieldShell, inputBorder, inputClass } from "./field-shell";
import { useUnits } from "./units-context";

export interface NumberFieldProps<T extends FieldValues> {
  /** Path of the SI value in the form ("duty.designHeatRejectionKW"). */
  name: FieldPath<T>;
  /** The form's control; omit inside a react-hook-form FormProvider. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  control?: Control<T, any, any>;
  label: ReactNode;
  /** Quantity kind from lib/units: decides the stored SI unit and the unit shown. */
  kind: QuantityKind;
  /** Defaults to the nearest UnitsProvider. */
  system?: UnitSystem;
  currency?: string;
  /** The field's default (SI) and where it comes from; shown under the field with a "use default" button. */
  defaultSI?: number | null;
  defaultSource?: string;
  /** Extra help under the field. */
  description?: ReactNode;
  /** What an empty box stores (default undefined; use null for nullable schema fields). */
  emptyValue?: null | undefined;
  /**
   * Significant figures the box shows. Default: 6 where the unit shown is the stored one (enough to
   * round-trip what a person typed); a converted value rounded by lib/units' convertedInputText.
   */
  inputSig?: number;
  /** Significant figures or decimals of the default shown in the hint. */
  hintDecimals?: number;
  placeholder?: string;
  required?: boolean;
  disabled?: boolean;
  readOnly?: boolean;
  id?: string;
  className?: string;
  /** Called with the new SI value after each edit (NaN for unreadable text, the empty value for empty). */
  onValueChange?: (valueSI: number | null | undefined) => void;
}

const sameNumber = (a: unknown, b: unknown) =>
  Object.is(a, b) || (typeof a === "number" && typeof b === "number" && Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b)));

/**
 * A number input that shows and accepts the value in the project's unit system while the form holds SI.
 * The text the person typed is kept as typed (no reformatting under the cursor); it is re-derived from the
 * form value only when that value changes from outside (reset, "use default", another unit system).
 */
export function NumberField<T extends FieldValues>(props: NumberFieldProps<T>) {
  const units = useUnits();
  const system = props.system ?? units.system;
  const currency = props.currency ?? units.currency;
  const { kind, emptyValue } = props;
  const {
    field: { ref: inputRef, name: fieldName, value: fieldValue, onChange: fieldOnChange, onBlur: fieldOnBlur },
    fieldState,
  } = useController({ name: props.name, ...(props.control ? { control: props.control } : {}) });
  const value: unknown = fieldValue;

  // A converted value (IP) reads rounded ("29.5 hp", not "29.5025"); the form keeps the stored SI value.
  const textOf = (v: unknown) =>
    typeof v !== "number" || !Number.isFinite(v)
      ? ""
      : props.inputSig !== undefined
        ? inputText(fromSI(kind, v, system), props.inputSig)
        : quantityInputText(kind, v, system);
  const [text, setText] = useState(() => textOf(value));
  const [seen, setSeen] = useState<{ value: unknown; system: UnitSystem }>({ value, system });
  if (!sameNumber(seen.value, value) || seen.system !== system) {
    setSeen({ value, system });
    const typed = parseNumberInput(text);
    const typedSI = typed === null || Number.isNaN(typed) ? typed : toSI(kind, typed, system);
    if (seen.system !== system || !sameNumber(typedSI, value)) setText(textOf(value));
  }

  const id = props.id ?? fieldId(props.name);
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const unit = unitLabel(kind, system, currency);
  const error = fieldState.error?.message;
  const hasDefault = typeof props.defaultSI === "number" && Number.isFinite(props.defaultSI);
  const atDefault = hasDefault && sameNumber(value, props.defaultSI);

  const emit = (v: number | null | undefined) => {
    fieldOnChange(v);
    props.onValueChange?.(v);
  };

  const hint =
    hasDefault || props.defaultSource || props.description ? (
      <>
        {props.description ? <span className="block">{props.description}</span> : null}
        {hasDefault ? (
          <span className="inline-flex flex-wrap items-baseline gap-x-2" title={props.defaultSource}>
            <span data-testid="field-default">
              Default{" "}
              <span className="font-mono tabular-nums">
                {formatQuantity(kind, props.defaultSI, system, {
                  currency,
                  ...(props.hintDecimals !== undefined ? { decimals: props.hintDecimals } : { sig: 4 }),
                })}
              </span>
              {props.defaultSource ? <span> · {props.defaultSource}</span> : null}
            </span>
            {!atDefault && !props.disabled && !props.readOnly ? (
              <button
                type="button"
                className="rounded px-1 text-basin-700 underline-offset-2 hover:underline"
                onClick={() => emit(props.defaultSI as number)}
                aria-label={`Use the default for ${typeof props.label === "string" ? props.label : "this field"}`}
              >
                use default
              </button>
            ) : null}
          </span>
        ) : props.defaultSource ? (
          <span>Source: {props.defaultSource}</span>
        ) : null}
      </>
    ) : null;

  return (
    <FieldShell
      id={id}
      label={props.label}
      unit={unit || undefined}
      hint={hint}
      hintId={hintId}
      errorId={errorId}
      error={error}
      required={props.required}
      className={props.className}
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
          placeholder={props.placeholder}
          disabled={props.disabled}
          readOnly={props.readOnly}
          required={props.required}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(hint ? hintId : null, errorId)}
          data-unit={unit}
          onChange={(e) => {
            const raw = e.target.value;
            setText(raw);
            const n = parseNumberInput(raw);
            const si = n === null ? emptyValue : Number.isNaN(n) ? NaN : toSI(kind, n, system);
            setSeen({ value: si, system });
            emit(si);
          }}
          onBlur={fieldOnBlur}
          className={`${inputClass} ${inputBorder(Boolean(error))} num ${unit ? "rounded-r-none" : ""}`}
        />
        {unit ? (
          <span
            className="inline-flex min-w-12 items-center justify-center rounded-r-md border border-l-0 border-line-strong bg-paper-sunk px-2 text-xs text-ink-soft"
            title={unitName(kind, system, currency)}
            aria-hidden="true"
          >
            {unit}
          </span>
        ) : null}
      </div>
    </FieldShell>
  );
}
