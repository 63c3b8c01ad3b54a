import { Link } from "react-router";
import { Wordmark } from "../../components/wordmark.js";

/** Any address no route matches; inside a workspace it keeps the workspace frame. */
export function NotFoundPage({ inWorkspace = false }: { inWorkspace?: boolean }) {
  return (
    <div className={inWorkspace ? "max-w-lg space-y-4 py-6" : "mx-auto max-w-lg space-y-4 px-6 py-20"}>
      {inWorkspace ? null : <Wordmark />}
      <h1 className="text-lg font-semibold" data-testid="page-title">
        No page at this address
      </h1>
      <p className="text-sm text-ink-soft">The link may be mistyped or out of date. Start again from your workspace.</p>
      <Link to="/" className="text-sm font-medium text-moss hover:underline">
        Go to your workspace
      </Link>
    </div>
  );
}
