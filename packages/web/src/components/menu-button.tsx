/** The button that opens and closes the navigation panel on narrow screens: three bars, or a cross while open. */
export function MenuButton({ open, onToggle, controls }: { open: boolean; onToggle: () => void; controls: string }) {
  return (
    <button
      type="button"
      onClick={onToggle}
      aria-expanded={open}
      aria-controls={controls}
      aria-label={open ? "Close the menu" : "Open the menu"}
      data-testid="nav-toggle"
      className="-ml-1.5 flex size-9 shrink-0 items-center justify-center rounded-md border border-transparent text-ink-soft hover:border-line hover:text-ink md:hidden"
    >
      <svg width="18" height="18" viewBox="0 0 18 18" aria-hidden fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round">
        {open ? (
          <path d="M4 4l10 10M14 4 4 14" />
        ) : (
          <>
            <path d="M2.5 4.5h13" />
            <path d="M2.5 9h13" />
            <path d="M2.5 13.5h9" />
          </>
        )}
      </svg>
    </button>
  );
}
