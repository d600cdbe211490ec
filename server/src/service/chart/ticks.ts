/** Axis ranges and ticks, and the least-squares fit behind the guide lines. */

export interface Ticks {
  min: number;
  max: number;
  step: number;
  ticks: number[];
  /** Decimals needed to write every tick exactly. */
  decimals: number;
}

/** Keeps hi − lo finite. */
const LIMIT = 1e300;

/** A value with the floating-point noise of `k · step` taken off. */
const clean = (value: number) => parseFloat(value.toPrecision(12));

/**
 * Ticks at 1, 2, 2.5 or 5 × 10ⁿ steps covering [lo, hi] with about `target` intervals. With `integer`, steps
 * are whole numbers (no 2.5 and nothing below 1). A zero or non-finite span is widened around the value.
 */
export function niceTicks(lo: number, hi: number, target = 5, integer = false): Ticks {
  [lo, hi] = saneRange(lo, hi);
  const intervals = Math.max(1, Math.min(20, Math.round(Number.isFinite(target) ? target : 5)));
  const { step, multiple } = niceStep((hi - lo) / intervals, integer);
  if (!(step > 0) || !Number.isFinite(step)) return niceTicks(0, 1, target, integer);
  const [first, last] = coveringMultiples(lo, hi, step);
  const ticks: number[] = [];
  for (let k = first; k <= last && ticks.length < 200; k++) ticks.push(clean(k * step));
  const stepExponent = Math.floor(Math.log10(step) + 1e-9);
  // toFixed takes at most 100 digits; 20 already writes steps far below any value a chart is given.
  const decimals = Math.min(20, Math.max(0, -stepExponent + (multiple === 2.5 ? 1 : 0)));
  return { min: ticks[0], max: ticks[ticks.length - 1], step, ticks, decimals };
}

/** Finite, ordered, and wide enough to divide. */
function saneRange(lo: number, hi: number): [number, number] {
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) [lo, hi] = [0, 1];
  lo = Math.max(-LIMIT, Math.min(LIMIT, lo));
  hi = Math.max(-LIMIT, Math.min(LIMIT, hi));
  if (lo > hi) [lo, hi] = [hi, lo];
  if (hi - lo < 1e-12 * Math.max(1, Math.abs(hi))) {
    // Around a value too small to scale (zero, denormals), widen by 1.
    const half = Math.abs(lo) < 1e-200 ? 1 : Math.abs(lo) * 0.1;
    lo -= half;
    hi += half;
  }
  return [lo, hi];
}

/** The smallest nice step not below `raw`. */
function niceStep(raw: number, integer: boolean): { step: number; multiple: number } {
  const exponent = Math.floor(Math.log10(raw));
  const magnitude = Math.pow(10, exponent);
  const multiples = integer && exponent <= 0 ? [1, 2, 5, 10] : [1, 2, 2.5, 5, 10];
  const multiple = multiples.find((m) => m * magnitude >= raw * (1 - 1e-9)) ?? 10;
  if (integer && multiple * magnitude < 1) return { step: 1, multiple: 1 };
  return { step: clean(multiple * magnitude), multiple };
}

/**
 * The outermost multiples of the step that still cover [lo, hi], checked on the cleaned values so that
 * floating-point noise neither drops a bound nor adds a tick.
 */
function coveringMultiples(lo: number, hi: number, step: number): [number, number] {
  let first = Math.floor(lo / step);
  if (clean((first + 1) * step) <= lo) first++;
  if (clean(first * step) > lo) first--;
  let last = Math.ceil(hi / step);
  if (clean((last - 1) * step) >= hi) last--;
  if (clean(last * step) < hi) last++;
  if (last <= first) last = first + 1;
  return [first, last];
}

/**
 * The range shown for some values, widened by `fraction` of its span on each side. A narrow range (one salt,
 * or near-equal values) is shown as at least 20 % of its magnitude, so that small differences do not look
 * large; a range of values that are all ≥ 0 does not go below 0.
 */
export function paddedRange(values: readonly number[], fraction: number): [number, number] {
  const least = Math.min(...values);
  const most = Math.max(...values);
  let lo = least;
  let hi = most;
  const narrowest = Math.max(Math.abs(lo), Math.abs(hi)) * 0.2 || 1;
  if (hi - lo < narrowest) {
    const mid = (lo + hi) / 2;
    lo = mid - narrowest / 2;
    hi = mid + narrowest / 2;
  }
  const span = hi - lo;
  const start = lo - span * fraction;
  return [least >= 0 && start < 0 ? 0 : start, hi + span * fraction];
}

/**
 * The range of an axis that runs edge to edge: the values' extent, widened so that the outermost values sit
 * `edge` px inside an axis `length` px long. A single value (or values within 1e-9 of each other) gets ±5 %
 * around it.
 */
export function edgeToEdge(values: readonly number[], length: number, edge: number): [number, number] {
  const lo = Math.min(...values);
  const hi = Math.max(...values);
  const span = hi - lo;
  if (!(span > 1e-9 * Math.max(Math.abs(lo), Math.abs(hi)))) {
    const half = Math.abs(lo) * 0.05 || 0.05;
    return [lo - half, hi + half];
  }
  const extra = (span * edge) / Math.max(1, length - 2 * edge);
  return [lo - extra, hi + extra];
}

/**
 * Nice ticks (as `niceTicks`) that lie inside [lo, hi] rather than covering it, so the axis can run edge to
 * edge. Asks for more ticks until at least two fit, where the range allows.
 */
export function ticksWithin(lo: number, hi: number, target: number, integer = false): Ticks {
  const tolerance = (hi - lo) * 1e-9;
  for (let more = Number.isFinite(target) ? Math.max(1, target) : 5; ; more *= 2) {
    const ticks = niceTicks(lo, hi, more, integer);
    const inside = ticks.ticks.filter((t) => t >= lo - tolerance && t <= hi + tolerance);
    if (inside.length >= 2 || more >= 20) return { ...ticks, ticks: inside, min: inside[0] ?? lo, max: inside[inside.length - 1] ?? hi };
  }
}

export interface LineFit {
  slope: number;
  intercept: number;
  n: number;
}

/** Ordinary least squares y = intercept + slope·x; null for fewer than two points or a single x value. */
export function leastSquares(xs: readonly number[], ys: readonly number[]): LineFit | null {
  const m = Math.min(xs.length, ys.length);
  if (m < 2) return null;
  let sumX = 0;
  let sumY = 0;
  for (let i = 0; i < m; i++) {
    sumX += xs[i];
    sumY += ys[i];
  }
  const meanX = sumX / m;
  const meanY = sumY / m;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < m; i++) {
    sxx += (xs[i] - meanX) * (xs[i] - meanX);
    sxy += (xs[i] - meanX) * (ys[i] - meanY);
  }
  if (!(sxx > 1e-12 * Math.max(1, meanX * meanX)) || !Number.isFinite(sxy)) return null;
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX, n: m };
}
