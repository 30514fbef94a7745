"use client";

import type { ReactNode } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { errorIdOf, fieldId, hintIdOf } from "./errors";
import { describedBy, FieldShell, inputBorder, inputClass } from "./field-shell";

export interface TextFieldProps<T extends FieldValues> {
  name: FieldPath<T>;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  control?: Control<T, any, any>;
  label: ReactNode;
  description?: ReactNode;
  type?: "text" | "email" | "url" | "search";
  /** Render a textarea with this many rows instead of an input. */
  rows?: number;
  placeholder?: string;
  autoComplete?: string;
  maxLength?: number;
  required?: boolean;
  disabled?: boolean;
  /** Upper-case what is typed (ISO codes). */
  uppercase?: boolean;
  id?: string;
  className?: string;
}

export function TextField<T extends FieldValues>(props: TextFieldProps<T>) {
  const {
    field: { ref: inputRef, name: fieldName, value: fieldValue, onChange: fieldOnChange, onBlur: fieldOnBlur },
    fieldState,
  } = useController({ name: props.name, ...(props.control ? { control: props.control } : {}) });
  const id = props.id ?? fieldId(props.name);
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const error = fieldState.error?.message;
  const common = {
    id,
    name: fieldName,
    value: typeof fieldValue === "string" ? fieldValue : fieldValue == null ? "" : String(fieldValue),
    onChange: (e: { target: { value: string } }) => fieldOnChange(props.uppercase ? e.target.value.toUpperCase() : e.target.value),
    onBlur: fieldOnBlur,
    placeholder: props.placeholder,
    maxLength: props.maxLength,
    required: props.required,
    disabled: props.disabled,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": describedBy(props.description ? hintId : null, errorId),
    className: `${inputClass} ${inputBorder(Boolean(error))}`,
  };
  return (
    <FieldShell
      id={id}
      label={props.label}
      hint={props.description}
      hintId={hintId}
      errorId={errorId}
      error={error}
      required={props.required}
      className={props.className}
    >
      {props.rows ? (
        <textarea {...common} ref={inputRef} rows={props.rows} />
      ) : (
        <input {...common} ref={inputRef} type={props.type ?? "text"} autoComplete={props.autoComplete ?? "off"} />
      )}
    </FieldShell>
  );
}
