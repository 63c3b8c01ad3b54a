import { useState } from "react";
import { MAIL_KIND_LABELS, type OutboxMessageSummaryDto } from "@loopyard/core";
import { useOutbox, useOutboxMessage } from "../../api/use-outbox.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { formatDateTime } from "../../components/format-date.js";
import { ListTable } from "../../components/list-table.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { mailPreviewDocument, recipientsLabel } from "./mail-preview-document.js";

const COLUMNS = [
  { label: "Received", className: "w-44" },
  { label: "To" },
  { label: "Subject" },
  { label: "Kind", className: "w-44" },
] as const;

/**
 * The outbox (admins): the mail that the local mail sink received about this workspace, newest
 * first; open one to read its plain text or its HTML (in a sandboxed frame that runs nothing).
 */
export function OutboxPage() {
  const { slug, role, workspace } = useWorkspaceRole();
  const isAdmin = role === "admin";
  const outbox = useOutbox(isAdmin ? slug : "");
  const [openId, setOpenId] = useState<string | null>(null);

  const header = <PageHeader title="Outbox" subtitle="Mail Loopyard sent about this workspace, as the local mail sink received it." />;
  if (!isAdmin) {
    return (
      <div>
        {header}
        <p className="text-sm text-ink-soft" data-testid="outbox-refused">
          {roleSentence("Reading the outbox", "admin", workspace.data?.workspace.name, role).replace("role or higher", "role")}
        </p>
      </div>
    );
  }
  if (outbox.isPending) return <Loading label="Reading the outbox…" />;
  if (outbox.isError) return <ErrorNote error={outbox.error} title="Could not read the outbox" />;
  const { localSink, folder, messages } = outbox.data;

  return (
    <div className="space-y-5">
      {header}
      {!localSink ? (
        <EmptyState title="Mail goes to a real server">
          SMTP_URL is set, so Loopyard hands its mail to that server and nothing arrives in the local sink. Unset SMTP_URL to collect mail here
          instead.
        </EmptyState>
      ) : messages.length === 0 ? (
        <EmptyState title="No mail yet" testId="outbox-empty">
          Mail appears here when a sweep or comparison ends or a proposal moves. Start a sweep to see one arrive. The sink writes each message
          as an .eml file into <span className="font-mono">{folder}</span>.
        </EmptyState>
      ) : (
        <>
          <p className="text-xs text-ink-soft">
            {messages.length} message{messages.length === 1 ? "" : "s"} · files in <span className="font-mono">{folder}</span> · password-reset
            and address-check mails are never listed here
          </p>
          <ListTable testId="outbox-table" columns={COLUMNS}>
            {messages.map((message) => (
              <OutboxRow key={message.id} message={message} open={message.id === openId} onOpen={() => setOpenId(message.id === openId ? null : message.id)} />
            ))}
          </ListTable>
          {openId ? <OutboxMessage slug={slug} id={openId} /> : null}
        </>
      )}
    </div>
  );
}

function OutboxRow({ message, open, onOpen }: { message: OutboxMessageSummaryDto; open: boolean; onOpen: () => void }) {
  return (
    <tr className={open ? "bg-moss-wash" : "hover:bg-paper"} data-testid="outbox-row">
      <td className="whitespace-nowrap px-4 py-2 font-mono text-xs text-ink-soft">{formatDateTime(message.receivedAt)}</td>
      <td className="px-4 py-2">{recipientsLabel(message.to)}</td>
      <td className="px-4 py-2">
        <button type="button" onClick={onOpen} className="text-left font-medium text-moss hover:underline" aria-expanded={open}>
          {message.subject || "(no subject)"}
        </button>
        {message.attachments.length > 0 ? <span className="ml-2 text-xs text-ink-soft">📎 {message.attachments.length}</span> : null}
      </td>
      <td className="px-4 py-2 text-ink-soft">{message.kind ? MAIL_KIND_LABELS[message.kind].label : "—"}</td>
    </tr>
  );
}

function OutboxMessage({ slug, id }: { slug: string; id: string }) {
  const message = useOutboxMessage(slug, id);
  const [view, setView] = useState<"html" | "text">("html");
  if (message.isPending) return <Loading label="Opening the message…" />;
  if (message.isError) return <ErrorNote error={message.error} title="Could not open the message" />;
  const mail = message.data;
  const shown = mail.html === null ? "text" : view;
  return (
    <Section
      title={mail.subject || "(no subject)"}
      testId="outbox-message"
      aside={
        mail.html === null ? (
          "plain text only"
        ) : (
          <span className="inline-flex gap-1" role="group" aria-label="Show the message as">
            {(["html", "text"] as const).map((v) => (
              <button
                key={v}
                type="button"
                onClick={() => setView(v)}
                aria-pressed={shown === v}
                className={`rounded px-2 py-0.5 ${shown === v ? "bg-moss text-white" : "border border-line hover:border-ink-faint"}`}
              >
                {v === "html" ? "HTML" : "Plain text"}
              </button>
            ))}
          </span>
        )
      }
    >
      <dl className="mb-3 grid grid-cols-[6rem_1fr] gap-x-3 gap-y-1 text-sm">
        <dt className="text-ink-soft">From</dt>
        <dd>{mail.from}</dd>
        <dt className="text-ink-soft">To</dt>
        <dd>{mail.to.join(", ")}</dd>
        <dt className="text-ink-soft">Received</dt>
        <dd>{formatDateTime(mail.receivedAt)}</dd>
        {mail.link ? (
          <>
            <dt className="text-ink-soft">Link</dt>
            <dd className="truncate">
              <a href={mail.link} className="text-moss hover:underline">
                {mail.link}
              </a>
            </dd>
          </>
        ) : null}
        {mail.attachments.length > 0 ? (
          <>
            <dt className="text-ink-soft">Attached</dt>
            <dd>{mail.attachments.map((a) => `${a.filename} (${a.contentType}, ${Math.max(1, Math.round(a.size / 1024))} kB)`).join("; ")}</dd>
          </>
        ) : null}
      </dl>
      {shown === "html" && mail.html !== null ? (
        <iframe
          title={`HTML of “${mail.subject}”`}
          sandbox="allow-popups allow-popups-to-escape-sandbox"
          srcDoc={mailPreviewDocument(mail.html)}
          className="h-[28rem] w-full rounded border border-line-soft bg-white"
          data-testid="outbox-html"
        />
      ) : (
        <pre className="max-h-[28rem] overflow-auto whitespace-pre-wrap rounded border border-line-soft bg-paper p-3 font-mono text-xs" data-testid="outbox-text">
          {mail.text}
        </pre>
      )}
    </Section>
  );
}
