import { useState } from "react";
import type { DecisionDetailDto } from "@loopyard/core";
import { useApproveDecision, useReturnDecision, useReviseDecision, useWithdrawDecision } from "../../api/use-decisions.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";

type Open = "none" | "return" | "revise";

/**
 * What the signed-in person may do with the decision now, from the DTO's `can` flags (the API checks the
 * same): approve, or return with a comment (a lead who may); withdraw and revise (the proposer). Nothing
 * shows when none applies; a lead held back by the four-eyes rule reads why.
 */
export function DecisionActions({ slug, decision }: { slug: string; decision: DecisionDetailDto }) {
  const { can } = decision;
  const approve = useApproveDecision(slug, decision.id);
  const giveBack = useReturnDecision(slug, decision.id);
  const withdraw = useWithdrawDecision(slug, decision.id);
  const revise = useReviseDecision(slug, decision.id);
  const [open, setOpen] = useState<Open>("none");
  const [comment, setComment] = useState("");
  const [title, setTitle] = useState(decision.title);
  const [rationale, setRationale] = useState(decision.rationale);
  const failed = [approve, giveBack, withdraw, revise].find((m) => m.isError);
  const busy = approve.isPending || giveBack.isPending || withdraw.isPending || revise.isPending;

  if (!can.canApprove && !can.canReturn && !can.canWithdraw && !can.canRevise && !can.approveBlockedBecause) return null;
  return (
    <section className="space-y-3 rounded-lg border border-line bg-sheet px-4 py-3" data-testid="decision-actions">
      <div className="flex flex-wrap items-center gap-2">
        {can.canApprove ? (
          <Button tone="primary" disabled={busy} onClick={() => approve.mutate(undefined)} data-testid="decision-approve">
            {approve.isPending ? "Approving…" : "Approve"}
          </Button>
        ) : null}
        {can.canReturn ? (
          <Button disabled={busy} onClick={() => setOpen(open === "return" ? "none" : "return")} aria-expanded={open === "return"} data-testid="decision-return-open">
            Return with a comment
          </Button>
        ) : null}
        {can.canRevise ? (
          <Button disabled={busy} onClick={() => setOpen(open === "revise" ? "none" : "revise")} aria-expanded={open === "revise"} data-testid="decision-revise-open">
            Revise and propose again
          </Button>
        ) : null}
        {can.canWithdraw ? (
          <Button tone="plain" disabled={busy} onClick={() => withdraw.mutate(undefined)} data-testid="decision-withdraw">
            {withdraw.isPending ? "Withdrawing…" : "Withdraw"}
          </Button>
        ) : null}
      </div>
      {can.approveBlockedBecause ? (
        <p className="text-sm text-ink-soft" data-testid="approve-blocked">
          {can.approveBlockedBecause}
        </p>
      ) : null}
      {open === "return" ? (
        <form
          className="space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            giveBack.mutate(comment, { onSuccess: () => (setOpen("none"), setComment("")) });
          }}
        >
          <Field label="What should change before it can be approved?" htmlFor="return-comment" name="comment">
            <textarea id="return-comment" rows={3} value={comment} onChange={(e) => setComment(e.target.value)} className={`${inputClass} resize-y`} data-testid="decision-return-comment" />
          </Field>
          <Button type="submit" tone="danger" disabled={busy || comment.trim() === ""} data-testid="decision-return">
            {giveBack.isPending ? "Returning…" : "Return to the proposer"}
          </Button>
        </form>
      ) : null}
      {open === "revise" ? (
        <form
          className="space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            revise.mutate({ title, rationale, source: decision.source }, { onSuccess: () => setOpen("none") });
          }}
        >
          <Field label="Title" htmlFor="revise-title" name="title">
            <input id="revise-title" value={title} onChange={(e) => setTitle(e.target.value)} className={inputClass} data-testid="decision-revise-title" />
          </Field>
          <Field label="Rationale" htmlFor="revise-rationale" name="rationale" hint="Answer the lead's comment; the design stays the same (propose another design for a different one).">
            <textarea id="revise-rationale" rows={5} value={rationale} onChange={(e) => setRationale(e.target.value)} className={`${inputClass} resize-y`} data-testid="decision-revise-rationale" />
          </Field>
          <Button type="submit" tone="primary" disabled={busy} data-testid="decision-revise">
            {revise.isPending ? "Proposing again…" : "Propose again"}
          </Button>
        </form>
      ) : null}
      {failed ? <ErrorNote error={failed.error} title="The decision could not be changed" /> : null}
    </section>
  );
}
