import { useMe } from "../../api/use-me.js";
import { useSendVerificationEmail } from "../../api/use-auth.js";
import { Button } from "../../components/button.js";

/** A thin notice above workspace pages while the signed-in account's address is not confirmed. */
export function VerifyNotice() {
  const me = useMe();
  const send = useSendVerificationEmail();
  if (!me.data || me.data.emailVerified) return null;
  return (
    <div role="note" data-testid="verify-notice" className="mb-4 flex flex-wrap items-center gap-3 rounded-md border border-amber/40 bg-amber-wash px-4 py-2 text-sm">
      <span>
        Please confirm your address: we mailed a link to <strong className="font-medium">{me.data.user.email}</strong> when you signed up.
      </span>
      {send.isSuccess ? (
        <span className="text-ink-soft">A new link is on its way.</span>
      ) : (
        <Button tone="plain" disabled={send.isPending} onClick={() => send.mutate(me.data.user.email)}>
          {send.isPending ? "Sending…" : "Mail it again"}
        </Button>
      )}
      {send.isError ? <span className="text-rust">{send.error.message}</span> : null}
    </div>
  );
}
