/**
 * Brent's method for a root of f on a bracket [a, b] with f(a) f(b) <= 0: inverse quadratic
 * interpolation or secant steps, falling back to bisection whenever a step would not shrink the
 * bracket fast enough, so it converges at least as surely as bisection (R. P. Brent, "Algorithms
 * for Minimization without Derivatives", 1973, chapter 4, procedure zero; the layout of Press et
 * al., "Numerical Recipes", zbrent; both cited from memory).
 *
 * Stops when the bracket is narrower than 2 (2 eps |x| + xTol) or f(x) is exactly 0. Returns null
 * when [a, b] does not bracket a sign change or f gives a non-finite value.
 */
export function brentRoot(f: (x: number) => number, a0: number, b0: number, xTol = 1e-14, maxIter = 200): { x: number; iterations: number } | null {
  let a = a0;
  let b = b0;
  let fa = f(a);
  let fb = f(b);
  if (!Number.isFinite(fa) || !Number.isFinite(fb)) return null;
  if (fa === 0) return { x: a, iterations: 0 };
  if (fb === 0) return { x: b, iterations: 0 };
  if (fa > 0 === fb > 0) return null;
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 1; iter <= maxIter; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xTol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { x: b, iterations: iter };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
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
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) return null;
  }
  return { x: b, iterations: maxIter };
}
