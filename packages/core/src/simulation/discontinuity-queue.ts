/**
 * Orders of smoothness the classical Runge–Kutta method needs: a discontinuity in the q-th
 * derivative of the right-hand side inside a step costs a local error O(h^(q+1)), so pieces must
 * break at every discontinuity of order q ≤ 3 to keep the global order 4 (E. Hairer, S. P. Nørsett
 * and G. Wanner, Solving ODEs I, 2nd ed., 1993, §II.17, delay equations and their breaking points).
 */
export const TRACKED_ORDERS = 4;

/**
 * The future breaking points of a loop with dead time θ. A discontinuity of order q in the
 * actuator output u at time t_s (q = 0 a jump: the setpoint step, the load step, a new noise
 * sample; q = 1 a kink: a switch of saturation, rate limit or integration) reaches the plant input
 * at t_s + θ, and through the plant and the controller comes back one order smoother every further
 * θ: breaking points t_s + m·θ of order q + m − 1, kept while that order is below TRACKED_ORDERS.
 * (Hairer, Nørsett & Wanner, §II.17.)
 *
 * Sources arrive in time order, so each of the queues m = 1…TRACKED_ORDERS is sorted by
 * construction (first in, first out) and the next breaking point is the least of their heads.
 */
export class DiscontinuityQueue {
  private readonly queues: Float64Array[] = [];
  private readonly heads: number[] = [];
  private readonly tails: number[] = [];

  constructor(private readonly theta: number) {
    for (let m = 0; m < TRACKED_ORDERS; m++) {
      this.queues.push(new Float64Array(16));
      this.heads.push(0);
      this.tails.push(0);
    }
  }

  /** Records a discontinuity of order q of u at time ts (sources must come in time order). */
  add(ts: number, order: number): void {
    for (let m = 1; m + order <= TRACKED_ORDERS; m++) this.enqueue(m - 1, ts + m * this.theta);
  }

  /** The earliest pending breaking point, or Infinity. */
  peek(): number {
    let first = Infinity;
    for (let m = 0; m < TRACKED_ORDERS; m++) if (this.heads[m] < this.tails[m]) first = Math.min(first, this.queues[m][this.heads[m]]);
    return first;
  }

  /** Drops every breaking point ≤ t; true when there was one. */
  popThrough(t: number): boolean {
    let any = false;
    for (let m = 0; m < TRACKED_ORDERS; m++) {
      const q = this.queues[m];
      while (this.heads[m] < this.tails[m] && q[this.heads[m]] <= t) {
        this.heads[m]++;
        any = true;
      }
    }
    return any;
  }

  private enqueue(m: number, t: number): void {
    let q = this.queues[m];
    if (this.tails[m] === q.length) {
      // Compact, then grow if still full.
      const live = this.tails[m] - this.heads[m];
      const next = live * 2 >= q.length ? new Float64Array(q.length * 2) : q;
      next.set(q.subarray(this.heads[m], this.tails[m]));
      this.queues[m] = q = next;
      this.heads[m] = 0;
      this.tails[m] = live;
    }
    q[this.tails[m]++] = t;
  }
}
