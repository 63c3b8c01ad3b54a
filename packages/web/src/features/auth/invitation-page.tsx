import { Link, useLocation, useNavigate } from "react-router";
import { isApiError } from "../../api/api-error.js";
import { useSignOut } from "../../api/use-auth.js";
import { useAcceptInvitation, useDeclineInvitation, useInvitationPreview } from "../../api/use-invitation.js";
import { useMe } from "../../api/use-me.js";
import { Button, ButtonLink } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { Loading } from "../../components/loading.js";
import { AuthShell } from "./auth-shell.js";
import { pathWithSecret, secretFromHash } from "./link-secret.js";

/**
 * /invitation#<token> — the page the invitation mail links to. Signed out: sign in or create an
 * account with the invited address, then come back here. Signed in: what the invitation offers, and
 * accept or decline. Refusals (used, revoked, expired, another account) show the server's sentence.
 */
export function InvitationPage() {
  const location = useLocation();
  const navigate = useNavigate();
  const token = secretFromHash(location.hash);
  const me = useMe();
  const signedIn = me.isSuccess;
  const preview = useInvitationPreview(token, signedIn && token !== "");
  const accept = useAcceptInvitation();
  const decline = useDeclineInvitation();
  const signOut = useSignOut();
  const back = encodeURIComponent(pathWithSecret("invitation", token));

  if (token === "") {
    return (
      <AuthShell title="Invitation">
        <p className="text-sm text-ink-soft" data-testid="invitation-no-token">
          This address holds no invitation token. Open the link from the invitation mail exactly as it is (everything after “#” belongs to it).
        </p>
      </AuthShell>
    );
  }
  if (me.isPending) return <AuthShell title="Invitation"><Loading label="Checking your session…" /></AuthShell>;
  if (!signedIn) {
    return (
      <AuthShell title="You have an invitation">
        <div className="space-y-4 text-sm" data-testid="invitation-signed-out">
          <p className="text-ink-soft">
            Someone invited you to a Loopyard workspace. Sign in — or create an account — with the address the invitation was mailed to; then this page
            shows the invitation and lets you accept or decline it.
          </p>
          <div className="flex gap-2">
            <ButtonLink to={`/sign-up?next=${back}`} tone="primary" testId="invitation-sign-up">
              Create an account
            </ButtonLink>
            <ButtonLink to={`/sign-in?next=${back}`} tone="quiet" testId="invitation-sign-in">
              Sign in
            </ButtonLink>
          </div>
        </div>
      </AuthShell>
    );
  }
  if (decline.isSuccess) {
    return (
      <AuthShell title="Invitation declined">
        <p className="text-sm text-ink-soft" data-testid="invitation-declined">
          You declined the invitation; nobody was added. <Link to="/" className="text-moss hover:underline">Go to your workspaces</Link>
        </p>
      </AuthShell>
    );
  }
  if (preview.isPending) return <AuthShell title="Invitation"><Loading label="Opening the invitation…" /></AuthShell>;
  if (preview.isError) {
    const wrongAccount = isApiError(preview.error) && preview.error.status === 403;
    return (
      <AuthShell title="This invitation cannot be answered">
        <div className="space-y-4">
          <ErrorNote error={preview.error} title={wrongAccount ? "Signed in with another address" : "Invitation not usable"} hint={wrongAccount ? "Sign out and use the invited address." : "Ask an admin of the workspace for a new invitation."} testId="invitation-error" />
          {wrongAccount ? (
            <Button tone="quiet" onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(`/sign-in?next=${back}`) })}>
              Sign out and switch account
            </Button>
          ) : (
            <Link to="/" className="text-sm text-moss hover:underline">
              Go to your workspaces
            </Link>
          )}
        </div>
      </AuthShell>
    );
  }
  const offer = preview.data;
  const error = accept.error ?? decline.error;
  return (
    <AuthShell title={`Join ${offer.workspace.name}`}>
      <div className="space-y-4 text-sm" data-testid="invitation-offer">
        <p>
          {offer.invitedBy ?? "An admin"} invites <strong className="font-medium">{offer.email}</strong> to the workspace{" "}
          <strong className="font-medium">{offer.workspace.name}</strong> as {/^[aeiou]/.test(offer.role) ? "an" : "a"}{" "}
          <strong className="font-mono text-xs">{offer.role}</strong>.
        </p>
        <p className="text-xs text-ink-faint">The link works once and until {formatDateTime(offer.expiresAt)}.</p>
        {error ? <ErrorNote error={error} title="Could not answer the invitation" /> : null}
        <div className="flex gap-2">
          <Button
            tone="primary"
            disabled={accept.isPending || decline.isPending}
            data-testid="invitation-accept"
            onClick={() => accept.mutate(token, { onSuccess: (joined) => navigate(`/w/${joined.workspace.slug}`, { replace: true }) })}
          >
            {accept.isPending ? "Joining…" : "Accept and join"}
          </Button>
          <Button tone="quiet" disabled={accept.isPending || decline.isPending} data-testid="invitation-decline" onClick={() => decline.mutate(token)}>
            Decline
          </Button>
        </div>
      </div>
    </AuthShell>
  );
}
