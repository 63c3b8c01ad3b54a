import type { ReactNode } from "react";
import type { UseQueryResult } from "@tanstack/react-query";
import { ErrorNote } from "./error-note.js";
import { Loading } from "./loading.js";
import { PageHeader } from "./page-header.js";
import { RoleNote } from "./role-note.js";

/**
 * A page that lists one kind of record: the header with its actions, the note when the viewer's role
 * refuses the page's action, then loading, the error, the empty state (when there are no rows) or the rows.
 */
export function ListPage<Row>({
  testId,
  title,
  subtitle,
  actions,
  refusal,
  query,
  loadingLabel,
  errorTitle,
  empty,
  children,
}: {
  testId: string;
  title: string;
  subtitle: string;
  actions: ReactNode;
  /** The sentence naming the role the page's action needs, or null when the viewer has it. */
  refusal: string | null;
  query: UseQueryResult<Row[]>;
  loadingLabel: string;
  errorTitle: string;
  /** Shown when the list has no rows: what is missing and what to do next. */
  empty: ReactNode;
  children: (rows: Row[]) => ReactNode;
}) {
  return (
    <div data-testid={testId}>
      <PageHeader title={title} subtitle={subtitle} actions={actions} />
      {refusal ? <RoleNote sentence={refusal} /> : null}
      {query.isPending ? (
        <Loading label={loadingLabel} />
      ) : query.isError ? (
        <ErrorNote error={query.error} title={errorTitle} />
      ) : query.data.length === 0 ? (
        empty
      ) : (
        children(query.data)
      )}
    </div>
  );
}
