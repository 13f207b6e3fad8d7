import { LN_DISCOUNT_LIMIT, MAX_SOLVER_EVALUATIONS, NODE_TOLERANCE, SOLVER_FIRST_STEP } from '../numeric/tolerance.ts';

export type SolveOutcome =
  | { readonly ok: true; readonly x: number; readonly evaluations: number }
  | { readonly ok: false; readonly reason: 'non-positive-discount' | 'no-solution'; readonly evaluations: number };

/** ln DF beyond these bounds means a discount factor that float64 cannot tell from 0 or infinity. */
const X_MIN = -LN_DISCOUNT_LIMIT;
const X_MAX = LN_DISCOUNT_LIMIT;

/**
 * Solves residual(x) = 0 for a node x = ln DF, where the residual is present value minus target
 * and rises with the discount factor. Newton steps on a secant (first a forward-difference)
 * derivative, kept inside a bracket once one is found, bisection when a step leaves it (a
 * safeguarded Newton in the manner of Press et al., "Numerical Recipes", rtsafe; cited from
 * memory). Stops when a step moves the node by at most NODE_TOLERANCE relative (|dx| for
 * x = ln DF), or the residual is exactly zero.
 *
 * No root with a positive discount factor: `non-positive-discount` (the residual stays positive
 * as DF goes to 0); none with a finite one: `no-solution`.
 */
export function solveNode(residual: (x: number) => number, x0: number, f0?: number, stopAtRoot = false): SolveOutcome {
  let evaluations = 0;
  let x = x0;
  // f0: the residual at x0 when the caller already has it (saves one evaluation).
  let fx: number;
  if (f0 !== undefined && Number.isFinite(f0)) fx = f0;
  else {
    evaluations++;
    fx = residual(x);
  }
  if (fx === 0) return { ok: true, x, evaluations };
  let neg = fx < 0 ? x : Number.NaN; // a point with residual < 0
  let pos = fx > 0 ? x : Number.NaN; // a point with residual > 0
  const h = SOLVER_FIRST_STEP;
  let stride = 1;
  let xPrev = x + h;
  evaluations++;
  let fPrev = residual(xPrev);
  if (fPrev < 0) neg = Number.isNaN(neg) || xPrev > neg ? xPrev : neg;
  if (fPrev > 0) pos = Number.isNaN(pos) || xPrev < pos ? xPrev : pos;
  while (evaluations < MAX_SOLVER_EVALUATIONS) {
    const bracketed = !Number.isNaN(neg) && !Number.isNaN(pos);
    const slope = (fx - fPrev) / (x - xPrev);
    let next = x - fx / slope;
    // With `stopAtRoot`: a secant step below the last point's rounding means x is the root to the
    // last bit (a residual linear in x, such as a forward deposit's in ln space, lands there in one
    // step); bisecting the bracket instead would walk up to NODE_TOLERANCE away from it. Off for
    // every other residual, whose solves stay as they were bit for bit (test/cli/golden.test.ts).
    if (stopAtRoot && next === x) return { ok: true, x, evaluations };
    if (!Number.isFinite(next)) next = bracketed ? 0.5 * (neg + pos) : x - Math.sign(fx) * stride;
    if (bracketed) {
      const lo = Math.min(neg, pos);
      const hi = Math.max(neg, pos);
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    } else {
      // Walk toward a sign change, the longest stride doubling each time (1, 2, 4, ... units of ln DF).
      if (Math.abs(next - x) > stride) next = x + Math.sign(next - x) * stride;
      stride *= 2;
      if (next < X_MIN) return { ok: false, reason: 'non-positive-discount', evaluations };
      if (next > X_MAX) return { ok: false, reason: 'no-solution', evaluations };
    }
    evaluations++;
    const fNext = residual(next);
    if (!Number.isFinite(fNext)) return { ok: false, reason: 'no-solution', evaluations };
    const step = Math.abs(next - x);
    xPrev = x;
    fPrev = fx;
    x = next;
    fx = fNext;
    if (fx === 0 || step <= NODE_TOLERANCE) return { ok: true, x, evaluations };
    if (fx < 0) neg = x;
    else pos = x;
    if (!Number.isNaN(neg) && !Number.isNaN(pos) && Math.abs(neg - pos) <= NODE_TOLERANCE) return { ok: true, x, evaluations };
  }
  return { ok: false, reason: 'no-solution', evaluations };
}
