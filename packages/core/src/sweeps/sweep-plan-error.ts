/**
 * A sweep definition that does not fit its plants (planSweep) or its own rules: `field` is the
 * dotted path of the definition's field ("ranges", "family.variants.1.parameters"), `reason` the
 * sentence without the field; the message is sweepIssueSentence's "<field>: <reason>".
 */
export class SweepPlanError extends RangeError {
  override name = "SweepPlanError";
  readonly field: string;
  readonly reason: string;
  constructor(field: string, reason: string) {
    super(`${field}: ${reason}`);
    this.field = field;
    this.reason = reason;
  }
}
