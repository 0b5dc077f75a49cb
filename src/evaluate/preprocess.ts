/**
 * Training-fold preprocessing: median imputation of missing values, then standardisation
 * to zero mean and unit (population) variance, both fitted on the training rows only and
 * then applied unchanged to the test rows. Fitting them on all rows would leak the test
 * rows' distribution into training (Hastie, Tibshirani & Friedman 2009, The Elements of
 * Statistical Learning, 2nd ed., sec. 7.10.2). The convention matches scikit-learn's
 * SimpleImputer(strategy="median") followed by StandardScaler (ddof = 0).
 *
 * A column whose training values are all missing, or constant after imputation, carries no
 * information the classifier could learn from this fold; it is left out of this fold's design
 * (and reported in `dropped`), rather than divided by a zero spread.
 */

/** Why a column was left out of one fold's design. */
export type DropReason = 'all missing in training rows' | 'constant in training rows';

export interface FittedPreprocessing {
  /** Source column numbers that enter the design, in order. */
  columns: Int32Array;
  /** Training median of each kept column (the fill value for missing entries). */
  median: Float64Array;
  /** Training mean of each kept column after imputation. */
  mean: Float64Array;
  /** Training population standard deviation of each kept column after imputation (> 0). */
  scale: Float64Array;
  /** Columns left out, with the reason. */
  dropped: { column: number; reason: DropReason }[];
}

/**
 * Median of the finite entries of `column` over `rows`, using `scratch` (length >= rows.length).
 * Even counts average the two middle values (numpy's convention). NaN when every entry is missing.
 * O(n log n). Example: values [3, NaN, 1, 2] -> 2.
 */
export function medianOfRows(values: Float64Array, nCols: number, column: number, rows: Int32Array, scratch: Float64Array): number {
  let n = 0;
  for (let i = 0; i < rows.length; i++) {
    const v = values[rows[i] * nCols + column];
    if (v === v) scratch[n++] = v;
  }
  if (n === 0) return NaN;
  const sorted = scratch.subarray(0, n).sort();
  const mid = n >> 1;
  return n % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/**
 * Fits imputation and scaling for `columns` of a row-major matrix on `trainRows`.
 *
 * O(C · n log n) for C columns and n training rows. Returns the fitted parameters; a column
 * that is all missing or constant in the training rows is listed in `dropped`.
 * Example: one column [1, 3, NaN] trained on all rows -> median 2, mean 2, scale sqrt(2/3).
 */
export function fitPreprocessing(values: Float64Array, nCols: number, columns: Int32Array, trainRows: Int32Array): FittedPreprocessing {
  const scratch = new Float64Array(trainRows.length);
  const kept: number[] = [];
  const medians: number[] = [];
  const means: number[] = [];
  const scales: number[] = [];
  const dropped: FittedPreprocessing['dropped'] = [];
  for (let i = 0; i < columns.length; i++) {
    const c = columns[i];
    const median = medianOfRows(values, nCols, c, trainRows, scratch);
    if (median !== median) {
      dropped.push({ column: c, reason: 'all missing in training rows' });
      continue;
    }
    const { mean, sd, constant } = imputedMoments(values, nCols, c, trainRows, median);
    if (constant) {
      dropped.push({ column: c, reason: 'constant in training rows' });
      continue;
    }
    kept.push(c);
    medians.push(median);
    means.push(mean);
    scales.push(sd);
  }
  return {
    columns: Int32Array.from(kept),
    median: Float64Array.from(medians),
    mean: Float64Array.from(means),
    scale: Float64Array.from(scales),
    dropped,
  };
}

/** Mean and population SD of one column over `rows`, missing entries replaced by `fill` (two-pass). */
function imputedMoments(values: Float64Array, nCols: number, c: number, rows: Int32Array, fill: number): { mean: number; sd: number; constant: boolean } {
  let sum = 0;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < rows.length; i++) {
    let v = values[rows[i] * nCols + c];
    if (v !== v) v = fill;
    sum += v;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const mean = sum / rows.length;
  let ss = 0;
  for (let i = 0; i < rows.length; i++) {
    let v = values[rows[i] * nCols + c];
    if (v !== v) v = fill;
    ss += (v - mean) * (v - mean);
  }
  const sd = Math.sqrt(ss / rows.length);
  return { mean, sd, constant: min === max || !(sd > 0) };
}

/**
 * Applies fitted preprocessing to `rows`: missing -> training median, then (x - mean) / scale.
 *
 * O(rows · kept columns). Returns a row-major Float64Array of rows.length x prep.columns.length
 * without NaN. Example: prep from the fitPreprocessing example applied to [NaN] -> [0].
 */
export function applyPreprocessing(values: Float64Array, nCols: number, prep: FittedPreprocessing, rows: Int32Array): Float64Array {
  const k = prep.columns.length;
  const out = new Float64Array(rows.length * k);
  for (let i = 0; i < rows.length; i++) {
    const base = rows[i] * nCols;
    const o = i * k;
    for (let j = 0; j < k; j++) {
      let v = values[base + prep.columns[j]];
      if (v !== v) v = prep.median[j];
      out[o + j] = (v - prep.mean[j]) / prep.scale[j];
    }
  }
  return out;
}
