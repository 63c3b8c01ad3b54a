import { useForm } from "react-hook-form";
import { MIN_PASSWORD_LENGTH } from "@loopyard/core";
import { Link, useLocation } from "react-router";
import { isApiError } from "../../api/api-error.js";
import { useResetPassword } from "../../api/use-auth.js";
import { Button, ButtonLink } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { AuthShell } from "./auth-shell.js";
import { secretFromHash } from "./link-secret.js";

/** /reset-password#<token> — the page the reset mail links to: choose a new password (this ends every session of the account). */
export function ResetPasswordPage() {
  const location = useLocation();
  const token = secretFromHash(location.hash);
  const reset = useResetPassword();
  const { register, handleSubmit, formState } = useForm<{ password: string; repeat: string }>({ defaultValues: { password: "", repeat: "" } });
  const onSubmit = handleSubmit((values) => reset.mutate({ token, newPassword: values.password }));

  if (token === "") {
    return (
      <AuthShell title="Choose a new password">
        <p className="text-sm text-ink-soft">
          This address holds no reset token. Open the link from the reset mail exactly as it is, or <Link to="/forgot-password" className="text-moss hover:underline">ask for a new one</Link>.
        </p>
      </AuthShell>
    );
  }
  if (reset.isSuccess) {
    return (
      <AuthShell title="Password changed">
        <div className="space-y-4 text-sm" data-testid="reset-done">
          <p>Your new password is set, and every session of the account has been signed out.</p>
          <ButtonLink to="/sign-in" tone="primary">
            Sign in
          </ButtonLink>
        </div>
      </AuthShell>
    );
  }
  const expired = isApiError(reset.error) && reset.error.status === 400 && !reset.error.field;
  return (
    <AuthShell title="Choose a new password">
      <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="reset-password-form">
        {reset.error ? (
          <ErrorNote
            error={reset.error}
            title="Could not set the password"
            hint={expired ? "A reset link works once and for an hour; ask for a new one on the forgot-password page." : undefined}
          />
        ) : null}
        <Field label="New password" htmlFor="password" name="password" hint={`At least ${MIN_PASSWORD_LENGTH} characters.`} error={formState.errors.password?.message}>
          <input
            id="password"
            type="password"
            autoComplete="new-password"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.password)}
            {...register("password", {
              required: "choose a password",
              minLength: { value: MIN_PASSWORD_LENGTH, message: `use at least ${MIN_PASSWORD_LENGTH} characters` },
            })}
          />
        </Field>
        <Field label="The same again" htmlFor="repeat" name="repeat" error={formState.errors.repeat?.message}>
          <input
            id="repeat"
            type="password"
            autoComplete="new-password"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.repeat)}
            {...register("repeat", { validate: (repeat, values) => repeat === values.password || "type the same password twice" })}
          />
        </Field>
        <Button type="submit" tone="primary" className="w-full" disabled={reset.isPending} data-testid="reset-password-submit">
          {reset.isPending ? "Saving…" : "Set the new password"}
        </Button>
        {expired ? (
          <Link to="/forgot-password" className="block text-sm text-moss hover:underline">
            Ask for a new reset link
          </Link>
        ) : null}
      </form>
    </AuthShell>
  );
}
