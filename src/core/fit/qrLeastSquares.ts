/**
 * Linear least squares min |A x - b| by Householder QR (A row-major, rows >= cols), as in Golub
 * and Van Loan, "Matrix Computations", section 5.3 (cited from memory). Null when A is rank
 * deficient to working precision (a diagonal of R below 1e-13 of the largest).
 */
export function solveLeastSquares(a: ArrayLike<number>, b: ArrayLike<number>, rows: number, cols: number): Float64Array | null {
  const A = Float64Array.from(a);
  const y = Float64Array.from(b);
  const diag = new Float64Array(cols);
  for (let k = 0; k < cols; k++) {
    let norm = 0;
    for (let i = k; i < rows; i++) norm += A[i * cols + k]! * A[i * cols + k]!;
    norm = Math.sqrt(norm);
    if (norm === 0) return null;
    const alpha = A[k * cols + k]! > 0 ? -norm : norm;
    // v = x - alpha e1, stored in column k from row k down.
    A[k * cols + k] = A[k * cols + k]! - alpha;
    let vv = 0;
    for (let i = k; i < rows; i++) vv += A[i * cols + k]! * A[i * cols + k]!;
    if (vv > 0) {
      for (let j = k + 1; j < cols; j++) {
        let s = 0;
        for (let i = k; i < rows; i++) s += A[i * cols + k]! * A[i * cols + j]!;
        const f = (2 * s) / vv;
        for (let i = k; i < rows; i++) A[i * cols + j] = A[i * cols + j]! - f * A[i * cols + k]!;
      }
      let s = 0;
      for (let i = k; i < rows; i++) s += A[i * cols + k]! * y[i]!;
      const f = (2 * s) / vv;
      for (let i = k; i < rows; i++) y[i] = y[i]! - f * A[i * cols + k]!;
    }
    diag[k] = alpha;
  }
  let largest = 0;
  for (let k = 0; k < cols; k++) largest = Math.max(largest, Math.abs(diag[k]!));
  const x = new Float64Array(cols);
  for (let k = cols - 1; k >= 0; k--) {
    if (!(Math.abs(diag[k]!) > 1e-13 * largest)) return null;
    let s = y[k]!;
    for (let j = k + 1; j < cols; j++) s -= A[k * cols + j]! * x[j]!;
    x[k] = s / diag[k]!;
  }
  return x;
}
