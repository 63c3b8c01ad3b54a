import type { ReactNode } from "react";
import { Wordmark } from "../../components/wordmark.js";

/** The frame of the pages before a workspace is open: the mark, one card, a line about Loopyard. */
export function AuthShell({ title, children, footer }: { title: string; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center px-4 py-12">
      <div className="mb-6">
        <Wordmark size="large" />
      </div>
      <div className="w-full max-w-sm rounded-lg border border-line bg-sheet p-6">
        <h1 className="mb-5 text-lg font-semibold" data-testid="page-title">
          {title}
        </h1>
        {children}
      </div>
      {footer ? <div className="mt-4 text-sm text-ink-soft">{footer}</div> : null}
      <p className="mt-10 max-w-sm text-center text-xs text-ink-faint">
        A team lab for benchmarking controller cost criteria across a shared library of plant models.
      </p>
    </div>
  );
}
