/**
 * Solves the dense linear system A x = b (n x n, row-major in `a`) by Gaussian elimination with
 * partial pivoting (e.g. Golub and Van Loan, "Matrix Computations", algorithm 3.4.1; cited from
 * memory). Overwrites `a` and `b`; returns x, or null when A is singular to working precision.
 * Units are the caller's.
 */
export function solveLinear(a: Float64Array, b: Float64Array, n: number): Float64Array | null {
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(a[i]!));
  if (!(scale > 0) || !Number.isFinite(scale)) return null;
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r * n + col]!) > Math.abs(a[pivot * n + col]!)) pivot = r;
    const p = a[pivot * n + col]!;
    if (!(Math.abs(p) > 1e-14 * scale)) return null;
    if (pivot !== col) {
      for (let c = 0; c < n; c++) {
        const tmp = a[col * n + c]!;
        a[col * n + c] = a[pivot * n + c]!;
        a[pivot * n + c] = tmp;
      }
      const tb = b[col]!;
      b[col] = b[pivot]!;
      b[pivot] = tb;
    }
    for (let r = col + 1; r < n; r++) {
      const f = a[r * n + col]! / p;
      if (f === 0) continue;
      for (let c = col; c < n; c++) a[r * n + c] = a[r * n + c]! - f * a[col * n + c]!;
      b[r] = b[r]! - f * b[col]!;
    }
  }
  const x = new Float64Array(n);
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let c = r + 1; c < n; c++) s -= a[r * n + c]! * x[c]!;
    x[r] = s / a[r * n + r]!;
  }
  return x;
}
