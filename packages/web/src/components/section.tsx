import type { ReactNode } from "react";

/** A titled block of a page on a paper sheet with a hairline border. */
export function Section({ title, aside, children, testId }: { title: ReactNode; aside?: ReactNode; children: ReactNode; testId?: string }) {
  return (
    <section data-testid={testId} className="rounded-lg border border-line bg-sheet">
      <div className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1 border-b border-line-soft px-4 py-2.5">
        <h2 className="text-sm font-semibold">{title}</h2>
        {aside ? <div className="text-xs text-ink-soft">{aside}</div> : null}
      </div>
      <div className="p-4">{children}</div>
    </section>
  );
}
