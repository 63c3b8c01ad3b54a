import { Link } from "react-router";
import type { UserDto } from "@loopyard/core";
import { formatDateTime } from "../../components/format-date.js";

/** The revisions of a plant or family, newest first, each with its change note ("no note" for revisions saved before notes). */
export function RevisionList({
  revisions,
  shown,
  linkTo,
}: {
  revisions: readonly { id: string; number: number; note: string | null; createdAt: string; createdBy: UserDto }[];
  shown: number;
  linkTo: (number: number) => string;
}) {
  return (
    <ol className="space-y-1 text-sm">
      {[...revisions]
        .sort((a, b) => b.number - a.number)
        .map((r) => (
          <li key={r.id}>
            <Link
              to={linkTo(r.number)}
              className={`block rounded px-2 py-1 ${r.number === shown ? "bg-moss-wash text-moss" : "hover:bg-paper"}`}
              data-testid="revision-entry"
            >
              <span className="flex items-baseline justify-between gap-3">
                <span className="font-mono">rev {r.number}</span>
                <span className="truncate text-xs text-ink-soft">
                  {formatDateTime(r.createdAt)} · {r.createdBy.name}
                </span>
              </span>
              <span className={`block text-xs ${r.note ? "text-ink" : "italic text-ink-faint"}`} data-testid="revision-note">
                {r.note ?? "no note"}
              </span>
            </Link>
          </li>
        ))}
    </ol>
  );
}
