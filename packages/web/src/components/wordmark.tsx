/** The Loopyard mark: a closed loop with a summing tick, then the name in monospace. */
export function Wordmark({ size = "base" }: { size?: "base" | "large" }) {
  const px = size === "large" ? 26 : 20;
  return (
    <span className="inline-flex items-center gap-2">
      <svg width={px} height={px} viewBox="0 0 24 24" aria-hidden fill="none" stroke="currentColor" strokeWidth="2" className="text-moss">
        <rect x="3" y="5" width="18" height="14" rx="7" />
        <path d="M15 5h-3" stroke="var(--color-paper)" strokeWidth="3" />
        <path d="M12 2.5 15 5l-3 2.5" strokeLinecap="round" strokeLinejoin="round" />
        <circle cx="8" cy="12" r="1.6" fill="currentColor" stroke="none" />
      </svg>
      <span className={`font-mono font-medium tracking-tight text-ink ${size === "large" ? "text-xl" : "text-[15px]"}`}>Loopyard</span>
    </span>
  );
}
