/**
 * Dense symmetric positive-definite solve by Cholesky factorisation (internal).
 *
 * Golub & Van Loan (2013), Matrix Computations, 4th ed., Algorithm 4.2.1 (gaxpy Cholesky),
 * then forward and back substitution.
 */

/**
 * Solves A x = b for symmetric positive-definite A (d x d, row-major; only the lower
 * triangle is read). A is overwritten by its Cholesky factor L (lower triangle), b by x.
 * Returns false, leaving A and b in an unspecified state, when A is not numerically
 * positive definite (a pivot <= 0 or not finite). O(d³/3).
 *
 * @example A = [[4, 2], [2, 3]], b = [2, 1] gives x = [0.5, 0] and returns true.
 */
export function choleskySolveInPlace(A: Float64Array, b: Float64Array, d: number): boolean {
  for (let j = 0; j < d; j++) {
    const rowJ = j * d;
    let pivot = A[rowJ + j];
    for (let k = 0; k < j; k++) pivot -= A[rowJ + k] * A[rowJ + k];
    if (!(pivot > 0) || !Number.isFinite(pivot)) return false;
    const ljj = Math.sqrt(pivot);
    A[rowJ + j] = ljj;
    for (let i = j + 1; i < d; i++) {
      const rowI = i * d;
      let s = A[rowI + j];
      for (let k = 0; k < j; k++) s -= A[rowI + k] * A[rowJ + k];
      A[rowI + j] = s / ljj;
    }
  }
  for (let i = 0; i < d; i++) {
    let s = b[i];
    for (let k = 0; k < i; k++) s -= A[i * d + k] * b[k];
    b[i] = s / A[i * d + i];
  }
  for (let i = d - 1; i >= 0; i--) {
    let s = b[i];
    for (let k = i + 1; k < d; k++) s -= A[k * d + i] * b[k];
    b[i] = s / A[i * d + i];
  }
  return true;
}
