import type { ButtonHTMLAttributes, ReactNode } from "react";
import { Link, type LinkProps } from "react-router";

export type ButtonTone = "primary" | "danger" | "quiet" | "plain";

const TONES: Record<ButtonTone, string> = {
  primary:
    "bg-moss text-white border border-moss hover:bg-moss-dark disabled:bg-line disabled:border-line disabled:text-ink-soft",
  danger: "bg-rust text-white border border-rust hover:bg-rust/90 disabled:bg-line disabled:border-line disabled:text-ink-soft",
  quiet: "bg-sheet text-ink border border-line hover:border-ink-faint disabled:text-ink-faint disabled:hover:border-line",
  plain: "bg-transparent text-ink-soft border border-transparent hover:text-ink disabled:text-ink-faint",
};

const BASE =
  "inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed";

export function buttonClass(tone: ButtonTone = "quiet"): string {
  return `${BASE} ${TONES[tone]}`;
}

export function Button({ tone = "quiet", className = "", ...props }: ButtonHTMLAttributes<HTMLButtonElement> & { tone?: ButtonTone }) {
  return <button type="button" className={`${buttonClass(tone)} ${className}`} {...props} />;
}

/**
 * A link that looks like a button. With `disabledReason` set (the member's role does not allow the
 * action) it is not rendered at all: nobody is offered a button that leads to a form they cannot
 * submit; the page says why in its role note.
 */
export function ButtonLink({
  tone = "quiet",
  disabledReason,
  children,
  className = "",
  testId,
  ...props
}: LinkProps & { tone?: ButtonTone; disabledReason?: string | null; testId?: string; children: ReactNode }) {
  if (disabledReason) return null;
  return (
    <Link className={`${buttonClass(tone)} ${className}`} data-testid={testId} {...props}>
      {children}
    </Link>
  );
}
