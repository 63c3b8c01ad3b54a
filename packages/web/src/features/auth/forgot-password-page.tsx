import { useForm } from "react-hook-form";
import { Link } from "react-router";
import { useRequestPasswordReset } from "../../api/use-auth.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { AuthShell } from "./auth-shell.js";

/** /forgot-password — asks for a reset link by mail; the answer is the same whether or not the address has an account. */
export function ForgotPasswordPage() {
  const request = useRequestPasswordReset();
  const { register, handleSubmit, formState, getValues } = useForm<{ email: string }>({ defaultValues: { email: "" } });
  const onSubmit = handleSubmit((values) => request.mutate(values.email.trim()));
  return (
    <AuthShell
      title="Forgot your password?"
      footer={
        <Link to="/sign-in" className="font-medium text-moss hover:underline">
          Back to sign-in
        </Link>
      }
    >
      {request.isSuccess ? (
        <p className="text-sm" role="status" data-testid="reset-requested">
          If an account uses <strong className="font-medium">{getValues("email").trim()}</strong>, a mail with a link to choose a new password is on its way.
          The link works once, for an hour. Nothing arrived? Check the address and the spam folder, then ask again.
        </p>
      ) : (
        <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="forgot-password-form">
          {request.error ? <ErrorNote error={request.error} title="Could not ask for a reset link" /> : null}
          <p className="text-sm text-ink-soft">Type the address you signed up with; we mail you a link to choose a new password.</p>
          <Field label="Email" htmlFor="email" name="email" error={formState.errors.email?.message}>
            <input
              id="email"
              type="email"
              autoComplete="username"
              className={inputClass}
              aria-invalid={Boolean(formState.errors.email)}
              {...register("email", { required: "type the email you signed up with" })}
            />
          </Field>
          <Button type="submit" tone="primary" className="w-full" disabled={request.isPending} data-testid="forgot-password-submit">
            {request.isPending ? "Sending…" : "Mail me a reset link"}
          </Button>
        </form>
      )}
    </AuthShell>
  );
}
