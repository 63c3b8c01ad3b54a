import { useEffect, useState } from "react";
import type { ReactNode } from "react";
import { Link, useLocation } from "react-router";
import type { Role, UserDto } from "@loopyard/core";
import { MenuButton } from "./menu-button.js";
import { Wordmark } from "./wordmark.js";
import { WorkspaceNav } from "./workspace-nav.js";

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

const MENU_PANEL_ID = "workspace-menu";

/**
 * The frame of every workspace page: top bar (wordmark, workspace, user menu), the navigation, content.
 * From the `md` breakpoint (768 px) up the navigation is a left column; below it, a menu button in the top
 * bar opens it as a panel over the page, closed again by the button, Escape, a click beside it or following a link.
 */
export function Layout({ workspace, role, user, otherWorkspaces, onSignOut, signingOut, children }: LayoutProps) {
  const base = `/w/${workspace.slug}`;
  const [menuOpen, setMenuOpen] = useState(false);
  const location = useLocation();
  useEffect(() => setMenuOpen(false), [location.pathname]);
  useEffect(() => {
    if (!menuOpen) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") setMenuOpen(false);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [menuOpen]);

  return (
    <div className="flex min-h-screen flex-col">
      <header className="sticky top-0 z-30 flex h-13 items-center gap-3 border-b border-line bg-sheet/95 px-3 backdrop-blur sm:gap-4 sm:px-5">
        <MenuButton open={menuOpen} onToggle={() => setMenuOpen(!menuOpen)} controls={MENU_PANEL_ID} />
        <Link to={base} aria-label="Loopyard home" className="shrink-0">
          <Wordmark />
        </Link>
        <span aria-hidden className="hidden h-5 w-px bg-line sm:block" />
        <span className="hidden min-w-0 truncate text-sm font-medium text-ink sm:block" data-testid="workspace-name">
          {workspace.name}
        </span>
        <div className="ml-auto shrink-0">
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
      {menuOpen ? (
        <>
          <div aria-hidden className="fixed inset-0 top-13 z-20 bg-ink/20 md:hidden" onClick={() => setMenuOpen(false)} />
          <nav
            id={MENU_PANEL_ID}
            aria-label="Workspace"
            data-testid="nav-panel"
            className="fixed inset-x-0 top-13 z-20 border-b border-line bg-sheet px-3 pt-3 pb-4 shadow-[0_10px_24px_-16px_rgba(34,38,43,0.45)] md:hidden"
          >
            <div className="mb-2 truncate px-3 text-xs text-ink-soft">{workspace.name}</div>
            <WorkspaceNav base={base} role={role} idPrefix="menu-" onNavigate={() => setMenuOpen(false)} />
          </nav>
        </>
      ) : null}
      <div className="flex flex-1">
        <nav aria-label="Workspace" className="hidden w-48 shrink-0 border-r border-line px-3 py-5 md:block">
          <WorkspaceNav base={base} role={role} />
        </nav>
        <main className="min-w-0 flex-1 px-4 py-5 sm:px-6 md:px-8 md:py-6">
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
