import { Outlet, useNavigate, useParams } from "react-router";
import { isApiError } from "../../api/api-error.js";
import { useSignOut } from "../../api/use-auth.js";
import { useMe } from "../../api/use-me.js";
import { useWorkspace } from "../../api/use-workspace.js";
import { ErrorNote } from "../../components/error-note.js";
import { Layout } from "../../components/layout.js";
import { Loading } from "../../components/loading.js";
import { Wordmark } from "../../components/wordmark.js";
import { VerifyNotice } from "../auth/verify-notice.js";

/** Loads the workspace of the route and frames its pages with the top bar and left nav. */
export function WorkspaceShell() {
  const { slug = "" } = useParams();
  const me = useMe();
  const workspace = useWorkspace(slug);
  const signOut = useSignOut();
  const navigate = useNavigate();

  if (workspace.isPending || !me.data) {
    return (
      <div className="mx-auto max-w-md px-6 py-20">
        <Loading label="Opening the workspace…" />
      </div>
    );
  }
  if (workspace.isError) {
    const status = isApiError(workspace.error) ? workspace.error.status : 0;
    return (
      <div className="mx-auto max-w-lg space-y-6 px-6 py-16">
        <Wordmark />
        <ErrorNote
          error={workspace.error}
          title={status === 404 ? "No such workspace" : status === 403 ? "Not a member of this workspace" : "Could not open the workspace"}
        />
        <a href="/" className="text-sm text-moss hover:underline">
          Go to your workspaces
        </a>
      </div>
    );
  }

  const { workspace: ws, role } = workspace.data;
  return (
    <Layout
      workspace={ws}
      role={role}
      user={me.data.user}
      otherWorkspaces={me.data.memberships.filter((m) => m.workspace.slug !== ws.slug).map((m) => m.workspace)}
      signingOut={signOut.isPending}
      onSignOut={() => signOut.mutate(undefined, { onSettled: () => navigate("/sign-in", { replace: true }) })}
    >
      <VerifyNotice />
      <Outlet />
    </Layout>
  );
}
