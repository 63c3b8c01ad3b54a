import type { Aggregate } from "../aggregates/aggregate-scores.js";
import type { ControllerKind } from "../controllers/controller.js";
import type { CriterionId } from "../criteria/criterion-id.js";
import type { DiscretePidCoefficients, DiscretizationMethod } from "../deployment/discrete-pid.js";
import type { FixedPointFormat } from "../deployment/fixed-point.js";
import type { Scenario } from "../simulation/scenario.js";
import type { ScoreValue } from "./dto.js";

/**
 * The deployment sheet as the API sends it (GET …/sweeps/:id/candidates/:index/sheet, and a
 * decision's sheet): every number that firmware needs, and what sampling and rounding do to the
 * loop. Numbers that may be infinite or absent are `null` with the meaning stated at the field
 * (JSON has no Infinity); scores use ScoreValue ("inf", "-inf", null for "does not apply").
 */
export interface DeploymentSheetDto {
  /** Version of this format; raised when a field changes meaning. */
  version: 1;
  request: { sampleTime: number; method: DiscretizationMethod; format: FixedPointFormat | null };
  /** The controller as designed (continuous), its kind and its parameters by name. */
  controller: { kind: ControllerKind; parameters: Record<string, number> };
  forms: DeploymentFormsDto;
  /** The difference equations with exact (double-precision) coefficients. */
  discrete: DiscreteEquationsDto;
  /** The same coefficients in the chosen fixed-point format; null without a format. */
  fixedPoint: FixedPointDto | null;
  criteria: { id: CriterionId; label: string; unit: string; better: "smaller" | "larger" }[];
  /** Scores of every variant: continuous, sampled with exact coefficients, sampled with rounded ones. */
  variants: DeploymentVariantDto[];
  /** The family's aggregate of each of the three, per criterion (criteria order). */
  aggregate: { kind: Aggregate; continuous: ScoreValue[]; sampled: ScoreValue[]; rounded: ScoreValue[] | null };
  scenario: Scenario;
  /** Sentences the reader should heed (sheet notes: an alternating filter, saturated coefficients, limits that differ by variant …). */
  notes: string[];
  /** The safety caution, printed on every sheet. */
  caution: string;
}

export type FormDto<T> = ({ exists: true } & T) | { exists: false; reason: string };

export interface DeploymentFormsDto {
  /** kp + ki/s + kd·s/(tf·s + 1). */
  parallel: { kp: number; ki: number; kd: number; tf: number };
  /** K·(1 + 1/(Ti·s) + Td·s/((Td/N)·s + 1)); integralTime null: no integral action; filterDivisor null: no filter. */
  ideal: FormDto<{ gain: number; integralTime: number | null; derivativeTime: number; filterDivisor: number | null }>;
  /** K'·(1 + 1/(Ti'·s))·(1 + Td'·s)/(1 + Tf·s); integralTime null: no integral action. */
  series: FormDto<{ gain: number; integralTime: number | null; derivativeTime: number; filterTime: number }>;
  /** Set-point weights on P (b) and D (c); 1 and 1 for a one-degree-of-freedom PID. */
  weights: { b: number; c: number };
}

export interface DiscreteEquationsDto {
  method: DiscretizationMethod;
  sampleTime: number;
  /** The coefficients in DISCRETE_PID_COEFFICIENTS order with what each multiplies. */
  coefficients: { name: keyof DiscretePidCoefficients; value: number; meaning: string }[];
  /** The difference equations as text lines with the coefficients written out (differenceEquations). */
  equations: string[];
  /** Output limits [u] (null: none), rate limit [u/s] and the largest step per sample rate·h [u] (null: none). */
  limits: { min: number | null; max: number | null; rate: number | null; step: number | null };
  /** Tracking time Tt [s] of back-calculation; null without integral action or with anti-windup off. */
  trackingTime: number | null;
}

export interface FixedPointDto {
  format: FixedPointFormat;
  fractionalBits: number;
  coefficients: { name: keyof DiscretePidCoefficients; exact: number; mantissa: number; exponent: number; rounded: number; error: number; saturated: boolean; underflow: boolean }[];
  equations: string[];
}

export interface DeploymentVariantDto {
  label: string;
  /** The plant revision of this variant, when the design came from the library. */
  revision: { plantId: string; plantName: string; revisionId: string; revisionNumber: number } | null;
  /** Largest |z| of the sampled closed loop's poles (limits ignored); null when not judged by eigenvalues (nonlinear plant; a dead time of many samples, judged on the characteristic polynomial). */
  sampledPoleRadius: number | null;
  /** Margins of the continuous loop (null: not applicable or nonlinear): gain margin [–], phase margin [°], Ms [–]. */
  margins: { gainMargin: ScoreValue; phaseMargin: ScoreValue; ms: ScoreValue };
  continuous: { status: "stable" | "unstable" | "diverged"; scores: ScoreValue[] | null };
  /** Null with `skipped` for a variant that cannot be re-simulated sampled (a nonlinear plant). */
  sampled: { status: "ok" | "diverged"; scores: ScoreValue[] | null } | null;
  rounded: { status: "ok" | "diverged"; scores: ScoreValue[] | null } | null;
  skipped?: string;
}
