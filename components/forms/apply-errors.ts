import type { FieldPath, FieldValues, UseFormSetError } from "react-hook-form";
import type { FieldErrorMap } from "./errors";

/** Put a server action's field errors on the form's fields (first message each); returns the form-level ones. */
export function applyFieldErrors<T extends FieldValues>(setError: UseFormSetError<T>, errors: FieldErrorMap): string[] {
  const formLevel: string[] = [];
  for (const [path, messages] of Object.entries(errors)) {
    const message = messages.join(" ");
    if (!path) {
      formLevel.push(...messages);
      continue;
    }
    setError(path as FieldPath<T>, { type: "server", message });
  }
  return formLevel;
}
