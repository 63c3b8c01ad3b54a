/** Throws a RangeError unless t has at least one sample and every signal matches its length. */
export function assertSameLength(t: ArrayLike<number>, signals: Record<string, ArrayLike<number>>): void {
  if (t.length < 1) throw new RangeError("t must hold at least one sample");
  for (const [name, v] of Object.entries(signals)) {
    if (v.length !== t.length) throw new RangeError(`${name} must have as many samples as t (${t.length}), got ${v.length}`);
  }
}
