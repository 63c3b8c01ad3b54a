import { DEFAULT_FILTER_DIVISOR, tunedFromIdeal, type TunedPid } from "./tuned-pid.js";
import type { UltimatePoint } from "./ultimate-point.js";

/** Ziegler–Nichols 1942, ultimate-sensitivity method, P: K = 0.5·Ku. */
export const ZN_P_GAIN = 0.5;
/** PI: K = 0.45·Ku, Ti = Pu/1.2. */
export const ZN_PI_GAIN = 0.45;
export const ZN_PI_INTEGRAL_DIVISOR = 1.2;
/** PID: K = 0.6·Ku, Ti = Pu/2, Td = Pu/8. */
export const ZN_PID_GAIN = 0.6;
export const ZN_PID_INTEGRAL_DIVISOR = 2;
export const ZN_PID_DERIVATIVE_DIVISOR = 8;

/** The three controller variants of a rule. */
export type ZieglerNicholsVariant = "p" | "pi" | "pid";

/**
 * Ziegler–Nichols settings from the ultimate gain Ku and period Pu (ultimatePoint):
 *
 *   P:   K = 0.5·Ku
 *   PI:  K = 0.45·Ku,  Ti = Pu/1.2
 *   PID: K = 0.6·Ku,   Ti = Pu/2,  Td = Pu/8
 *
 * applied in the ideal form K(1 + 1/(Ti s) + Td s/((Td/N)s + 1)), as Åström & Hägglund 2006 present
 * them (the 1942 paper gives no derivative filter; N = DEFAULT_FILTER_DIVISOR unless given).
 * Throws a RangeError for a non-finite Ku or a non-positive Pu.
 *
 * References: J. G. Ziegler and N. B. Nichols, "Optimum settings for automatic controllers",
 * Trans. ASME 64 (1942) 759–768; K. J. Åström and T. Hägglund, Advanced PID Control, ISA, 2006,
 * §6.2 (Table 6.1 — numbering from memory).
 */
export function zieglerNichols(point: UltimatePoint, variant: ZieglerNicholsVariant, filterDivisor: number = DEFAULT_FILTER_DIVISOR): TunedPid {
  const { ku, pu } = point;
  if (!Number.isFinite(ku) || ku === 0) throw new RangeError(`point.ku must be a finite non-zero number, got ${ku}`);
  if (!Number.isFinite(pu) || !(pu > 0)) throw new RangeError(`point.pu must be a finite number > 0 s, got ${pu}`);
  switch (variant) {
    case "p":
      return tunedFromIdeal({ K: ZN_P_GAIN * ku, Ti: Infinity, Td: 0 }, filterDivisor);
    case "pi":
      return tunedFromIdeal({ K: ZN_PI_GAIN * ku, Ti: pu / ZN_PI_INTEGRAL_DIVISOR, Td: 0 }, filterDivisor);
    case "pid":
      return tunedFromIdeal({ K: ZN_PID_GAIN * ku, Ti: pu / ZN_PID_INTEGRAL_DIVISOR, Td: pu / ZN_PID_DERIVATIVE_DIVISOR }, filterDivisor);
    default:
      throw new RangeError(`variant must be "p", "pi" or "pid", got ${String(variant)}`);
  }
}
