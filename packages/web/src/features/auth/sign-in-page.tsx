import { useForm } from "react-hook-form";
import { Link, useNavigate, useSearchParams } from "react-router";
import { isApiError } from "../../api/api-error.js";
import { useSignIn } from "../../api/use-auth.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { AuthShell } from "./auth-shell.js";
import { safeNext } from "./safe-next.js";

interface SignInValues {
  email: string;
  password: string;
}

export function SignInPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const signIn = useSignIn();
  const { register, handleSubmit, formState } = useForm<SignInValues>({ defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit((values) =>
    signIn.mutate(values, { onSuccess: () => navigate(safeNext(params.get("next")), { replace: true }) }),
  );

  return (
    <AuthShell
      title="Sign in"
      footer={
        <>
          New to Loopyard?{" "}
          <Link to={params.get("next") ? `/sign-up?next=${encodeURIComponent(params.get("next") ?? "/")}` : "/sign-up"} className="font-medium text-moss hover:underline">
            Create an account
          </Link>
        </>
      }
    >
      <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="sign-in-form">
        {signIn.error ? <ErrorNote error={signIn.error} title="Could not sign in" hint={isApiError(signIn.error) && signIn.error.status === 401 ? "Check the email and the password (it is case-sensitive) and try again." : undefined} /> : null}
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
        <Field label="Password" htmlFor="password" name="password" error={formState.errors.password?.message}>
          <input
            id="password"
            type="password"
            autoComplete="current-password"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.password)}
            {...register("password", { required: "type your password" })}
          />
        </Field>
        <Button type="submit" tone="primary" className="w-full" disabled={signIn.isPending} data-testid="sign-in-submit">
          {signIn.isPending ? "Signing in…" : "Sign in"}
        </Button>
        <Link to="/forgot-password" className="block text-center text-sm text-ink-soft hover:text-moss" data-testid="forgot-password-link">
          Forgot your password?
        </Link>
      </form>
    </AuthShell>
  );
}
