import { isAccountMailKind, MAIL_KINDS, MAIL_KIND_LABELS, type NotificationSettingsDto, type NotificationSettingsInput, type UserDto } from "@loopyard/core";
import type { Database } from "../db/database.js";
import { badRequest } from "../http/http-error.js";
import { findNotificationSettings, saveNotificationSettings } from "./notification-repository.js";

/** The signed-in person's setting for every kind of mail (on unless turned off; account kinds locked on). */
export async function getNotificationSettings(db: Database, me: UserDto): Promise<NotificationSettingsDto> {
  const stored = await findNotificationSettings(db, me.id);
  return {
    email: me.email,
    settings: MAIL_KINDS.map((kind) => {
      const locked = isAccountMailKind(kind);
      return { kind, ...MAIL_KIND_LABELS[kind], enabled: locked ? true : (stored.get(kind) ?? true), locked };
    }),
  };
}

/** Turns kinds on or off for the signed-in person; 400 for an account kind or a kind listed twice. */
export async function updateNotificationSettings(db: Database, me: UserDto, input: NotificationSettingsInput): Promise<NotificationSettingsDto> {
  const seen = new Set<string>();
  input.settings.forEach((setting, i) => {
    if (isAccountMailKind(setting.kind) && !setting.enabled) {
      throw badRequest(`settings.${i}.kind: ${MAIL_KIND_LABELS[setting.kind].label} mails cannot be turned off; they concern your account.`, `settings.${i}.kind`);
    }
    if (seen.has(setting.kind)) throw badRequest(`settings.${i}.kind: “${setting.kind}” is listed twice; list each kind once.`, `settings.${i}.kind`);
    seen.add(setting.kind);
  });
  await saveNotificationSettings(db, me.id, input.settings.filter((s) => !isAccountMailKind(s.kind)));
  return getNotificationSettings(db, me);
}
