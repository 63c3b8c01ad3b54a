import type { MailKind } from "@loopyard/core";
import { useNotificationSettings, useUpdateNotificationSettings } from "../../api/use-notifications.js";
import { ErrorNote } from "../../components/error-note.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";

/** Notification settings of the signed-in person: each kind of mail on or off; account mail always on. */
export function NotificationSettingsPage() {
  const settings = useNotificationSettings();
  const update = useUpdateNotificationSettings();

  if (settings.isPending) return <Loading label="Reading your notification settings…" />;
  if (settings.isError) return <ErrorNote error={settings.error} title="Could not read your notification settings" />;
  const { email, settings: rows } = settings.data;
  const toggle = (kind: MailKind, enabled: boolean) => update.mutate({ settings: [{ kind, enabled }] });
  const work = rows.filter((r) => !r.locked);
  const account = rows.filter((r) => r.locked);

  return (
    <div className="max-w-2xl space-y-5">
      <PageHeader title="Notification settings" subtitle={<>Mail goes to <span className="font-medium text-ink">{email}</span>. These settings hold in every workspace.</>} />
      {update.isError ? <ErrorNote error={update.error} title="The change was not saved" /> : null}
      <Section title="Mail about your work" aside={update.isPending ? "Saving…" : "Saved as you switch"} testId="notification-settings">
        <ul className="divide-y divide-line-soft">
          {work.map((row) => (
            <li key={row.kind} className="flex items-start gap-3 py-2.5">
              <input
                id={`kind-${row.kind}`}
                type="checkbox"
                className="mt-1 size-4 accent-moss"
                checked={row.enabled}
                disabled={update.isPending}
                onChange={(event) => toggle(row.kind, event.target.checked)}
                data-testid={`notify-${row.kind}`}
              />
              <label htmlFor={`kind-${row.kind}`} className="text-sm">
                <span className="font-medium">{row.label}</span>
                <span className="block text-ink-soft">When {row.when}.</span>
              </label>
            </li>
          ))}
        </ul>
      </Section>
      <Section title="Mail about your account">
        <p className="mb-2 text-sm text-ink-soft">These are always sent: they carry invitations and sign-in links.</p>
        <ul className="space-y-1 text-sm">
          {account.map((row) => (
            <li key={row.kind}>
              <span className="font-medium">{row.label}</span> <span className="text-ink-soft">— when {row.when}</span>
            </li>
          ))}
        </ul>
      </Section>
    </div>
  );
}
