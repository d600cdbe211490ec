/**
 * Brent's method for a root of a function of one variable bracketed by [a, b] (Brent, Algorithms for
 * Minimization without Derivatives, 1973, ch. 4): inverse quadratic interpolation and the secant where
 * they are safe, bisection where they are not. Bounded evaluations.
 */
export function brent(
  f: (x: number) => number,
  a: number,
  b: number,
  fa: number,
  fb: number,
  tol: number,
  maxEvaluations = 60,
): { x: number; fx: number; evaluations: number } {
  if (fa * fb > 0) return { x: Math.abs(fa) < Math.abs(fb) ? a : b, fx: Math.abs(fa) < Math.abs(fb) ? fa : fb, evaluations: 0 };
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  let n = 0;
  for (; n < maxEvaluations; n++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = e = b - a;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol1 || fb === 0) break;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol1 * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : m > 0 ? tol1 : -tol1;
    fb = f(b);
  }
  return { x: b, fx: fb, evaluations: n };
}
