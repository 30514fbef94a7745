"use client";

/**
 * The message under a field. The live region is always rendered (empty when valid) so that screen readers
 * announce a message when it appears; the field points at it with aria-describedby.
 */
export function FieldError({ id, message }: { id: string; message?: string | undefined }) {
  return (
    <div id={id} aria-live="polite" className="min-h-0">
      {message && (
        <p className="mt-1 text-xs text-danger-700" data-testid="field-error">
          {message}
        </p>
      )}
    </div>
  );
}
