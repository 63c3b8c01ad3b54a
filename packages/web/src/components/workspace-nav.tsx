import { NavLink } from "react-router";
import type { Role } from "@loopyard/core";

/** The pages of a workspace that the navigation lists, in order. `to` is relative to /w/:slug. */
export const WORKSPACE_NAV = [
  { to: "", label: "Home", end: true, testId: "nav-home" },
  { to: "plants", label: "Library", end: false, testId: "nav-library" },
  { to: "families", label: "Families", end: false, testId: "nav-families" },
  { to: "sweeps", label: "Sweeps", end: false, testId: "nav-sweeps" },
  { to: "comparisons", label: "Compare criteria", end: false, testId: "nav-comparisons" },
  { to: "decisions", label: "Decisions", end: false, testId: "nav-decisions" },
  { to: "members", label: "Members", end: false, testId: "nav-members" },
] as const;

/** Shown to admins only (the server refuses the outbox to everyone else). */
const ADMIN_NAV = [{ to: "outbox", label: "Outbox", end: false, testId: "nav-outbox" }] as const;

/**
 * The workspace's page links as a vertical list: the left column on wide screens and the menu panel on
 * narrow ones. `onNavigate` runs when a link is followed (the menu panel closes itself with it).
 */
export function WorkspaceNav({ base, role, onNavigate, idPrefix = "" }: { base: string; role: Role; onNavigate?: () => void; idPrefix?: string }) {
  return (
    <ul className="space-y-0.5">
      {[...WORKSPACE_NAV, ...(role === "admin" ? ADMIN_NAV : [])].map((item) => (
        <li key={item.label}>
          <NavLink
            to={item.to === "" ? base : `${base}/${item.to}`}
            end={item.end}
            onClick={onNavigate}
            data-testid={`${idPrefix}${item.testId}`}
            className={({ isActive }) =>
              `block rounded-md border-l-2 px-3 py-2 text-sm md:py-1.5 ${
                isActive ? "border-moss bg-moss-wash font-medium text-moss" : "border-transparent text-ink-soft hover:bg-sheet hover:text-ink"
              }`
            }
          >
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
