"use client";

import type { ReactNode } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { errorIdOf, fieldId, hintIdOf } from "./errors";
import { describedBy, FieldShell, inputBorder, inputClass } from "./field-shell";

export interface SelectOption<V extends string | number = string> {
  value: V;
  label: string;
  disabled?: boolean;
}

export interface SelectFieldProps<T extends FieldValues, V extends string | number = string> {
  name: FieldPath<T>;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  control?: Control<T, any, any>;
  label: ReactNode;
  options: readonly SelectOption<V>[];
  description?: ReactNode;
  /** Where the preselected choice comes from (shown in the hint). */
  defaultSource?: string;
  /** An empty first choice ("Choose…"); picking it stores `emptyValue`. */
  placeholder?: string;
  emptyValue?: null | undefined | "";
  required?: boolean;
  disabled?: boolean;
  id?: string;
  className?: string;
}

/** A native select (keyboard and screen-reader friendly). Number option values are stored as numbers. */
export function SelectField<T extends FieldValues, V extends string | number = string>(props: SelectFieldProps<T, V>) {
  const {
    field: { ref: inputRef, name: fieldName, value: fieldValue, onChange: fieldOnChange, onBlur: fieldOnBlur },
    fieldState,
  } = useController({ name: props.name, ...(props.control ? { control: props.control } : {}) });
  const id = props.id ?? fieldId(props.name);
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const error = fieldState.error?.message;
  const hint =
    props.description || props.defaultSource ? (
      <>
        {props.description ? <span className="block">{props.description}</span> : null}
        {props.defaultSource ? <span>Default choice · {props.defaultSource}</span> : null}
      </>
    ) : null;
  const current = fieldValue == null ? "" : String(fieldValue);
  return (
    <FieldShell
      id={id}
      label={props.label}
      hint={hint}
      hintId={hintId}
      errorId={errorId}
      error={error}
      required={props.required}
      className={props.className}
    >
      <select
        id={id}
        name={fieldName}
        ref={inputRef}
        value={current}
        onChange={(e) => {
          const raw = e.target.value;
          if (raw === "") return fieldOnChange(props.emptyValue);
          const opt = props.options.find((o) => String(o.value) === raw);
          fieldOnChange(opt ? opt.value : raw);
        }}
        onBlur={fieldOnBlur}
        disabled={props.disabled}
        required={props.required}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy(hint ? hintId : null, errorId)}
        className={`${inputClass} ${inputBorder(Boolean(error))}`}
      >
        {props.placeholder !== undefined ? <option value="">{props.placeholder}</option> : null}
        {props.options.map((o) => (
          <option key={String(o.value)} value={String(o.value)} disabled={o.disabled}>
            {o.label}
          </option>
        ))}
      </select>
    </FieldShell>
  );
}
