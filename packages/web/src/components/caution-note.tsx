import type { ReactNode } from "react";

/** The safety sentence every results page carries. */
export const SAFETY_CAUTION =
  "Simulated designs are not validated designs. Validate on the real system with its safety interlocks in place, and follow your organisation's safety practice and local codes.";

/** An amber note for things the user must keep in mind; defaults to the safety caution. */
export function CautionNote({ children = SAFETY_CAUTION, testId = "caution-note" }: { children?: ReactNode; testId?: string }) {
  return (
    <aside
      role="note"
      data-testid={testId}
      className="flex gap-3 rounded-md border border-amber/40 border-l-4 border-l-amber bg-amber-wash px-4 py-2.5 text-sm text-ink"
    >
      <span aria-hidden className="mt-px font-mono text-amber">!</span>
      <div>{children}</div>
    </aside>
  );
}
