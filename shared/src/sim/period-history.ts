/**
 * Accepted points (time, unknowns, junction state) of at least the last PERIODS periods, oldest first,
 * for the periodic predictor. A ring that grows while they do not fit, up to MAX_POINTS. Its capacity is a
 * power of two, so a place in it is a mask, not a branch (a wrap first taken after V8 had compiled the
 * predictor deoptimized it), and it starts large enough for the periods at the expected points per period,
 * so that a run does not grow it (growing deoptimized it too).
 */
export class PeriodHistory {
  /**
   * Periods kept: the drift from one period to the next is extrapolated by a polynomial through them. Two
   * (a straight line) rather than three (a parabola): on the charging 5- to 80-stage cascades of
   * scripts/bench/sim-process.bench.ts the parabola took 0.1–1.5 % more Newton iterations, and each step
   * more work, for last-cycle means within 0.005 % of each other.
   */
  static readonly PERIODS = 2;
  private static readonly MAX_POINTS = 1 << 15;
  /** Largest capacity allocated up front (more points per period grow the ring as they come). */
  private static readonly MAX_INITIAL_POINTS = 1 << 12;
  private capacity: number;
  private mask: number;
  private start = 0;
  count = 0;
  /** Points pushed since the last clear; a point's sequence number is its place in that count. */
  private pushed = 0;
  /** Sequence numbers of the last points found, by the caller's slot (see find). */
  private readonly hints = new Float64Array(2 * PeriodHistory.PERIODS).fill(-1);
  private times: Float64Array;
  private xs: Float64Array;
  private js: Float64Array;

  /** The step being taken, from startS to endS, of length stepS (set by the stepper before findBack). */
  startS = 0;
  endS = 0;
  stepS = 0;

  constructor(
    private readonly xLength: number,
    private readonly jLength: number,
    private readonly periodS: number,
    expectedPointsPerPeriod = 0,
  ) {
    let capacity = 256;
    const wanted = Math.min((PeriodHistory.PERIODS + 1) * expectedPointsPerPeriod, PeriodHistory.MAX_INITIAL_POINTS);
    while (capacity < wanted) capacity *= 2;
    this.capacity = capacity;
    this.mask = capacity - 1;
    this.times = new Float64Array(capacity);
    this.xs = new Float64Array(this.capacity * xLength);
    this.js = new Float64Array(this.capacity * jLength);
  }

  clear(): void {
    this.start = 0;
    this.count = 0;
    this.pushed = 0;
    this.hints.fill(-1);
  }

  private slot(i: number): number {
    return (this.start + i) & this.mask;
  }

  timeAt(i: number): number {
    return this.times[this.slot(i)]!;
  }

  /** Appends a point; drops the oldest once the rest still reach back to keepFromS. */
  push(timeS: number, x: Float64Array, junction: Float64Array, keepFromS: number): void {
    if (this.count === this.capacity) {
      if (this.timeAt(1) <= keepFromS) {
        this.start = this.slot(1);
        this.count--;
      } else if (this.capacity < PeriodHistory.MAX_POINTS) this.grow();
      else {
        // More points per period than kept: give the predictor up until a period fits again.
        this.clear();
      }
    }
    const s = this.slot(this.count);
    this.times[s] = timeS;
    // x and junction are exactly xLength and jLength long (the stepper's own vectors).
    this.xs.set(x, s * this.xLength);
    this.js.set(junction, s * this.jLength);
    this.count++;
    this.pushed++;
  }

  private grow(): void {
    const capacity = 2 * this.capacity;
    const times = new Float64Array(capacity);
    const xs = new Float64Array(capacity * this.xLength);
    const js = new Float64Array(capacity * this.jLength);
    for (let i = 0; i < this.count; i++) {
      const s = this.slot(i);
      times[i] = this.times[s]!;
      xs.set(this.xs.subarray(s * this.xLength, (s + 1) * this.xLength), i * this.xLength);
      js.set(this.js.subarray(s * this.jLength, (s + 1) * this.jLength), i * this.jLength);
    }
    this.capacity = capacity;
    this.mask = capacity - 1;
    this.times = times;
    this.xs = xs;
    this.js = js;
    this.start = 0;
  }

  /**
   * Index of the stored point `periods` periods before the step's end (atEnd) or start, to within 1e-6 of
   * the step, or −1. The times come from the fields, not arguments, so that no double is boxed on the way.
   * Each kind of point has its own `slot` (0 … 2·PERIODS − 1): the point after the last one found there is
   * tried first, and the search only runs when that misses.
   */
  findBack(periods: number, atEnd: boolean, slot: number): number {
    if (this.count === 0) return -1;
    const timeS = (atEnd ? this.endS : this.startS) - periods * this.periodS;
    const tolerance = 1e-6 * this.stepS;
    const first = this.pushed - this.count;
    const hinted = this.hints[slot]! - first;
    for (let i = hinted + 1; i >= hinted && i >= 0; i--) {
      if (i < this.count && Math.abs(this.timeAt(i) - timeS) <= tolerance) {
        this.hints[slot] = first + i;
        return i;
      }
    }
    const found = this.search(timeS, tolerance);
    if (found >= 0) this.hints[slot] = first + found;
    return found;
  }

  /**
   * Index of the first stored point more than `tolerance` after the time `periods` periods before the step's
   * start, or −1: where a step off the last period's points can land to take them up again.
   */
  nextAfterStart(periods: number, tolerance: number): number {
    if (this.count === 0) return -1;
    const timeS = this.startS - periods * this.periodS + tolerance;
    let lo = 0;
    let hi = this.count;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.timeAt(mid) <= timeS) lo = mid + 1;
      else hi = mid;
    }
    return lo < this.count ? lo : -1;
  }

  private search(timeS: number, tolerance: number): number {
    let lo = 0;
    let hi = this.count - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.timeAt(mid) < timeS) lo = mid + 1;
      else hi = mid;
    }
    if (Math.abs(this.timeAt(lo) - timeS) <= tolerance) return lo;
    if (lo > 0 && Math.abs(this.timeAt(lo - 1) - timeS) <= tolerance) return lo - 1;
    return -1;
  }

  /**
   * The periodic prediction of the first n unknowns and of the junction state, from the stored points
   * refs[2m − 2] at t1 − m·T and refs[2m − 1] at t0 − m·T, m = 1 … periods: the drift over one period,
   * d(m) = x(t1 − m·T) − x(t0 − m·T), extrapolated to the present period by the polynomial through the
   * last `periods` of them (weights 1; 2, −1; 3, −3, 1), plus x0.
   */
  predict(
    refs: Int32Array,
    periods: number,
    x0: Float64Array,
    x: Float64Array,
    n: number,
    junction0: Float64Array,
    junction: Float64Array,
  ): void {
    this.extrapolate(this.xs, this.xLength, refs, periods, x0, x, n);
    this.extrapolate(this.js, this.jLength, refs, periods, junction0, junction, this.jLength);
  }

  private extrapolate(
    stored: Float64Array,
    stride: number,
    refs: Int32Array,
    periods: number,
    now: Float64Array,
    into: Float64Array,
    n: number,
  ): void {
    const n1 = this.slot(refs[0]!) * stride;
    const b1 = this.slot(refs[1]!) * stride;
    if (periods === 1) {
      for (let i = 0; i < n; i++) into[i] = now[i]! + stored[n1 + i]! - stored[b1 + i]!;
      return;
    }
    const n2 = this.slot(refs[2]!) * stride;
    const b2 = this.slot(refs[3]!) * stride;
    if (periods === 2) {
      for (let i = 0; i < n; i++)
        into[i] = now[i]! + 2 * (stored[n1 + i]! - stored[b1 + i]!) - (stored[n2 + i]! - stored[b2 + i]!);
      return;
    }
    const n3 = this.slot(refs[4]!) * stride;
    const b3 = this.slot(refs[5]!) * stride;
    for (let i = 0; i < n; i++)
      into[i] =
        now[i]! +
        3 * (stored[n1 + i]! - stored[b1 + i]! - stored[n2 + i]! + stored[b2 + i]!) +
        (stored[n3 + i]! - stored[b3 + i]!);
  }
}
