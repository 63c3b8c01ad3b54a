import { useForm } from "react-hook-form";
import { MIN_PASSWORD_LENGTH } from "@loopyard/core";
import { Link, useNavigate, useSearchParams } from "react-router";
import { useSignUp } from "../../api/use-auth.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { AuthShell } from "./auth-shell.js";
import { safeNext } from "./safe-next.js";

interface SignUpValues {
  name: string;
  email: string;
  password: string;
}


export function SignUpPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = params.get("next");
  const fromInvitation = safeNext(next).startsWith("/invitation");
  const signUp = useSignUp();
  const { register, handleSubmit, formState } = useForm<SignUpValues>({ defaultValues: { name: "", email: "", password: "" } });

  const onSubmit = handleSubmit((values) => signUp.mutate(values, { onSuccess: () => navigate(safeNext(next), { replace: true }) }));

  return (
    <AuthShell
      title="Create an account"
      footer={
        <>
          Already have an account?{" "}
          <Link to={next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in"} className="font-medium text-moss hover:underline">
            Sign in
          </Link>
        </>
      }
    >
      <p className="mb-4 text-sm text-ink-soft" data-testid="sign-up-note">
        {fromInvitation
          ? "Use the address the invitation was mailed to: only that account can accept it. After creating the account you come back to the invitation."
          : "Joining a team? Its admin invites you by mail: create the account with that address, then open the invitation link to accept. Or create a workspace of your own once signed in."}
      </p>
      <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="sign-up-form">
        {signUp.error ? <ErrorNote error={signUp.error} title="Could not create the account" /> : null}
        <Field label="Name" htmlFor="name" name="name" error={formState.errors.name?.message}>
          <input
            id="name"
            autoComplete="name"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.name)}
            {...register("name", { required: "type your name as colleagues know it" })}
          />
        </Field>
        <Field label="Email" htmlFor="email" name="email" error={formState.errors.email?.message}>
          <input
            id="email"
            type="email"
            autoComplete="email"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.email)}
            {...register("email", {
              required: "type your email address",
              pattern: { value: /^[^\s@]+@[^\s@]+$/, message: "type an address like name@company.example" },
            })}
          />
        </Field>
        <Field
          label="Password"
          htmlFor="password"
          name="password"
          hint={`At least ${MIN_PASSWORD_LENGTH} characters.`}
          error={formState.errors.password?.message}
        >
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
        <Button type="submit" tone="primary" className="w-full" disabled={signUp.isPending} data-testid="sign-up-submit">
          {signUp.isPending ? "Creating…" : "Create account"}
        </Button>
      </form>
    </AuthShell>
  );
}
