/** Relative distance to a node within which a read time counts as lying on the node. */
const NODE_TOLERANCE = 1e-9;

/**
 * The past of the actuator output u(t) on nodes t_0 = 0 < t_1 < …, for reading a delayed input
 * u(t − θ) at any time. The nodes are the ends of the integration pieces: the internal steps, and
 * the instants where u or the plant input is not smooth (switching instants, propagated
 * discontinuities), so no interval between two nodes holds a kink. Each node keeps its left and
 * right limits — value and time derivative, (u(t_j⁻), u'(t_j⁻)) and (u(t_j⁺), u'(t_j⁺)) — so a
 * signal that jumps at a node (the setpoint step at t = 0, a new noise sample at a grid point) is
 * stored without smearing. Between two nodes the signal is the cubic Hermite interpolant of the
 * right limit at t_j and the left limit at t_{j+1} (Δ = t_{j+1} − t_j, τ = (t − t_j)/Δ):
 *
 *   u(t) ≈ h00(τ)·u_j⁺ + h10(τ)·Δ·u'_j⁺ + h01(τ)·u_{j+1}⁻ + h11(τ)·Δ·u'_{j+1}⁻,
 *   h00 = 2τ³ − 3τ² + 1, h10 = τ³ − 2τ² + τ, h01 = −2τ³ + 3τ², h11 = τ³ − τ²,
 *
 * whose error is O(Δ⁴) where u is four times differentiable (C. de Boor, A Practical Guide to
 * Splines, rev. ed., Springer, 2001, ch. IV). Before t = 0 the signal is the operating input u_op.
 * Past the newest node it is extended by its tangent (reached only within rounding of that node,
 * as the internal step never exceeds θ).
 *
 * A read that lands on a node (within 1e-9 of its spacing) takes the side of `side` (the
 * midpoint of the piece being integrated, shifted by θ), so a jump at a node is never straddled.
 * Storage is a ring that doubles when the nodes still within reach would not fit; reads move
 * with a cursor, so a read costs O(1) when time advances.
 */
export class InputHistory {
  /** Derivative u' at the last read point. */
  derivative = 0;
  private times: Float64Array;
  private leftValue: Float64Array;
  private leftSlope: Float64Array;
  private rightValue: Float64Array;
  private rightSlope: Float64Array;
  private capacity: number;
  /** Index (unbounded) of the newest and the oldest kept node, and the read cursor. */
  private newest = -1;
  private oldest = 0;
  private cursor = 0;

  constructor(
    /** Kept span [s]: nodes older than newest − reach are dropped (θ plus a few steps). */
    private readonly reach: number,
    capacity: number,
    /** u(t) for t < 0. */
    private readonly before: number,
  ) {
    this.capacity = Math.max(8, capacity);
    this.times = new Float64Array(this.capacity);
    this.leftValue = new Float64Array(this.capacity);
    this.leftSlope = new Float64Array(this.capacity);
    this.rightValue = new Float64Array(this.capacity);
    this.rightSlope = new Float64Array(this.capacity);
  }

  /** Time of the newest node [s]. */
  get newestTime(): number {
    return this.newest < 0 ? -Infinity : this.times[this.newest % this.capacity];
  }

  /**
   * Appends a node at t (after the newest) with left and right limits of value and slope; a node
   * within rounding of the newest one only replaces that node's right limit (no empty interval).
   */
  push(t: number, left: number, leftSlope: number, right: number, rightSlope: number): void {
    if (this.newest >= 0 && t - this.times[this.newest % this.capacity] <= NODE_TOLERANCE * Math.max(1, Math.abs(t))) {
      this.setNewestRight(right, rightSlope);
      return;
    }
    const limit = t - this.reach;
    while (this.oldest < this.newest && this.times[(this.oldest + 1) % this.capacity] <= limit) this.oldest++;
    if (this.newest + 1 - this.oldest >= this.capacity) this.grow();
    const j = ++this.newest;
    const i = j % this.capacity;
    this.times[i] = t;
    this.leftValue[i] = left;
    this.leftSlope[i] = leftSlope;
    this.rightValue[i] = right;
    this.rightSlope[i] = rightSlope;
  }

  /** Overwrites the right limit of the newest node (a jump decided after it was pushed). */
  setNewestRight(value: number, slope: number): void {
    const i = this.newest % this.capacity;
    this.rightValue[i] = value;
    this.rightSlope[i] = slope;
  }

  /** u(s) by the Hermite interpolant (see the class comment); sets `derivative` to u'(s). */
  read(s: number, side: number): number {
    const { capacity, times } = this;
    if (this.newest < 0 || s < times[this.oldest % capacity] - 1e-9 * Math.max(1, Math.abs(s))) {
      this.derivative = 0;
      return this.before;
    }
    let j = Math.min(Math.max(this.cursor, this.oldest), this.newest);
    while (j < this.newest && times[(j + 1) % capacity] <= s) j++;
    while (j > this.oldest && times[j % capacity] > s) j--;
    // On a node (or within rounding of one): take the side of the piece.
    const tj = times[j % capacity];
    const spacing = j < this.newest ? times[(j + 1) % capacity] - tj : j > this.oldest ? tj - times[(j - 1) % capacity] : 1;
    const tol = NODE_TOLERANCE * spacing;
    if (j < this.newest && times[(j + 1) % capacity] - s <= tol && side > times[(j + 1) % capacity]) j++;
    else if (s - tj <= tol && side < tj) j--;
    this.cursor = Math.max(j, this.oldest);
    if (j < this.oldest) {
      // Before the first node (t = 0): the operating input.
      this.derivative = 0;
      return this.before;
    }
    const a = j % capacity;
    if (j >= this.newest) {
      this.derivative = this.rightSlope[a];
      return this.rightValue[a] + this.rightSlope[a] * (s - times[a]);
    }
    const b = (j + 1) % capacity;
    const width = times[b] - times[a];
    const tau = (s - times[a]) / width;
    const u0 = this.rightValue[a];
    const m0 = this.rightSlope[a] * width;
    const u1 = this.leftValue[b];
    const m1 = this.leftSlope[b] * width;
    const t2 = tau * tau;
    const t3 = t2 * tau;
    this.derivative = ((6 * t2 - 6 * tau) * u0 + (3 * t2 - 4 * tau + 1) * m0 + (6 * tau - 6 * t2) * u1 + (3 * t2 - 2 * tau) * m1) / width;
    return (2 * t3 - 3 * t2 + 1) * u0 + (t3 - 2 * t2 + tau) * m0 + (3 * t2 - 2 * t3) * u1 + (t3 - t2) * m1;
  }

  private grow(): void {
    const old = this.capacity;
    const size = old * 2;
    const copy = (src: Float64Array): Float64Array => {
      const out = new Float64Array(size);
      for (let j = this.oldest; j <= this.newest; j++) out[j % size] = src[j % old];
      return out;
    };
    this.times = copy(this.times);
    this.leftValue = copy(this.leftValue);
    this.leftSlope = copy(this.leftSlope);
    this.rightValue = copy(this.rightValue);
    this.rightSlope = copy(this.rightSlope);
    this.capacity = size;
  }
}
