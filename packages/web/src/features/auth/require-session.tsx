import { Navigate, Outlet, useLocation } from "react-router";
import { isApiError } from "../../api/api-error.js";
import { useMe } from "../../api/use-me.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";

/** Renders its child routes for a signed-in user; sends everyone else to the sign-in page and back here afterwards. */
export function RequireSession() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) {
    return (
      <div className="mx-auto max-w-md px-6 py-20">
        <Loading label="Checking your session…" />
      </div>
    );
  }
  if (me.isError) {
    if (isApiError(me.error) && me.error.status === 401) {
      const next = `${location.pathname}${location.search}`;
      return <Navigate to={next === "/" ? "/sign-in" : `/sign-in?next=${encodeURIComponent(next)}`} replace />;
    }
    return (
      <div className="mx-auto max-w-lg px-6 py-20">
        <ErrorNote error={me.error} title="Could not load your session" />
      </div>
    );
  }
  return <Outlet />;
}
