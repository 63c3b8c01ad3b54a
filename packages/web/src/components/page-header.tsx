import type { ReactNode } from "react";
import { Link } from "react-router";

/** Title row of a page: an optional trail back up, the title, a line of context, and actions on the right. */
export function PageHeader({
  title,
  subtitle,
  actions,
  back,
}: {
  title: ReactNode;
  subtitle?: ReactNode;
  actions?: ReactNode;
  back?: { to: string; label: string };
}) {
  return (
    <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-line pb-4">
      <div className="min-w-0">
        {back ? (
          <Link to={back.to} className="mb-1 inline-block text-xs text-ink-soft hover:text-moss">
            ← {back.label}
          </Link>
        ) : null}
        <h1 className="text-xl font-semibold" data-testid="page-title">
          {title}
        </h1>
        {subtitle ? <div className="mt-1 text-sm text-ink-soft">{subtitle}</div> : null}
      </div>
      {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
    </header>
  );
}
