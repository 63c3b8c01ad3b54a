import { useState } from "react";
import type { DecisionDetailDto } from "@loopyard/core";
import { useCommentOnDecision } from "../../api/use-decisions.js";
import { Button } from "../../components/button.js";
import { ErrorNote } from "../../components/error-note.js";
import { inputClass } from "../../components/field.js";
import { formatDateTime } from "../../components/format-date.js";

/** The comment thread, oldest first (a lead's return comments marked), and a box to add one while the proposal is open. */
export function DecisionThread({ slug, decision }: { slug: string; decision: DecisionDetailDto }) {
  const comment = useCommentOnDecision(slug, decision.id);
  const [text, setText] = useState("");
  return (
    <div data-testid="decision-thread" className="space-y-3">
      {decision.comments.length === 0 ? <p className="text-sm text-ink-soft">No comments yet.</p> : null}
      <ol className="space-y-3">
        {decision.comments.map((c) => (
          <li key={c.id} className={`rounded-md border px-3 py-2 text-sm ${c.kind === "return" ? "border-rust/30 bg-rust-wash/60" : "border-line-soft bg-white/60"}`} data-testid="decision-comment">
            <div className="mb-0.5 flex flex-wrap items-baseline gap-x-2 text-xs text-ink-soft">
              <span className="font-medium text-ink">{c.author.name}</span>
              <span>{formatDateTime(c.at)}</span>
              {c.kind === "return" ? <span className="text-rust">returned it with this comment</span> : null}
            </div>
            <p className="whitespace-pre-wrap break-words">{c.text}</p>
          </li>
        ))}
      </ol>
      {decision.can.canComment ? (
        <form
          className="relative space-y-2"
          onSubmit={(event) => {
            event.preventDefault();
            comment.mutate(text, { onSuccess: () => setText("") });
          }}
        >
          <label htmlFor="decision-comment-text" className="sr-only">
            Comment
          </label>
          <textarea id="decision-comment-text" rows={3} value={text} onChange={(e) => setText(e.target.value)} placeholder="Add a comment" className={`${inputClass} resize-y`} data-testid="decision-comment-text" />
          <Button type="submit" disabled={comment.isPending || text.trim() === ""} data-testid="decision-comment-submit">
            {comment.isPending ? "Sending…" : "Comment"}
          </Button>
          {comment.isError ? <ErrorNote error={comment.error} title="Could not add the comment" /> : null}
        </form>
      ) : null}
    </div>
  );
}
