/** Roles of a workspace member, from least to most rights (GLOSSARY). */
export const ROLES = ["viewer", "engineer", "lead", "admin"] as const;

export type Role = (typeof ROLES)[number];

/** True when `role` carries at least the rights of `needed` (admin ⊇ lead ⊇ engineer ⊇ viewer). */
export function hasRole(role: Role, needed: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(needed);
}

/**
 * True when a member may cancel a sweep: its author, a lead or an admin (an engineer may not stop a
 * colleague's sweep; a viewer cancels nothing).
 */
export function canCancelSweep(member: { role: Role; userId: string }, authorId: string): boolean {
  if (hasRole(member.role, "lead")) return true;
  return hasRole(member.role, "engineer") && member.userId === authorId;
}
