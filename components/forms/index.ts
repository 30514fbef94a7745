/** Shared form primitives: react-hook-form fields, and the plain fields of the server-action forms (./action-form). */
export { NumberField, type NumberFieldProps } from "./number-field";
export { TextField, type TextFieldProps } from "./text-field";
export { SelectField, type SelectFieldProps, type SelectOption } from "./select-field";
export { CheckboxField, type CheckboxFieldProps } from "./checkbox-field";
export { FieldError } from "./field-error";
export { FormErrorSummary, flattenFormErrors, type FormErrorSummaryProps } from "./form-error-summary";
export { UnitsProvider, useUnits, type UnitsContextValue } from "./units-context";
export { applyFieldErrors } from "./apply-errors";
export { fieldId, errorIdOf, hintIdOf, type FieldErrorMap } from "./errors";
export { Field, FormMessage, submitKeepingFields, failureText, type ActionState } from "./action-form";
