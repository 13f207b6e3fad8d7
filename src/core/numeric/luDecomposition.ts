import { SINGULAR_PIVOT } from './tolerance.ts';

/**
 * LU decomposition with partial pivoting of a square matrix (row-major, n x n), PA = LU, and the
 * solves that use it. Doolittle form, as in Golub and Van Loan, "Matrix Computations", section
 * 3.4 (Gaussian elimination with partial pivoting; cited from memory). The engine's one Gaussian
 * elimination: the bootstrap's joint Newton step and the forward-rate sensitivities both use it.
 */
export interface LuFactors {
  readonly n: number;
  /** L (unit lower, below the diagonal) and U (on and above), row-major. */
  readonly lu: Float64Array;
  /** Row permutation: row i of PA is row perm[i] of A. */
  readonly perm: Int32Array;
}

/**
 * Factors A; null when A is singular to working precision: an entry is not finite, A is zero, or
 * a pivot (the largest candidate in its column) is at most SINGULAR_PIVOT times the largest
 * |entry| of A. Below that the pivot is of the size of the rounding error the elimination has
 * already made in it (about n eps max|A|), so the solution would be noise.
 */
export function luFactor(a: ArrayLike<number>, n: number): LuFactors | null {
  const lu = Float64Array.from(a);
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(lu[i]!));
  if (!(scale > 0) || !Number.isFinite(scale)) return null;
  const minPivot = SINGULAR_PIVOT * scale;
  const perm = new Int32Array(n);
  for (let i = 0; i < n; i++) perm[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(lu[k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]!);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (!(best > minPivot)) return null;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const tmp = lu[k * n + j]!;
        lu[k * n + j] = lu[p * n + j]!;
        lu[p * n + j] = tmp;
      }
      const tp = perm[k]!;
      perm[k] = perm[p]!;
      perm[p] = tp;
    }
    const pivot = lu[k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = lu[i * n + k]! / pivot;
      lu[i * n + k] = f;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j] = lu[i * n + j]! - f * lu[k * n + j]!;
    }
  }
  return { n, lu, perm };
}

/** Solves A x = b. */
export function luSolve(f: LuFactors, b: ArrayLike<number>): Float64Array {
  const { n, lu, perm } = f;
  const x = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = b[perm[i]!]!;
    for (let j = 0; j < i; j++) s -= lu[i * n + j]! * x[j]!;
    x[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let j = i + 1; j < n; j++) s -= lu[i * n + j]! * x[j]!;
    x[i] = s / lu[i * n + i]!;
  }
  return x;
}

/** The inverse of A, row-major. */
export function luInverse(f: LuFactors): Float64Array {
  const { n } = f;
  const inv = new Float64Array(n * n);
  const e = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    e.fill(0);
    e[k] = 1;
    const col = luSolve(f, e);
    for (let i = 0; i < n; i++) inv[i * n + k] = col[i]!;
  }
  return inv;
}
