import { formatCoefficient, formatPolynomial } from "./format-transfer-function.js";

/** G(s) drawn as a fraction in monospace: numerator over a rule over denominator, then the dead-time factor. */
export function TransferFunctionView({
  num,
  den,
  delay,
  size = "base",
  testId = "transfer-function",
}: {
  num: readonly number[];
  den: readonly number[];
  delay: number;
  size?: "base" | "large";
  testId?: string;
}) {
  const text = size === "large" ? "text-lg" : "text-sm";
  const hasDelay = delay > 0;
  return (
    <div data-testid={testId} className={`inline-flex items-center gap-3 font-mono ${text} text-ink`}>
      <span className="text-ink-soft">G(s) =</span>
      <span className="inline-flex flex-col items-center">
        <span className="px-2">{formatPolynomial(num)}</span>
        <span className="my-0.5 h-px w-full bg-ink/70" aria-hidden />
        <span className="px-2">{formatPolynomial(den)}</span>
      </span>
      {hasDelay ? (
        <span data-testid={`${testId}-delay`}>
          · e<sup className="ml-px text-[0.75em]">−{formatCoefficient(delay)}s</sup>
        </span>
      ) : null}
    </div>
  );
}
