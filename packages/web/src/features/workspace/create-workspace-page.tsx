import { useForm } from "react-hook-form";
import { workspaceNameSchema } from "@loopyard/core";
import { Link, useNavigate } from "react-router";
import { useMe } from "../../api/use-me.js";
import { useCreateWorkspace } from "../../api/use-workspace.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { AuthShell } from "../auth/auth-shell.js";

/** A signed-in user without a workspace (or wanting another) creates one and becomes its admin. */
export function CreateWorkspacePage() {
  const navigate = useNavigate();
  const me = useMe();
  const create = useCreateWorkspace();
  const { register, handleSubmit, formState } = useForm<{ name: string }>({ defaultValues: { name: "" } });
  const hasWorkspace = (me.data?.memberships.length ?? 0) > 0;

  const onSubmit = handleSubmit((values) =>
    create.mutate({ name: values.name.trim() }, { onSuccess: (workspace) => navigate(`/w/${workspace.slug}`) }),
  );

  return (
    <AuthShell
      title="Create a workspace"
      footer={
        hasWorkspace ? (
          <Link to="/" className="text-moss hover:underline">
            Back to your workspace
          </Link>
        ) : (
          <>
            Or ask an admin of an existing workspace to invite {me.data?.user.email ?? "you"}: the invitation comes by mail, and its link lets you accept.
          </>
        )
      }
    >
      <p className="mb-4 text-sm text-ink-soft">
        {hasWorkspace
          ? "A workspace holds a team's plant library and sweeps."
          : "You are not a member of any workspace yet. A workspace holds a team's plant library and sweeps; you become its admin."}
      </p>
      <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="create-workspace-form">
        {create.error ? <ErrorNote error={create.error} title="Could not create the workspace" /> : null}
        <Field label="Workspace name" htmlFor="workspace-name" name="name" hint="e.g. the team or product line" error={formState.errors.name?.message}>
          <input
            id="workspace-name"
            className={inputClass}
            aria-invalid={Boolean(formState.errors.name)}
            {...register("name", {
              // The server's own rule (core workspaceNameSchema), so the page and the API agree.
              validate: (v) => {
                const result = workspaceNameSchema.safeParse(v);
                return result.success ? true : (result.error.issues[0]?.message ?? "give the workspace a name");
              },
            })}
          />
        </Field>
        <Button type="submit" tone="primary" className="w-full" disabled={create.isPending}>
          {create.isPending ? "Creating…" : "Create workspace"}
        </Button>
      </form>
    </AuthShell>
  );
}
