/**
 * Exact rational arithmetic on BigInt, for balancing equations without rounding.
 *
 * A `Rational` is always normalised: the denominator is positive and shares no factor with the
 * numerator, and zero is 0/1. So two equal values have equal fields and `equals` is a field compare.
 *
 * The arithmetic is for code, not for user text: dividing by zero (or building x/0) is a programming
 * error and throws a RangeError. Everything that reads user text (`parseRational`, `fromNumber`) returns
 * null instead of throwing.
 */

export interface Rational {
  /** Numerator, any sign. */
  readonly n: bigint;
  /** Denominator, always > 0. */
  readonly d: bigint;
}

const abs = (x: bigint) => (x < 0n ? -x : x);

/** Greatest common divisor, never negative; gcd(0, 0) = 0. */
export function gcd(a: bigint, b: bigint): bigint {
  a = abs(a);
  b = abs(b);
  while (b !== 0n) {
    const t = a % b;
    a = b;
    b = t;
  }
  return a;
}

/** Least common multiple, never negative; lcm(x, 0) = 0. */
export function lcm(a: bigint, b: bigint): bigint {
  if (a === 0n || b === 0n) return 0n;
  return abs((a / gcd(a, b)) * b);
}

export const ZERO: Rational = Object.freeze({ n: 0n, d: 1n });
export const ONE: Rational = Object.freeze({ n: 1n, d: 1n });

/** n/d in lowest terms. Throws a RangeError when d is zero. */
export function rational(n: bigint | number, d: bigint | number = 1n): Rational {
  let num = typeof n === 'bigint' ? n : BigInt(n);
  let den = typeof d === 'bigint' ? d : BigInt(d);
  if (den === 0n) throw new RangeError('Rational with a zero denominator.');
  if (den < 0n) {
    num = -num;
    den = -den;
  }
  if (num === 0n) return ZERO;
  const g = gcd(num, den);
  return g === 1n ? { n: num, d: den } : { n: num / g, d: den / g };
}

export function add(a: Rational, b: Rational): Rational {
  if (a.n === 0n) return b;
  if (b.n === 0n) return a;
  if (a.d === b.d) return rational(a.n + b.n, a.d);
  return rational(a.n * b.d + b.n * a.d, a.d * b.d);
}

export function neg(a: Rational): Rational {
  return a.n === 0n ? a : { n: -a.n, d: a.d };
}

export function sub(a: Rational, b: Rational): Rational {
  return add(a, neg(b));
}

export function mul(a: Rational, b: Rational): Rational {
  if (a.n === 0n || b.n === 0n) return ZERO;
  // Cross-cancel first so the products stay small.
  const g1 = gcd(a.n, b.d);
  const g2 = gcd(b.n, a.d);
  return { n: (a.n / g1) * (b.n / g2), d: (a.d / g2) * (b.d / g1) };
}

/** 1/a. Throws a RangeError for zero. */
export function inv(a: Rational): Rational {
  if (a.n === 0n) throw new RangeError('Division by zero.');
  return a.n < 0n ? { n: -a.d, d: -a.n } : { n: a.d, d: a.n };
}

/** a/b. Throws a RangeError when b is zero. */
export function div(a: Rational, b: Rational): Rational {
  return mul(a, inv(b));
}

export function isZero(a: Rational): boolean {
  return a.n === 0n;
}

export function sign(a: Rational): -1 | 0 | 1 {
  return a.n > 0n ? 1 : a.n < 0n ? -1 : 0;
}

export function equals(a: Rational, b: Rational): boolean {
  return a.n === b.n && a.d === b.d;
}

export function compare(a: Rational, b: Rational): -1 | 0 | 1 {
  const x = a.n * b.d;
  const y = b.n * a.d;
  return x < y ? -1 : x > y ? 1 : 0;
}

export function isInteger(a: Rational): boolean {
  return a.d === 1n;
}

/** Closest double (exact for values whose parts fit in 53 bits). */
export function toNumber(a: Rational): number {
  const LIMIT = 1n << 1000n;
  if (abs(a.n) < LIMIT && a.d < LIMIT) return Number(a.n) / Number(a.d);
  // Very large parts: integer part plus a scaled fraction, so Infinity/Infinity does not give NaN.
  const q = a.n / a.d;
  const r = a.n - q * a.d;
  const SCALE = 10n ** 17n;
  return Number(q) + Number((r * SCALE) / a.d) / 1e17;
}

/** "3", "-1/2". */
export function toString(a: Rational): string {
  return a.d === 1n ? a.n.toString() : `${a.n}/${a.d}`;
}

/**
 * The rational a double stands for. A count such as 0.95 or 1/3 (stored as 0.333…) becomes 19/20 or 1/3:
 * the simplest fraction with a denominator up to 10⁶ that lies within 1e-9 (relative) of the double is
 * used; otherwise the double's exact binary value. Null for NaN and ±Infinity.
 */
export function fromNumber(x: number): Rational | null {
  if (!Number.isFinite(x)) return null;
  if (Number.isInteger(x)) return rational(BigInt(x));
  const tolerance = 1e-9 * Math.max(1, Math.abs(x));
  // Continued-fraction convergents of |x|.
  const ax = Math.abs(x);
  let h0 = 0,
    h1 = 1,
    k0 = 1,
    k1 = 0;
  let y = ax;
  for (let step = 0; step < 64; step++) {
    const a = Math.floor(y);
    const h2 = a * h1 + h0;
    const k2 = a * k1 + k0;
    if (k2 > 1_000_000 || !Number.isSafeInteger(h2)) break;
    h0 = h1;
    h1 = h2;
    k0 = k1;
    k1 = k2;
    if (Math.abs(ax - h1 / k1) <= tolerance) return rational(BigInt(x < 0 ? -h1 : h1), BigInt(k1));
    const frac = y - a;
    if (frac === 0) break;
    y = 1 / frac;
  }
  // Exact binary value: doubling a non-integer double is exact, and at most 1074 doublings make it whole.
  let m = x;
  let d = 1n;
  while (!Number.isInteger(m)) {
    m *= 2;
    d *= 2n;
  }
  return rational(BigInt(m), d);
}

/**
 * Read an unsigned number written as an integer (`12`), a decimal (`0.25`) or a fraction (`3/4`).
 * Null when the text is not one of these, or when a denominator is zero.
 */
export function parseRational(text: string): Rational | null {
  let m = /^([0-9]+)$/.exec(text);
  if (m) return rational(BigInt(m[1]));
  m = /^([0-9]*)\.([0-9]+)$/.exec(text);
  if (m) return rational(BigInt((m[1] || '0') + m[2]), 10n ** BigInt(m[2].length));
  m = /^([0-9]+)\/([0-9]+)$/.exec(text);
  if (m) {
    const den = BigInt(m[2]);
    return den === 0n ? null : rational(BigInt(m[1]), den);
  }
  return null;
}
