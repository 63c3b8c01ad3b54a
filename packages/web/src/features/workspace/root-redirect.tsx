import { Navigate } from "react-router";
import { useMe } from "../../api/use-me.js";
import { Loading } from "../../components/loading.js";

/** "/" opens the first workspace of the user, or the page to create one. */
export function RootRedirect() {
  const me = useMe();
  if (!me.data) return <Loading />;
  const first = me.data.memberships[0];
  return <Navigate to={first ? `/w/${first.workspace.slug}` : "/workspaces/new"} replace />;
}
