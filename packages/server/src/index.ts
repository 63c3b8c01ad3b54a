// Public surface of @loopyard/server. Every export is named here; types are kept apart.

export { AUTH_BODY_LIMIT, createApp, JSON_BODY_LIMIT } from "./app.js";
export { DEFAULT_RATE_LIMITS } from "./http/rate-limits.js";
export { configFromEnv, ConfigError, defaultMigrationsFolder, DEFAULT_DATABASE_URL, DEFAULT_HOST, DEFAULT_PORT } from "./config.js";
export { runMigrations } from "./db/migrate.js";
export { HttpError } from "./http/http-error.js";
export { routeTable } from "./http/route-table.js";
export { DEMO_LOAD_SWEEP_NAME, DEMO_PASSWORD, DEMO_PLANTS, DEMO_SWEEPS, DEMO_USERS, DEMO_WORKSPACE, DEMO_SWEEP_NAME, seedDemo } from "./seed/demo-seed.js";

export type { AppConfig, ServerConfig } from "./config.js";
export type { RateLimits, RateLimitRule } from "./http/rate-limits.js";
export type { RouteEntry } from "./http/route-table.js";
export type { LoopyardApp } from "./app.js";
export type { SeedReport } from "./seed/demo-seed.js";

// Mail: queue, recipients, templates, the local sink (see src/mail/).
export { queueMail, ensureMailQueue, MAIL_QUEUE, MAIL_RETRY_LIMIT, MAIL_RETRY_DELAY_SECONDS } from "./mail/mail-queue.js";
export { notifyUsers } from "./mail/notify-users.js";
export { mailRecipients } from "./mail/mail-recipients.js";
export { createMailSystem } from "./mail/mail-system.js";
export { mailConfigFromEnv, DEFAULT_SMTP_SINK_PORT } from "./mail/mail-config.js";
export { startMailSink } from "./mail/mail-sink.js";
export { MAIL_HEADERS } from "./mail/mail-message.js";
export { MAIL_TEMPLATES, renderMailOf } from "./mail/templates/mail-templates.js";
export { escapeHtml, renderMail } from "./mail/templates/mail-layout.js";
export { DECISION_MAIL_CAUTION } from "./mail/templates/decision-mails.js";
export type { MailMessage, MailAttachment, MailJobData } from "./mail/mail-message.js";
export type { MailRecipient } from "./mail/mail-recipients.js";
export type { MailSystem } from "./mail/mail-system.js";
export type { MailConfig } from "./mail/mail-config.js";
export type { MailSink, MailSinkOptions } from "./mail/mail-sink.js";
export type { NotifyUsersInput } from "./mail/notify-users.js";
export type { MailTemplateData } from "./mail/templates/mail-templates.js";
export type { RenderedMail } from "./mail/templates/mail-layout.js";
