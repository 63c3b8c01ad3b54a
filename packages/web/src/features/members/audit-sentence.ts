import type { AuditEventDto, Role } from "@loopyard/core";

function withArticle(role: Role | null): string {
  if (role === null) return "a member";
  return `${/^[aeiou]/.test(role) ? "an" : "a"} ${role}`;
}

/** The person an entry is about: their name, or the address when there is no name (an invitation). */
function subjectOf(event: AuditEventDto): string {
  return event.subject.name ? `${event.subject.name} (${event.subject.email})` : event.subject.email;
}

/**
 * One audit-trail entry as a sentence without its actor and time (the table shows those apart),
 * e.g. "invited mira@halvard.example as an admin", "changed Jon Eide's role from viewer to engineer".
 */
export function auditSentence(event: AuditEventDto): string {
  const who = subjectOf(event);
  switch (event.action) {
    case "invitation-sent":
      return `invited ${who} as ${withArticle(event.role)}`;
    case "invitation-resent":
      return `re-sent the invitation to ${who} (a new link; the older one stopped working)`;
    case "invitation-revoked":
      return `revoked the invitation to ${who}`;
    case "invitation-accepted":
      return `accepted the invitation and joined as ${withArticle(event.role)}`;
    case "invitation-declined":
      return "declined the invitation";
    case "role-changed":
      return `changed the role of ${who} from ${event.previousRole ?? "?"} to ${event.role ?? "?"}`;
    case "member-removed":
      return `removed ${who}${event.previousRole ? `, ${withArticle(event.previousRole)},` : ""} from the workspace`;
  }
}
