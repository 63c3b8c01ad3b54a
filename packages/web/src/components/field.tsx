import type { ReactNode } from "react";

export const inputClass =
  "w-full rounded-md border border-line bg-white px-3 py-1.5 text-sm text-ink placeholder:text-ink-faint focus:border-moss focus:outline-none aria-[invalid=true]:border-rust";

/** A labelled form field with an optional hint and its error shown inline, right under the input. */
export function Field({
  label,
  htmlFor,
  hint,
  error,
  name,
  children,
  className = "",
}: {
  label: ReactNode;
  htmlFor: string;
  hint?: ReactNode;
  error?: string;
  /** Used for the error's data-testid: field-error-<name>. */
  name: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div className={className}>
      <label htmlFor={htmlFor} className="mb-1 block text-xs font-medium text-ink-soft">
        {label}
      </label>
      {children}
      {error ? (
        <p role="alert" data-testid={`field-error-${name}`} className="mt-1 text-xs text-rust">
          {error}
        </p>
      ) : hint ? (
        <p className="mt-1 text-xs text-ink-faint">{hint}</p>
      ) : null}
    </div>
  );
}
