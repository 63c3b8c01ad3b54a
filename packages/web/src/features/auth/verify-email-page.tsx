import { useEffect } from "react";
import { Link, useLocation } from "react-router";
import { useVerifyEmail } from "../../api/use-auth.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { AuthShell } from "./auth-shell.js";
import { secretFromHash } from "./link-secret.js";

/** /verify-email#<token> — the page the address-check mail links to: confirms the address at once. */
export function VerifyEmailPage() {
  const location = useLocation();
  const token = secretFromHash(location.hash);
  const verify = useVerifyEmail();
  const { mutate } = verify;
  useEffect(() => {
    if (token !== "") mutate(token);
  }, [token, mutate]);

  return (
    <AuthShell title="Confirm your address">
      {token === "" ? (
        <p className="text-sm text-ink-soft">This address holds no confirmation token. Open the link from the mail exactly as it is.</p>
      ) : verify.isError ? (
        <ErrorNote
          error={verify.error}
          title="Could not confirm the address"
          hint="The link works for 48 hours. Sign in and ask for a new one from the notice at the top of any workspace page."
        />
      ) : verify.isSuccess ? (
        <p className="text-sm" data-testid="verify-done">
          Your address is confirmed. <Link to="/" className="font-medium text-moss hover:underline">Open Loopyard</Link>
        </p>
      ) : (
        <Loading label="Confirming…" />
      )}
    </AuthShell>
  );
}
