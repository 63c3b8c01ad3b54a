/** Roles of a workspace member, from least to most rights (GLOSSARY). */
export const ROLES = ["viewer", "engineer", "lead", "admin"] as const;

export type Role = (typeof ROLES)[number];

/** True when `role` carries at least the rights of `needed` (admin ⊇ lead ⊇ engineer ⊇ viewer). */
export function hasRole(role: Role, needed: Role): boolean {
  return ROLES.indexOf(role) >= ROLES.indexOf(needed);
}
