/**
 * Column ranks of a training table: the presorting step of the forest (internal).
 *
 * A CART split only depends on the order of a column's values, so each column is replaced
 * once per fit by dense ranks (equal values share a rank) and the list of its distinct
 * values, from which split thresholds are read back (Breiman et al. 1984, Classification
 * and Regression Trees, ch. 2: splits between consecutive distinct values).
 */
import { sortByFloat64Key } from './sort-pairs.ts';

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
 * Complexity O(nCols · nRows · log nRows): one quicksort of (value, row) pairs per column,
 * then one pass. The input must hold no NaN (the caller checks); -0 and 0 share a rank.
 *
 * @example rankColumns(Float64Array.of(3, 1, 3), 3, 1) gives rank [1, 0, 1], distinct [1, 3],
 * distinctStart [0, 2].
 */
export function rankColumns(X: Float64Array, nRows: number, nCols: number): ColumnRanks {
  const rank = new Int32Array(nRows * nCols);
  const distinctAll = new Float64Array(nRows * nCols);
  const distinctStart = new Int32Array(nCols + 1);
  const keys = new Float64Array(nRows);
  const rows = new Int32Array(nRows);
  let used = 0;
  for (let c = 0; c < nCols; c++) {
    for (let i = 0; i < nRows; i++) {
      keys[i] = X[i * nCols + c];
      rows[i] = i;
    }
    sortByFloat64Key(keys, rows, 0, nRows - 1);
    const offset = c * nRows;
    distinctStart[c] = used;
    let r = -1;
    for (let k = 0; k < nRows; k++) {
      if (k === 0 || keys[k] !== keys[k - 1]) {
        r++;
        distinctAll[used++] = keys[k];
      }
      rank[offset + rows[k]] = r;
    }
  }
  distinctStart[nCols] = used;
  return { nRows, nCols, rank, distinct: distinctAll.slice(0, used), distinctStart };
}
