import { useForm } from "react-hook-form";
import { INVITATION_LIFETIME_DAYS, invitationInputSchema, ROLES, type Role } from "@loopyard/core";
import { useInvite } from "../../api/use-members.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";

interface InviteValues {
  email: string;
  role: Role;
}

/** Admins invite by address with a role; the server mails a single-use link (same schema as the server's). */
export function InviteForm({ slug }: { slug: string }) {
  const invite = useInvite(slug);
  const { register, handleSubmit, reset, formState } = useForm<InviteValues>({ defaultValues: { email: "", role: "engineer" } });
  const onSubmit = handleSubmit((values) => invite.mutate(values, { onSuccess: () => reset({ email: "", role: values.role }) }));
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" data-testid="invite-form">
      {invite.error ? <ErrorNote error={invite.error} title="Could not send the invitation" /> : null}
      {invite.data && !invite.isPending ? (
        <p role="status" data-testid="invite-sent" className="rounded-md border border-moss/40 bg-moss-wash px-3 py-2 text-sm">
          Invitation mailed to <strong className="font-medium">{invite.data.email}</strong> as {invite.data.role}; its link works once, for {INVITATION_LIFETIME_DAYS} days.
        </p>
      ) : null}
      <div className="flex flex-wrap items-start gap-3">
        <Field label="E-mail address" htmlFor="invite-email" name="email" error={formState.errors.email?.message} className="min-w-64 flex-1">
          <input
            id="invite-email"
            type="email"
            autoComplete="off"
            placeholder="name@company.example"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.email)}
            {...register("email", {
              validate: (email) => {
                const result = invitationInputSchema.shape.email.safeParse(email);
                return result.success ? true : (result.error.issues[0]?.message ?? "give an e-mail address");
              },
            })}
          />
        </Field>
        <Field label="Role" htmlFor="invite-role" name="role" className="w-40">
          <select id="invite-role" className={inputClass} {...register("role")}>
            {ROLES.map((role) => (
              <option key={role} value={role}>
                {role}
              </option>
            ))}
          </select>
        </Field>
        <div className="pt-5">
          <Button type="submit" tone="primary" disabled={invite.isPending} data-testid="invite-submit">
            {invite.isPending ? "Sending…" : "Send invitation"}
          </Button>
        </div>
      </div>
      <p className="text-xs text-ink-faint">
        The person gets a mail with a link; they sign in or create an account with this address and accept or decline. Nobody is added before
        accepting.
      </p>
    </form>
  );
}
