import { Link } from "react-router";
import { howToFix, isApiError } from "../api/api-error.js";

/** A failed load or action: what went wrong (the server's sentence) and how to fix it. */
export function ErrorNote({
  error,
  title = "Something went wrong",
  hint,
  testId = "error-note",
}: {
  error: unknown;
  title?: string;
  /** How to fix it, when the page knows better than the status alone. */
  hint?: string;
  testId?: string;
}) {
  const message = error instanceof Error ? error.message : String(error);
  const status = isApiError(error) ? error.status : null;
  return (
    <div role="alert" data-testid={testId} className="rounded-md border border-rust/40 border-l-4 border-l-rust bg-rust-wash px-4 py-3 text-sm">
      <p className="font-semibold text-rust">
        {title}
        {status ? <span className="ml-2 font-mono text-xs font-normal text-rust/80">HTTP {status}</span> : null}
      </p>
      <p className="mt-1 text-ink" data-testid={`${testId}-message`}>{message}</p>
      <p className="mt-1 text-ink-soft">
        {hint ?? howToFix(error)}
        {status === 401 && !hint ? (
          <>
            {" "}
            <Link to="/sign-in" className="font-medium text-moss underline">
              Sign in
            </Link>
          </>
        ) : null}
      </p>
    </div>
  );
}
