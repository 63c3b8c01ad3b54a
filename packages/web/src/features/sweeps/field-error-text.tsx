/** A field problem under an input, with the test id the browser tests look for. */
export function FieldErrorText({ field, message }: { field: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p role="alert" data-testid={`field-error-${field}`} className="mt-1 text-xs text-rust">
      {message}
    </p>
  );
}
