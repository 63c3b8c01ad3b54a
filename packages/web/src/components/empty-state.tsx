import type { ReactNode } from "react";

/** What a page shows when there is nothing yet: what is missing and what to do next. */
export function EmptyState({ title, children, action, testId = "empty-state" }: { title: string; children: ReactNode; action?: ReactNode; testId?: string }) {
  return (
    <div data-testid={testId} className="rounded-lg border border-dashed border-line bg-sheet px-6 py-10 text-center">
      <h3 className="text-base font-semibold">{title}</h3>
      <div className="mx-auto mt-2 max-w-prose text-sm text-ink-soft">{children}</div>
      {action ? <div className="mt-5 flex justify-center">{action}</div> : null}
    </div>
  );
}
