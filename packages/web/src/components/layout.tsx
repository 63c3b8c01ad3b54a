import type { ReactNode } from "react";
import { Link, NavLink } from "react-router";
import type { Role, UserDto } from "@loopyard/core";
import { Wordmark } from "./wordmark.js";

export interface LayoutProps {
  workspace: { slug: string; name: string };
  role: Role;
  user: UserDto;
  /** Other workspaces of the user, for switching. */
  otherWorkspaces: { slug: string; name: string }[];
  onSignOut: () => void;
  signingOut: boolean;
  children: ReactNode;
}

const NAV = [
  { to: "", label: "Home", end: true, testId: "nav-home" },
  { to: "plants", label: "Library", end: false, testId: "nav-library" },
  { to: "families", label: "Families", end: false, testId: "nav-families" },
  { to: "sweeps", label: "Sweeps", end: false, testId: "nav-sweeps" },
  { to: "comparisons", label: "Compare criteria", end: false, testId: "nav-comparisons" },
  { to: "members", label: "Members", end: false, testId: "nav-members" },
] as const;

/** Shown to admins only (the server refuses the outbox to everyone else). */
const ADMIN_NAV = { to: "outbox", label: "Outbox", end: false, testId: "nav-outbox" } as const;

/** The frame of every workspace page: top bar (wordmark, workspace, user menu), left nav, content. */
export function Layout({ workspace, role, user, otherWorkspaces, onSignOut, signingOut, children }: LayoutProps) {
  const base = `/w/${workspace.slug}`;
  return (
    <div className="flex min-h-screen flex-col">
      <header className="sticky top-0 z-20 flex h-13 items-center gap-4 border-b border-line bg-sheet/95 px-5 backdrop-blur">
        <Link to={base} aria-label="Loopyard home">
          <Wordmark />
        </Link>
        <span aria-hidden className="h-5 w-px bg-line" />
        <span className="truncate text-sm font-medium text-ink" data-testid="workspace-name">
          {workspace.name}
        </span>
        <div className="ml-auto">
          <details className="group relative" data-testid="user-menu">
            <summary className="flex cursor-pointer list-none items-center gap-2 rounded-md border border-transparent px-2 py-1 text-sm hover:border-line">
              <span className="flex size-7 items-center justify-center rounded-full bg-moss-wash font-mono text-xs text-moss">
                {initials(user.name)}
              </span>
              <span className="hidden sm:inline">{user.name}</span>
              <span className="rounded border border-line px-1.5 py-px font-mono text-[11px] text-ink-soft" data-testid="user-role">
                {role}
              </span>
            </summary>
            <div className="absolute right-0 mt-1 w-64 rounded-md border border-line bg-sheet p-1 text-sm shadow-[0_6px_20px_-12px_rgba(34,38,43,0.35)]">
              <div className="border-b border-line-soft px-3 py-2">
                <div className="font-medium">{user.name}</div>
                <div className="text-xs text-ink-soft">{user.email}</div>
              </div>
              {otherWorkspaces.length > 0 ? (
                <div className="border-b border-line-soft py-1">
                  <div className="px-3 pt-1 text-[11px] uppercase tracking-wide text-ink-faint">Switch workspace</div>
                  {otherWorkspaces.map((w) => (
                    <Link key={w.slug} to={`/w/${w.slug}`} className="block rounded px-3 py-1.5 hover:bg-paper">
                      {w.name}
                    </Link>
                  ))}
                </div>
              ) : null}
              <Link
                to={`${base}/notifications`}
                onClick={(event) => event.currentTarget.closest("details")?.removeAttribute("open")}
                className="block rounded px-3 py-1.5 hover:bg-paper"
                data-testid="menu-notifications"
              >
                Notification settings
              </Link>
              <Link to="/workspaces/new" className="block rounded px-3 py-1.5 hover:bg-paper">
                New workspace
              </Link>
              <button
                type="button"
                onClick={onSignOut}
                disabled={signingOut}
                data-testid="sign-out"
                className="block w-full rounded px-3 py-1.5 text-left hover:bg-paper disabled:text-ink-faint"
              >
                {signingOut ? "Signing out…" : "Sign out"}
              </button>
            </div>
          </details>
        </div>
      </header>
      <div className="flex flex-1">
        <nav aria-label="Workspace" className="w-48 shrink-0 border-r border-line px-3 py-5">
          <ul className="space-y-0.5">
            {[...NAV, ...(role === "admin" ? [ADMIN_NAV] : [])].map((item) => (
              <li key={item.label}>
                <NavLink
                  to={item.to === "" ? base : `${base}/${item.to}`}
                  end={item.end}
                  data-testid={item.testId}
                  className={({ isActive }) =>
                    `block rounded-md border-l-2 px-3 py-1.5 text-sm ${
                      isActive ? "border-moss bg-moss-wash font-medium text-moss" : "border-transparent text-ink-soft hover:bg-sheet hover:text-ink"
                    }`
                  }
                >
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <main className="min-w-0 flex-1 px-8 py-6">
          <div className="mx-auto max-w-6xl">{children}</div>
        </main>
      </div>
    </div>
  );
}

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  return ((parts[0]?.[0] ?? "?") + (parts.length > 1 ? parts[parts.length - 1][0] : "")).toUpperCase();
}
