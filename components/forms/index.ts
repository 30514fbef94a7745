/** Shared form primitives for react-hook-form. Server code imports field-error helpers from ./errors directly. */
export { NumberField, type NumberFieldProps } from "./number-field";
export { TextField, type TextFieldProps } from "./text-field";
export { SelectField, type SelectFieldProps, type SelectOption } from "./select-field";
export { CheckboxField, type CheckboxFieldProps } from "./checkbox-field";
export { FieldError } from "./field-error";
export { FormErrorSummary, flattenFormErrors, type FormErrorSummaryProps } from "./form-error-summary";
export { UnitsProvider, useUnits, type UnitsContextValue } from "./units-context";
export { applyFieldErrors } from "./apply-errors";
export { toFieldErrors, fieldId, errorIdOf, hintIdOf, type FieldErrorMap, type ActionResult } from "./errors";
