/**
 * Column ranks of a training table: the presorting step of the forest (internal).
 *
 * A CART split only depends on the order of a column's values, so each column is replaced
 * once per fit by dense ranks (equal values share a rank) and the list of its distinct
 * values, from which split thresholds are read back (Breiman et al. 1984, Classification
 * and Regression Trees, ch. 2: splits between consecutive distinct values).
 */

/** Dense ranks and distinct values of every column; all arrays are column-major. */
export interface ColumnRanks {
  nRows: number;
  nCols: number;
  /** rank[c * nRows + i]: 0-based dense rank of row i in column c. */
  rank: Int32Array;
  /** Distinct values of column c, ascending, at distinct[distinctStart[c] .. distinctStart[c + 1]). */
  distinct: Float64Array;
  distinctStart: Int32Array;
}

/**
 * Dense ranks of each column of a row-major table.
 *
 * Per column: the engine's numeric sort of a copy of the column (TypedArray.prototype.sort,
 * no comparator), one pass keeping the distinct values, then each row's rank by binary
 * search among them. Complexity O(nCols · nRows · log nRows). The input must hold no NaN
 * (the caller checks); -0 and 0 share a rank.
 *
 * @example rankColumns(Float64Array.of(3, 1, 3), 3, 1) gives rank [1, 0, 1], distinct [1, 3],
 * distinctStart [0, 2].
 */
export function rankColumns(X: Float64Array, nRows: number, nCols: number): ColumnRanks {
  const rank = new Int32Array(nRows * nCols);
  const distinctAll = new Float64Array(nRows * nCols);
  const distinctStart = new Int32Array(nCols + 1);
  const sorted = new Float64Array(nRows);
  let used = 0;
  for (let c = 0; c < nCols; c++) {
    for (let i = 0; i < nRows; i++) sorted[i] = X[i * nCols + c];
    sorted.sort();
    distinctStart[c] = used;
    const first = used;
    for (let k = 0; k < nRows; k++) {
      if (k === 0 || sorted[k] !== sorted[k - 1]) distinctAll[used++] = sorted[k];
    }
    const offset = c * nRows;
    for (let i = 0; i < nRows; i++) rank[offset + i] = lowerBound(distinctAll, first, used, X[i * nCols + c]) - first;
  }
  distinctStart[nCols] = used;
  return { nRows, nCols, rank, distinct: distinctAll.slice(0, used), distinctStart };
}

/** First index in the ascending a[lo, hi) whose value is not below v; O(log(hi − lo)). */
function lowerBound(a: Float64Array, lo: number, hi: number, v: number): number {
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (a[mid] < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
