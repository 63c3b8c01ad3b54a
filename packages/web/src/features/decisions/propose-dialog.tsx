import { useEffect, useRef } from "react";
import { useForm } from "react-hook-form";
import { useNavigate } from "react-router";
import { MAX_RATIONALE_LENGTH, decisionProposalSchema, type DecisionSource } from "@loopyard/core";
import { useProposeDecision } from "../../api/use-decisions.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { applyServerErrors } from "../../forms/apply-server-errors.js";
import { sourceKindLabel } from "./decision-text.js";

/** What is about to be proposed: the design's source, and the title the dialog starts with. */
export interface ProposeTarget {
  source: DecisionSource;
  /** e.g. "Candidate #63 of “Ember 600 — PI load rejection”". */
  what: string;
  title: string;
}

interface ProposeValues {
  title: string;
  rationale: string;
}

/**
 * A small modal dialog to propose one design for its family: a title and a rationale, checked with the
 * server's own schema (decisionProposalSchema) before sending; on success it opens the new proposal's page.
 * Closed (nothing sent) with Cancel or Escape.
 */
export function ProposeDialog({ slug, target, onClose }: { slug: string; target: ProposeTarget | null; onClose: () => void }) {
  const dialog = useRef<HTMLDialogElement>(null);
  const navigate = useNavigate();
  const propose = useProposeDecision(slug);
  const { register, handleSubmit, reset, setError, formState } = useForm<ProposeValues>({ defaultValues: { title: "", rationale: "" } });

  useEffect(() => {
    const element = dialog.current;
    if (!element) return;
    if (target) {
      reset({ title: target.title, rationale: "" });
      propose.reset();
      if (!element.open) element.showModal();
    } else if (element.open) element.close();
    // Opened and filled once per target (not again when the mutation or the form change).
  }, [target]);

  const submit = handleSubmit((values) => {
    if (!target) return;
    const body = { title: values.title, rationale: values.rationale, source: target.source };
    const checked = decisionProposalSchema.safeParse(body);
    if (!checked.success) {
      for (const issue of checked.error.issues) {
        const field = issue.path[0];
        if (field === "title" || field === "rationale") setError(field, { type: "schema", message: issue.message });
      }
      return;
    }
    propose.mutate(body, {
      onSuccess: (detail) => {
        onClose();
        navigate(`/w/${slug}/decisions/${detail.id}`);
      },
      onError: (error) => applyServerErrors(error, ["title", "rationale"], setError),
    });
  });

  return (
    <dialog
      ref={dialog}
      onClose={onClose}
      data-testid="propose-dialog"
      aria-labelledby="propose-title"
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-lg border border-line bg-sheet p-0 text-ink shadow-[0_12px_40px_-16px_rgba(34,38,43,0.45)] backdrop:bg-ink/30"
    >
      {target ? (
        <form onSubmit={submit} className="space-y-4 p-5" noValidate>
          <div>
            <h2 id="propose-title" className="text-base font-semibold">
              Propose this design
            </h2>
            <p className="mt-1 text-sm text-ink-soft" data-testid="propose-what">
              {target.what} — {sourceKindLabel(target.source)}, put forward as the decision for its family. A lead approves it or returns it with a comment.
            </p>
          </div>
          <Field label="Title" htmlFor="propose-title-input" name="title" error={formState.errors.title?.message}>
            <input id="propose-title-input" className={inputClass} data-testid="propose-title" {...register("title")} />
          </Field>
          <Field label="Rationale" htmlFor="propose-rationale" name="rationale" error={formState.errors.rationale?.message} hint="Why this design: what it trades, on which variants it was checked, what the lead should look at.">
            <textarea id="propose-rationale" rows={5} maxLength={MAX_RATIONALE_LENGTH} className={`${inputClass} resize-y`} data-testid="propose-rationale" {...register("rationale")} />
          </Field>
          {propose.isError && !formState.errors.title && !formState.errors.rationale ? <ErrorNote error={propose.error} title="Could not propose this design" /> : null}
          <div className="flex flex-wrap justify-end gap-2">
            <Button onClick={onClose} data-testid="propose-cancel">
              Cancel
            </Button>
            <Button type="submit" tone="primary" disabled={propose.isPending} data-testid="propose-submit">
              {propose.isPending ? "Proposing…" : "Propose"}
            </Button>
          </div>
        </form>
      ) : null}
    </dialog>
  );
}
