"use client";

import type { ReactNode } from "react";
import { useController, type Control, type FieldPath, type FieldValues } from "react-hook-form";
import { errorIdOf, fieldId, hintIdOf } from "./errors";
import { describedBy } from "./field-shell";
import { FieldError } from "./field-error";

export interface CheckboxFieldProps<T extends FieldValues> {
  name: FieldPath<T>;
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  control?: Control<T, any, any>;
  label: ReactNode;
  description?: ReactNode;
  defaultSource?: string;
  disabled?: boolean;
  id?: string;
  className?: string;
}

export function CheckboxField<T extends FieldValues>(props: CheckboxFieldProps<T>) {
  const {
    field: { ref: inputRef, name, value, onChange, onBlur },
    fieldState,
  } = useController({ name: props.name, ...(props.control ? { control: props.control } : {}) });
  const id = props.id ?? fieldId(props.name);
  const errorId = errorIdOf(id);
  const hintId = hintIdOf(id);
  const error = fieldState.error?.message;
  const hasHint = Boolean(props.description || props.defaultSource);
  return (
    <div className={props.className} data-field={id}>
      <div className="flex items-start gap-2">
        <input
          id={id}
          type="checkbox"
          name={name}
          ref={inputRef}
          checked={value === true}
          onChange={(e) => onChange(e.target.checked)}
          onBlur={onBlur}
          disabled={props.disabled}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(hasHint ? hintId : null, errorId)}
          className="mt-0.5 h-4 w-4 rounded border-line-strong accent-basin-600"
        />
        <div>
          <label htmlFor={id} className="text-sm font-medium text-ink">
            {props.label}
          </label>
          {hasHint ? (
            <div id={hintId} className="text-xs text-ink-faint">
              {props.description}
              {props.description && props.defaultSource ? " · " : null}
              {props.defaultSource ? `Default · ${props.defaultSource}` : null}
            </div>
          ) : null}
        </div>
      </div>
      <FieldError id={errorId} message={error} />
    </div>
  );
}
